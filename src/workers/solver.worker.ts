/// <reference lib="webworker" />
import { expose, releaseProxy, transfer, type Remote } from 'comlink';
import type { SolveProgress } from '../../solver/solve';
import type { AnalysisApi, AnalysisProgress, LayoutMeasure, SolverApi } from './solver-api';
import { compareOutcome, comparisonBuffers, responsesOutcome, traceBuffers, traceOutcome } from './worker-analysis';
import { PlannerStore } from './worker-planner';
import { fieldBuffers, measureLayout, resultBuffers, solveOutcome, throttledProgress } from './worker-solve';

/**
 * The solver, off the main thread. The page talks to it through comlink (see app/core/solver-client.ts); a
 * solve is stopped by ending this worker (it is busy in a loop and cannot read messages meanwhile).
 */

/** The last layout measured (keyed by its shapes): the solve right after a measure need not repeat it. */
let measured: { key: string; measure: LayoutMeasure } | null = null;

/** The Planner's unit responses, kept here for its sliders and plans. */
const planner = new PlannerStore();

function measureOf(design: unknown): LayoutMeasure {
  const key = JSON.stringify((design as { shapes?: unknown } | null)?.shapes ?? null);
  if (measured?.key !== key) measured = { key, measure: measureLayout(design) };
  return measured.measure;
}

/** A proxied progress callback as a throttled local one (each call is a message to the page), and its release. */
function analysisReporter(onProgress?: (p: AnalysisProgress) => void): [((p: AnalysisProgress) => void) | undefined, () => void] {
  const remote = onProgress as Remote<(p: AnalysisProgress) => void> | undefined;
  if (!remote) return [undefined, () => undefined];
  let last = -Infinity;
  let label = '';
  const report = (p: AnalysisProgress) => {
    const t = performance.now();
    if (p.label === label && p.fraction < 1 && t - last < 80) return;
    last = t;
    label = p.label;
    void Promise.resolve(remote(p)).catch(() => undefined);
  };
  return [report, () => remote[releaseProxy]()];
}

const api: SolverApi & AnalysisApi = {
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
  async compare(design, options, onProgress) {
    const [report, release] = analysisReporter(onProgress);
    try {
      const outcome = compareOutcome(design, options, report);
      return outcome.ok ? transfer(outcome, comparisonBuffers(outcome.comparison)) : outcome;
    } finally {
      release();
    }
  },
  async unitResponses(design, options, onProgress) {
    const [report, release] = analysisReporter(onProgress);
    try {
      const outcome = responsesOutcome(design, options, report);
      if (!outcome.ok) return outcome;
      const basis = planner.keep(outcome.responses);
      return transfer({ ok: true as const, workerMs: outcome.workerMs, basis }, fieldBuffers(basis.fields));
    } finally {
      release();
    }
  },
  async recombine(basis, map, settings) {
    const outcome = planner.recombine(basis, map, settings);
    return outcome.ok ? transfer(outcome, [outcome.values.buffer as ArrayBuffer]) : outcome;
  },
  async plan(basis, request) {
    return planner.plan(basis, request);
  },
  async releaseBasis(basis) {
    planner.release(basis);
  },
  async trace(design, request, onProgress) {
    const [report, release] = analysisReporter(onProgress);
    try {
      const outcome = traceOutcome(design, request, report);
      return outcome.ok ? transfer(outcome, traceBuffers(outcome.run)) : outcome;
    } finally {
      release();
    }
  },
};

expose(api);
