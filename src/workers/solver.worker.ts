/// <reference lib="webworker" />
import { expose, releaseProxy, transfer, type Remote } from 'comlink';
import type { SolveProgress } from '../../solver/solve';
import type { LayoutMeasure, SolverApi } from './solver-api';
import { measureLayout, resultBuffers, solveOutcome, throttledProgress } from './worker-solve';

/**
 * The solver, off the main thread. The page talks to it through comlink (see app/core/solver-client.ts); a
 * solve is stopped by ending this worker (it is busy in a loop and cannot read messages meanwhile).
 */

/** The last layout measured (keyed by its shapes): the solve right after a measure need not repeat it. */
let measured: { key: string; measure: LayoutMeasure } | null = null;

function measureOf(design: unknown): LayoutMeasure {
  const key = JSON.stringify((design as { shapes?: unknown } | null)?.shapes ?? null);
  if (measured?.key !== key) measured = { key, measure: measureLayout(design) };
  return measured.measure;
}

const api: SolverApi = {
  async hello() {
    return { ready: true, at: Date.now() };
  },
  async measure(design) {
    return measureOf(design);
  },
  async solve(design, options, onProgress) {
    const remote = onProgress as Remote<(p: SolveProgress) => void> | undefined;
    const report = remote ? throttledProgress((p) => void Promise.resolve(remote(p)).catch(() => undefined)) : undefined;
    try {
      const outcome = solveOutcome(design, options, report, measureOf(design));
      return outcome.ok ? transfer(outcome, resultBuffers(outcome.result)) : outcome;
    } finally {
      remote?.[releaseProxy]();
    }
  },
};

expose(api);
