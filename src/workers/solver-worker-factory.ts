import { wrap, type Remote } from 'comlink';
import type { SolverApi } from './solver-api';

/** Starts the solver worker. Kept in its own file: `import.meta` and `Worker` exist only in the browser build. */
export function createSolverWorker(): Remote<SolverApi> {
  return wrap<SolverApi>(new Worker(new URL('./solver.worker', import.meta.url), { type: 'module' }));
}
