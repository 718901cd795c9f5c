export { apply, createOperator, finishOperator, residual, type Operator5 } from './operator';
export { coarsen, prolongAdd, restrict } from './coarsen';
export { buildHierarchy, vcycle, type Hierarchy } from './cycle';
export { pcg, dot, type KrylovResult, type PcgOptions } from './pcg';
export { smoothRedBlack } from './smooth';

import { buildHierarchy, vcycle } from './cycle';
import type { Operator5 } from './operator';
import { pcg, type KrylovResult, type PcgOptions } from './pcg';

/** Solves A x = b by conjugate gradients preconditioned with one multigrid V-cycle. */
export function solveMultigridPcg(
  op: Operator5,
  b: Float64Array,
  x: Float64Array,
  options: Omit<PcgOptions, 'precondition'> & { sweeps?: number } = {},
): KrylovResult & { levels: number } {
  const h = buildHierarchy(op, options.sweeps ?? 2);
  const result = pcg(op, b, x, { ...options, precondition: (r, z) => vcycle(h, r, z) });
  return { ...result, levels: h.levels.length };
}
