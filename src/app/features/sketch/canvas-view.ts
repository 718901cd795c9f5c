/**
 * The view of the sketch canvas: where the layout (m) lands on the screen (px) at a pan and zoom, and the views
 * that show a whole layout or centre a point. The plot area is the drawing less the axis bands (left and bottom).
 */
import type { DesignDocument } from '../../../../shared/design';
import { shapeBounds, unionBounds, type Bounds } from './shape-transform';
import { UM } from './sketch-path';
import type { Vec } from './tool-geometry';

/** Screen px = (x, y) + k · µm, with y flipped: d3's zoom transform. */
export interface View {
  readonly x: number;
  readonly y: number;
  readonly k: number;
}

export interface Size {
  width: number;
  height: number;
}

/** Height of the x axis band along the bottom (px). */
export const AXIS_BAND = 22;
/** Width of the y axis band along the left edge (px). */
export const AXIS_LEFT = 52;
/** Space kept around a layout the view is fitted to (px). */
export const MARGIN = 48;

/** Metres → screen pixels. */
export function toScreen(view: View, p: readonly [number, number]): Vec {
  return [view.x + view.k * p[0] * UM, view.y - view.k * p[1] * UM];
}

/** Screen pixels → metres. */
export function toWorld(view: View, s: readonly [number, number]): Vec {
  return [(s[0] - view.x) / view.k / UM, (view.y - s[1]) / view.k / UM];
}

/** The middle of the plot area (px). */
export function plotCentre(size: Size): Vec {
  return [AXIS_LEFT + (size.width - AXIS_LEFT) / 2, (size.height - AXIS_BAND) / 2];
}

/** The view that shows the bounds (m) whole, in the middle of the plot area with a margin all round. */
export function fitView(b: Bounds, size: Size): View {
  const bw = Math.max(b[2] - b[0], 1e-6) * UM, bh = Math.max(b[3] - b[1], 1e-6) * UM;
  const k = Math.min((size.width - AXIS_LEFT - 2 * MARGIN) / bw, (size.height - AXIS_BAND - 2 * MARGIN) / bh);
  const cx = ((b[0] + b[2]) / 2) * UM, cy = ((b[1] + b[3]) / 2) * UM;
  const [sx, sy] = plotCentre(size);
  return { x: sx - k * cx, y: sy + k * cy, k };
}

/** The view at zoom k with the point (m) in the middle of the plot area. */
export function centredView(p: readonly [number, number], k: number, size: Size): View {
  const [sx, sy] = plotCentre(size);
  return { x: sx - k * p[0] * UM, y: sy + k * p[1] * UM, k };
}

/** The box (m) around every shape and port of a layout; null when it has none. */
export function layoutBounds(doc: Pick<DesignDocument, 'shapes' | 'ports'>): Bounds | null {
  const all: Bounds[] = doc.shapes.map(shapeBounds);
  for (const p of doc.ports) all.push([Math.min(p.from[0], p.to[0]), Math.min(p.from[1], p.to[1]), Math.max(p.from[0], p.to[0]), Math.max(p.from[1], p.to[1])]);
  return unionBounds(all);
}
