import { clearOnRuns, prolongRow, restrictRow } from './coarsen';
import { prepared, type Operator5 } from './operator';

/**
 * Red–black Gauss–Seidel relaxation of A x = b, row by row over the stretches of active volumes (stretches.ts).
 * The colour of volume (i, j) is (i + j) mod 2; a volume of one colour has neighbours of the other only, so the
 * volumes of a colour can be relaxed in any order, and one colour in row j needs the other only in rows j − 1 … j + 1.
 *
 * The stencils carry no tests: inside rows 1 … n2 − 2 every neighbour index exists, a closed face is 0, and x
 * is finite everywhere (the solvers keep it 0 off the active volumes), so g·x_neighbour adds exactly 0 across
 * a closed face. The first and last rows, whose outer neighbours lie outside the arrays, keep the tests.
 * Uniform volumes read no coefficient at all (one reciprocal per stretch); general ones divide by diag.
 *
 * Passes are fused row by row: the second colour of a sweep follows one row behind the first, and the
 * restriction (or the prolongation) one row behind the sweep it follows, so each row is read once while in
 * cache (the fusion of red–black Gauss–Seidel with residual and transfers of C. C. Douglas, J. Hu,
 * M. Kowarschik, U. Rüde & C. Weiss, Electron. Trans. Numer. Anal. 10, 21 (2000)).
 */

/** x_c = (b_c + Σ g x_nb) / d_c for the volumes of `colour` in row j. */
export function relaxRow(op: Operator5, x: Float64Array, b: Float64Array, j: number, colour: number): void {
  const { n1, n2, gx, gy, diag } = op;
  const { bounds, rowStart, conductance } = op.stretches!;
  const shift = j * n1 - j - colour; // (c − shift) & 1 is 0 on the volumes of `colour`
  const inside = j > 0 && j < n2 - 1;
  for (let s = rowStart[j], last = rowStart[j + 1]; s < last; s++) {
    const first = bounds[2 * s], end = bounds[2 * s + 1];
    const start = first + ((first - shift) & 1);
    const g = conductance[s];
    if (g > 0) relaxUniform(n1, g, x, b, start, end);
    else if (inside) relaxGeneral(n1, gx, gy, diag, x, b, j, start, end);
    else relaxOnEdge(n1, gx, gy, diag, x, b, j, start, end);
  }
}

/** Every other volume from `start` to `end`, all with four faces g and diagonal 4g. */
function relaxUniform(n1: number, g: number, x: Float64Array, b: Float64Array, start: number, end: number): void {
  const inv = 1 / (4 * g); // diag = 4g exactly there
  let c = start;
  for (; c + 2 < end; c += 4) {
    x[c] = (b[c] + g * (x[c - 1] + x[c + 1] + x[c - n1] + x[c + n1])) * inv;
    const d = c + 2;
    x[d] = (b[d] + g * (x[d - 1] + x[d + 1] + x[d - n1] + x[d + n1])) * inv;
  }
  if (c < end) x[c] = (b[c] + g * (x[c - 1] + x[c + 1] + x[c - n1] + x[c + n1])) * inv;
}

function relaxGeneral(
  n1: number, gx: Float64Array, gy: Float64Array, diag: Float64Array,
  x: Float64Array, b: Float64Array, j: number, start: number, end: number,
): void {
  for (let c = start; c < end; c += 2) {
    const f = c + j; // gx index of the face left of c
    x[c] = (b[c] + gx[f] * x[c - 1] + gx[f + 1] * x[c + 1] + gy[c] * x[c - n1] + gy[c + n1] * x[c + n1]) / diag[c];
  }
}

function relaxOnEdge(
  n1: number, gx: Float64Array, gy: Float64Array, diag: Float64Array,
  x: Float64Array, b: Float64Array, j: number, start: number, end: number,
): void {
  for (let c = start; c < end; c += 2) {
    const f = c + j;
    let s = b[c];
    const w = gx[f], e = gx[f + 1], so = gy[c], no = gy[c + n1];
    if (w !== 0) s += w * x[c - 1];
    if (e !== 0) s += e * x[c + 1];
    if (so !== 0) s += so * x[c - n1];
    if (no !== 0) s += no * x[c + n1];
    x[c] = s / diag[c];
  }
}

