import type { Operator5 } from './operator';

/**
 * Exact solve of a small operator by Cholesky factorisation (A = L Lᵀ) of its active part,
 * used on the coarsest multigrid level.
 */
export interface DenseSolver {
  solve(b: Float64Array, x: Float64Array): void;
}

export function denseSolver(op: Operator5): DenseSolver {
  const { n1, n2, active } = op;
  const index = new Int32Array(n1 * n2).fill(-1);
  const cells: number[] = [];
  for (let c = 0; c < n1 * n2; c++) if (active[c]) index[c] = cells.push(c) - 1;
  const m = cells.length;
  const L = new Float64Array(m * m);
  const sx = n1 + 1;
  for (let k = 0; k < m; k++) {
    const c = cells[k];
    const i = c % n1;
    const j = (c - i) / n1;
    L[k * m + k] = op.diag[c];
    const couple = (nb: number, g: number) => {
      if (g !== 0 && index[nb] >= 0) L[k * m + index[nb]] = -g;
    };
    if (i > 0) couple(c - 1, op.gx[i + j * sx]);
    if (i < n1 - 1) couple(c + 1, op.gx[i + 1 + j * sx]);
    if (j > 0) couple(c - n1, op.gy[c]);
    if (j < n2 - 1) couple(c + n1, op.gy[c + n1]);
  }
  // In-place Cholesky, lower triangle.
  for (let k = 0; k < m; k++) {
    let d = L[k * m + k];
    for (let p = 0; p < k; p++) d -= L[k * m + p] * L[k * m + p];
    d = Math.sqrt(Math.max(d, 1e-300));
    L[k * m + k] = d;
    for (let r = k + 1; r < m; r++) {
      let s = L[r * m + k];
      for (let p = 0; p < k; p++) s -= L[r * m + p] * L[k * m + p];
      L[r * m + k] = s / d;
    }
  }
  const y = new Float64Array(m);
  return {
    solve(b, x) {
      for (let k = 0; k < m; k++) {
        let s = b[cells[k]];
        for (let p = 0; p < k; p++) s -= L[k * m + p] * y[p];
        y[k] = s / L[k * m + k];
      }
      for (let k = m - 1; k >= 0; k--) {
        let s = y[k];
        for (let p = k + 1; p < m; p++) s -= L[p * m + k] * y[p];
        y[k] = s / L[k * m + k];
      }
      x.fill(0);
      for (let k = 0; k < m; k++) x[cells[k]] = y[k];
    },
  };
}
