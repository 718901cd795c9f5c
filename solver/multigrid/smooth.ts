import { prepared, type Operator5 } from './operator';

/**
 * Red–black Gauss–Seidel relaxation of A x = b, row by row over the runs of active volumes. The colour of
 * volume (i, j) is (i + j) mod 2; a volume of one colour has neighbours of the other only, so the volumes of a
 * colour can be relaxed in any order, and one colour in row j needs the other colour only in rows j − 1 … j + 1.
 *
 * The stencils carry no tests: inside rows 1 … n2 − 2 every neighbour index exists, a closed face is 0, and x
 * is finite everywhere (the solvers keep it 0 off the active volumes), so g·x_neighbour adds exactly 0 across
 * a closed face. The first and last rows, whose outer neighbours lie outside the arrays, keep the tests.
 * Each update multiplies by the stored 1 / diag (Operator5.inverseDiag).
 */

/** x_c = (b_c + Σ g x_nb) / d_c for the volumes of `colour` in row j. */
export function relaxRow(op: Operator5, x: Float64Array, b: Float64Array, j: number, colour: number): void {
  if (j === 0 || j === op.n2 - 1) {
    relaxOnEdge(op.n1, op.gx, op.gy, op.inverseDiag!, op.runs!, op.rowRuns!, x, b, j, colour);
    return;
  }
  const { n1, gx, gy } = op;
  const runs = op.runs!, rowRuns = op.rowRuns!, inv = op.inverseDiag!;
  const shift = j * n1 - j - colour; // (c − shift) & 1 is 0 on the volumes of `colour`
  for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
    const first = runs[k], end = runs[k + 1];
    let c = first + ((first - shift) & 1);
    let west = x[c - 1]; // the east neighbour of one volume is the west one of the next
    for (; c < end; c += 2) {
      const f = c + j; // gx index of the face left of c
      const east = x[c + 1];
      x[c] = (b[c] + gx[f] * west + gx[f + 1] * east + gy[c] * x[c - n1] + gy[c + n1] * x[c + n1]) * inv[c];
      west = east;
    }
  }
}

function relaxOnEdge(
  n1: number, gx: Float64Array, gy: Float64Array, inv: Float64Array, runs: Int32Array, rowRuns: Int32Array,
  x: Float64Array, b: Float64Array, j: number, colour: number,
): void {
  const shift = j * n1 - j - colour;
  for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
    const first = runs[k], end = runs[k + 1];
    for (let c = first + ((first - shift) & 1); c < end; c += 2) {
      const f = c + j;
      let s = b[c];
      const w = gx[f], e = gx[f + 1], so = gy[c], no = gy[c + n1];
      if (w !== 0) s += w * x[c - 1];
      if (e !== 0) s += e * x[c + 1];
      if (so !== 0) s += so * x[c - n1];
      if (no !== 0) s += no * x[c + n1];
      x[c] = s * inv[c];
    }
  }
}

/** x_c = b_c / d_c for the volumes of colour 0 in row j: their relaxation when every x is 0. */
function relaxRowFromZero(op: Operator5, x: Float64Array, b: Float64Array, j: number): void {
  const runs = op.runs!, rowRuns = op.rowRuns!, inv = op.inverseDiag!;
  const shift = j * op.n1 - j;
  for (let k = rowRuns[j], last = rowRuns[j + 1]; k < last; k += 2) {
    const end = runs[k + 1];
    for (let c = runs[k] + ((runs[k] - shift) & 1); c < end; c += 2) x[c] = b[c] * inv[c];
  }
}

/**
 * One red–black Gauss–Seidel sweep on A x = b. `first` is the colour relaxed first ((i + j) % 2);
 * a sweep with colours (0, 1) followed later by one with (1, 0) keeps the V-cycle symmetric, as
 * conjugate gradients needs of its preconditioner. Only the runs of active volumes are visited, and the
 * two colours in one pass: the second colour follows one row behind the first, which has then been
 * relaxed in every row the second reads (the same result as two passes, with the rows still in cache).
 * x must be finite off the active volumes.
 */
export function smoothRedBlack(op: Operator5, x: Float64Array, b: Float64Array, first: 0 | 1): void {
  prepared(op);
  const n2 = op.n2, second = 1 - first;
  for (let j = 0; j <= n2; j++) {
    if (j < n2) relaxRow(op, x, b, j, first);
    if (j > 0) relaxRow(op, x, b, j - 1, second);
  }
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
