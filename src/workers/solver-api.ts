import type { Comparison } from '../../solver/compare';
import type { PlanRequest, UnitResponses } from '../../solver/planner';
import type { SolveProgress, SolveResult } from '../../solver/solve';
import type { TraceRequest, TraceRun } from '../../solver/tracer';
import type { PlanOutcome, PlannerBasis, PlannerMap, RecombineOutcome } from './worker-planner';

export type { PlanOutcome, PlannerBasis, PlannerMap, RecombineOutcome } from './worker-planner';

/** The solver's types the page reads (types only: the solver's code stays in the workers). */
export type { Comparison, ComparisonSide } from '../../solver/compare';
export type { Drive, PlanRequest, PlanResult, Target, UnitResponses } from '../../solver/planner';
export type { SolveProgress, SolveResult } from '../../solver/solve';
export type { Injection, PhaseSpec, TraceFrame, TraceResult, TraceRun } from '../../solver/tracer';

/** What the worker measures of a layout before solving: enough to show cells across the narrowest channel. */
export interface LayoutMeasure {
  /** Width of the narrowest channel (m); null when the layout has none (empty, or no facing walls). */
  narrowest: number | null;
  /** Fluid bounding box [xmin, ymin, xmax, ymax] (m); null when there is no fluid. */
  bounds: [number, number, number, number] | null;
  /** Why the layout could not be measured (shapes that do not combine), if so. */
  problem?: string;
}

export interface WorkerSolveOptions {
  /** Cells along the longer side of the layout; the solver's default (about 10 across the narrowest channel) when absent. */
  cells?: number;
  tolerance?: number;
}

/** A solve's error as plain data (comlink would lose a SolveError's code). */
export interface SolveFailure {
  code: string;
  message: string;
  field?: string;
}

export type SolveOutcome =
  | {
      ok: true;
      /** The result; its field arrays arrive as transferred buffers. */
      result: SolveResult;
      /** Narrowest channel (m) of the solved layout, and the cells across it at the solved spacing. */
      narrowest: number | null;
      cellsAcross: number | null;
      /** The cells option that gives this grid again (settings of a stored run). */
      cells: number;
      /** Worker-side time of the solve (ms). */
      workerMs: number;
    }
  | { ok: false; error: SolveFailure };

/** What the solver worker offers the page (through comlink). */
export interface SolverApi {
  hello(): Promise<{ ready: boolean; at: number }>;
  measure(design: unknown): Promise<LayoutMeasure>;
  /** Solves; progress goes to the (comlink-proxied) callback, a few times a second at most. */
  solve(design: unknown, options: WorkerSolveOptions, onProgress?: (progress: SolveProgress) => void): Promise<SolveOutcome>;
}

/** Progress of an analysis (several solves, then maybe a trace): what is running and how far overall, in [0, 1]. */
export interface AnalysisProgress {
  label: string;
  fraction: number;
}

export interface WorkerCompareOptions {
  /** The port whose flow rate the slip and the pressure cases share. */
  port: string;
  cells?: number;
  referenceDiffusivity?: number;
}

/** A trace request without its callbacks (they cannot cross to the worker). */
export type WorkerTraceRequest = Omit<TraceRequest, 'shouldStop' | 'onProgress'>;

export type AnalysisOutcome<T> = ({ ok: true; workerMs: number } & T) | { ok: false; error: SolveFailure };
export type CompareOutcome = AnalysisOutcome<{ comparison: Comparison }>;
export type ResponsesOutcome = AnalysisOutcome<{ responses: UnitResponses }>;
export type BasisOutcome = AnalysisOutcome<{ basis: PlannerBasis }>;
export type TraceOutcome = AnalysisOutcome<{ run: TraceRun }>;

/** The solver worker's analyses (Compare, Planner, Tracer): results come back with their typed arrays transferred. */
export interface AnalysisApi {
  compare(design: unknown, options: WorkerCompareOptions, onProgress?: (progress: AnalysisProgress) => void): Promise<CompareOutcome>;
  /**
   * The chip's response to each electrode at 1 V and to each head that is not zero at 1 Pa (the Planner's basis).
   * The responses stay in the worker; the page gets their drives, the design's settings and the map's grid.
   */
  unitResponses(design: unknown, options: WorkerSolveOptions, onProgress?: (progress: AnalysisProgress) => void): Promise<BasisOutcome>;
  /** A map and the port table for drive strengths s, recombined from the basis (no solve): the slider's step. */
  recombine(basis: number, map: PlannerMap, settings: number[]): Promise<RecombineOutcome>;
  /** Potentials for targets by bounded least squares on the basis. */
  plan(basis: number, request: PlanRequest): Promise<PlanOutcome>;
  /** Lets the worker drop the basis (the Planner tab has closed). */
  releaseBasis(basis: number): Promise<void>;
  trace(design: unknown, request: WorkerTraceRequest, onProgress?: (progress: AnalysisProgress) => void): Promise<TraceOutcome>;
}
