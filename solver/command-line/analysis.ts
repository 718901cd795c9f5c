/**
 * What the analysis commands print: `compare`, `trace`, `plan` and `edl` as JSON summaries (no per-cell arrays)
 * and as short readable text. Pure (no Node imports): cli.ts reads the file and writes the output.
 * Refusals are SolveError or PlanError; cli.ts turns them into exit 2.
 */
import type { DesignDocument } from '../../shared/design';
import { compareDrives, type ComparisonSide } from '../compare';
import { doubleLayer, gouyChapmanPotential, edlVelocityRatio } from '../double-layer';
import { ARC_TOLERANCE } from '../geometry/arc';
import { channelWidths } from '../geometry/channel-width';
import { fluidRegion } from '../geometry/fluid-region';
import { shapeFeatureSize } from '../geometry/shape-outline';
import { SLIVER_RATIO } from '../grid/discretise';
import { planSettings, PlanError, unitResponses, type Target } from '../planner';
import { SolveError } from '../result/errors';
import type { PortResult } from '../result/types';
import { guessCrossRoles, pinchedPlug, runTrace, type PhaseSpec, type TraceRequest } from '../tracer';
import type { CompareCommand, EdlCommand, PlanCommand, TraceCommand } from './analysis-args';
import { formatFlow, formatSI } from './summary';

export interface AnalysisOutput {
  json: unknown;
  text: string;
}

/** Rates in 1/s with four digits (vorticity, shear rate): prefixes read badly on a reciprocal second. */
const perSecond = (v: number) => `${Number(v.toPrecision(4))} 1/s`;

const portJson = (p: PortResult) => ({ id: p.id, potential: p.potential, current: p.current, flowRate: p.flowRate });

export function runCompare(design: DesignDocument, c: CompareCommand): AnalysisOutput {
  const cmp = compareDrives(design, c.port, { cells: c.cells, referenceDiffusivity: c.diffusivity, particles: c.particles, seed: c.seed });
  const side = (s: ComparisonSide) => ({
    flowRate: s.flowRate,
    maxSpeed: s.result.metrics.maxSpeed,
    maxVorticity: s.maxVorticity,
    meanVorticity: s.meanVorticity,
    wallShear: s.wallShear,
    dispersionRatio: s.dispersionRatio,
    // The tracer's band (small: figures and a histogram on band.edges).
    band: s.band,
    ports: s.result.ports.map(portJson),
    warnings: s.result.warnings.map((w) => w.code),
  });
  const json = {
    port: cmp.port,
    matchedFlowRate: cmp.slip.flowRate,
    pressurePerVolt: cmp.pressurePerVolt,
    pressures: cmp.pressures,
    referenceDiffusivity: cmp.referenceDiffusivity,
    band: cmp.band,
    bandProblem: cmp.bandProblem,
    grid: cmp.slip.result.grid,
    slip: side(cmp.slip),
    pressure: side(cmp.pressure),
  };
  const row = (name: string, s: ComparisonSide) =>
    `  ${name.padEnd(9)} ${formatFlow(s.flowRate).padEnd(14)} ${formatSI(s.result.metrics.maxSpeed, 'm/s').padEnd(12)} ${perSecond(s.meanVorticity).padEnd(11)} ${perSecond(s.wallShear).padEnd(11)} ${s.dispersionRatio.toPrecision(4)}`;
  const bandRow = (name: string, s: ComparisonSide) => {
    const b = s.band;
    if (!b) return `  ${name.padEnd(9)} no band`;
    return `  ${name.padEnd(9)} ${`${b.arrived}`.padEnd(8)} ${formatSI(b.meanTime, 's').padEnd(10)} ${formatSI(Math.sqrt(b.timeVariance), 's').padEnd(10)} ${formatSI(b.plateHeight, 'm').padEnd(10)} ${(b.effectiveDiffusivity / cmp.referenceDiffusivity).toPrecision(4).padEnd(8)} ${formatSI(b.tilt, 'm')}`;
  };
  const b = cmp.band;
  const text = [
    `${design.name}: slip against pressure at the flow rate through port ${cmp.port}`,
    `heads ${Object.entries(cmp.pressures).map(([id, p]) => `${id} ${formatSI(p, 'Pa')}`).join(', ')} (${formatSI(cmp.pressurePerVolt, 'Pa')} per volt)`,
    '  drive     flow rate      max speed    mean |ω|    wall shear  D_eff/D (depth-wise Taylor–Aris, area mean)',
    row('slip', cmp.slip),
    row('pressure', cmp.pressure),
    b
      ? [
          `band of the reference species (D ${b.diffusivity.toPrecision(3)} m²/s, mobility 0): ${b.particles} particles, seed ${b.seed}, released across port ${cmp.port}'s channel and detected ${formatSI(b.distance, 'm')} on`,
          '  drive     arrived  mean t̄     σ_t        plate H    D_app/D  tilt',
          bandRow('slip', cmp.slip),
          bandRow('pressure', cmp.pressure),
        ].join('\n')
      : `no band: ${cmp.bandProblem ?? 'not asked for (--particles 0)'}`,
    ...(b && cmp.bandProblem ? [`note: ${cmp.bandProblem}`] : []),
    '',
  ].join('\n');
  return { json, text };
}

