/**
 * The per-cell fields the result, the probes and the views show, derived from a flow solution:
 * velocity (cell-centred), vorticity, streamfunction and pressure (physics.md §3).
 */
import { cellVelocity } from './cell-velocity';
import type { FlowProblem } from './flow-problem';
import type { FlowSolution } from './solve-flow';
import { streamfunction } from './streamfunction';
import { vorticity } from './vorticity';

export interface FlowFields {
  /** Depth-averaged velocity per cell (m/s); 0 outside the fluid. */
  velocityX: Float64Array;
  velocityY: Float64Array;
  /** ω = ∂v/∂x − ∂u/∂y per cell (1/s). */
  vorticity: Float64Array;
  /** ψ per cell (m²/s; times the depth, a flow rate): u = ∂ψ/∂y, v = −∂ψ/∂x. */
  streamfunction: Float64Array;
  /** Gauge pressure per cell (Pa); NaN outside the fluid. */
  pressure: Float64Array;
}

export function flowFields(problem: FlowProblem, solution: FlowSolution): FlowFields {
  const { grid } = problem;
  const velocity = cellVelocity(grid, solution.ports, solution.u, solution.v);
  return {
    velocityX: velocity.x,
    velocityY: velocity.y,
    vorticity: vorticity(grid, solution.ports, solution.u, solution.v, solution.slip),
    streamfunction: streamfunction(grid, solution.ports, solution.u),
    pressure: solution.pressure,
  };
}
