import type { DesignDocument } from '../../shared/design';
import { discretiseDesign } from '../grid/discretise';
import type { FluidRegion } from '../geometry/fluid-region';
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { electroosmoticMobility } from '../physics/electrokinetics';
import { geometryRefusal, SolveError } from '../result/errors';
import type { SolveFields } from '../result/types';
import type { TraceFields } from './trace';

/** Mean of the floor's and the lid's electroosmotic mobility (m²/Vs): the depth-wise slip u_tb = μ_tb E. */
export function floorLidMobility(design: DesignDocument): number {
  const { relativePermittivity: epsR, viscosity } = design.buffer;
  const floor = design.zeta.floor ?? design.zeta.side;
  const lid = design.zeta.lid ?? design.zeta.side;
  return (electroosmoticMobility(epsR, viscosity, floor) + electroosmoticMobility(epsR, viscosity, lid)) / 2;
}

/**
 * The cut-cell grid (and fluid region) a solve of this design used: solveDesign does not hand its grid out, but discretising the
 * same shapes with the same `cells` gives the same grid (the discretisation is deterministic). Checked against
 * the solve's own grid size, spacing and origin, so a mismatch is an error rather than a shifted tracer.
 */
export function gridForSolve(
  design: DesignDocument,
  fields: Pick<SolveFields, 'nx' | 'ny' | 'spacing' | 'x0' | 'y0'>,
  cells?: number,
): { grid: CutCellGrid; region: FluidRegion } {
  const disc = discretiseDesign(design, { cells });
  if (!disc.ok || !disc.grid || !disc.region) throw geometryRefusal(disc.problems);
  const g = disc.grid;
  const tol = 1e-9 * fields.spacing;
  if (g.nx !== fields.nx || g.ny !== fields.ny || Math.abs(g.spacing - fields.spacing) > tol || Math.abs(g.x0 - fields.x0) > tol || Math.abs(g.y0 - fields.y0) > tol) {
    throw new SolveError('internal', `the tracer's grid (${g.nx} × ${g.ny}) is not the solve's (${fields.nx} × ${fields.ny}); solve and trace with the same cells`);
  }
  return { grid: g, region: disc.region };
}

/** TraceFields of one solved state: the solve's cell fields on its grid, with the design's depth and floor/lid slip. */
export function traceFieldsOf(design: DesignDocument, fields: SolveFields, grid: CutCellGrid): TraceFields {
  return {
    grid,
    velocityX: fields.velocityX,
    velocityY: fields.velocityY,
    fieldX: fields.fieldX,
    fieldY: fields.fieldY,
    depth: design.depth,
    floorLidMobility: floorLidMobility(design),
  };
}
