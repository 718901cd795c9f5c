export { apply, createOperator, finishOperator, residual, type Operator5 } from './operator';
export { coarsen, prolongAdd, restrict } from './coarsen';
export { buildHierarchy, vcycle, type Coarsening, type Hierarchy } from './cycle';
export { coarsenWithExtents, unitExtents, type Extents } from './coarsen-extents';
export { pcg, dot, type KrylovResult, type PcgOptions } from './pcg';
export { smoothRedBlack } from './smooth';

import { buildHierarchy, vcycle, type Hierarchy } from './cycle';
import type { Operator5 } from './operator';
import { pcg, type KrylovResult, type PcgOptions } from './pcg';

/** A multigrid-preconditioned conjugate-gradient solver for one operator, reusable for many right-hand sides. */
export interface MultigridPcg {
  hierarchy: Hierarchy;
  solve(b: Float64Array, x: Float64Array, options?: Omit<PcgOptions, 'precondition'>): KrylovResult;
}

/** Builds the hierarchy of `op` once (`sweeps` red–black sweeps before and after each coarse correction). */
export function multigridPcg(op: Operator5, options: { sweeps?: number } = {}): MultigridPcg {
  const hierarchy = buildHierarchy(op, options.sweeps ?? 2);
  const precondition = (r: Float64Array, z: Float64Array) => vcycle(hierarchy, r, z);
  return { hierarchy, solve: (b, x, opts = {}) => pcg(op, b, x, { ...opts, precondition }) };
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
