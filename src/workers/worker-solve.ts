/**
 * The worker's work as plain functions (no worker globals), so specs can run them in Node:
 * measuring a layout, solving it into a SolveOutcome, and listing the buffers to transfer back.
 */
import type { SolveFields } from '../../shared/result';
import { parseDesign } from '../../shared/design';
import { ARC_TOLERANCE } from '../../solver/geometry/arc';
import { channelWidths } from '../../solver/geometry/channel-width';
import { fluidRegion } from '../../solver/geometry/fluid-region';
import { shapeFeatureSize } from '../../solver/geometry/shape-outline';
import { DEFAULT_CELLS_ACROSS } from '../../solver/grid/choose-grid';
import { SLIVER_RATIO } from '../../solver/grid/discretise';
import { SolveError, solveDesign, type SolveProgress, type SolveResult } from '../../solver/solve';
import type { LayoutMeasure, SolveOutcome, WorkerSolveOptions } from './solver-api';

/** Fewest cells along the longer side the solver uses by default (solver/grid/choose-grid.ts). */
const MIN_CELLS = 16;

/** The narrowest channel and the fluid's bounds, as the solver's grid choice sees them (same tolerances). */
export function measureLayout(design: unknown): LayoutMeasure {
  const parsed = parseDesign(design);
  if (!parsed.ok) return { narrowest: null, bounds: null, problem: parsed.errors[0]?.message ?? 'invalid design' };
  const shapes = parsed.design.shapes;
  if (!shapes.some((s) => s.op === 'add')) return { narrowest: null, bounds: null };
  try {
    const region = fluidRegion(shapes, ARC_TOLERANCE);
    if (!(region.area > 0)) return { narrowest: null, bounds: null };
    const features = shapes.filter((s) => s.op === 'add').map(shapeFeatureSize);
    const widths = channelWidths(region, SLIVER_RATIO * Math.min(...features));
    return { narrowest: widths.narrowest?.width ?? null, bounds: [...region.bounds] as [number, number, number, number] };
  } catch (error) {
    return { narrowest: null, bounds: null, problem: error instanceof Error ? error.message : String(error) };
  }
}

/** The solver's default cells along the longer side for this layout (about 10 across the narrowest channel). */
export function defaultCells(measure: LayoutMeasure): number | null {
  if (!measure.bounds || !measure.narrowest) return null;
  const [xmin, ymin, xmax, ymax] = measure.bounds;
  return Math.max(MIN_CELLS, Math.ceil((Math.max(xmax - xmin, ymax - ymin) / measure.narrowest) * DEFAULT_CELLS_ACROSS));
}

/** Solves into a SolveOutcome: never throws; a SolveError becomes { ok: false, error }. */
export function solveOutcome(
  design: unknown,
  options: WorkerSolveOptions,
  onProgress?: (progress: SolveProgress) => void,
  measure: LayoutMeasure = measureLayout(design),
  shouldStop?: () => boolean,
): SolveOutcome {
  const started = performance.now();
  try {
    const result = solveDesign(design, { cells: options.cells, tolerance: options.tolerance, onProgress, shouldStop });
    const narrowest = measure.narrowest;
    const [xmin, ymin, xmax, ymax] = measure.bounds ?? [0, 0, 0, 0];
    const long = Math.max(xmax - xmin, ymax - ymin);
    const cells = options.cells ?? (defaultCells(measure) ?? Math.round(long / result.grid.spacing));
    return {
      ok: true,
      result,
      narrowest,
      cellsAcross: narrowest ? narrowest / result.grid.spacing : null,
      cells,
      workerMs: performance.now() - started,
    };
  } catch (error) {
    const e = error instanceof SolveError ? error : new SolveError('internal', error instanceof Error ? error.message : String(error));
    return { ok: false, error: e.toJSON() };
  }
}

/** The distinct buffers of a result's field arrays (a buffer listed twice would make the transfer fail). */
export function resultBuffers(result: SolveResult): ArrayBuffer[] {
  return fieldBuffers(result.fields);
}

/** The distinct buffers of a set of fields. */
export function fieldBuffers(f: SolveFields): ArrayBuffer[] {
  const arrays = [f.fraction, f.potential, f.fieldX, f.fieldY, f.velocityX, f.velocityY, f.pressure, f.vorticity, f.streamfunction];
  return [...new Set(arrays.map((a) => a.buffer))].filter((b): b is ArrayBuffer => b instanceof ArrayBuffer && b.byteLength > 0);
}

/**
 * Wraps a progress callback so that it is called when the stage changes, when a stage ends, and otherwise at
 * most every `intervalMs` (each call is a message to the page).
 */
export function throttledProgress(report: (p: SolveProgress) => void, intervalMs = 80, clock = () => performance.now()): (p: SolveProgress) => void {
  let stage = '';
  let last = -Infinity;
  return (p) => {
    const t = clock();
    if (p.stage !== stage || p.fraction >= 1 || t - last >= intervalMs) {
      stage = p.stage;
      last = t;
      report({ stage: p.stage, fraction: p.fraction });
    }
  };
}
