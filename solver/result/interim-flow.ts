/**
 * INTERIM flow model, until the Stokes–Brinkman solver of solver/flow/ replaces this one function:
 *
 *   u = μ_eo E,  μ_eo = −ε ζ_side / μ   (Helmholtz–Smoluchowski, physics.md §3),
 *
 * exact when zeta is uniform on every wall, floor and lid and all ports are at one pressure (the
 * similitude of Cummings, Griffiths, Nilson & Paul, Anal. Chem. 72, 2526 (2000);
 * reference-values.md §9): then p is that constant pressure and the flow is irrotational
 * (vorticity 0). Otherwise it ignores the pressure differences and the zeta variations, and says so.
 *
 * Port flow rates: Q_k = −d ∫ u·n_out ds = μ_eo d ∫ ∂φ/∂n_out ds = μ_eo I_k / σ, the flux of u
 * through the same port pieces that carry the current.
 */
import type { DesignDocument } from '../../shared/design';
import type { CutCellGrid } from '../grid/cut-cell-grid';
import { electroosmoticMobility } from '../physics/electrokinetics';
import type { CellField } from '../potential/gradient';
import { streamfunction } from './streamfunction';
import type { SolveWarning } from './types';

export interface FlowInput {
  design: DesignDocument;
  grid: CutCellGrid;
  /** Cells where the potential was solved (fluid with an electrode). */
  active: Uint8Array;
  potential: Float64Array;
  field: CellField;
  portCurrent: ArrayLike<number>;
  shouldStop?: () => boolean;
  /** Potential of each port (V; the solved one of a floating port), for the field at the port faces. */
  portPotential?: ReadonlyArray<number | null>;
  /** Relative residual of the flow solve. */
  tolerance?: number;
  /** Fraction of the flow solve done, in [0, 1]. */
  onProgress?: (fraction: number) => void;
  /** Narrowest channel width (m), for the Reynolds number. */
  narrowestWidth?: number;
}

export interface FlowOutput {
  /** Per cell, NaN outside the fluid. */
  velocityX: Float32Array;
  velocityY: Float32Array;
  pressure: Float32Array;
  vorticity: Float32Array;
  streamfunction: Float32Array;
  /** m³/s per port, positive into the fluid. */
  portFlowRate: Float64Array;
  /** m/s per port: |Q| / (port width × depth), the mean speed in the channel leg the port feeds. */
  portMeanSpeed?: Float64Array;
  /** 1/s: largest in-plane shear rate at the side walls, and at floor and lid. */
  maxWallShearRate?: number;
  maxFloorShearRate?: number;
  iterations: number;
  residual: number;
  warnings: SolveWarning[];
}

export function interimFlow(input: FlowInput): FlowOutput {
  const { design, grid, active, potential, field } = input;
  const { nx, ny, fraction, apertureX, apertureY } = grid;
  const n = nx * ny;
  const mobility = electroosmoticMobility(design.buffer.relativePermittivity, design.buffer.viscosity, design.zeta.side);
  const pressures = new Set(design.ports.map((p) => p.pressure));
  const uniformPressure = pressures.size <= 1 ? (design.ports[0]?.pressure ?? 0) : NaN;

  const velocityX = new Float32Array(n), velocityY = new Float32Array(n);
  const pressure = new Float32Array(n), vorticity = new Float32Array(n);
  for (let c = 0; c < n; c++) {
    if (!(fraction[c] > 0)) {
      velocityX[c] = velocityY[c] = pressure[c] = vorticity[c] = NaN;
      continue;
    }
    velocityX[c] = active[c] ? mobility * field.x[c] : 0;
    velocityY[c] = active[c] ? mobility * field.y[c] : 0;
    pressure[c] = uniformPressure;
  }
  // Face fluxes of u = μ_eo E per unit depth: μ_eo · a · (φ_upstream − φ_downstream).
  const sx = nx + 1;
  const fluxX = (f: number) => {
    const i = f % sx, j = (f - i) / sx, l = i - 1 + j * nx, r = i + j * nx;
    return active[l] && active[r] ? mobility * apertureX[f] * (potential[l] - potential[r]) : 0;
  };
  const fluxY = (f: number) => {
    const b = f - nx;
    return active[b] && active[f] ? mobility * apertureY[f] * (potential[b] - potential[f]) : 0;
  };
  const psi = streamfunction(grid, fluxX, fluxY);

  const portFlowRate = Float64Array.from(design.ports, (_, k) => (mobility * input.portCurrent[k]) / design.buffer.conductivity);

  const warnings: SolveWarning[] = [];
  const zetaVaries =
    design.zeta.floor !== design.zeta.side ||
    design.zeta.lid !== design.zeta.side ||
    design.wallZones.some((z) => z.zeta !== design.zeta.side);
  if (pressures.size > 1 || zetaVaries) {
    const what = [pressures.size > 1 ? 'pressure differences between ports' : '', zetaVaries ? 'zeta that varies between walls' : '']
      .filter(Boolean)
      .join(' and ');
    warnings.push({
      code: 'flow-model-interim',
      message:
        `The flow shown is the electroosmotic velocity mu_eo E for the side-wall zeta only; ${what} ` +
        'are not taken into account yet (the pressure-driven flow solver is still to come)' +
        (pressures.size > 1 ? ', and the pressure field is not computed.' : '.'),
    });
  }
  return { velocityX, velocityY, pressure, vorticity, streamfunction: psi, portFlowRate, iterations: 0, residual: 0, warnings };
}
