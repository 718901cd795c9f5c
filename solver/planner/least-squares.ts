import { Matrix, SVD } from 'ml-matrix';

/**
 * min ‖A x − b‖₂ subject to lo ≤ x ≤ hi, for the few unknowns of a voltage plan. Active-set method in the manner
 * of Lawson & Hanson (Solving Least Squares Problems, 1974, ch. 23; Stark & Parker's BVLS, 1995): solve the free
 * variables by SVD (minimum-norm when the targets leave freedom), clamp the worst bound violation, and release a
 * clamped variable whose gradient points back inside, until neither happens.
 */
export function boundedLeastSquares(A: number[][], b: number[], lo: number[], hi: number[]): number[] {
  const n = lo.length;
  const x = new Array<number>(n).fill(0);
  const clamped = new Array<number>(n).fill(0); // 0 free, −1 at lo, +1 at hi
  for (let pass = 0; pass < 4 * n + 4; pass++) {
    const free = [...Array(n).keys()].filter((j) => clamped[j] === 0);
    // Right-hand side without the clamped variables' contribution.
    const rhs = b.map((bi, i) => bi - A[i].reduce((s, a, j) => (clamped[j] ? s + a * x[j] : s), 0));
    if (free.length) {
      const Af = new Matrix(A.map((row) => free.map((j) => row[j])));
      const xf = new SVD(Af, { autoTranspose: true }).solve(Matrix.columnVector(rhs)).getColumn(0);
      free.forEach((j, k) => (x[j] = xf[k]));
    }
    // Worst violation among the free variables.
    let worst = -1;
    let excess = 0;
    for (const j of free) {
      const e = Math.max(lo[j] - x[j], x[j] - hi[j]);
      if (e > excess * (1 + 1e-12) && e > 1e-12 * (1 + Math.abs(x[j]))) {
        excess = e;
        worst = j;
      }
    }
    if (worst >= 0) {
      clamped[worst] = x[worst] < lo[worst] ? -1 : 1;
      x[worst] = clamped[worst] < 0 ? lo[worst] : hi[worst];
      continue;
    }
    // Release a clamped variable if moving it inwards lowers the residual (gradient g = Aᵀ(Ax − b)).
    let release = -1;
    for (let j = 0; j < n; j++) {
      if (!clamped[j]) continue;
      let g = 0;
      for (let i = 0; i < A.length; i++) g += A[i][j] * (A[i].reduce((s, a, k) => s + a * x[k], 0) - b[i]);
      if ((clamped[j] > 0 && g > 1e-14) || (clamped[j] < 0 && g < -1e-14)) {
        release = j;
        break;
      }
    }
    if (release < 0) break;
    clamped[release] = 0;
  }
  return x;
}
