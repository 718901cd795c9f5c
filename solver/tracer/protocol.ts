import { parseDesign, type DesignDocument } from '../../shared/design';
import type { Vec2 } from '../geometry/ring';
import type { FluidRegion } from '../geometry/fluid-region';
import { windingNumber } from '../geometry/ring';
import { invalidDesign, SolveError } from '../result/errors';
import { solveDesign, type SolveProgress, type SolveResult } from '../solve';
import { traceBand, type Injection, type Species, type TraceFields, type TraceResult } from './trace';
import { gridForSolve, traceFieldsOf } from './trace-fields';

const { max, hypot } = Math;

/**
 * One step of a protocol as the engineer states it: port potentials and pressures that differ from the design's
 * (e.g. loading, then dispensing for a pinched plug), held for a time. The last phase may leave its duration out:
 * it then lasts until the band has passed the detector (see `runTrace`).
 */
export interface PhaseSpec {
  label?: string;
  potentials?: Record<string, number | null>;
  pressures?: Record<string, number>;
  duration?: number;
}

export interface TraceRequest {
  species: Species;
  injection: Injection;
  detector?: { from: Vec2; to: Vec2 };
  /** Default: one phase, the design as it stands. */
  phases?: PhaseSpec[];
  particles?: number;
  seed?: number;
  frames?: number;
  depthDispersion?: boolean;
  /** Grid cells along the longer side (as `solve --cells`). */
  cells?: number;
  tolerance?: number;
  shouldStop?: () => boolean;
  onProgress?: (progress: { stage: 'solve' | 'trace'; phase: number; fraction: number }) => void;
}

export interface TraceRun {
  trace: TraceResult;
  /** The solve of each phase (fields on the same grid), and the design each phase solved. */
  solves: SolveResult[];
  designs: DesignDocument[];
  /** The duration of each phase as run (s); `automatic` when the last one was chosen from the detector. */
  durations: number[];
  automatic: boolean;
}

/** The design with a phase's port potentials and pressures written in. */
export function phaseDesign(design: DesignDocument, phase: PhaseSpec): DesignDocument {
  const known = new Set(design.ports.map((p) => p.id));
  for (const id of [...Object.keys(phase.potentials ?? {}), ...Object.keys(phase.pressures ?? {})]) {
    if (!known.has(id)) throw new SolveError('invalid-option', `phase "${phase.label ?? ''}" sets port "${id}", which the design does not have`, { field: 'phases' });
  }
  return {
    ...design,
    ports: design.ports.map((p) => ({
      ...p,
      potential: phase.potentials && p.id in phase.potentials ? phase.potentials[p.id] : p.potential,
      pressure: phase.pressures && p.id in phase.pressures ? phase.pressures[p.id] : p.pressure,
    })),
  };
}

/**
 * Solves each phase of a protocol, then follows the band through them (traceBand). When the last phase has no
 * duration, a pilot of a few particles without diffusion finds when the slowest of them crosses the detector, and
 * the band is followed 1.6 times as long (enough for the diffusive tail of the arrival curve).
 */
