import type PgBoss from 'pg-boss';
import { PointStore, type SweepInputs } from './point-store';
import type { PointJob, SweepQueue } from './queue';
import { SolverFailure, StopSignal, type SolverPool } from './solver-pool';

export interface SweepWorkerOptions {
  /** Who this is in the points' `worker` column (host:pid). */
  name: string;
  /** Points solved at once (one solver thread each). */
  concurrency: number;
  /** How often a point being solved checks whether its sweep was cancelled. */
  cancelCheckMs?: number;
  /** Waits this long after claiming each point; only for tests and demonstrations that need a point in flight. */
  holdMs?: number;
  log?: (line: string) => void;
}

/**
 * A sweep worker: takes point jobs from the queue, solves each point in a solver thread and stores the outcome.
 * A refusal by the solver (the point's document is invalid, e.g. a width that makes shapes overlap) is that
 * point's result, stored as failed and not retried; anything else (a lost database connection, a thread that
 * died) fails the job, and pg-boss retries it with backoff. A job whose worker died expires and is retried the
 * same way; its second run finds the point still open and solves it.
 */
export class SweepWorker {
  private readonly inputs = new Map<number, Promise<SweepInputs | null>>();

  constructor(
    private readonly queue: SweepQueue,
    private readonly pool: SolverPool,
    private readonly store: PointStore,
    private readonly options: SweepWorkerOptions,
  ) {}

  async start(): Promise<void> {
    await this.queue.work(
      this.options.concurrency,
      (job) => this.solve(job),
      (job) => this.giveUp(job),
    );
  }

  /** The sweep's document and parameters, read once per sweep (revisions never change). */
  private sweepInputs(sweepId: number): Promise<SweepInputs | null> {
    let found = this.inputs.get(sweepId);
    if (!found) {
      if (this.inputs.size > 50) this.inputs.delete(this.inputs.keys().next().value!);
      found = this.store.inputs(sweepId);
      found.catch(() => this.inputs.delete(sweepId));
      this.inputs.set(sweepId, found);
    }
    return found;
  }

  private async solve(job: PgBoss.JobWithMetadata<PointJob>): Promise<void> {
    const { sweepId, index } = job.data;
    const inputs = await this.sweepInputs(sweepId);
    if (!inputs) return; // the sweep was deleted with its revision
    const values = await this.store.claim(sweepId, index, this.options.name);
    if (!values) return; // solved already, or cancelled
    if (this.options.holdMs) await new Promise((r) => setTimeout(r, this.options.holdMs));

    const signal = new StopSignal();
    const watch = setInterval(() => {
      this.store.closed(sweepId, index).then((closed) => closed && signal.stop(), () => undefined);
    }, this.options.cancelCheckMs ?? 1000);
    const started = performance.now();
    try {
      const result = await this.pool.run({ kind: 'point', document: inputs.document, pointers: inputs.pointers, values, cells: inputs.cells }, signal);
      await this.store.finish(sweepId, index, { status: 'solved', result, seconds: (performance.now() - started) / 1000 });
    } catch (err) {
      if (err instanceof SolverFailure && err.kind === 'cancelled') return;
      if (err instanceof SolverFailure && err.kind === 'refused') {
        await this.store.finish(sweepId, index, { status: 'failed', error: err.message, seconds: (performance.now() - started) / 1000 });
        return;
      }
      this.options.log?.(`[worker] sweep ${sweepId} point ${index}: ${err instanceof Error ? err.message : String(err)} (try ${job.retryCount + 1})`);
      throw err;
    } finally {
      clearInterval(watch);
    }
  }

  /** A point whose job failed on every retry (dead-letter queue): stored as failed so its sweep can finish. */
  private async giveUp(job: PgBoss.JobWithMetadata<PointJob>): Promise<void> {
    const { sweepId, index } = job.data;
    const output = job.output as { value?: { message?: string }; message?: string } | null;
    const why = output?.value?.message ?? output?.message ?? 'no reason recorded';
    await this.store.finish(sweepId, index, { status: 'failed', error: `Gave up after ${job.retryLimit + 1} tries: ${why}` });
  }
}