export function runTraceCommand(design: DesignDocument, c: TraceCommand): AnalysisOutput {
  const request: TraceRequest = {
    species: c.species,
    injection: c.injection!,
    detector: c.detector,
    particles: c.particles,
    seed: c.seed,
    cells: c.cells,
    frames: 2,
  };
  let phases: PhaseSpec[] = c.phases.map((p) => ({ potentials: p.potentials, duration: p.duration }));
  if (c.pinched) {
    const roles = guessCrossRoles(design);
    if (!roles) throw new SolveError('invalid-option', '--pinched needs a cross with ports S, SW, B and W (or named sample, sample waste, buffer, waste)', { field: 'pinched' });
    const preset = pinchedPlug(design, roles, { speciesMobility: c.species.mobility });
    request.injection = c.injection ?? preset.injection;
    request.detector = c.detector ?? preset.detector;
    // --phase replaces the preset's phases one by one (potentials merged, a given duration wins).
    phases = preset.phases.map((p, k) => ({
      label: p.label,
      potentials: { ...p.potentials, ...(c.phases[k]?.potentials ?? {}) },
      duration: c.phases[k]?.duration ?? p.duration,
    }));
  }
  if (c.duration !== undefined) {
    if (phases.length === 0) phases = [{}];
    phases[phases.length - 1] = { ...phases[phases.length - 1], duration: c.duration };
  }
  request.phases = phases.length ? phases : undefined;
  const run = runTrace(design, request);
  const t = run.trace;
  const json = {
    particles: t.particles,
    seed: t.seed,
    dt: t.dt,
    steps: t.steps,
    phases: run.durations.map((d, k) => ({ label: phases[k]?.label ?? null, duration: d, potentials: Object.fromEntries(run.designs[k].ports.map((p) => [p.id, p.potential])) })),
    automaticDuration: run.automatic,
    absorbed: t.absorbed,
    detector: t.detector ?? null,
    arrivals: Array.from(t.arrivals.time),
    grid: run.solves[0].grid,
  };
  const d = t.detector;
  const text = [
    `${design.name}: ${t.particles} particles (seed ${t.seed}), ${run.durations.length} phase${run.durations.length > 1 ? 's' : ''} over ${formatSI(run.durations.reduce((a, b) => a + b, 0), 's')}, ${t.steps} steps of ${formatSI(t.dt, 's')}`,
    d
      ? [
          `arrived ${d.arrived} of ${t.particles}; mean time ${formatSI(d.meanTime, 's')}, spread σ_t ${formatSI(Math.sqrt(d.timeVariance), 's')}`,
          `plate number ${d.plateNumber.toPrecision(4)}, plate height ${formatSI(d.plateHeight, 'm')}, tilt ${formatSI(d.tilt, 'm')}, speed ${formatSI(d.speed, 'm/s')}`,
        ].join('\n')
      : `arrived ${t.arrivals.time.length} at the detector (too few for statistics)`,
    '',
  ].join('\n');
  return { json, text };
}

