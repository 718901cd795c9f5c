import { minres } from './minres';

/** A small symmetric saddle-point matrix [A Bᵀ; B 0] with A SPD, dense, from a fixed pseudo-random sequence. */
function saddle(nu: number, np: number): number[][] {
  let seed = 12345;
  const rand = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648) * 2 - 1;
  const n = nu + np;
  const K = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  const G = Array.from({ length: nu }, () => Array.from({ length: nu }, rand));
  for (let i = 0; i < nu; i++) {
    for (let j = 0; j < nu; j++) {
      let s = i === j ? nu : 0;
      for (let k = 0; k < nu; k++) s += G[i][k] * G[j][k];
      K[i][j] = s;
    }
  }
  for (let p = 0; p < np; p++) {
    for (let i = 0; i < nu; i++) {
      const b = rand();
      K[nu + p][i] = b;
      K[i][nu + p] = b;
    }
  }
  return K;
}

function denseSolve(K: number[][], b: number[]): number[] {
  const n = b.length;
  const M = K.map((row, i) => [...row, b[i]]);
  for (let k = 0; k < n; k++) {
    let piv = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(M[i][k]) > Math.abs(M[piv][k])) piv = i;
    [M[k], M[piv]] = [M[piv], M[k]];
    for (let i = k + 1; i < n; i++) {
      const f = M[i][k] / M[k][k];
      for (let j = k; j <= n; j++) M[i][j] -= f * M[k][j];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    let s = M[i][n];
    for (let j = i + 1; j < n; j++) s -= M[i][j] * x[j];
    x[i] = s / M[i][i];
  }
  return x;
}

describe('preconditioned MINRES (Paige & Saunders 1975)', () => {
  const nu = 12, np = 5, n = nu + np;
  const K = saddle(nu, np);
  const rhs = Array.from({ length: n }, (_, i) => Math.cos(i + 1));
  const exact = denseSolve(K, rhs);
  const applyK = (z: Float64Array, out: Float64Array, beta: number) => {
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let j = 0; j < n; j++) s += K[i][j] * z[j];
      out[i] = beta === 0 ? s : s - beta * out[i];
    }
  };

  it('solves a symmetric indefinite system, unpreconditioned, in at most n steps', () => {
    const x = new Float64Array(n);
    const res = minres(applyK, (r, z) => z.set(r), Float64Array.from(rhs), x, { tolerance: 1e-12, maxIterations: 3 * n });
    expect(res.converged).toBe(true);
    for (let i = 0; i < n; i++) expect(x[i]).toBeCloseTo(exact[i], 8);
  });

  it('solves it with a symmetric positive definite block-diagonal preconditioner, residuals never growing', () => {
    // M = diag(diag(A), |Schur| estimated by B diag(A)⁻¹ Bᵀ's diagonal): the kind of preconditioner the flow uses.
    const m = new Float64Array(n);
    for (let i = 0; i < nu; i++) m[i] = K[i][i];
    for (let p = 0; p < np; p++) for (let i = 0; i < nu; i++) m[nu + p] += K[nu + p][i] ** 2 / K[i][i];
    const x = new Float64Array(n);
    const res = minres(applyK, (r, z) => { for (let i = 0; i < n; i++) z[i] = r[i] / m[i]; }, Float64Array.from(rhs), x, { tolerance: 1e-12 });
    expect(res.converged).toBe(true);
    for (let i = 0; i < n; i++) expect(x[i]).toBeCloseTo(exact[i], 8);
    for (let k = 1; k < res.history.length; k++) expect(res.history[k]).toBeLessThanOrEqual(res.history[k - 1] * (1 + 1e-12));
    // The tracked residual is the true one: check ‖b − K x‖ independently.
    const r = new Float64Array(n);
    applyK(x, r, 0);
    const err = Math.hypot(...rhs.map((b, i) => b - r[i])) / Math.hypot(...rhs);
    expect(err).toBeLessThan(1e-10);
  });

  it('returns zero for a zero right-hand side', () => {
    const x = new Float64Array(n).fill(7);
    const res = minres(applyK, (r, z) => z.set(r), new Float64Array(n), x);
    expect(res.iterations).toBe(0);
    expect([...x].every((v) => v === 0)).toBe(true);
  });
});
