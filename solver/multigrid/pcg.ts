import { directionAndProduct, dotOnRuns, residualAndNorms, stepAndNorm } from './cg-kernels';
import { activeRuns, zeroInactive, type Operator5 } from './operator';

const { sqrt } = Math;

export interface KrylovResult {
  iterations: number;
  /** Final ‖b − A x‖₂ / ‖b‖₂ (1 when b = 0 is not the case and nothing converged). */
  relativeResidual: number;
  converged: boolean;
  history: number[];
}

/** The three work vectors of `pcg` (residual, direction, and one for both A p and the preconditioned residual). */
export interface PcgWorkspace {
  r: Float64Array;
  p: Float64Array;
  q: Float64Array;
}

/** Work vectors for `pcg` on `op`, reusable for every solve with it (they stay 0 off its active volumes). */
export function pcgWorkspace(op: Operator5): PcgWorkspace {
  const n = op.n1 * op.n2;
  return { r: new Float64Array(n), p: new Float64Array(n), q: new Float64Array(n) };
}

export interface PcgOptions {
  tolerance?: number;
  maxIterations?: number;
  /**
   * z = M⁻¹ r; M must be symmetric positive definite. Every active entry of z must be written (z holds A p from
   * the previous step on entry), and z's other entries left at 0.
   */
  precondition: (r: Float64Array, z: Float64Array) => void;
  /** Called after each iteration with the relative residual; return false to stop (cancellation). */
  onIteration?: (iteration: number, relativeResidual: number) => boolean | void;
  /** Work vectors from `pcgWorkspace(op)`; allocated for this solve when absent. */
  workspace?: PcgWorkspace;
}

/**
 * Preconditioned conjugate gradients for a symmetric positive definite Operator5
 * (Hestenes & Stiefel 1952; Saad, Iterative Methods for Sparse Linear Systems, 2nd ed. 2003, alg. 9.1).
 * x holds the initial guess on entry (its entries off the active volumes are set to 0) and the solution on exit.
 *
 * Three work vectors: A p and z = M⁻¹ r share one, as A p is spent once r is updated. Each iteration makes two
 * passes besides the preconditioner and one dot product: p ← z + β p fused with q ← A p and pᵀq, then
 * x ← x + α p and r ← r − α q fused with ‖r‖² (cg-kernels.ts).
 */
export function pcg(op: Operator5, b: Float64Array, x: Float64Array, options: PcgOptions): KrylovResult {
  const tol = options.tolerance ?? 1e-8;
  const maxIt = options.maxIterations ?? 200;
  const runs = activeRuns(op);
  const { r, p, q } = options.workspace ?? pcgWorkspace(op);
  zeroInactive(op, x);
  const [bb, rr0] = residualAndNorms(op, x, b, r, q);
  const bnorm = sqrt(bb);
  const history: number[] = [];
  if (bnorm === 0) {
    x.fill(0);
    return { iterations: 0, relativeResidual: 0, converged: true, history };
  }
  history.push(sqrt(rr0) / bnorm);
  if (history[0] <= tol) return { iterations: 0, relativeResidual: history[0], converged: true, history };
  options.precondition(r, q);
  let rz = dotOnRuns(r, q, runs);
  let beta = 0;
  let it = 0;
  while (it < maxIt) {
    it++;
    const alpha = rz / directionAndProduct(op, q, beta, p, q);
    const rel = sqrt(stepAndNorm(op, alpha, p, q, x, r)) / bnorm;
    history.push(rel);
    if (rel <= tol) break;
    if (options.onIteration?.(it, rel) === false) break;
    options.precondition(r, q);
    const rzNew = dotOnRuns(r, q, runs);
    beta = rzNew / rz;
    rz = rzNew;
  }
  const rel = history[history.length - 1];
  return { iterations: it, relativeResidual: rel, converged: rel <= tol, history };
}

export function dot(a: Float64Array, b: Float64Array, active: Uint8Array): number {
  let s = 0;
  for (let c = 0; c < a.length; c++) if (active[c]) s += a[c] * b[c];
  return s;
}
