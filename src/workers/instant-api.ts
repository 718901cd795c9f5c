import type { CrossRoles } from '../../shared/cross-roles';
import type { DesignDocument, DesignProblem, Shape } from '../../shared/design';
import type { PinchedPlug } from '../../solver/tracer';
import type { DistanceAxis, EdlInputs, EdlView } from './double-layer-view';

export type { DistanceAxis, EdlInputs, EdlView } from './double-layer-view';
export type { PinchedPlug } from '../../solver/tracer';

/** Rings of the fluid outline in metres (open vertex lists). */
export type OutlineRings = Array<Array<[number, number]>>;

export type PresetOutcome = { ok: true; preset: PinchedPlug } | { ok: false; message: string };

/**
 * What the instant worker offers the page (through comlink): the small computations the page shows while the
 * engineer types or draws. They run in a worker of their own, so they answer while the solver worker is busy
 * with a solve, and the solver's code stays off the main thread (architecture.md).
 */
export interface InstantApi {
  /** The fluid outline (the solver's boolean operations on the shapes); none when the shapes do not combine. */
  outline(shapes: Shape[]): Promise<OutlineRings>;
  /** The solver's geometry checks on a coarse grid, without notes about resolution (the sketch's live checks). */
  checkGeometry(design: DesignDocument): Promise<DesignProblem[]>;
  /** The Double layer tab's profiles, report and Poisson–Boltzmann check. */
  doubleLayer(inputs: EdlInputs, axis: DistanceAxis): Promise<EdlView>;
  /** The Tracer tab's pinched-plug preset for a cross with the given port roles. */
  pinchedPlug(design: DesignDocument, roles: CrossRoles, speciesMobility: number): Promise<PresetOutcome>;
}
