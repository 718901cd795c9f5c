/**
 * The worker's analyses as plain functions (no worker globals), so specs can run them in Node: Compare, the
 * planner's unit responses and the tracer, each into an outcome that never throws, plus the buffers to transfer.
 */
import { parseDesign } from '../../shared/design';
import { compareDrives, type Comparison } from '../../solver/compare';
import { drivesOf, unitResponses, type Drive } from '../../solver/planner';
import { SolveError, type SolveProgress } from '../../solver/solve';
import { runTrace, type TraceRun } from '../../solver/tracer';
import type { AnalysisOutcome, AnalysisProgress, CompareOutcome, ResponsesOutcome, TraceOutcome, WorkerCompareOptions, WorkerSolveOptions, WorkerTraceRequest } from './solver-api';
import { resultBuffers } from './worker-solve';

type Report = (progress: AnalysisProgress) => void;

/** Runs the work and times it; a SolveError (or any failure) becomes { ok: false, error }. */
function outcome<T extends object>(work: () => T): AnalysisOutcome<T> {
  const started = performance.now();
  try {
    const value = work();
    return { ok: true, workerMs: performance.now() - started, ...value };
  } catch (error) {
    if (error instanceof SolveError) return { ok: false, error: error.toJSON() };
    const message = error instanceof Error ? error.message : String(error);
    // The planner's and the tracer's refusals are plain errors with a code; anything else is internal.
    const code = (error as { code?: unknown }).code;
    return { ok: false, error: { code: typeof code === 'string' ? code : 'internal', message } };
  }
}

/**
 * Progress over `count` solves in a row: each solve reports its stages from geometry to fields; a new
 * geometry stage after the first means the next solve began.
 */
export function solvesProgress(report: Report | undefined, labels: string[], share = 1): (p: SolveProgress) => void {
  let index = 0;
  let seenFields = false;
  const weights: Record<SolveProgress['stage'], [number, number]> = { geometry: [0, 0.05], potential: [0.05, 0.3], flow: [0.3, 0.95], fields: [0.95, 1] };
  return (p) => {
    if (p.stage === 'geometry' && seenFields) {
      index = Math.min(labels.length - 1, index + 1);
      seenFields = false;
    }
    if (p.stage === 'fields') seenFields = true;
    const [a, b] = weights[p.stage];
    const within = a + (b - a) * p.fraction;
    report?.({ label: labels[index], fraction: (share * (index + within)) / labels.length });
  };
}

/** Share of Compare's bar for its three solves; the two band runs (slip, then pressure) share the rest. */
const COMPARE_SOLVES_SHARE = 0.75;

export function compareOutcome(design: unknown, options: WorkerCompareOptions, report?: Report): CompareOutcome {
  const bandShare = (1 - COMPARE_SOLVES_SHARE) / 2;
  return outcome(() => ({
    comparison: compareDrives(design, options.port, {
      cells: options.cells,
      referenceDiffusivity: options.referenceDiffusivity,
      onProgress: solvesProgress(report, ['slip-driven solve', 'unit-head solve', 'pressure-driven solve'], COMPARE_SOLVES_SHARE),
      onBandProgress: ({ side, fraction }) =>
        report?.({
          label: `${side}-driven band`,
          fraction: COMPARE_SOLVES_SHARE + bandShare * ((side === 'slip' ? 0 : 1) + fraction),
        }),
    }),
  }));
}

export function responsesOutcome(input: unknown, options: WorkerSolveOptions, report?: Report): ResponsesOutcome {
  return outcome(() => {
    const parsed = parseDesign(input);
    if (!parsed.ok) throw new SolveError('invalid-design', parsed.errors.map((e) => `${e.field}: ${e.message}`).join('; '));
    const design = parsed.design;
    if (!design.ports.some((p) => p.potential !== null)) throw new SolveError('invalid-option', 'no port has an electrode: give at least one port a potential');
    // Every electrode at 1 V, and every head that is not zero at 1 Pa (the planner holds heads as they are).
    const drives: Drive[] = [
      ...drivesOf(design, false),
      ...design.ports.filter((p) => (p.pressure ?? 0) !== 0).map((p) => ({ port: p.id, kind: 'pressure' as const })),
    ];
    const labels = drives.map((d) => (d.kind === 'potential' ? `unit response of ${d.port}` : `unit head at ${d.port}`));
    return { responses: unitResponses(design, { drives, cells: options.cells, tolerance: options.tolerance, onProgress: solvesProgress(report, labels) }) };
  });
}

export function traceOutcome(design: unknown, request: WorkerTraceRequest, report?: Report): TraceOutcome {
  const phases = Math.max(1, request.phases?.length ?? 1);
  // Solves take about the first half of the bar, the particles the second.
  return outcome(() => ({
    run: runTrace(design, {
      ...request,
      onProgress: (p) =>
        report?.(
          p.stage === 'solve'
            ? { label: `solving phase ${p.phase + 1} of ${phases}`, fraction: (0.5 * (p.phase + p.fraction)) / phases }
            : { label: 'following the band', fraction: 0.5 + 0.5 * p.fraction },
        ),
    }),
  }));
}

/** Distinct buffers of a comparison's two solves. */
export function comparisonBuffers(c: Comparison): ArrayBuffer[] {
  return distinct([...resultBuffers(c.slip.result), ...resultBuffers(c.pressure.result)]);
}

export function traceBuffers(run: TraceRun): ArrayBuffer[] {
  const t = run.trace;
  return distinct([...run.solves.flatMap(resultBuffers), ...t.frames.map((f) => f.positions.buffer), t.arrivals.time.buffer, t.arrivals.along.buffer]);
}

function distinct(buffers: ArrayBufferLike[]): ArrayBuffer[] {
  return [...new Set(buffers)].filter((b): b is ArrayBuffer => b instanceof ArrayBuffer && b.byteLength > 0);
}
