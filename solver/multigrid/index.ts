export { apply, createOperator, finishOperator, operatorBytes, residual, type Operator5 } from './operator';
export { coarsen, prolongAdd, prolongCorrection, restrict, restrictResidual } from './coarsen';
export { buildHierarchy, cycleFromZero, vcycle, type Coarsening, type Hierarchy } from './cycle';
export { coarsenWithExtents, unitExtents, type Extents } from './coarsen-extents';
export { pcg, pcgWorkspace, dot, type KrylovResult, type PcgOptions, type PcgWorkspace } from './pcg';
export { smoothRedBlack, smoothRedBlackFromZero } from './smooth';

import { buildHierarchy, cycleFromZero, type Hierarchy } from './cycle';
import type { Operator5 } from './operator';
import { pcg, pcgWorkspace, type KrylovResult, type PcgOptions } from './pcg';

/** A multigrid-preconditioned conjugate-gradient solver for one operator, reusable for many right-hand sides. */
export interface MultigridPcg {
  hierarchy: Hierarchy;
  solve(b: Float64Array, x: Float64Array, options?: Omit<PcgOptions, 'precondition'>): KrylovResult;
}

/**
 * Builds the hierarchy of `op` and the conjugate-gradient work vectors once (`sweeps` red–black sweeps before and
 * after each coarse correction). pcg keeps its vectors 0 off the active volumes, so the cycle need not clear them.
 */
export function multigridPcg(op: Operator5, options: { sweeps?: number } = {}): MultigridPcg {
  const hierarchy = buildHierarchy(op, options.sweeps ?? 2);
  const workspace = pcgWorkspace(op);
  const precondition = (r: Float64Array, z: Float64Array) => cycleFromZero(hierarchy, r, z);
  return { hierarchy, solve: (b, x, opts = {}) => pcg(op, b, x, { ...opts, precondition, workspace }) };
}

/** Solves A x = b by conjugate gradients preconditioned with one multigrid V-cycle. */
export function solveMultigridPcg(
  op: Operator5,
  b: Float64Array,
  x: Float64Array,
  options: Omit<PcgOptions, 'precondition'> & { sweeps?: number } = {},
): KrylovResult & { levels: number } {
  const solver = multigridPcg(op, { sweeps: options.sweeps });
  const { sweeps: _sweeps, ...pcgOptions } = options;
  return { ...solver.solve(b, x, pcgOptions), levels: solver.hierarchy.levels.length };
}
