import type { DesignDocument, DesignProblem } from '../../shared/design';
import { discretiseDesign } from '../../solver/grid/discretise';

/** Grid cells the live checks may use, and the arc tolerance they draw curves with: light enough to answer while drawing. */
const LIVE_MAX_CELLS = 150_000;
const LIVE_ARC_TOLERANCE = 1e-4;
/** Problems about the solver's resolution belong to the solve, not to the drawing. */
const RESOLUTION_CODES = new Set(['under-resolved', 'grid-capped']);

/**
 * The solver's geometry checks (solver/grid/discretise.ts: empty layout, self-crossing outlines, slivers, ports
 * off the outline or overlapping, fluid that touches no port, nothing that drives) on a coarse grid, without the
 * notes about resolution. Runs in the instant worker (the sketch's GEOMETRY_CHECKS in the app).
 */
export function liveProblems(doc: DesignDocument): DesignProblem[] {
  try {
    return discretiseDesign(doc, { maxCells: LIVE_MAX_CELLS, arcTolerance: LIVE_ARC_TOLERANCE }).problems.filter((p) => !RESOLUTION_CODES.has(p.code));
  } catch (error) {
    return [{ code: 'geometry-failed', severity: 'error', message: `The layout could not be checked: ${error instanceof Error ? error.message : String(error)}` }];
  }
}
