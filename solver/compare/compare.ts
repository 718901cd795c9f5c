import { parseDesign, type DesignDocument } from '../../shared/design';
import { electroosmoticMobility } from '../physics/electrokinetics';
import { SolveError, solveDesign, type SolveOptions, type SolveResult } from '../solve';

/**
 * The same layout driven two ways at a matched flow rate through one port (product.md, Compare):
 *
 * - slip: the electrodes as designed, every reservoir at the same head (all pressures 0);
 * - pressure: no field (every electrode at 0 V) and reservoir heads in the pattern of the slip case's port
 *   potentials, p_k = α V_k (floating ports take their solved potential), with α chosen so that the flow
 *   through the chosen port equals the slip case's. Both solves are linear, so α = Q_slip / Q(p_k = V_k).
 *
 * Under ideal electroosmosis the slip flow is irrotational (Cummings et al., Anal. Chem. 72, 2526 (2000)); the
 * pressure-driven flow at the same flow rate carries vorticity from every wall. The Taylor–Aris figure below is
 * the depth-wise dispersion of a reference species, D_eff/D = 1 + (|u − u_tb| d)²/(210 D²) (physics.md §5),
 * averaged over the fluid area.
 */
export interface ComparisonSide {
  result: SolveResult;
  /** Flow rate through the chosen port (m³/s, positive into the fluid). */
  flowRate: number;
  /** Largest |vorticity| (1/s) and the area-weighted mean |vorticity|. */
  maxVorticity: number;
  meanVorticity: number;
  /** Largest wall shear rate estimate: |vorticity| in the fluid cells next to a wall (1/s). */
  wallShear: number;
  /** Area-weighted mean of D_eff / D for the reference species. */
  dispersionRatio: number;
}

export interface Comparison {
  port: string;
  /** Head pattern scale α (Pa per V of slip-case port potential). */
  pressurePerVolt: number;
  /** Reservoir pressures of the pressure-driven case (Pa), by port id. */
  pressures: Record<string, number>;
  slip: ComparisonSide;
  pressure: ComparisonSide;
  referenceDiffusivity: number;
}

export function compareDrives(
  input: unknown,
  portId: string,
  options: SolveOptions & { referenceDiffusivity?: number } = {},
): Comparison {
  const parsed = parseDesign(input);
  if (!parsed.ok) throw new SolveError('invalid-design', parsed.errors.map((e) => `${e.field}: ${e.message}`).join('; '));
  const design = parsed.design;
  const j = design.ports.findIndex((p) => p.id === portId);
  if (j < 0) throw new SolveError('invalid-option', `no port "${portId}" in the design`, { field: 'port' });
  if (!design.ports.some((p) => p.potential !== null && p.potential !== 0)) {
    throw new SolveError('invalid-option', 'the design has no electrode above 0 V, so there is no slip-driven case to compare');
  }
  const D = options.referenceDiffusivity ?? 1e-9;

  const slipDesign: DesignDocument = { ...design, ports: design.ports.map((p) => ({ ...p, pressure: 0 })) };
  const slip = solveDesign(slipDesign, options);
  const qSlip = slip.ports[j].flowRate;
  if (!(Math.abs(qSlip) > 0)) {
    throw new SolveError('invalid-option', `no slip-driven flow passes port "${portId}"; pick a port the flow goes through`, { field: 'port' });
  }

  // Unit head pattern p_k = V_k (1 Pa per volt), no field.
  const pattern = slip.ports.map((p) => p.potential ?? 0);
  const unitDesign: DesignDocument = {
    ...design,
    ports: design.ports.map((p, k) => ({ ...p, potential: p.potential === null ? null : 0, pressure: pattern[k] })),
  };
  const unit = solveDesign(unitDesign, options);
  const qUnit = unit.ports[j].flowRate;
  if (!(Math.abs(qUnit) > 0)) throw new SolveError('invalid-option', `heads in the pattern of the port potentials move nothing through port "${portId}"`);
  const alpha = qSlip / qUnit;
  const pressureDesign: DesignDocument = {
    ...design,
    ports: design.ports.map((p, k) => ({ ...p, potential: p.potential === null ? null : 0, pressure: alpha * pattern[k] })),
  };
  const pressure = solveDesign(pressureDesign, options);

  const { relativePermittivity: epsR, viscosity } = design.buffer;
  const floorLidMobility =
    (electroosmoticMobility(epsR, viscosity, design.zeta.floor ?? design.zeta.side) + electroosmoticMobility(epsR, viscosity, design.zeta.lid ?? design.zeta.side)) / 2;
  return {
    port: portId,
    pressurePerVolt: alpha,
    pressures: Object.fromEntries(design.ports.map((p, k) => [p.id, alpha * pattern[k]])),
    slip: summarise(slip, j, design.depth, floorLidMobility, D),
    pressure: summarise(pressure, j, design.depth, floorLidMobility, D),
    referenceDiffusivity: D,
  };
}

function summarise(result: SolveResult, port: number, depth: number, floorLidMobility: number, D: number): ComparisonSide {
  const f = result.fields;
  const { nx, ny } = f;
  let maxVorticity = 0;
  let wallShear = 0;
  let area = 0;
  let sumVorticity = 0;
  let sumDispersion = 0;
  for (let jy = 0; jy < ny; jy++) {
    for (let ix = 0; ix < nx; ix++) {
      const c = ix + jy * nx;
      const a = f.fraction[c];
      if (!(a > 0)) continue;
      const w = Math.abs(f.vorticity[c]);
      if (Number.isFinite(w)) {
        maxVorticity = Math.max(maxVorticity, w);
        sumVorticity += a * w;
        const nearWall = a < 1 || [c - 1, c + 1, c - nx, c + nx].some((n) => n >= 0 && n < nx * ny && !(f.fraction[n] > 0));
        if (nearWall) wallShear = Math.max(wallShear, w);
      }
      const px = f.velocityX[c] - floorLidMobility * f.fieldX[c];
      const py = f.velocityY[c] - floorLidMobility * f.fieldY[c];
      const taylor = Number.isFinite(px) && Number.isFinite(py) ? ((px * px + py * py) * depth * depth) / (210 * D * D) : 0;
      sumDispersion += a * (1 + taylor);
      area += a;
    }
  }
  return {
    result,
    flowRate: result.ports[port].flowRate,
    maxVorticity,
    meanVorticity: area ? sumVorticity / area : 0,
    wallShear,
    dispersionRatio: area ? sumDispersion / area : 1,
  };
}
