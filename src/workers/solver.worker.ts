/// <reference lib="webworker" />
import { expose } from 'comlink';
import type { SolverApi } from './solver-api';

/** The solver, off the main thread. The page talks to it through comlink (see solver-client.ts). */
const api: SolverApi = {
  async hello() {
    return { ready: true, at: Date.now() };
  },
};

expose(api);