/** x_c = b_c / d_c for the volumes of colour 0 in row j: their relaxation when every x is 0. */
export function relaxRowFromZero(op: Operator5, x: Float64Array, b: Float64Array, j: number): void {
  const { diag } = op;
  const { bounds, rowStart, conductance } = op.stretches!;
  const shift = j * op.n1 - j;
  for (let s = rowStart[j], last = rowStart[j + 1]; s < last; s++) {
    const first = bounds[2 * s], end = bounds[2 * s + 1];
    const g = conductance[s];
    if (g > 0) {
      const inv = 1 / (4 * g);
      for (let c = first + ((first - shift) & 1); c < end; c += 2) x[c] = b[c] * inv;
    } else {
      for (let c = first + ((first - shift) & 1); c < end; c += 2) x[c] = b[c] / diag[c];
    }
  }
}

/**
 * One red–black Gauss–Seidel sweep on A x = b. `first` is the colour relaxed first ((i + j) % 2);
 * a sweep with colours (0, 1) followed later by one with (1, 0) keeps the V-cycle symmetric, as
 * conjugate gradients needs of its preconditioner. Only the runs of active volumes are visited, and the
 * two colours in one pass: the second colour follows one row behind the first, which has then been
 * relaxed in every row the second reads (the same result as two passes, with the rows still in cache).
 * x must be finite off the active volumes. With `dot`, returns bᵀx after the sweep, each row summed as soon as
 * both its colours are done (0 otherwise).
 */
export function smoothRedBlack(op: Operator5, x: Float64Array, b: Float64Array, first: 0 | 1, dot = false): number {
  prepared(op);
  const n2 = op.n2, second = 1 - first;
  let bx = 0;
  for (let j = 0; j <= n2; j++) {
    if (j < n2) relaxRow(op, x, b, j, first);
    if (j > 0) {
      relaxRow(op, x, b, j - 1, second);
      if (dot) bx += dotRow(op, b, x, j - 1);
    }
  }
  return bx;
}

/** Σ a_c b_c over the active volumes of row j. */
export function dotRow(op: Operator5, a: Float64Array, b: Float64Array, j: number): number {
  const runs = op.runs!, rowRuns = op.rowRuns!;
  let s = 0;
  for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) for (let c = runs[k], end = runs[k + 1]; c < end; c++) s += a[c] * b[c];
  return s;
}

/**
 * The sweep smoothRedBlack(op, x, b, 0) from x = 0 on the active volumes, without reading them: colour 0
 * becomes b / d, colour 1 is relaxed as usual. Every active entry of x is written; x must be finite elsewhere.
 */
export function smoothRedBlackFromZero(op: Operator5, x: Float64Array, b: Float64Array): void {
  prepared(op);
  for (let j = 0; j <= op.n2; j++) {
    if (j < op.n2) relaxRowFromZero(op, x, b, j);
    if (j > 0) relaxRow(op, x, b, j - 1, 1);
  }
}

/**
 * smoothRedBlack(op, x, b, 0) followed by restrictResidual(op, x, b, coarse, rc) in one pass: the residual of
 * row j − 2 is restricted once the black volumes of row j − 1 are relaxed, the last its red volumes depend on.
 */
export function smoothAndRestrict(op: Operator5, x: Float64Array, b: Float64Array, coarse: Operator5, rc: Float64Array): void {
  prepared(op);
  clearOnRuns(coarse, rc);
  const n2 = op.n2, cn1 = coarse.n1;
  for (let j = 0; j <= n2 + 1; j++) {
    if (j < n2) relaxRow(op, x, b, j, 0);
    if (j > 0 && j <= n2) relaxRow(op, x, b, j - 1, 1);
    if (j > 1) restrictRow(op, x, b, cn1, rc, j - 2);
  }
}

/**
 * prolongCorrection(op, x, coarse, xc) followed by smoothRedBlack(op, x, b, 1, dot) in one pass: row j is
 * corrected, then the black volumes of row j − 1 and the red ones of row j − 2 are relaxed.
 */
export function prolongAndSmooth(op: Operator5, x: Float64Array, b: Float64Array, coarse: Operator5, xc: Float64Array, dot = false): number {
  prepared(op);
  const n2 = op.n2, cn1 = coarse.n1;
  let bx = 0;
  for (let j = 0; j <= n2 + 1; j++) {
    if (j < n2) prolongRow(op, x, cn1, xc, j);
    if (j > 0 && j <= n2) relaxRow(op, x, b, j - 1, 1);
    if (j > 1) {
      relaxRow(op, x, b, j - 2, 0);
      if (dot) bx += dotRow(op, b, x, j - 2);
    }
  }
  return bx;
}
