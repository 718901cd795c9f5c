import { InjectionToken, inject } from '@angular/core';
import { proxy, wrap, type Remote } from 'comlink';
import type {
  AnalysisApi,
  AnalysisProgress,
  BasisOutcome,
  CompareOutcome,
  LayoutMeasure,
  PlanOutcome,
  PlannerMap,
  PlanRequest,
  RecombineOutcome,
  SolveFailure,
  SolveOutcome,
  SolveProgress,
  SolverApi,
  TraceOutcome,
  WorkerCompareOptions,
  WorkerSolveOptions,
  WorkerTraceRequest,
} from '../../workers/solver-api';

export type {
  AnalysisProgress,
  BasisOutcome,
  CompareOutcome,
  Drive,
  LayoutMeasure,
  PlanOutcome,
  PlannerBasis,
  PlannerMap,
  PlanRequest,
  PlanResult,
  RecombineOutcome,
  Target,
  SolveFailure,
  SolveOutcome,
  SolveProgress,
  TraceOutcome,
  WorkerCompareOptions,
  WorkerSolveOptions,
  WorkerTraceRequest,
} from '../../workers/solver-api';


/**
 * The solver as the app sees it. Solves run in a Web Worker; `cancel()` ends that worker (a worker busy in the
 * solver's loops cannot read a message) and the next call starts a fresh one. Tests provide a fake with useValue.
 */
export interface SolverClient {
  hello(): Promise<{ ready: boolean; at: number }>;
  measure(design: unknown): Promise<LayoutMeasure>;
  /** Resolves with the outcome; a cancelled solve resolves with { ok: false, error: { code: 'cancelled' } }. */
  solve(design: unknown, options: WorkerSolveOptions, onProgress?: (progress: SolveProgress) => void): Promise<SolveOutcome>;
  /** Stops the solve in flight, if any. */
  cancel(): void;
}

export const SOLVER = new InjectionToken<SolverClient>('Osmolane solver worker');

/**
 * The analyses of the Compare, Planner and Tracer tabs, in the same worker as the solves (one at a time: starting
 * one stops whatever was running). `cancel()` stops it. Tests provide a fake with useValue.
 */
export interface AnalysisClient {
  compare(design: unknown, options: WorkerCompareOptions, onProgress?: (progress: AnalysisProgress) => void): Promise<CompareOutcome>;
  unitResponses(design: unknown, options: WorkerSolveOptions, onProgress?: (progress: AnalysisProgress) => void): Promise<BasisOutcome>;
  recombine(basis: number, map: PlannerMap, settings: number[]): Promise<RecombineOutcome>;
  plan(basis: number, request: PlanRequest): Promise<PlanOutcome>;
  releaseBasis(basis: number): Promise<void>;
  trace(design: unknown, request: WorkerTraceRequest, onProgress?: (progress: AnalysisProgress) => void): Promise<TraceOutcome>;
  cancel(): void;
}

/** By default the app's SOLVER, which runs the analyses too. */
export const ANALYSIS = new InjectionToken<AnalysisClient>('Osmolane analyses in the solver worker', {
  providedIn: 'root',
  factory: () => inject(SOLVER) as unknown as AnalysisClient,
});

const CANCELLED_ERROR: SolveFailure = { code: 'cancelled', message: 'The solve was stopped.' };
export const CANCELLED: SolveOutcome = { ok: false, error: CANCELLED_ERROR };

/** One started worker: its comlink handle, and a promise that rejects when it ends or fails. */
class WorkerHandle {
  readonly remote: Remote<SolverApi & AnalysisApi>;
  readonly ended: Promise<never>;
  private end!: (reason: Error) => void;

  constructor(private readonly worker: Worker) {
    this.remote = wrap<SolverApi & AnalysisApi>(worker);
    this.ended = new Promise<never>((_, reject) => (this.end = reject));
    this.ended.catch(() => undefined);
    worker.addEventListener('error', (event) => {
      event.preventDefault();
      this.stop(new Error(`The solver worker failed: ${event.message || 'it could not start'}`));
    });
  }

