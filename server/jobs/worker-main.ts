/**
 * `npm run worker`: a sweep worker process. Start any number per machine and on any number of machines, all
 * pointing at the same database (PG* variables); each takes point jobs from the queue in the project's
 * PostgreSQL and solves them in SWEEP_WORKER_THREADS solver threads. SIGINT/SIGTERM let the points in hand finish.
 */
import { hostname } from 'node:os';
import { loadConfig } from '../config';
import { openDatabase } from '../db/orm';
import { PointStore } from './point-store';
import { SweepQueue } from './queue';
import { SolverPool } from './solver-pool';
import { SweepWorker } from './worker';

async function main(): Promise<void> {
  const config = loadConfig();
  const orm = await openDatabase();
  const threads = Math.max(1, Math.floor(config.sweeps.threads));
  const queue = new SweepQueue(config.database, config.sweeps);
  const pool = new SolverPool(threads);
  const name = `${hostname()}:${process.pid}`;
  const holdMs = Number(process.env['SWEEP_POINT_HOLD_MS'] ?? 0) || undefined;
  const worker = new SweepWorker(queue, pool, new PointStore(orm), { name, concurrency: threads, holdMs, log: (l) => console.error(l) });
  await worker.start();
  console.log(`[worker] ${name} takes sweep points from ${config.database.dbName} with ${threads} solver thread${threads === 1 ? '' : 's'}`);

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`[worker] ${signal}: finishing the points in hand`);
    setTimeout(() => process.exit(1), 20_000).unref();
    await queue.stop(15_000).catch((err: unknown) => console.error('[worker] queue did not stop cleanly:', err));
    await pool.close();
    await orm.close(true);
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((err: unknown) => {
  console.error('[worker] failed to start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