export function runTrace(input: unknown, request: TraceRequest): TraceRun {
  const parsed = parseDesign(input);
  if (!parsed.ok) throw invalidDesign(parsed.errors);
  const design = parsed.design;
  const specs = request.phases?.length ? request.phases : [{}];
  checkRequest(request, specs);

  const designs = specs.map((spec) => phaseDesign(design, spec));
  const solves = designs.map((d, k) =>
    solveDesign(d, {
      cells: request.cells,
      tolerance: request.tolerance,
      shouldStop: request.shouldStop,
      onProgress: request.onProgress && ((p: SolveProgress) => request.onProgress!({ stage: 'solve', phase: k, fraction: stageFraction(p) })),
    }),
  );
  const { grid, region } = gridForSolve(design, solves[0].fields, request.cells);
  const fields = solves.map((s, k) => traceFieldsOf(designs[k], s.fields, grid));
  const injection = request.injection.kind === 'line' ? clipToFluid(request.injection, region) : request.injection;

  let durations = specs.map((s) => s.duration ?? NaN);
  const automatic = !(durations[durations.length - 1] > 0);
  if (automatic) {
    if (!request.detector) throw new SolveError('invalid-option', 'give the last phase a duration, or a detector line to run until the band has passed it', { field: 'duration' });
    const last = fields.length - 1;
    const times = pilotArrivals(fields, durations, injection, request.detector, request.species.mobility, request.seed ?? 1, request.shouldStop);
    if (times.length === 0) {
      throw new SolveError(
        'invalid-option',
        'the band does not reach the detector: draw the detector across the channel downstream of the injection, or give the last phase a duration',
        { field: 'detector' },
      );
    }
    durations = durations.map((d, k) => (k === last ? 1.6 * max(...times) : d));
  }

  const total = durations.reduce((a, b) => a + b, 0);
  const trace = placed(() => traceBand({
    species: request.species,
    injection,
    phases: fields.map((f, k) => ({ fields: f, duration: durations[k] })),
    detector: request.detector,
    particles: request.particles,
    seed: request.seed,
    frames: request.frames,
    depthDispersion: request.depthDispersion,
    shouldStop: request.shouldStop,
    onProgress: request.onProgress && ((f: number) => request.onProgress!({ stage: 'trace', phase: phaseAt(durations, f * total), fraction: f })),
  }));
  if (request.shouldStop?.()) throw new SolveError('cancelled', 'The trace was stopped.');
  return { trace, solves, designs, durations, automatic };
}

/**
 * A pilot for an open-ended last phase: 24 particles without diffusion (so along their streamlines) through the
 * phases, the last held until they pass the detector, capped at 400 000 steps of 0.3 cells at the top species
 * speed. Returns their arrival times at the detector (s, from the start of the last phase); empty when none
 * arrive. `durations` gives every phase but the last.
 */
export function pilotArrivals(
  fields: ReadonlyArray<TraceFields>,
  durations: ReadonlyArray<number>,
  injection: Injection,
  detector: { from: Vec2; to: Vec2 },
  mobility: number,
  seed: number,
  shouldStop?: () => boolean,
): Float64Array {
  const grid = fields[0].grid;
  const last = fields.length - 1;
  const vmax = max(1e-30, ...fields.map((f) => speedLimit(f.velocityX, f.velocityY, f.fieldX, f.fieldY, mobility, grid.fraction)));
  const cap = (4e5 * 0.3 * grid.spacing) / vmax;
  const pilot = placed(() => traceBand({
    species: { mobility, diffusivity: 0 },
    injection,
    phases: fields.map((f, k) => ({ fields: f, duration: k === last ? cap : durations[k] })),
    detector,
    particles: 24,
    seed,
    frames: 2,
    depthDispersion: false,
    shouldStop,
  }));
  return pilot.arrivals.time;
}

/** traceBand refuses a region with too little fluid by a plain Error: that is the engineer's input, not a bug. */
function placed<T>(work: () => T): T {
  try {
    return work();
  } catch (error) {
    if (error instanceof Error && !(error instanceof SolveError) && /injection region/.test(error.message)) {
      throw new SolveError('invalid-option', `${error.message}: draw it over the channel`, { field: 'injection' });
    }
    throw error;
  }
}

/**
 * The part of an injection line inside the fluid: a line drawn across a channel usually runs a little past its
 * walls, and particles placed outside the fluid would never move. Cuts the line at every edge of the fluid
 * outline and keeps the longest stretch inside, pulled in from the walls by a millionth of its length.
 */
