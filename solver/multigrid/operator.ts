/**
 * A symmetric five-point operator on an n1 × n2 box of control volumes (index c = i + j·n1),
 * written as face conductances plus a diagonal part:
 *
 *   (A x)_c = (Σ_faces g_f + reaction_c + boundary_c) x_c − Σ_faces g_f x_neighbour
 *
 * - `gx[(i) + j·(n1+1)]` is the conductance of the face between volumes (i−1, j) and (i, j);
 *   faces on the box edge and faces next to an inactive volume are 0.
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
}

export function createOperator(n1: number, n2: number): Operator5 {
  const n = n1 * n2;
  return {
    n1,
    n2,
    gx: new Float64Array((n1 + 1) * n2),
    gy: new Float64Array(n1 * (n2 + 1)),
    reaction: new Float64Array(n),
    boundary: new Float64Array(n),
    active: new Uint8Array(n),
    diag: new Float64Array(n),
  };
}

/**
 * Clears conductances that touch inactive volumes or the box edge, and computes the diagonal.
 * A volume whose diagonal is zero (no face, no reaction, no boundary) is made inactive.
 */
export function finishOperator(op: Operator5): Operator5 {
  const { n1, n2, gx, gy, reaction, boundary, active, diag } = op;
  // One pass: a face keeps its conductance only between two active volumes inside the box.
  for (let j = 0; j < n2; j++) {
    for (let i = 0; i < n1; i++) {
      const c = i + j * n1;
      const f = c + j; // face left of c in gx
      if (!active[c]) {
        gx[f] = 0;
        gx[f + 1] = 0;
        gy[c] = 0;
        gy[c + n1] = 0;
        diag[c] = 0;
        continue;
      }
      const w = i > 0 && active[c - 1] ? gx[f] : 0;
      const e = i < n1 - 1 && active[c + 1] ? gx[f + 1] : 0;
      const so = j > 0 && active[c - n1] ? gy[c] : 0;
      const no = j < n2 - 1 && active[c + n1] ? gy[c + n1] : 0;
      gx[f] = w;
      gx[f + 1] = e;
      gy[c] = so;
      gy[c + n1] = no;
      const d = w + e + so + no + reaction[c] + boundary[c];
      if (d > 0) {
        diag[c] = d;
      } else {
        active[c] = 0;
        diag[c] = 0;
      }
    }
  }
  op.runs = findRuns(op);
  return op;
}

function findRuns(op: Operator5): Int32Array {
  const { n1, n2, active } = op;
  let count = 0;
  for (let j = 0; j < n2; j++) {
    for (let i = 0; i < n1; i++) if (active[i + j * n1] && (i === 0 || !active[i - 1 + j * n1])) count++;
  }
  const runs = new Int32Array(2 * count);
  let k = 0;
  for (let j = 0; j < n2; j++) {
    const row = j * n1;
    let i = 0;
    while (i < n1) {
      while (i < n1 && !active[row + i]) i++;
      if (i === n1) break;
      runs[k++] = row + i;
      while (i < n1 && active[row + i]) i++;
      runs[k++] = row + i;
    }
  }
  return runs;
}

/** The runs of active volumes (see Operator5.runs), found once. */
export function activeRuns(op: Operator5): Int32Array {
  return op.runs ?? (op.runs = findRuns(op));
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
