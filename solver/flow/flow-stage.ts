/**
 * The flow stage of solveDesign (solver/solve.ts): the Stokes–Brinkman solve of this folder behind the
 * stage's FlowInput → FlowOutput contract (solver/result/interim-flow.ts), with the per-cell fields as
 * Float32 (NaN outside the fluid), the port flow rates, the mean speed per port's channel leg, the wall and
 * floor shear rates and a warning when MINRES stops short of the tolerance.
 */
import { fluidRuns } from '../grid/fluid-runs';
import { SolveError } from '../result/errors';
import type { FlowInput, FlowOutput } from '../result/interim-flow';
import { convergenceWarning } from '../result/warnings';
import { flowFields } from './flow-fields';
import { flowMetrics } from './flow-metrics';
import { flowProblemFromDesign } from './flow-problem';
import { FlowCancelled, solveFlow } from './solve-flow';

const DEFAULT_TOLERANCE = 1e-8;

export function stokesBrinkmanFlow(input: FlowInput): FlowOutput {
  const { design, grid } = input;
  const tolerance = input.tolerance ?? DEFAULT_TOLERANCE;
  const portPotential = input.portPotential ?? design.ports.map((p) => p.potential);
  const problem = flowProblemFromDesign(design, grid, input.potential, portPotential, input.field);
  const logTolerance = Math.log(tolerance);
  let solution;
  try {
    solution = solveFlow(problem, {
      tolerance,
      shouldStop: input.shouldStop,
      onIteration: (_, residual) => input.onProgress?.(Math.min(1, Math.max(0, Math.log(residual) / logTolerance))),
    });
  } catch (error) {
    if (error instanceof FlowCancelled) throw new SolveError('cancelled', 'The solve was stopped.');
    throw error;
  }
  const fields = flowFields(problem, solution);
  const metrics = flowMetrics(problem, solution, fields, { density: design.buffer.density, narrowestWidth: input.narrowestWidth ?? Infinity });
  const n = grid.nx * grid.ny;
  const out = {
    velocityX: new Float32Array(n).fill(NaN),
    velocityY: new Float32Array(n).fill(NaN),
    pressure: new Float32Array(n).fill(NaN),
    vorticity: new Float32Array(n).fill(NaN),
    streamfunction: new Float32Array(n).fill(NaN),
  };
  // NaN outside the fluid; the fluid cells' values copied run by run.
  const { runs } = fluidRuns(grid);
  for (let k = 0; k < runs.length; k += 2) {
    const from = runs[k], to = runs[k + 1];
    out.velocityX.set(fields.velocityX.subarray(from, to), from);
    out.velocityY.set(fields.velocityY.subarray(from, to), from);
    out.pressure.set(fields.pressure.subarray(from, to), from);
    out.vorticity.set(fields.vorticity.subarray(from, to), from);
    out.streamfunction.set(fields.streamfunction.subarray(from, to), from);
  }
  return {
    ...out,
    portFlowRate: solution.portFlowRate,
    portMeanSpeed: metrics.portMeanSpeed,
    maxWallShearRate: metrics.maxWallShearRate,
    maxFloorShearRate: metrics.maxFloorShearRate,
    iterations: solution.iterations,
    residual: solution.residual,
    warnings: convergenceWarning('flow', solution.residual, tolerance),
  };
}