export function clipToFluid(line: { kind: 'line'; from: Vec2; to: Vec2 }, region: FluidRegion): { kind: 'line'; from: Vec2; to: Vec2 } {
  const [ax, ay] = line.from;
  const dx = line.to[0] - ax, dy = line.to[1] - ay;
  const cuts = [0, 1];
  for (const rings of region.polygons) {
    for (const ring of rings) {
      for (let k = 0, n = ring.length; k < n; k++) {
        const [px, py] = ring[k];
        const ex = ring[(k + 1) % n][0] - px, ey = ring[(k + 1) % n][1] - py;
        const den = dx * ey - dy * ex;
        if (den === 0) continue;
        const t = ((px - ax) * ey - (py - ay) * ex) / den;
        const u = ((px - ax) * dy - (py - ay) * dx) / den;
        if (t > 0 && t < 1 && u >= 0 && u <= 1) cuts.push(t);
      }
    }
  }
  cuts.sort((a, b) => a - b);
  let best: [number, number] | null = null;
  for (let k = 0; k + 1 < cuts.length; k++) {
    const [t0, t1] = [cuts[k], cuts[k + 1]];
    if (!(t1 > t0)) continue;
    const m = (t0 + t1) / 2;
    const inside = region.polygons.some((rings) => windingNumber(rings, ax + m * dx, ay + m * dy) !== 0);
    if (inside && (!best || t1 - t0 > best[1] - best[0])) best = [t0, t1];
  }
  if (!best) throw new SolveError('invalid-option', 'the injection line does not cross the fluid: draw it across a channel', { field: 'injection' });
  if (best[0] === 0 && best[1] === 1) return line;
  const lo = best[0] + 1e-6 * (best[1] - best[0]);
  const hi = best[1] - 1e-6 * (best[1] - best[0]);
  return { kind: 'line', from: [ax + lo * dx, ay + lo * dy], to: [ax + hi * dx, ay + hi * dy] };
}

function checkRequest(r: TraceRequest, specs: PhaseSpec[]): void {
  const bad = (field: string, message: string) => new SolveError('invalid-option', message, { field });
  if (!Number.isFinite(r.species.mobility)) throw bad('species', 'the species mobility must be a finite number (m²/Vs)');
  if (!(r.species.diffusivity >= 0) || !Number.isFinite(r.species.diffusivity)) throw bad('species', 'the species diffusivity must be zero or positive (m²/s)');
  if (r.particles !== undefined && !(Number.isInteger(r.particles) && r.particles >= 10 && r.particles <= 200000)) {
    throw bad('particles', 'particles must be a whole number from 10 to 200000');
  }
  if (r.seed !== undefined && !Number.isInteger(r.seed)) throw bad('seed', 'the seed must be a whole number');
  specs.forEach((s, k) => {
    const isLast = k === specs.length - 1;
    if (s.duration === undefined && !isLast) throw bad('phases', `phase ${k + 1} needs a duration (only the last may run until the band passes the detector)`);
    if (s.duration !== undefined && !(s.duration > 0 && Number.isFinite(s.duration))) throw bad('phases', `phase ${k + 1}'s duration must be a positive number of seconds`);
  });
  const segment = (name: string, seg?: { from: Vec2; to: Vec2 }) => {
    if (!seg) return;
    const ok = [...seg.from, ...seg.to].every(Number.isFinite) && hypot(seg.to[0] - seg.from[0], seg.to[1] - seg.from[1]) > 0;
    if (!ok) throw bad(name, `the ${name} line needs two different points`);
  };
  if (r.injection.kind === 'line') segment('injection', r.injection);
  else if (r.injection.polygon.length < 3 || !r.injection.polygon.flat().every(Number.isFinite)) throw bad('injection', 'the injection region needs at least three points');
  segment('detector', r.detector);
}

/** The largest species speed |u + μ_ep E| over the fluid. */
function speedLimit(ux: ArrayLike<number>, uy: ArrayLike<number>, ex: ArrayLike<number>, ey: ArrayLike<number>, mu: number, fraction: ArrayLike<number>): number {
  let top = 0;
  for (let c = 0; c < fraction.length; c++) {
    if (!(fraction[c] > 0)) continue;
    const s = hypot(ux[c] + mu * ex[c], uy[c] + mu * ey[c]);
    if (s > top) top = s;
  }
  return top;
}

function phaseAt(durations: number[], t: number): number {
  let end = 0;
  for (let k = 0; k < durations.length; k++) {
    end += durations[k];
    if (t < end) return k;
  }
  return durations.length - 1;
}

const STAGE_SHARE: Record<SolveProgress['stage'], [number, number]> = { geometry: [0, 0.05], potential: [0.05, 0.3], flow: [0.3, 0.95], fields: [0.95, 1] };

function stageFraction(p: SolveProgress): number {
  const [a, b] = STAGE_SHARE[p.stage];
  return a + (b - a) * p.fraction;
}

