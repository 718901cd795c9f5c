import { activeRuns, applyActive, type Operator5 } from './operator';

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
  const runs = activeRuns(op);
  // Work vectors are touched on the active runs only, so they stay 0 elsewhere.
  const r = new Float64Array(n);
  const z = new Float64Array(n);
  const p = new Float64Array(n);
  const q = new Float64Array(n);
  applyActive(op, x, q);
  let bnorm = 0;
  for (let k = 0; k < runs.length; k += 2) {
    for (let c = runs[k]; c < runs[k + 1]; c++) {
      r[c] = b[c] - q[c];
      bnorm += b[c] * b[c];
    }
  }
  bnorm = Math.sqrt(bnorm);
  const history: number[] = [];
  if (bnorm === 0) {
    x.fill(0);
    return { iterations: 0, relativeResidual: 0, converged: true, history };
  }
  let rnorm = Math.sqrt(dotRuns(r, r, runs));
  history.push(rnorm / bnorm);
  if (rnorm / bnorm <= tol) return { iterations: 0, relativeResidual: rnorm / bnorm, converged: true, history };
  options.precondition(r, z);
  for (let k = 0; k < runs.length; k += 2) for (let c = runs[k]; c < runs[k + 1]; c++) p[c] = z[c];
  let rz = dotRuns(r, z, runs);
  let it = 0;
  while (it < maxIt) {
    it++;
    applyActive(op, p, q);
    const alpha = rz / dotRuns(p, q, runs);
    // x += α p, r −= α q and ‖r‖² in one pass.
    let rr = 0;
    for (let k = 0; k < runs.length; k += 2) {
      for (let c = runs[k]; c < runs[k + 1]; c++) {
        x[c] += alpha * p[c];
        const rc = r[c] - alpha * q[c];
        r[c] = rc;
        rr += rc * rc;
      }
    }
    rnorm = Math.sqrt(rr);
    const rel = rnorm / bnorm;
    history.push(rel);
    if (rel <= tol) break;
    if (options.onIteration?.(it, rel) === false) break;
    options.precondition(r, z);
    const rzNew = dotRuns(r, z, runs);
    const beta = rzNew / rz;
    rz = rzNew;
    for (let k = 0; k < runs.length; k += 2) for (let c = runs[k]; c < runs[k + 1]; c++) p[c] = z[c] + beta * p[c];
  }
  const rel = history[history.length - 1];
  return { iterations: it, relativeResidual: rel, converged: rel <= tol, history };
}

export function dot(a: Float64Array, b: Float64Array, active: Uint8Array): number {
  let s = 0;
  for (let c = 0; c < a.length; c++) if (active[c]) s += a[c] * b[c];
  return s;
}

function dotRuns(a: Float64Array, b: Float64Array, runs: Int32Array): number {
  let s = 0;
  for (let k = 0; k < runs.length; k += 2) for (let c = runs[k]; c < runs[k + 1]; c++) s += a[c] * b[c];
  return s;
}
