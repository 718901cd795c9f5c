import { coarsen, restrictResidual } from './coarsen';
import { coarsenWithExtents, unitExtents } from './coarsen-extents';
import { bandedCost, coarsestSolver, type CoarsestSolver } from './banded';
import { activeRuns, zeroInactive, type Operator5 } from './operator';
import { prolongAndSmooth, smoothAndRestrict, smoothRedBlack, smoothRedBlackFromZero } from './smooth';

/** Levels of a geometric multigrid hierarchy, finest first, with their work arrays. */
export interface Hierarchy {
  levels: Operator5[];
  /**
   * Right-hand side and correction per level (index 0 unused: the caller's). The residual needs no array of its
   * own: it goes straight into the next level's right-hand side (restrictResidual).
   */
  b: Float64Array[];
  x: Float64Array[];
  coarsest: CoarsestSolver;
  /** Red–black sweeps before and after the coarse-grid correction. */
  sweeps: number;
}

/** Coarsening stops once a level has this few active volumes ... */
const COARSEST_CELLS = 96;
/**
 * ... or once its banded Cholesky costs at most this many operations (about a millisecond). Stopping
 * early keeps the coarsest level fine enough to see the walls between neighbouring channels: a
 * level coarser than the wall between two channels joins them and spoils the coarse correction
 * (the serpentine benchmark went from 8 to 19 iterations when its legs merged on the last level).
 */
const COARSEST_FACTOR_COST = 2e5;

function activeCount(op: Operator5): number {
  const runs = activeRuns(op);
  let n = 0;
  for (let k = 0; k < runs.length; k += 2) n += runs[k + 1] - runs[k];
  return n;
}

/**
 * How coarse operators are made: 'half' is `coarsen` (half-sum rule), 'extents' is `coarsenWithExtents`, which
 * stays convergent where Dirichlet boundaries (no-slip walls, ports) fall on odd grid lines or lie other than
 * half a cell from their volume's centre (then give that distance per volume, in cells, as boundaryDistance).
 */
export type Coarsening = 'half' | 'extents';

/**
 * Builds levels by coarsening until the coarsest level is small or cheap enough for an exact solve; the cycles
 * make `sweeps` (at least 1) red–black sweeps before and after each coarse correction.
 */
export function buildHierarchy(fine: Operator5, sweeps = 2, coarsening: Coarsening = 'half', boundaryDistance?: Float64Array): Hierarchy {
  const levels = [fine];
  let n = activeCount(fine);
  let extents = coarsening === 'extents' ? unitExtents(fine, boundaryDistance) : null;
  while (n > COARSEST_CELLS && bandedCost(levels[levels.length - 1], n) > COARSEST_FACTOR_COST) {
    const last = levels[levels.length - 1];
    let next: Operator5;
    if (extents) ({ op: next, extents } = coarsenWithExtents(last, extents));
    else next = coarsen(last);
    const m = activeCount(next);
    if (m >= n) break; // no more reduction possible
    levels.push(next);
    n = m;
  }
  // Level 0's b and x are the caller's: leave those empty.
  const size = (op: Operator5) => op.n1 * op.n2;
  return {
    levels,
    b: levels.map((op, l) => new Float64Array(l === 0 ? 0 : size(op))),
    x: levels.map((op, l) => new Float64Array(l === 0 ? 0 : size(op))),
    coarsest: coarsestSolver(levels[levels.length - 1]),
    sweeps: Math.max(1, sweeps),
  };
}

/**
 * One V-cycle for A x = b on level `l`, starting from x = 0. Pre-smoothing relaxes red then black, post-smoothing
 * black then red, and the coarse correction is exact at the bottom, so the cycle is a symmetric positive definite
 * preconditioner (Briggs, Henson & McCormick, A Multigrid Tutorial, 2nd ed., SIAM 2000, ch. 3).
 * x's entries off the active volumes are set to 0; b's there are not read.
 */
export function vcycle(h: Hierarchy, b: Float64Array, x: Float64Array, l = 0): void {
  zeroInactive(h.levels[l], x);
  cycleFromZero(h, b, x, l);
}

/**
 * The V-cycle of `vcycle` for an x that is already 0 (or any finite value) off the active volumes: its active
 * entries are overwritten without being read. The first sweep starts from zero (red is b / d), the residual
 * after pre-smoothing is evaluated on red volumes only (black ones are 0 after a black half-sweep) and summed
 * into the coarse right-hand side, and the correction is added on red volumes only (post-smoothing starts by
 * overwriting black): the same cycle as with full residual and transfer passes, up to rounding.
 */
export function cycleFromZero(h: Hierarchy, b: Float64Array, x: Float64Array, l = 0): void {
  if (l === h.levels.length - 1) {
    h.coarsest.solve(b, x);
    return;
  }
  smoothRedBlackFromZero(h.levels[l], x, b);
  completeCycle(h, b, x, l, false);
}

/**
 * The V-cycle of `cycleFromZero` after its first sweep (which the caller has made, perhaps fused with other
 * work): the other pre-smoothing sweeps, the coarse correction and post-smoothing. With `dot` it returns bᵀx,
 * summed row by row during the last sweep (0 otherwise). Level l must not be the coarsest.
 */
export function completeCycle(h: Hierarchy, b: Float64Array, x: Float64Array, l: number, dot: boolean): number {
  const op = h.levels[l];
  const coarse = h.levels[l + 1];
  const bc = h.b[l + 1];
  const xc = h.x[l + 1];
  // The last pre-smoothing sweep carries the restriction, the first post-smoothing sweep the prolongation.
  for (let s = 2; s < h.sweeps; s++) smoothRedBlack(op, x, b, 0);
  if (h.sweeps > 1) smoothAndRestrict(op, x, b, coarse, bc);
  else restrictResidual(op, x, b, coarse, bc);
  cycleFromZero(h, bc, xc, l + 1);
  if (h.sweeps === 1) return prolongAndSmooth(op, x, b, coarse, xc, dot);
  prolongAndSmooth(op, x, b, coarse, xc);
  for (let s = 2; s < h.sweeps; s++) smoothRedBlack(op, x, b, 1);
  return smoothRedBlack(op, x, b, 1, dot);
}
