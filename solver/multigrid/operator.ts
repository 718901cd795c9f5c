import { findStretches, StretchList, type Stretches } from './stretches';

/**
 * A symmetric five-point operator on an n1 × n2 box of control volumes (index c = i + j·n1),
 * written as face conductances plus a diagonal part:
 *
 *   (A x)_c = (Σ_faces g_f + reaction_c + boundary_c) x_c − Σ_faces g_f x_neighbour
 *
 * - `gx[(i) + j·(n1+1)]` is the conductance of the face between volumes (i−1, j) and (i, j);
 *   the faces of an active volume on the box edge or next to an inactive volume are 0.
 * - `gy[i + j·n1]` likewise for the face between (i, j−1) and (i, j), length n1·(n2+1).
 * - `reaction` holds terms that scale with the volume (Brinkman friction α·area); `boundary` holds Dirichlet
 *   conductances (a port face at a known value). Both are ≥ 0.
 * - `active[c]` is 1 for a volume that carries an unknown; inactive volumes are left untouched (x = 0).
 *
 * This is the finite-volume form of −div(k grad u) + α u = f on cut cells: face conductances carry the open
 * aperture, so insulating and no-flux walls are exact. A is symmetric by construction.
 */
export interface Operator5 {
  n1: number;
  n2: number;
  gx: Float64Array;
  gy: Float64Array;
  /** Per volume, or empty (length 0) when the operator has no reaction term. */
  reaction: Float64Array;
  boundary: Float64Array;
  active: Uint8Array;
  /** Σ g + reaction + boundary per volume; filled by `finishOperator`. */
  diag: Float64Array;
  /**
   * Runs of active volumes, row by row: pairs [first, end) of volume indices. Filled by `finishOperator`
   * (or on first use); the kernels loop over these only, so solid regions of the box cost nothing.
   */
  runs?: Int32Array;
  /** rowRuns[j] is the index in `runs` of the first run of row j; rowRuns[n2] = runs.length. */
  rowRuns?: Int32Array;
  /** The runs cut where the stencil changes between uniform and general (stretches.ts); by `finishOperator`. */
  stretches?: Stretches;
}

/** An operator of n1 × n2 inactive volumes; `reaction: false` leaves out the reaction term (length 0). */
export function createOperator(n1: number, n2: number, options: { reaction?: boolean } = {}): Operator5 {
  const n = n1 * n2;
  return {
    n1,
    n2,
    gx: new Float64Array((n1 + 1) * n2),
    gy: new Float64Array(n1 * (n2 + 1)),
    reaction: new Float64Array(options.reaction === false ? 0 : n),
    boundary: new Float64Array(n),
    active: new Uint8Array(n),
    diag: new Float64Array(n),
  };
}

/**
 * Clears the conductances of active volumes' faces that lead to an inactive volume or out of the box, and
 * computes the diagonal, the runs of active volumes and their stretches (stretches.ts): the runs from `active`
 * alone, then the rest on the runs only, so the solid part of the box costs one byte read per volume. A volume
 * whose diagonal is zero (no face, no reaction, no boundary) is made inactive. On inactive volumes diag is 0;
 * faces between two inactive volumes are left as they are (nothing reads them). Values that do not change are
 * not written again (the face arrays may be the grid's own).
 */
export function finishOperator(op: Operator5, runs?: { runs: Int32Array; rowRuns: Int32Array }): Operator5 {
  // The runs of `active` when the caller has them already (they are read, never written), else found here.
  if (runs) {
    op.runs = runs.runs;
    op.rowRuns = runs.rowRuns;
  } else findRuns(op);
  if (!closeAndSum(op)) {
    // Some volume had no conductance at all and was dropped: the runs and stretches are out of date.
    findRuns(op);
    op.stretches = findStretches(op);
  }
  return op;
}

/**
 * The face and diagonal work of finishOperator over the runs found by findRuns, telling uniform volumes apart on
 * the way (the stretches); false when a volume with a zero diagonal was made inactive. Inside a run the left and
 * right neighbours are active, at its ends they are not; only the vertical neighbours need looking up.
 */
function closeAndSum(op: Operator5): boolean {
  const { n1, n2, gx, gy, reaction, boundary, active, diag } = op;
  const runs = op.runs!, rowRuns = op.rowRuns!;
  const withReaction = reaction.length > 0, withBoundary = boundary.length > 0;
  const stretches = new StretchList(n2);
  let from = 0; // diag is 0 off the runs
  let dropped = false;
  for (let j = 0; j < n2; j++) {
    const below = j > 0, above = j < n2 - 1;
    stretches.row(j);
    for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
      const first = runs[k], end = runs[k + 1];
      if (first > from) diag.fill(0, from, first);
      from = end;
      // The faces at the ends of the run lead to an inactive volume or out of the box.
      if (gx[first + j] !== 0) gx[first + j] = 0;
      if (gx[end + j] !== 0) gx[end + j] = 0;
      stretches.run(first);
      let streak = 0; // conductance of the current streak of volumes (stretches.ts)
      for (let c = first; c < end; c++) {
        const f = c + j; // face left of c in gx
        let so = gy[c], no = gy[c + n1];
        if (so !== 0 && !(below && active[c - n1] !== 0)) gy[c] = so = 0;
        if (no !== 0 && !(above && active[c + n1] !== 0)) gy[c + n1] = no = 0;
        const w = gx[f], e = gx[f + 1];
        const d = w + e + so + no + (withReaction ? reaction[c] : 0) + (withBoundary ? boundary[c] : 0);
        if (d > 0) {
          diag[c] = d;
        } else {
          active[c] = 0; // its faces are all 0 already (d is their sum)
          diag[c] = 0;
          dropped = true;
        }
        const g = below && above && w > 0 && w === e && w === so && w === no && d === 4 * w ? w : 0;
        if (g !== streak) stretches.change(c, (streak = g));
      }
      stretches.end(end);
    }
  }
  if (from < diag.length) diag.fill(0, from);
  op.stretches = stretches.done();
  return !dropped;
}

