import PgBoss from 'pg-boss';
import type { ServerConfig, SweepQueueConfig } from '../config';

/** One job per sweep point; points whose retries ran out land in the dead-letter queue. */
export const POINT_QUEUE = 'sweep-point';
export const GIVEN_UP_QUEUE = 'sweep-point-given-up';
/** pg-boss keeps its tables in their own schema of the project's database. */
export const QUEUE_SCHEMA = 'pgboss';

export interface PointJob {
  sweepId: number;
  index: number;
}

export type PointJobHandler = (job: PgBoss.JobWithMetadata<PointJob>) => Promise<void>;

/**
 * The sweep job queue: pg-boss on the project's PostgreSQL. Started on first use, so a server that never makes a
 * sweep never opens its pool. Any number of processes on any number of machines share it: jobs are fetched
 * with SKIP LOCKED, a job still active after `jobExpirySeconds` is failed by whichever process runs maintenance
 * and retried with backoff, and one that keeps failing goes to the dead-letter queue.
 */
export class SweepQueue {
  private boss: Promise<PgBoss> | null = null;

  constructor(
    private readonly database: ServerConfig['database'],
    readonly config: SweepQueueConfig,
  ) {}

  private started(): Promise<PgBoss> {
    this.boss ??= this.open().catch((err: unknown) => {
      this.boss = null; // try again on the next call
      throw err;
    });
    return this.boss;
  }

  private async open(): Promise<PgBoss> {
    const { host, port, user, password, dbName } = this.database;
    const boss = new PgBoss({
      host,
      port,
      user,
      password,
      database: dbName,
      schema: QUEUE_SCHEMA,
      max: 4,
      application_name: 'osmolane-sweeps',
      schedule: false,
      maintenanceIntervalSeconds: this.config.maintenanceSeconds,
    });
    boss.on('error', (err: Error) => console.error(`[sweeps] job queue: ${err.message}`));
    await boss.start();
    await boss.createQueue(GIVEN_UP_QUEUE);
    await boss.createQueue(POINT_QUEUE, { name: POINT_QUEUE, deadLetter: GIVEN_UP_QUEUE });
    return boss;
  }

  /** Queues the points (job ids chosen by the caller and kept with the points, so they can be removed). */
  async enqueue(jobs: Array<PointJob & { id: string }>): Promise<void> {
    if (jobs.length === 0) return;
    const boss = await this.started();
    const { retryLimit, retryDelaySeconds, jobExpirySeconds } = this.config;
    await boss.insert(
      jobs.map(({ id, sweepId, index }) => ({
        id,
        name: POINT_QUEUE,
        data: { sweepId, index },
        retryLimit,
        retryDelay: retryDelaySeconds,
        retryBackoff: true,
        expireInSeconds: jobExpirySeconds,
        deadLetter: GIVEN_UP_QUEUE,
      })),
    );
  }

  /** Removes jobs (waiting, retrying or active); a worker still solving one finds its point cancelled. */
  async remove(ids: string[]): Promise<void> {
    if (ids.length === 0) return;
    const boss = await this.started();
    await boss.deleteJob(POINT_QUEUE, ids);
  }

  /** Takes point jobs one at a time, `concurrency` at once in this process; given-up jobs go to `givenUp`. */
  async work(concurrency: number, handler: PointJobHandler, givenUp: PointJobHandler): Promise<void> {
    const boss = await this.started();
    const options = { batchSize: 1, includeMetadata: true as const, pollingIntervalSeconds: this.config.pollingSeconds };
    for (let k = 0; k < concurrency; k++) {
      // After a job, ask for the next one at once; the polling interval only paces an idle worker.
      let id = '';
      id = await boss.work<PointJob>(POINT_QUEUE, options, async ([job]) => {
        try {
          await handler(job);
        } finally {
          if (id) boss.notifyWorker(id);
        }
      });
    }
    await boss.work<PointJob>(GIVEN_UP_QUEUE, options, ([job]) => givenUp(job));
  }

  /** Stops taking jobs, waits up to `timeoutMs` for those in hand, and closes the pool. */
  async stop(timeoutMs = 10_000): Promise<void> {
    const pending = this.boss;
    this.boss = null;
    if (!pending) return;
    const boss = await pending.catch(() => null);
    await boss?.stop({ graceful: true, wait: true, timeout: timeoutMs });
  }
}
