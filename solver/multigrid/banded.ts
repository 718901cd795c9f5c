import type { Operator5 } from './operator';

/**
 * Exact solve of a small operator by banded Cholesky factorisation (A = L Lᵀ) of its active part,
 * used on the coarsest multigrid level (G. H. Golub & C. F. Van Loan, Matrix Computations, 4th ed.
 * 2013, §4.3.5). The active volumes are numbered along the shorter side of the box, so every
 * coupling lies within `bandwidth` ≤ min(n1, n2) of the diagonal: the factorisation costs about
 * m·bandwidth² and each solve 4·m·bandwidth operations for m active volumes.
 */
export interface CoarsestSolver {
  solve(b: Float64Array, x: Float64Array): void;
  unknowns: number;
  bandwidth: number;
}

/** Active volumes in band order (x fastest when n1 ≤ n2, else y fastest), and the bandwidth. */
export function bandOrder(op: Operator5): { cells: Int32Array; index: Int32Array; bandwidth: number } {
  const { n1, n2, active } = op;
  const index = new Int32Array(n1 * n2).fill(-1);
  const cells: number[] = [];
  if (n1 <= n2) {
    for (let c = 0; c < n1 * n2; c++) if (active[c]) index[c] = cells.push(c) - 1;
  } else {
    for (let i = 0; i < n1; i++) for (let j = 0; j < n2; j++) {
      const c = i + j * n1;
      if (active[c]) index[c] = cells.push(c) - 1;
    }
  }
  let bandwidth = 0;
  forEachCoupling(op, index, (k, l) => { bandwidth = Math.max(bandwidth, Math.abs(k - l)); });
  return { cells: Int32Array.from(cells), index, bandwidth };
}

/** Calls f(k, l, g) for every coupling of active volumes k → l (in band numbering) with conductance g. */
function forEachCoupling(op: Operator5, index: Int32Array, f: (k: number, l: number, g: number) => void): void {
  const { n1, n2, gx, gy } = op;
  const sx = n1 + 1;
  for (let j = 0; j < n2; j++) {
    for (let i = 0; i < n1; i++) {
      const c = i + j * n1;
      const k = index[c];
      if (k < 0) continue;
      if (i < n1 - 1 && gx[i + 1 + j * sx] !== 0 && index[c + 1] >= 0) f(k, index[c + 1], gx[i + 1 + j * sx]);
      if (j < n2 - 1 && gy[c + n1] !== 0 && index[c + n1] >= 0) f(k, index[c + n1], gy[c + n1]);
    }
  }
}

/** An upper bound of the factorisation cost m·(bandwidth + 1)² of an operator with m active volumes. */
export function bandedCost(op: Operator5, activeVolumes: number): number {
  return activeVolumes * (Math.min(op.n1, op.n2) + 1) ** 2;
}

export function coarsestSolver(op: Operator5): CoarsestSolver {
  const { cells, index, bandwidth: w } = bandOrder(op);
  const m = cells.length;
  const stride = w + 1;
  // Row k holds L[k][k−w .. k] at band[k·stride + (p − k + w)].
  const band = new Float64Array(m * stride);
  for (let k = 0; k < m; k++) band[k * stride + w] = op.diag[cells[k]];
  forEachCoupling(op, index, (k, l, g) => {
    const hi = Math.max(k, l), lo = Math.min(k, l);
    band[hi * stride + (lo - hi + w)] = -g;
  });
  for (let k = 0; k < m; k++) {
    const rowK = k * stride;
    const first = Math.max(0, k - w);
    for (let p = first; p < k; p++) {
      // L[k][p] = (A[k][p] − Σ_{q<p} L[k][q] L[p][q]) / L[p][p]
      const rowP = p * stride;
      let s = band[rowK + (p - k + w)];
      for (let q = Math.max(first, p - w); q < p; q++) s -= band[rowK + (q - k + w)] * band[rowP + (q - p + w)];
      band[rowK + (p - k + w)] = s / band[rowP + w];
    }
    let d = band[rowK + w];
    for (let q = first; q < k; q++) d -= band[rowK + (q - k + w)] ** 2;
    band[rowK + w] = Math.sqrt(Math.max(d, 1e-300));
  }
  const y = new Float64Array(m);
  return {
    unknowns: m,
    bandwidth: w,
    solve(b, x) {
      for (let k = 0; k < m; k++) {
        let s = b[cells[k]];
        for (let q = Math.max(0, k - w); q < k; q++) s -= band[k * stride + (q - k + w)] * y[q];
        y[k] = s / band[k * stride + w];
      }
      for (let k = m - 1; k >= 0; k--) {
        let s = y[k];
        for (let r = k + 1; r <= Math.min(m - 1, k + w); r++) s -= band[r * stride + (k - r + w)] * y[r];
        y[k] = s / band[k * stride + w];
      }
      x.fill(0);
      for (let k = 0; k < m; k++) x[cells[k]] = y[k];
    },
  };
}
