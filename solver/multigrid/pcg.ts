import { apply, type Operator5 } from './operator';

export interface KrylovResult {
  iterations: number;
  /** Final ‖b − A x‖₂ / ‖b‖₂ (1 when b = 0 is not the case and nothing converged). */
  relativeResidual: number;
  converged: boolean;
  history: number[];
}

export interface PcgOptions {
  tolerance?: number;
  maxIterations?: number;
  /** z = M⁻¹ r; M must be symmetric positive definite. */
  precondition: (r: Float64Array, z: Float64Array) => void;
  /** Called after each iteration with the relative residual; return false to stop (cancellation). */
  onIteration?: (iteration: number, relativeResidual: number) => boolean | void;
}

/**
 * Preconditioned conjugate gradients for a symmetric positive definite Operator5
 * (Hestenes & Stiefel 1952; Saad, Iterative Methods for Sparse Linear Systems, 2nd ed. 2003, alg. 9.1).
 * x holds the initial guess on entry and the solution on exit.
 */
export function pcg(op: Operator5, b: Float64Array, x: Float64Array, options: PcgOptions): KrylovResult {
  const tol = options.tolerance ?? 1e-8;
  const maxIt = options.maxIterations ?? 200;
  const n = b.length;
  const { active } = op;
  const r = new Float64Array(n);
  const z = new Float64Array(n);
  const p = new Float64Array(n);
  const q = new Float64Array(n);
  apply(op, x, q);
  let bnorm = 0;
  for (let c = 0; c < n; c++) {
    if (!active[c]) continue;
    r[c] = b[c] - q[c];
    bnorm += b[c] * b[c];
  }
  bnorm = Math.sqrt(bnorm);
  const history: number[] = [];
  if (bnorm === 0) {
    x.fill(0);
    return { iterations: 0, relativeResidual: 0, converged: true, history };
  }
  let rnorm = norm(r, active);
  history.push(rnorm / bnorm);
  if (rnorm / bnorm <= tol) return { iterations: 0, relativeResidual: rnorm / bnorm, converged: true, history };
  options.precondition(r, z);
  p.set(z);
  let rz = dot(r, z, active);
  let it = 0;
  while (it < maxIt) {
    it++;
    apply(op, p, q);
    const alpha = rz / dot(p, q, active);
    for (let c = 0; c < n; c++) {
      if (!active[c]) continue;
      x[c] += alpha * p[c];
      r[c] -= alpha * q[c];
    }
    rnorm = norm(r, active);
    const rel = rnorm / bnorm;
    history.push(rel);
    if (rel <= tol) break;
    if (options.onIteration?.(it, rel) === false) break;
    options.precondition(r, z);
    const rzNew = dot(r, z, active);
    const beta = rzNew / rz;
    rz = rzNew;
    for (let c = 0; c < n; c++) if (active[c]) p[c] = z[c] + beta * p[c];
  }
  const rel = history[history.length - 1];
  return { iterations: it, relativeResidual: rel, converged: rel <= tol, history };
}

export function dot(a: Float64Array, b: Float64Array, active: Uint8Array): number {
  let s = 0;
  for (let c = 0; c < a.length; c++) if (active[c]) s += a[c] * b[c];
  return s;
}

function norm(a: Float64Array, active: Uint8Array): number {
  return Math.sqrt(dot(a, a, active));
}
