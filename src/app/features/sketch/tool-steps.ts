/**
 * The drawing tools as steps: what a tool previews while the pointer moves, and what a click does with the
 * points given so far (more points, new shapes, or a notice of what is wrong). Pure functions (m, degrees);
 * the editor keeps the state and commits the shapes.
 */
import type { Shape } from '../../../../shared/design';
import type { QuantityRule } from '../../ui/quantity-validator';
import type { CanvasPointer, SketchPreview } from './canvas-pointer';
import type { Segment } from './port-placement';
import type { ToolId } from './sketch-tools';
import { snapAngle } from './snap';
import {
  bendFromPoints,
  chamberFromCorners,
  directionDeg,
  junctionShapes,
  pillarAt,
  straightChannel,
  type JunctionKind,
  type Vec,
} from './tool-geometry';

/** The tools' settings from the options bar (m, degrees). */
export interface ToolSettings {
  straightWidth: number;
  bendWidth: number;
  junctionLeg: number;
  junctionWidth: number;
  junctionAngle: number;
  pillarRadius: number;
}

export const DEFAULT_TOOL_SETTINGS: ToolSettings = { straightWidth: 5e-5, bendWidth: 5e-5, junctionLeg: 5e-4, junctionWidth: 5e-5, junctionAngle: 0, pillarRadius: 2.5e-5 };

const LENGTH: QuantityRule = { dimension: 'length', defaultUnit: 'um', min: 0, minExclusive: true };

/** How each setting is typed: lengths in µm by default and more than zero, the junction's angle in degrees. */
export const TOOL_SETTING_RULES: Record<keyof ToolSettings, QuantityRule> = {
  straightWidth: LENGTH,
  bendWidth: LENGTH,
  junctionLeg: LENGTH,
  junctionWidth: LENGTH,
  junctionAngle: { dimension: 'angle', defaultUnit: 'deg' },
  pillarRadius: LENGTH,
};

export interface ToolState {
  tool: ToolId;
  /** Points clicked so far. */
  points: Vec[];
  /** Where the Chamber drag started. */
  chamberStart: Vec | null;
  settings: ToolSettings;
  junctionKind: JunctionKind;
}

/** What a click does: the points from now on, shapes to add, a notice, or closing the freeform polygon. */
export interface ToolStep {
  points?: Vec[];
  shapes?: Shape[];
  notice?: string;
  close?: boolean;
}

/** The end point, turned with Shift to the nearest 15° from the start. */
export function constrained(from: Vec, to: Vec, shift: boolean): Vec {
  if (!shift) return to;
  const angle = snapAngle(directionDeg(from, to), 15);
  const len = Math.hypot(to[0] - from[0], to[1] - from[1]);
  const r = (angle * Math.PI) / 180;
  return [from[0] + len * Math.cos(r), from[1] + len * Math.sin(r)];
}

/** What the tool shows with the pointer at `hover` (null: off the drawing); `segmentAt` finds the Port tool's port. */
export function toolPreview(state: ToolState, hover: CanvasPointer | null, segmentAt: (world: Vec) => Segment | null): SketchPreview | null {
  const pts = state.points;
  const s = state.settings;
  const at = hover?.snapped;
  switch (state.tool) {
    case 'straight': {
      if (pts.length === 0 || !at) return pts.length ? { shapes: [], points: pts } : null;
      const end = constrained(pts[0], at, !!hover?.event.shiftKey);
      const shape = straightChannel(pts[0], end, s.straightWidth);
      return { shapes: shape ? [shape] : [], points: pts, rubber: [pts[0], end] };
    }
    case 'bend': {
      if (pts.length === 0 || !at) return pts.length ? { shapes: [], points: pts } : null;
      if (pts.length === 1) return { shapes: [], points: pts, rubber: [pts[0], at] };
      const shape = bendFromPoints(pts[0], pts[1], at, s.bendWidth);
      return { shapes: shape ? [shape] : [], points: pts, rubber: [pts[0], at] };
    }
    case 'junction':
      return at ? { shapes: junctionShapes(state.junctionKind, at, s.junctionLeg, s.junctionWidth, s.junctionAngle), points: [] } : null;
    case 'chamber': {
      const start = state.chamberStart;
      const shape = start && at ? chamberFromCorners(start, at) : null;
      return { shapes: shape ? [shape] : [], points: start ? [start] : [] };
    }
    case 'pillar': {
      const shape = at ? pillarAt(at, s.pillarRadius) : null;
      return shape ? { shapes: [shape], points: [] } : null;
    }
    case 'freeform':
      return pts.length ? { shapes: [], points: pts, rubber: at ? [pts[pts.length - 1], at] : null } : null;
    case 'port':
      return hover ? { shapes: [], points: [], segment: segmentAt(hover.world) } : null;
    default:
      return null;
  }
}

/**
 * A click of a click tool (Straight, Bend, Junction, Pillar, Freeform) at `at`, with Shift held or not; a click
 * within `closeDistance` (m) of the first freeform point closes the polygon.
 */
export function toolClick(state: ToolState, at: Vec, shift: boolean, closeDistance: number): ToolStep {
  const s = state.settings;
  const pts = state.points;
  switch (state.tool) {
    case 'straight': {
      if (pts.length === 0) return { points: [at] };
      const shape = straightChannel(pts[0], constrained(pts[0], at, shift), s.straightWidth);
      return shape ? { points: [], shapes: [shape] } : { points: [], notice: 'The end is on the start; click the end of the channel somewhere else.' };
    }
    case 'bend': {
      if (pts.length < 2) return { points: [...pts, at] };
      const shape = bendFromPoints(pts[0], pts[1], at, s.bendWidth);
      return shape ? { points: [], shapes: [shape] } : { points: [], notice: 'The radius must be more than half the width, and the end must turn away from the start.' };
    }
    case 'junction': {
      const shapes = junctionShapes(state.junctionKind, at, s.junctionLeg, s.junctionWidth, s.junctionAngle);
      return shapes.length ? { shapes } : { notice: 'The legs must be longer than half their width.' };
    }
    case 'pillar': {
      const shape = pillarAt(at, s.pillarRadius);
      return shape ? { shapes: [shape] } : {};
    }
    case 'freeform': {
      const first = pts[0];
      if (first && pts.length >= 3 && Math.hypot(at[0] - first[0], at[1] - first[1]) <= closeDistance) return { close: true };
      return { points: [...pts, at] };
    }
    default:
      return {};
  }
}
