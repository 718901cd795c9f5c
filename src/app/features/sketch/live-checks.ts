import { InjectionToken } from '@angular/core';
import type { DesignDocument, DesignProblem } from '../../../../shared/design';
import { discretiseDesign } from '../../../../solver/grid/discretise';

/** Grid cells the live checks may use, and the arc tolerance they draw curves with: light enough for the main thread. */
const LIVE_MAX_CELLS = 150_000;
const LIVE_ARC_TOLERANCE = 1e-4;
/** Problems about the solver's resolution belong to the solve, not to the drawing. */
const RESOLUTION_CODES = new Set(['under-resolved', 'grid-capped']);

/**
 * The solver's geometry checks (solver/grid/discretise.ts: empty layout, self-crossing outlines, slivers, ports
 * off the outline or overlapping, fluid that touches no port, nothing that drives) on a coarse grid, without the
 * notes about resolution.
 */
export function liveProblems(doc: DesignDocument): DesignProblem[] {
  try {
    return discretiseDesign(doc, { maxCells: LIVE_MAX_CELLS, arcTolerance: LIVE_ARC_TOLERANCE }).problems.filter((p) => !RESOLUTION_CODES.has(p.code));
  } catch (error) {
    return [{ code: 'geometry-failed', severity: 'error', message: `The layout could not be checked: ${error instanceof Error ? error.message : String(error)}` }];
  }
}

export type GeometryChecks = (doc: DesignDocument) => DesignProblem[] | Promise<DesignProblem[]>;

/**
 * How the sketch runs its live checks. By default on the main thread (tens of milliseconds for the demo designs,
 * a few hundred for large serpentines); the app may provide one that runs them in the solver worker.
 */
export const GEOMETRY_CHECKS = new InjectionToken<GeometryChecks>('Osmolane live geometry checks', {
  providedIn: 'root',
  factory: () => liveProblems,
});
