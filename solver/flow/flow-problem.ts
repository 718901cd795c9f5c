/**
 * What the flow solver needs (physics.md §3): the cut-cell grid, the depth, the buffer's viscosity and
 * permittivity, the floor and lid zeta (the side-wall zeta, wall zones applied, is per boundary segment in
 * the grid), the potential per cell with the port potentials, and the port pressures.
 *
 *   μ Δu − (12 μ / d²)(u − u_tb) − ∇p = 0,   div u = 0,
 *   u_tb = μ_eo_tb E,   μ_eo_tb = −ε (ζ_floor + ζ_lid) / (2 μ),
 *   side walls: u = μ_eo_side E_t (Helmholtz–Smoluchowski slip), u·n = 0;   ports: p = p_k, u·t = 0.
 */
import type { DesignDocument } from '../../shared/design';
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { VACUUM_PERMITTIVITY } from '../physics/constants';

export interface FlowProblem {
  grid: CutCellGrid;
  /** Channel depth d, floor to lid (m). */
  depth: number;
  /** Dynamic viscosity μ (Pa·s). */
  viscosity: number;
  /** Permittivity ε = ε_r ε₀ (F/m). */
  permittivity: number;
  /** Floor and lid zeta (V). */
  zetaFloor: number;
  zetaLid: number;
  /** φ per cell (V). NaN (or any non-finite value) where no potential is defined: no field there. */
  potential: Float64Array;
  /** Potential of each port (V), indexed like design.ports; null where the port has none. */
  portPotential: ReadonlyArray<number | null>;
  /** Gauge pressure of each port (Pa). */
  portPressure: ReadonlyArray<number>;
  /**
   * E = −∇φ per cell (V/m), used for the tangential field at side walls. When absent it is taken from the
   * aperture-weighted mean of the face fields (face-field.ts).
   */
  cellField?: { x: Float64Array; y: Float64Array };
}

/** Brinkman friction coefficient α = 12 μ / d² of the depth average (physics.md §3). */
export function depthFriction(problem: Pick<FlowProblem, 'viscosity' | 'depth'>): number {
  return (12 * problem.viscosity) / (problem.depth * problem.depth);
}

/** Helmholtz–Smoluchowski mobility −ε ζ / μ (physics.md §3). */
export function mobility(problem: Pick<FlowProblem, 'viscosity' | 'permittivity'>, zeta: number): number {
  return (-problem.permittivity * zeta) / problem.viscosity;
}

/** Mobility of the floor-and-lid plug flow, μ_eo_tb = −ε (ζ_floor + ζ_lid) / (2 μ) (physics.md §3). */
export function floorLidMobility(problem: FlowProblem): number {
  return mobility(problem, 0.5 * (problem.zetaFloor + problem.zetaLid));
}

/** The flow problem of a design on its grid, given the solved potential. */
export function flowProblemFromDesign(
  design: DesignDocument,
  grid: CutCellGrid,
  potential: Float64Array,
  portPotential: ReadonlyArray<number | null>,
  cellField?: { x: Float64Array; y: Float64Array },
): FlowProblem {
  return {
    grid,
    depth: design.depth,
    viscosity: design.buffer.viscosity,
    permittivity: design.buffer.relativePermittivity * VACUUM_PERMITTIVITY,
    zetaFloor: design.zeta.floor,
    zetaLid: design.zeta.lid,
    potential,
    portPotential,
    portPressure: design.ports.map((p) => p.pressure),
    cellField,
  };
}
