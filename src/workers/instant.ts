import { fluidRegion } from '../../solver/geometry/fluid-region';
import { pinchedPlug } from '../../solver/tracer';
import { edlView } from './double-layer-view';
import type { InstantApi, OutlineRings } from './instant-api';
import { liveProblems } from './worker-live-checks';

/** Arc tolerance for drawn outlines (relative to the radius): invisible on screen, far cheaper than the solver's. */
const DRAWING_ARC_TOLERANCE = 1e-3;

/**
 * The instant worker's computations as plain async functions: the worker exposes this object, and tests of the
 * app's components provide it in-process in place of the worker.
 */
export const instantComputations: InstantApi = {
  async outline(shapes) {
    try {
      return fluidRegion(shapes, DRAWING_ARC_TOLERANCE).polygons.flat() as OutlineRings;
    } catch {
      return [];
    }
  },
  async checkGeometry(design) {
    return liveProblems(design);
  },
  async doubleLayer(inputs, axis) {
    return edlView(inputs, axis);
  },
  async pinchedPlug(design, roles, speciesMobility) {
    try {
      return { ok: true, preset: pinchedPlug(design, roles, { speciesMobility }) };
    } catch (error) {
      return { ok: false, message: error instanceof Error ? error.message : String(error) };
    }
  },
};
