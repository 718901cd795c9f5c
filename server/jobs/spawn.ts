import { spawn, type ChildProcess, type StdioOptions } from 'node:child_process';
import { join } from 'node:path';

const root = join(__dirname, '..', '..');

/**
 * Starts a sweep worker process (worker-main) with this process's Node: under TypeScript (tsx, ts-jest) through
 * tsx's loader, otherwise the compiled file. The server uses it for START_WORKER=1; tests and the benchmark
 * start their own. The returned process is node itself, so a signal sent to it reaches the worker.
 */
export function spawnWorker(env: NodeJS.ProcessEnv = process.env, stdio: StdioOptions = 'inherit'): ChildProcess {
  const ts = __filename.endsWith('.ts');
  const entry = join(__dirname, `worker-main${ts ? '.ts' : '.js'}`);
  const args = ts ? ['--import', 'tsx', entry] : [entry];
  return spawn(process.execPath, args, {
    cwd: root,
    env: ts ? { ...env, TSX_TSCONFIG_PATH: join(root, 'tsconfig.server.json') } : env,
    stdio,
  });
}
