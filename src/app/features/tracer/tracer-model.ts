/**
 * The Tracer tab's pure pieces: first injection and detector lines across ports, the trace request built from the
 * form (a band from a line or a region, or a pinched plug at a cross with its loading and dispensing potentials),
 * the phase shown at a frame's time, and the arrival-time histogram.
 */
import type { DesignDocument, Port } from '../../../../shared/design';
import type { Injection, PhaseSpec, TraceFrame, TraceResult } from '../../../workers/solver-api';
import type { WorkerTraceRequest } from '../../core/solver-client';
import { insideRings, type Vec } from '../fields/field-sampling';

export type InjectionMode = 'line' | 'region' | 'pinched';
export type Segment = { from: [number, number]; to: [number, number] };

/** A segment across the channel at a port, `widths` channel widths inside, a little longer than the port. */
export function acrossPort(port: Pick<Port, 'from' | 'to'>, rings: ReadonlyArray<ReadonlyArray<Vec>>, widths = 3, overhang = 0.05): Segment {
  const [ax, ay] = port.from, [bx, by] = port.to;
  const w = Math.hypot(bx - ax, by - ay) || 1e-12;
  const tx = (bx - ax) / w, ty = (by - ay) / w;
  const mx = (ax + bx) / 2, my = (ay + by) / 2;
  let nx = -ty, ny = tx;
  if (rings.length > 0 && !insideRings(rings, [mx + nx * 0.5 * w, my + ny * 0.5 * w])) [nx, ny] = [-nx, -ny];
  const cx = mx + nx * widths * w, cy = my + ny * widths * w;
  const half = (0.5 + overhang) * w;
  return { from: [cx - tx * half, cy - ty * half], to: [cx + tx * half, cy + ty * half] };
}

/**
 * A band and a detector to start from: injected across the channel at the port of highest potential (where a
 * species with positive apparent mobility enters), detected at the port of lowest potential; null without two
 * electrodes at different potentials.
 */
export function defaultBand(doc: DesignDocument, rings: ReadonlyArray<ReadonlyArray<Vec>>): { injection: Segment; detector: Segment } | null {
  const electrodes = doc.ports.filter((p) => p.potential !== null);
  if (electrodes.length < 2) return null;
  const hi = electrodes.reduce((a, b) => (b.potential! > a.potential! ? b : a));
  const lo = electrodes.reduce((a, b) => (b.potential! < a.potential! ? b : a));
  if (hi.potential === lo.potential) return null;
  return { injection: acrossPort(hi, rings, 3), detector: acrossPort(lo, rings, 3, 0) };
}

/** Rectangle of two corners as the polygon of a region injection. */
export function rectangle(a: Vec, b: Vec): Array<[number, number]> {
  return [
    [a[0], a[1]],
    [b[0], a[1]],
    [b[0], b[1]],
    [a[0], b[1]],
  ];
}

export interface TraceForm {
  mode: InjectionMode;
  mobility: number;
  diffusivity: number;
  particles: number;
  seed: number;
  /** Line and region modes: how long to follow the band; null until it passes the detector. */
  duration: number | null;
  line: Segment | null;
  region: Array<[number, number]> | null;
  detector: Segment | null;
  /** Pinched plug: injection region and the two phases (the last may run until the plug passes). */
  pinched: { region: Array<[number, number]>; phases: PhaseSpec[] } | null;
}

/** What the worker runs for the form, or the reason it cannot run yet. */
export function traceRequest(f: TraceForm): { request: WorkerTraceRequest } | { problem: string } {
  const species = { mobility: f.mobility, diffusivity: f.diffusivity };
  const common = { species, particles: f.particles, seed: f.seed, frames: 60, detector: f.detector ?? undefined };
  if (f.mode === 'pinched') {
    if (!f.pinched) return { problem: 'Pick the four ports of the cross.' };
    if (!f.detector) return { problem: 'Draw the detector line across the separation channel.' };
    return { request: { ...common, injection: { kind: 'region', polygon: f.pinched.region }, phases: f.pinched.phases } };
  }
  const injection: Injection | null =
    f.mode === 'line' ? (f.line ? { kind: 'line', ...f.line } : null) : f.region ? { kind: 'region', polygon: f.region } : null;
  if (!injection) return { problem: f.mode === 'line' ? 'Draw the injection line across a channel.' : 'Draw the injection region over a channel.' };
  if (!f.detector && f.duration === null) return { problem: 'Draw a detector line, or give a duration.' };
  return { request: { ...common, injection, phases: [{ duration: f.duration ?? undefined }] } };
}

/** Index of the phase running at time t (s), given each phase's duration. */
export function phaseAt(durations: ReadonlyArray<number>, t: number): number {
  let end = 0;
  for (let k = 0; k < durations.length; k++) {
    end += durations[k];
    if (t < end - 1e-12) return k;
  }
  return Math.max(0, durations.length - 1);
}

export interface Histogram {
  /** Bin edges (s), one more than the counts. */
  edges: number[];
  counts: number[];
}

/** Arrival times in about √n bins (at least 8, at most 60) over their range. */
export function arrivalHistogram(times: ArrayLike<number>): Histogram {
  const n = times.length;
  if (n === 0) return { edges: [], counts: [] };
  let lo = Infinity, hi = -Infinity;
  for (let k = 0; k < n; k++) {
    lo = Math.min(lo, times[k]);
    hi = Math.max(hi, times[k]);
  }
  if (!(hi > lo)) {
    const pad = Math.abs(lo) * 0.01 || 1e-6;
    lo -= pad;
    hi += pad;
  }
  const bins = Math.min(60, Math.max(8, Math.round(Math.sqrt(n))));
  const width = (hi - lo) / bins;
  const counts = new Array<number>(bins).fill(0);
  for (let k = 0; k < n; k++) counts[Math.min(bins - 1, Math.floor((times[k] - lo) / width))]++;
  return { edges: Array.from({ length: bins + 1 }, (_, k) => lo + k * width), counts };
}

/** Band spread σ = √variance along the direction of travel, per frame (m), for the plot over time. */
export function spreadSeries(frames: ReadonlyArray<TraceFrame>): { t: Float64Array; sigma: Float64Array } {
  return { t: Float64Array.from(frames, (f) => f.time), sigma: Float64Array.from(frames, (f) => Math.sqrt(f.variance)) };
}

/** Particles still in the chip in a frame. */
export function aliveCount(frame: TraceFrame): number {
  let n = 0;
  for (let k = 0; k < frame.positions.length; k += 2) if (frame.positions[k] === frame.positions[k]) n++;
  return n;
}

export type TraceSummary = Pick<TraceResult, 'particles' | 'seed' | 'dt' | 'steps' | 'absorbed' | 'detector'>;
