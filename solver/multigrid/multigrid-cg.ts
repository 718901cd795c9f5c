import { directionAndProduct, dotOnRuns, residualAndNorms, startFromZero, stepAndFirstSweep, stepAndNorm } from './cg-kernels';
import { completeCycle, cycleFromZero, type Hierarchy } from './cycle';
import { activeRuns, zeroInactive } from './operator';
import { smoothRedBlackFromZero } from './smooth';
import type { KrylovResult } from './pcg';

const { sqrt } = Math;

export interface MultigridCgOptions {
  /** Relative residual ‖b − A x‖₂ / ‖b‖₂ to reach (default 1e-8). */
  tolerance?: number;
  maxIterations?: number;
  /** Called after each iteration with the relative residual; return false to stop (cancellation). */
  onIteration?: (iteration: number, relativeResidual: number) => boolean | void;
  /**
   * Start from x = 0 on the active volumes whatever x holds (A x is then not formed); x's other entries are then
   * left as they are (the caller may keep NaN there: no kernel reads them).
   */
  zeroGuess?: boolean;
  /** b may serve as the residual vector: on exit it holds the final residual instead of the right-hand side. */
  overwriteRightHandSide?: boolean;
}

/** Work vectors of `multigridCg` for the finest level of a hierarchy; `r` may be left out when b is overwritten. */
export interface MultigridCgWork {
  p: Float64Array;
  q: Float64Array;
  r?: Float64Array;
}

/**
 * Conjugate gradients preconditioned by one V-cycle (cycleFromZero) of the hierarchy h on its finest operator
 * (Saad, Iterative Methods for Sparse Linear Systems, 2nd ed. 2003, alg. 9.1), with the vector work fused into
 * the passes the cycle makes over the finest level anyway:
 *   - p ← z + β p with q ← A p and pᵀq (directionAndProduct);
 *   - x ← x + α p and r ← r − α q with ‖r‖², in the same pass as the cycle's first sweep on the new r
 *     (stepAndFirstSweep; when the residual is small enough that sweep is wasted, once);
 *   - rᵀz, summed during the cycle's last sweep (completeCycle).
 * z and A p share one vector (A p is spent once r is updated). The iterates are those of `pcg` with
 * precondition = cycleFromZero, up to rounding. Vectors stay 0 off the active volumes, and so does x unless
 * `zeroGuess` (see there).
 */
export function multigridCg(h: Hierarchy, b: Float64Array, x: Float64Array, work: MultigridCgWork, options: MultigridCgOptions = {}): KrylovResult {
  const op = h.levels[0];
  const tol = options.tolerance ?? 1e-8;
  const maxIt = options.maxIterations ?? 200;
  const runs = activeRuns(op);
  const { p, q } = work;
  const r = options.overwriteRightHandSide ? b : work.r;
  if (!r) throw new Error('multigridCg: no residual vector');
  let bb: number, rr: number;
  if (options.zeroGuess) {
    bb = rr = startFromZero(runs, b, r, x);
  } else {
    zeroInactive(op, x);
    [bb, rr] = residualAndNorms(op, x, b, r, q);
  }
  const bnorm = sqrt(bb);
  const history: number[] = [];
  if (bnorm === 0) {
    if (!options.zeroGuess) x.fill(0);
    return { iterations: 0, relativeResidual: 0, converged: true, history };
  }
  history.push(sqrt(rr) / bnorm);
  if (history[0] <= tol) return { iterations: 0, relativeResidual: history[0], converged: true, history };
  // One level only: the cycle is the exact solve, and there is no sweep to fuse with.
  const fused = h.levels.length > 1;
  let rz: number;
  if (fused) {
    smoothRedBlackFromZero(op, q, r);
    rz = completeCycle(h, r, q, 0, true);
  } else {
    cycleFromZero(h, r, q);
    rz = dotOnRuns(r, q, runs);
  }
  let beta = 0;
  let it = 0;
  while (it < maxIt) {
    it++;
    const alpha = rz / directionAndProduct(op, q, beta, p, q);
    const rel = sqrt(fused ? stepAndFirstSweep(op, alpha, p, q, x, r, q) : stepAndNorm(op, alpha, p, q, x, r)) / bnorm;
    history.push(rel);
    if (rel <= tol) break;
    if (options.onIteration?.(it, rel) === false) break;
    let rzNew: number;
    if (fused) rzNew = completeCycle(h, r, q, 0, true);
    else {
      cycleFromZero(h, r, q);
      rzNew = dotOnRuns(r, q, runs);
    }
    beta = rzNew / rz;
    rz = rzNew;
  }
  const rel = history[history.length - 1];
  return { iterations: it, relativeResidual: rel, converged: rel <= tol, history };
}