  /** Calls into the worker, giving up when the worker ends first. */
  call<T>(work: (remote: Remote<SolverApi & AnalysisApi>) => Promise<T>): Promise<T> {
    return Promise.race([work(this.remote), this.ended]);
  }

  stop(reason: Error): void {
    this.worker.terminate();
    this.end(reason);
  }
}

class WorkerEnded extends Error {}

/** The SolverClient (and AnalysisClient) over a real worker, started on first use and again after a cancel. */
export class WorkerSolverClient implements SolverClient, AnalysisClient {
  private handle: WorkerHandle | null = null;
  private solving: WorkerHandle | null = null;

  constructor(private readonly start: () => Worker) {}

  private current(): WorkerHandle {
    this.handle ??= new WorkerHandle(this.start());
    return this.handle;
  }

  hello(): Promise<{ ready: boolean; at: number }> {
    return this.current().call((r) => r.hello());
  }

  measure(design: unknown): Promise<LayoutMeasure> {
    return this.current().call((r) => r.measure(design));
  }

  solve(design: unknown, options: WorkerSolveOptions, onProgress?: (progress: SolveProgress) => void): Promise<SolveOutcome> {
    return this.exclusive((r) => r.solve(design, options, onProgress ? proxy(onProgress) : undefined) as Promise<SolveOutcome>);
  }

  compare(design: unknown, options: WorkerCompareOptions, onProgress?: (progress: AnalysisProgress) => void): Promise<CompareOutcome> {
    return this.exclusive((r) => r.compare(design, options, onProgress ? proxy(onProgress) : undefined) as Promise<CompareOutcome>);
  }

  unitResponses(design: unknown, options: WorkerSolveOptions, onProgress?: (progress: AnalysisProgress) => void): Promise<BasisOutcome> {
    return this.exclusive((r) => r.unitResponses(design, options, onProgress ? proxy(onProgress) : undefined) as Promise<BasisOutcome>);
  }

  /** Not exclusive (as are plan and releaseBasis): waits behind a call in flight rather than stopping it. */
  recombine(basis: number, map: PlannerMap, settings: number[]): Promise<RecombineOutcome> {
    return this.current().call((r) => r.recombine(basis, map, settings) as Promise<RecombineOutcome>);
  }

  plan(basis: number, request: PlanRequest): Promise<PlanOutcome> {
    return this.current().call((r) => r.plan(basis, request) as Promise<PlanOutcome>);
  }

  releaseBasis(basis: number): Promise<void> {
    return this.current().call((r) => r.releaseBasis(basis));
  }

  trace(design: unknown, request: WorkerTraceRequest, onProgress?: (progress: AnalysisProgress) => void): Promise<TraceOutcome> {
    return this.exclusive((r) => r.trace(design, request, onProgress ? proxy(onProgress) : undefined) as Promise<TraceOutcome>);
  }

  /** One long call at a time: a new one stops the one in flight; a stopped call resolves as cancelled. */
  private async exclusive<T>(work: (remote: Remote<SolverApi & AnalysisApi>) => Promise<T>): Promise<T | { ok: false; error: SolveFailure }> {
    if (this.solving) this.cancel();
    const handle = this.current();
    this.solving = handle;
    try {
      return await handle.call(work);
    } catch (error) {
      if (error instanceof WorkerEnded) return { ok: false, error: { ...CANCELLED_ERROR } };
      return { ok: false, error: { code: 'internal', message: error instanceof Error ? error.message : String(error) } };
    } finally {
      if (this.solving === handle) this.solving = null;
    }
  }

  cancel(): void {
    const handle = this.solving;
    if (!handle) return;
    this.solving = null;
    if (this.handle === handle) this.handle = null;
    handle.stop(new WorkerEnded('The solve was stopped.'));
  }
}
