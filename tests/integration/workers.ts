import type { ChildProcess } from 'node:child_process';
import { spawnWorker } from '../../server/jobs/spawn';

/**
 * Sweep worker processes for integration tests and benchmarks: real `worker-main` processes on the test
 * database, started like `npm run worker` and resolved once each says it takes points.
 */
export interface WorkerProcess {
  child: ChildProcess;
  /** host:pid, as the points' `worker` column names it. */
  pid: number;
  output: string[];
  stop(signal?: NodeJS.Signals): Promise<void>;
}

export async function startWorker(env: Record<string, string> = {}, timeoutMs = 30_000): Promise<WorkerProcess> {
  const child = spawnWorker({ ...process.env, LOG_REQUESTS: '0', ...env }, ['ignore', 'pipe', 'pipe']);
  const output: string[] = [];
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the worker did not start within ${timeoutMs} ms:\n${output.join('')}`)), timeoutMs);
    const read = (chunk: Buffer) => {
      output.push(chunk.toString());
      if (output.join('').includes('takes sweep points')) {
        clearTimeout(timer);
        resolve();
      }
    };
    child.stdout!.on('data', read);
    child.stderr!.on('data', read);
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`the worker exited (${code}) before it started:\n${output.join('')}`));
    });
  });
  return {
    child,
    pid: child.pid!,
    output,
    async stop(signal: NodeJS.Signals = 'SIGTERM') {
      if (child.exitCode === null && child.signalCode === null) child.kill(signal);
      await exited;
    },
  };
}
