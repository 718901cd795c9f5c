/** Sweeps (capability 11): one or two parameters of a revision's document varied over a range. */
import type { Id, PersonRef, Timestamp } from './common';
import type { RunState } from './designs';

/** Outputs a sweep can plot and tabulate; every point keeps its whole summary, outputs choose what is shown. */
export const SWEEP_OUTPUTS = ['portCurrents', 'portFlowRates', 'maxField', 'maxVorticity', 'joulePower', 'warnings'] as const;
export type SweepOutput = (typeof SWEEP_OUTPUTS)[number];

/** How a sweep was answered: at once from unit responses (linear parameters), or one queued job per point. */
export type SweepMethod = 'superposed' | 'jobs';

export type SweepRange =
  | { kind: 'linear'; from: number; to: number; steps: number }
  /** Geometric steps from `from` to `to` (both of one sign, neither zero). */
  | { kind: 'log'; from: number; to: number; steps: number }
  | { kind: 'list'; values: number[] };

export interface SweepParameter {
  /** RFC 6901 JSON pointer to a number in the design document, e.g. `/ports/0/potential` or `/shapes/2/width`. */
  pointer: string;
  range: SweepRange;
}

/** POST /api/sweeps. */
export interface SweepRequest {
  revisionId: Id;
  /** One parameter (curves) or two (maps); at most 400 points in all. */
  parameters: SweepParameter[];
  outputs: SweepOutput[];
  /** Grid cells along the longer side of the layout (default 120). */
  cells?: number;
}

/** A parameter as a sweep reports it: what it points at, in words, with its unit kind and every value taken. */
export interface SweepParameterInfo extends SweepParameter {
  label: string;
  /** The quantity's kind, named as the app's unit formatter names dimensions ('length', 'potential', ...). */
  dimension: string;
  values: number[];
}

/** What one point of a sweep found (SI units, signs as a run's summary). */
export interface SweepPointResult {
  ports: { id: string; potential: number | null; current: number; flowRate: number }[];
  metrics: { joulePower: number; maxField: number; maxVorticity: number; maxSpeed: number };
  warnings: { code: string; message: string }[];
  grid?: { nx: number; ny: number; spacing: number };
}

export interface SweepPoint {
  /** Point k of a sweep: parameter 1 varies fastest (k = i1 + n1 * i2). */
  index: number;
  values: number[];
  status: RunState;
  result: SweepPointResult | null;
  error: string | null;
  /** How many times a worker started this point (more than 1 after a retry). */
  attempts: number;
  /** Solve time of the point (s), as the worker measured it. */
  seconds: number | null;
  /** The run this point was opened as, once someone opened it. */
  runId: Id | null;
}

export interface SweepSummary {
  id: Id;
  designId: Id;
  revisionId: Id;
  revisionNumber: number;
  status: RunState;
  method: SweepMethod;
  parameters: SweepParameterInfo[];
  outputs: SweepOutput[];
  cells: number;
  total: number;
  /** Points finished (solved or failed). */
  done: number;
  failed: number;
  /** Why the whole sweep failed or stopped, when it did. */
  message: string | null;
  createdAt: Timestamp;
  finishedAt: Timestamp | null;
  author: PersonRef;
}

export interface SweepDetail extends SweepSummary {
  points: SweepPoint[];
}

/**
 * GET /api/sweeps/:id/events (text/event-stream, bearer token): `snapshot` (a SweepDetail) first, then `point`
 * (a SweepPoint) and `status` (the summary) as they change; the stream ends after the sweep reaches solved,
 * failed or cancelled.
 */
export type SweepEvent =
  | { type: 'snapshot'; sweep: SweepDetail }
  | { type: 'point'; point: SweepPoint }
  | { type: 'status'; sweep: SweepSummary };
