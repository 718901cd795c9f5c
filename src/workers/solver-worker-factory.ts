import { WorkerSolverClient, type SolverClient } from '../app/core/solver-client';

/**
 * The app's solver: a client that starts the solver worker when first used (and a fresh one after a cancel).
 * Kept in its own file: `import.meta` and `Worker` exist only in the browser build.
 */
export function createSolverWorker(): SolverClient {
  return new WorkerSolverClient(() => new Worker(new URL('./solver.worker', import.meta.url), { type: 'module' }));
}
