import { InjectionToken } from '@angular/core';
import { proxy, wrap, type Remote } from 'comlink';
import type { SolveProgress } from '../../../solver/solve';
import type { LayoutMeasure, SolveOutcome, SolverApi, WorkerSolveOptions } from '../../workers/solver-api';

export type { LayoutMeasure, SolveFailure, SolveOutcome, WorkerSolveOptions } from '../../workers/solver-api';
export type { SolveProgress } from '../../../solver/solve';

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

export const CANCELLED: SolveOutcome = { ok: false, error: { code: 'cancelled', message: 'The solve was stopped.' } };

/** One started worker: its comlink handle, and a promise that rejects when it ends or fails. */
class WorkerHandle {
  readonly remote: Remote<SolverApi>;
  readonly ended: Promise<never>;
  private end!: (reason: Error) => void;

  constructor(private readonly worker: Worker) {
    this.remote = wrap<SolverApi>(worker);
    this.ended = new Promise<never>((_, reject) => (this.end = reject));
    this.ended.catch(() => undefined);
    worker.addEventListener('error', (event) => {
      event.preventDefault();
      this.stop(new Error(`The solver worker failed: ${event.message || 'it could not start'}`));
    });
  }

  /** Calls into the worker, giving up when the worker ends first. */
  call<T>(work: (remote: Remote<SolverApi>) => Promise<T>): Promise<T> {
    return Promise.race([work(this.remote), this.ended]);
  }

  stop(reason: Error): void {
    this.worker.terminate();
    this.end(reason);
  }
}

class WorkerEnded extends Error {}

/** The SolverClient over a real worker, started on first use and again after a cancel. */
export class WorkerSolverClient implements SolverClient {
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

  async solve(design: unknown, options: WorkerSolveOptions, onProgress?: (progress: SolveProgress) => void): Promise<SolveOutcome> {
    if (this.solving) this.cancel();
    const handle = this.current();
    this.solving = handle;
    try {
      return await handle.call((r) => r.solve(design, options, onProgress ? proxy(onProgress) : undefined) as Promise<SolveOutcome>);
    } catch (error) {
      if (error instanceof WorkerEnded) return CANCELLED;
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
