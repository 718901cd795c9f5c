import type { Operator5 } from './operator';

/**
 * One red–black Gauss–Seidel sweep on A x = b. `first` is the colour relaxed first ((i + j) % 2);
 * a sweep with colours (0, 1) followed later by one with (1, 0) keeps the V-cycle symmetric, as
 * conjugate gradients needs of its preconditioner.
 */
export function smoothRedBlack(op: Operator5, x: Float64Array, b: Float64Array, first: 0 | 1): void {
  relaxColour(op, x, b, first);
  relaxColour(op, x, b, (1 - first) as 0 | 1);
}

function relaxColour(op: Operator5, x: Float64Array, b: Float64Array, colour: 0 | 1): void {
  const { n1, n2, gx, gy, diag, active } = op;
  const sx = n1 + 1;
  for (let j = 0; j < n2; j++) {
    const row = j * n1;
    const rowx = j * sx;
    for (let i = (j + colour) & 1; i < n1; i += 2) {
      const c = row + i;
      if (!active[c]) continue;
      let s = b[c];
      const w = gx[rowx + i];
      const e = gx[rowx + i + 1];
      const so = gy[c];
      const no = gy[c + n1];
      if (w !== 0) s += w * x[c - 1];
      if (e !== 0) s += e * x[c + 1];
      if (so !== 0) s += so * x[c - n1];
      if (no !== 0) s += no * x[c + n1];
      x[c] = s / diag[c];
    }
  }
}
