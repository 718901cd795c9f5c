import { activeRuns, type Operator5 } from './operator';

/**
 * One red–black Gauss–Seidel sweep on A x = b. `first` is the colour relaxed first ((i + j) % 2);
 * a sweep with colours (0, 1) followed later by one with (1, 0) keeps the V-cycle symmetric, as
 * conjugate gradients needs of its preconditioner. Only the runs of active volumes are visited.
 */
export function smoothRedBlack(op: Operator5, x: Float64Array, b: Float64Array, first: 0 | 1): void {
  relaxColour(op, x, b, first);
  relaxColour(op, x, b, (1 - first) as 0 | 1);
}

function relaxColour(op: Operator5, x: Float64Array, b: Float64Array, colour: 0 | 1): void {
  const { n1, gx, gy, diag } = op;
  const runs = activeRuns(op);
  for (let r = 0; r < runs.length; r += 2) {
    const first = runs[r], end = runs[r + 1];
    const j = (first / n1) | 0; // gx index of the face left of volume c is c + j
    const i = first - j * n1;
    for (let c = first + ((i + j + colour) & 1); c < end; c += 2) {
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
}