export function runPlan(design: DesignDocument, c: PlanCommand): AnalysisOutput {
  const floats = new Set(c.float);
  for (const id of floats) if (!design.ports.some((p) => p.id === id)) throw new PlanError(`--float ${id}: no port "${id}" in the design`);
  const planned: DesignDocument = { ...design, ports: design.ports.map((p) => (floats.has(p.id) ? { ...p, potential: null } : p)) };
  if (!planned.ports.some((p) => p.potential !== null)) throw new PlanError('every port floats; keep at least one electrode');
  const responses = unitResponses(planned, { cells: c.cells });
  const targets: Target[] = c.targets.map((t) => ({ ...t }));
  const plan = planSettings(responses, {
    targets,
    hold: c.hold.map((h) => ({ port: h.port, kind: 'potential' as const, value: h.value })),
    bounds: c.bounds.map((b) => ({ port: b.port, kind: 'potential' as const, min: b.min, max: b.max })),
  });
  const settings = Object.fromEntries(responses.drives.map((d, k) => [d.port, plan.settings[k]]));
  const json = {
    drives: responses.drives.map((d) => d.port),
    floating: planned.ports.filter((p) => p.potential === null).map((p) => p.id),
    settings,
    targets: plan.targets.map((t) => ({ ...t.target, wanted: t.wanted, achieved: t.achieved, residual: t.residual })),
    ports: plan.ports.map(portJson),
    grid: responses.results[0].grid,
  };
  const show = (t: Target, v: number) => (t.kind === 'current' ? formatSI(v, 'A') : t.kind === 'speed' ? formatSI(v, 'm/s') : formatFlow(v));
  const text = [
    `${design.name}: reservoir potentials from ${responses.drives.length} unit responses`,
    ...Object.entries(settings).map(([id, v]) => `  ${id.padEnd(6)} ${formatSI(v, 'V')}`),
    'targets (wanted, achieved, residual):',
    ...plan.targets.map((t) => `  ${t.target.kind} ${t.target.port}${t.target.kind === 'ratio' ? ` = ${t.target.value} × ${t.target.of}` : ''}: ${show(t.target, t.wanted)}, ${show(t.target, t.achieved)}, ${show(t.target, t.residual)}`),
    '',
  ].join('\n');
  return { json, text };
}

/** Distances from the wall, in Debye lengths, at which `edl` reports the profile (those of reference-values.md §4). */
const EDL_POINTS = [0, 0.5, 1, 2, 3, 5];

export function runEdl(design: DesignDocument | null, c: EdlCommand): AnalysisOutput {
  const b = design?.buffer;
  const input = {
    ionicStrength: c.ionicStrength ?? b?.ionicStrength,
    zeta: c.zeta ?? design?.zeta.side,
    temperature: c.temperature ?? b?.temperature,
    relativePermittivity: c.permittivity ?? b?.relativePermittivity ?? 78.4,
    viscosity: c.viscosity ?? b?.viscosity ?? 8.9e-4,
    valence: c.valence,
    field: c.field,
    depth: c.depth ?? design?.depth,
    width: c.width ?? (design ? narrowestChannel(design) ?? undefined : undefined),
  };
  if (input.ionicStrength === undefined || input.zeta === undefined || input.temperature === undefined) {
    throw new SolveError('invalid-option', 'edl needs --ionic-strength, --zeta and --temperature');
  }
  const full = { ...input, ionicStrength: input.ionicStrength, zeta: input.zeta, temperature: input.temperature };
  const r = doubleLayer(full);
  const lambda = r.debyeLength;
  const profile = EDL_POINTS.map((s) => {
    const psi = gouyChapmanPotential(s * lambda, full.zeta, lambda, full.temperature, full.valence ?? 1);
    return { yOverDebye: s, y: s * lambda, potential: psi, potentialDebyeHuckel: full.zeta * Math.exp(-s), velocityRatio: edlVelocityRatio(psi, full.zeta) };
  });
  const { profile: _long, ...summary } = r;
  const json = { input: full, ...summary, profile };
  const text = [
    `Debye length ${formatSI(lambda, 'm')} (I = ${full.ionicStrength} mol/m³, ${(full.temperature - 273.15).toFixed(1)} °C)`,
    `slip ${formatSI(r.slipVelocity, 'm/s')} at ${formatSI(full.field ?? 1e4, 'V/m')} (mobility ${r.mobility.toExponential(3)} m²/Vs, zeta ${formatSI(full.zeta, 'V')})`,
    `wall vorticity ${perSecond(r.wallVorticity)}${r.pressureWallVorticity !== undefined ? `; pressure-driven at the same mean speed ${perSecond(r.pressureWallVorticity)}` : ''}`,
    ...(r.slitCorrection !== undefined ? [`finite-EDL mean velocity: slit ${r.slitCorrection.toPrecision(6)} of u_HS`] : []),
    ...(r.capillaryCorrection !== undefined ? [`finite-EDL mean velocity: capillary ${r.capillaryCorrection.toPrecision(6)} of u_HS`] : []),
    r.verdict,
    '',
  ].join('\n');
  return { json, text };
}

/** Width of the layout's narrowest channel (m), as the solver's grid choice measures it; null when it has none. */
export function narrowestChannel(design: DesignDocument): number | null {
  const adds = design.shapes.filter((s) => s.op === 'add');
  if (adds.length === 0) return null;
  const region = fluidRegion(design.shapes, ARC_TOLERANCE);
  if (!(region.area > 0)) return null;
  return channelWidths(region, SLIVER_RATIO * Math.min(...adds.map(shapeFeatureSize))).narrowest?.width ?? null;
}
