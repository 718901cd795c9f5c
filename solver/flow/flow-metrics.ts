/**
 * Summary numbers of a flow solution (physics.md §3, §6):
 *
 * - maxSpeed: largest cell-centred |u|;
 * - reynolds: ρ U D_h / μ with U = maxSpeed and D_h = 2 w d/(w + d) of the narrowest channel (the
 *   conservative pairing: the fastest flow with the narrowest duct);
 * - portMeanSpeed: per port, |Q_k| / (port width × d), the mean speed in the channel leg the port feeds;
 * - maxWallShearRate: in-plane shear rate at the side walls, |(u_c − u_wall)·t| / δ, u_c the velocity of
 *   the wall's cell, δ the distance from its fluid centroid to the wall (at least a quarter cell);
 * - maxFloorShearRate: shear rate at floor and lid from the depth profile the model implies, a Couette part
 *   between the floor and lid slips plus a Poiseuille part of mean ū − u_tb:
 *   |du/dz| ≤ (6 |ū − u_tb| + |u_lid − u_floor|) / d.
 */
import { cutIndex } from '../grid/cut-cell-grid';
import { fluidRuns } from '../grid/fluid-runs';
import { reynolds } from '../physics/electrokinetics';
import { cellFieldFromFaces } from './face-field';
import type { FlowFields } from './flow-fields';
import { floorLidMobility, mobility, type FlowProblem } from './flow-problem';
import type { FlowSolution } from './solve-flow';

export interface FlowMetrics {
  maxSpeed: number;
  reynolds: number;
  portMeanSpeed: Float64Array;
  maxWallShearRate: number;
  maxFloorShearRate: number;
}

const { abs, hypot, max } = Math;
const { isFinite } = Number;

/** Least centroid-to-wall distance for the wall shear estimate, in cells. */
const MIN_SHEAR_DISTANCE = 0.25;

export function flowMetrics(
  problem: FlowProblem,
  solution: FlowSolution,
  fields: FlowFields,
  options: { density: number; narrowestWidth: number },
): FlowMetrics {
  const { grid, depth } = problem;
  const { velocityX: ux, velocityY: uy } = fields;
  const { runs } = fluidRuns(grid);
  let maxSpeed = 0;
  for (let k = 0; k < runs.length; k += 2) {
    for (let c = runs[k], end = runs[k + 1]; c < end; c++) maxSpeed = max(maxSpeed, hypot(ux[c], uy[c]));
  }

  const seg = grid.segments;
  let maxWall = 0;
  for (let s = 0; s < seg.count; s++) {
    if (seg.port[s] >= 0) continue;
    const c = seg.cell[s];
    const k = cutIndex(grid, c);
    const nX = seg.normalX[s], nY = seg.normalY[s];
    const dist = abs((grid.cutCentroidX[k] - seg.midX[s]) * nX + (grid.cutCentroidY[k] - seg.midY[s]) * nY);
    const slip = (ux[c] - solution.slip.x[s]) * -nY + (uy[c] - solution.slip.y[s]) * nX;
    maxWall = max(maxWall, abs(slip) / max(dist, MIN_SHEAR_DISTANCE * grid.spacing));
  }

  const field = problem.cellField ?? cellFieldFromFaces(grid, problem.potential);
  const mTB = floorLidMobility(problem);
  const couette = abs(mobility(problem, problem.zetaLid) - mobility(problem, problem.zetaFloor));
  let maxFloor = 0;
  for (let k = 0; k < runs.length; k += 2) {
    for (let c = runs[k], end = runs[k + 1]; c < end; c++) {
      const ex = isFinite(field.x[c]) ? field.x[c] : 0, ey = isFinite(field.y[c]) ? field.y[c] : 0;
      const rate = (6 * hypot(ux[c] - mTB * ex, uy[c] - mTB * ey) + couette * hypot(ex, ey)) / depth;
      maxFloor = max(maxFloor, rate);
    }
  }

  const portMeanSpeed = new Float64Array(solution.portFlowRate.length);
  for (let k = 0; k < portMeanSpeed.length; k++) {
    const width = grid.portLength[k];
    portMeanSpeed[k] = width > 0 ? abs(solution.portFlowRate[k]) / (width * depth) : 0;
  }
  return {
    maxSpeed,
    reynolds: reynolds(options.density, maxSpeed, options.narrowestWidth, depth, problem.viscosity),
    portMeanSpeed,
    maxWallShearRate: maxWall,
    maxFloorShearRate: maxFloor,
  };
}
