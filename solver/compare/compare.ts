import { parseDesign, type DesignDocument } from '../../shared/design';
import { electroosmoticMobility } from '../physics/electrokinetics';
import { SolveError, solveDesign, type SolveOptions, type SolveResult } from '../solve';
import { gridForSolve, traceFieldsOf } from '../tracer';
import { placeBand, runBand, sharedHistogram, type BandRun, type BandSetup, type BandSpreading } from './band';

export type { BandSetup, BandSpreading, Segment } from './band';

/**
 * The same layout driven two ways at a matched flow rate through one port (product.md, Compare):
 *
 * - slip: the electrodes as designed, every reservoir at the same head (all pressures 0);
 * - pressure: no field (every electrode at 0 V) and reservoir heads in the pattern of the slip case's port
 *   potentials, p_k = α V_k (floating ports take their solved potential), with α chosen so that the flow
 *   through the chosen port equals the slip case's. Both solves are linear, so α = Q_slip / Q(p_k = V_k).
 *
 * Under ideal electroosmosis the slip flow is irrotational (Cummings et al., Anal. Chem. 72, 2526 (2000)); the
 * pressure-driven flow at the same flow rate carries vorticity from every wall.
 *
 * Two figures of band spreading for a reference species (diffusivity D, electrophoretic mobility 0, so it moves
 * with the liquid), which answer different questions:
 * - `dispersionRatio`: a closed-form estimate, the depth-wise Taylor–Aris ratio
 *   D_eff/D = 1 + (|u − u_tb| d)²/(210 D²) (physics.md §5) averaged over the fluid area. It knows nothing of
 *   the in-plane velocity differences (side walls, turns) and weighs every part of the chip alike.
 * - `band`: a tracer run (solver/tracer, traceBand) of a band of that species released across the chosen port's
 *   channel and detected a few widths along it (band.ts, placeBand): arrival-time variance, plate height, tilt.
 *   It includes depth-wise Taylor–Aris dispersion (as the local D_eff), the side-wall and turn effects of the
 *   in-plane flow and molecular diffusion, along the one stretch of channel the matched flow passes. Same
 *   lines, particles and seed for both drives, so the two are directly comparable.
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
  /** Area-weighted mean of the depth-wise Taylor–Aris D_eff / D for the reference species (closed form, no tracer). */
  dispersionRatio: number;
  /** The tracer's band spreading in this drive (see Comparison.band for where); null when no band was run or it never arrived. */
  band: BandSpreading | null;
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
  /** Where and how the band was run (shared by both sides); null when it was not run, with the reason in bandProblem. */
  band: BandSetup | null;
  bandProblem: string | null;
}

export interface CompareOptions extends SolveOptions {
  /** Diffusivity of the reference species (m²/s); default 1e-9. */
  referenceDiffusivity?: number;
  /** Particles in the tracer's band (default 2000; 0 runs no band). */
  particles?: number;
  /** Seed of the band's random walk (default 1). */
  seed?: number;
  /** Progress of the two band runs, after the three solves. */
  onBandProgress?: (progress: { side: 'slip' | 'pressure'; fraction: number }) => void;
}

/** Particles in Compare's band: the plate height's statistical error is then about √(2/n) ≈ 3 % (variance of n samples). */
export const COMPARE_PARTICLES = 2000;

export function compareDrives(
  input: unknown,
  portId: string,
  options: CompareOptions = {},
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
  if (!(Number.isFinite(D) && D > 0)) throw new SolveError('invalid-option', `the reference diffusivity must be a positive number of m²/s, not ${D}`, { field: 'referenceDiffusivity' });
  const particles = options.particles ?? COMPARE_PARTICLES;
  const seed = options.seed ?? 1;
  if (!(Number.isInteger(particles) && (particles === 0 || (particles >= 10 && particles <= 200000)))) {
    throw new SolveError('invalid-option', 'particles must be 0 (no band) or a whole number from 10 to 200000', { field: 'particles' });
  }
  if (!Number.isInteger(seed)) throw new SolveError('invalid-option', 'the seed must be a whole number', { field: 'seed' });

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
  const slipSide = summarise(slip, j, design.depth, floorLidMobility, D);
  const pressureSide = summarise(pressure, j, design.depth, floorLidMobility, D);

  let band: BandSetup | null = null;
  let bandProblem: string | null = null;
  if (particles > 0) {
    const { grid, region } = gridForSolve(slipDesign, slip.fields, options.cells);
    // The matched flow enters the chip through the port when Q > 0 (physics.md §3), in both drives. Where it enters,
    // the release line sits 5 D*/U in, D* the plate value D (1 + Pe²/210) at the port's mean speed U = |Q| / (w d):
    // a particle released a from an absorbing end against a drift U escapes with probability exp(−U a / D*)
    // (first passage of Brownian motion with drift; e.g. Karlin & Taylor, A First Course in Stochastic Processes, 1975).
    const port = design.ports[j];
    const U = Math.abs(qSlip) / (Math.hypot(port.to[0] - port.from[0], port.to[1] - port.from[1]) * design.depth);
    const plate = D + (U * design.depth) ** 2 / (210 * D);
    const lines = placeBand(region, port, qSlip > 0, (5 * plate) / U);
    if (typeof lines === 'string') bandProblem = lines;
    else {
      const species = { mobility: 0, diffusivity: D };
      const run = (side: 'slip' | 'pressure', result: SolveResult, drive: DesignDocument): BandRun | null =>
        runBand(traceFieldsOf(drive, result.fields, grid), lines, species, {
          particles,
          seed,
          shouldStop: options.shouldStop,
          onProgress: options.onBandProgress && ((fraction) => options.onBandProgress!({ side, fraction })),
        });
      const runs = [run('slip', slip, slipDesign), run('pressure', pressure, pressureDesign)];
      if (options.shouldStop?.()) throw new SolveError('cancelled', 'The comparison was stopped.');
      const { edges, counts } = sharedHistogram(runs.map((r) => r?.times ?? null));
      band = { ...lines, particles, seed, mobility: 0, diffusivity: D, edges };
      [slipSide, pressureSide].forEach((s, k) => (s.band = spreading(runs[k], counts[k])));
      const stuck = (['slip', 'pressure'] as const).filter((_, k) => !runs[k]?.detector);
      if (stuck.length) bandProblem = `the band did not reach the detector under the ${stuck.join(' and the ')} drive`;
    }
  }
  return {
    port: portId,
    pressurePerVolt: alpha,
    pressures: Object.fromEntries(design.ports.map((p, k) => [p.id, alpha * pattern[k]])),
    slip: slipSide,
    pressure: pressureSide,
    referenceDiffusivity: D,
    band,
    bandProblem,
  };
}

function spreading(run: BandRun | null, counts: number[] | null): BandSpreading | null {
  const d = run?.detector;
  if (!run || !d || !counts) return null;
  return {
    arrived: d.arrived,
    meanTime: d.meanTime,
    timeVariance: d.timeVariance,
    speed: d.speed,
    plateHeight: d.plateHeight,
    plateNumber: d.plateNumber,
    tilt: d.tilt,
    // D_app = H U / 2 (first passage of a line band, see BandSpreading.effectiveDiffusivity).
    effectiveDiffusivity: (d.plateHeight * d.speed) / 2,
    duration: run.duration,
    counts,
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
    band: null,
  };
}