/** Runs and their first index per row from `active` alone (for an operator that was not finished). */
export function findRuns(op: Operator5): void {
  op.stretches = undefined;
  const { n1, n2, active } = op;
  const runs: number[] = [];
  const rowRuns = new Int32Array(n2 + 1);
  for (let j = 0; j < n2; j++) {
    rowRuns[j] = runs.length;
    const row = j * n1;
    let i = 0;
    while (i < n1) {
      while (i < n1 && !active[row + i]) i++;
      if (i === n1) break;
      runs.push(row + i);
      while (i < n1 && active[row + i]) i++;
      runs.push(row + i);
    }
  }
  rowRuns[n2] = runs.length;
  op.runs = Int32Array.from(runs);
  op.rowRuns = rowRuns;
}

/** The runs of active volumes (see Operator5.runs), found once. */
export function activeRuns(op: Operator5): Int32Array {
  if (!op.runs || !op.rowRuns) findRuns(op);
  return op.runs!;
}

/** What the kernels read besides the operator's arrays: the runs, their first index per row, the stretches. */
export interface Prepared {
  runs: Int32Array;
  rowRuns: Int32Array;
  stretches: Stretches;
}

/** The kernels' view of an operator; one that `finishOperator` did not make gets these derived here. */
export function prepared(op: Operator5): Prepared {
  const runs = activeRuns(op);
  op.stretches ??= findStretches(op);
  return { runs, rowRuns: op.rowRuns!, stretches: op.stretches };
}

/** (A x)_c on the active volumes only; inactive entries of `out` are left as they are. */
export function applyActive(op: Operator5, x: Float64Array, out: Float64Array): void {
  const { n1, gx, gy, diag } = op;
  const runs = activeRuns(op);
  for (let r = 0; r < runs.length; r += 2) {
    const end = runs[r + 1];
    const j = (runs[r] / n1) | 0; // gx index of the face left of volume c is c + j
    for (let c = runs[r]; c < end; c++) {
      const f = c + j;
      let s = diag[c] * x[c];
      const w = gx[f], e = gx[f + 1], so = gy[c], no = gy[c + n1];
      if (w !== 0) s -= w * x[c - 1];
      if (e !== 0) s -= e * x[c + 1];
      if (so !== 0) s -= so * x[c - n1];
      if (no !== 0) s -= no * x[c + n1];
      out[c] = s;
    }
  }
}

/** Sets the entries of v outside the active runs to 0. */
export function zeroInactive(op: Operator5, v: Float64Array): void {
  const runs = activeRuns(op);
  let from = 0;
  for (let r = 0; r < runs.length; r += 2) {
    if (runs[r] > from) v.fill(0, from, runs[r]);
    from = runs[r + 1];
  }
  if (from < v.length) v.fill(0, from, v.length);
}

/** out = A x (inactive volumes give 0). */
export function apply(op: Operator5, x: Float64Array, out: Float64Array): void {
  applyActive(op, x, out);
  zeroInactive(op, out);
}

/** r = b − A x (0 on inactive volumes). */
export function residual(op: Operator5, x: Float64Array, b: Float64Array, r: Float64Array): void {
  const { n1, gx, gy, diag } = op;
  const runs = activeRuns(op);
  for (let k = 0; k < runs.length; k += 2) {
    const end = runs[k + 1];
    const j = (runs[k] / n1) | 0;
    for (let c = runs[k]; c < end; c++) {
      const f = c + j;
      let s = b[c] - diag[c] * x[c];
      const w = gx[f], e = gx[f + 1], so = gy[c], no = gy[c + n1];
      if (w !== 0) s += w * x[c - 1];
      if (e !== 0) s += e * x[c + 1];
      if (so !== 0) s += so * x[c - n1];
      if (no !== 0) s += no * x[c + n1];
      r[c] = s;
    }
  }
  zeroInactive(op, r);
}

/** Bytes of the typed arrays an operator holds (its faces included, whether or not they are shared). */
export function operatorBytes(op: Operator5): number {
  const s = op.stretches;
  return op.gx.byteLength + op.gy.byteLength + op.reaction.byteLength + op.boundary.byteLength + op.diag.byteLength +
    op.active.byteLength + (op.runs?.byteLength ?? 0) + (op.rowRuns?.byteLength ?? 0) +
    (s ? s.bounds.byteLength + s.rowStart.byteLength + s.conductance.byteLength : 0);
}
