export { apply, createOperator, finishOperator, operatorBytes, residual, type Operator5 } from './operator';
export { coarsen, prolongAdd, prolongCorrection, restrict, restrictResidual } from './coarsen';
export { buildHierarchy, cycleFromZero, vcycle, type Coarsening, type Hierarchy } from './cycle';
export { coarsenWithExtents, unitExtents, type Extents } from './coarsen-extents';
export { pcg, pcgWorkspace, dot, type KrylovResult, type PcgOptions, type PcgWorkspace } from './pcg';
export { multigridCg, type MultigridCgOptions, type MultigridCgWork } from './multigrid-cg';
export { smoothRedBlack, smoothRedBlackFromZero } from './smooth';

import { buildHierarchy, type Hierarchy } from './cycle';
import { multigridCg, type MultigridCgOptions, type MultigridCgWork } from './multigrid-cg';
import type { Operator5 } from './operator';
import type { KrylovResult } from './pcg';

/** A multigrid-preconditioned conjugate-gradient solver for one operator, reusable for many right-hand sides. */
export interface MultigridPcg {
  hierarchy: Hierarchy;
  solve(b: Float64Array, x: Float64Array, options?: MultigridCgOptions): KrylovResult;
}

/**
 * Builds the hierarchy of `op` once (`sweeps` red–black sweeps before and after each coarse correction); the
 * conjugate-gradient work vectors are allocated at the first solve and kept for the next (multigrid-cg.ts).
 */
export function multigridPcg(op: Operator5, options: { sweeps?: number } = {}): MultigridPcg {
  const hierarchy = buildHierarchy(op, options.sweeps ?? 2);
  const n = op.n1 * op.n2;
  let work: MultigridCgWork | null = null;
  const solve = (b: Float64Array, x: Float64Array, opts: MultigridCgOptions = {}) => {
    work ??= { p: new Float64Array(n), q: new Float64Array(n) };
    if (!opts.overwriteRightHandSide) work.r ??= new Float64Array(n);
    return multigridCg(hierarchy, b, x, work, opts);
  };
  return { hierarchy, solve };
}

/** Solves A x = b by conjugate gradients preconditioned with one multigrid V-cycle. */
export function solveMultigridPcg(
  op: Operator5,
  b: Float64Array,
  x: Float64Array,
  options: MultigridCgOptions & { sweeps?: number } = {},
): KrylovResult & { levels: number } {
  const solver = multigridPcg(op, { sweeps: options.sweeps });
  const { sweeps: _sweeps, ...pcgOptions } = options;
  return { ...solver.solve(b, x, pcgOptions), levels: solver.hierarchy.levels.length };
}
