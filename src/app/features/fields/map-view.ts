/**
 * The screen mapping of a layout map: X = x + k·wx, Y = y − k·wy (wx, wy in metres, X, Y in px from the map's
 * top left, k in px per metre; y goes up on the layout and down on the screen).
 */
import type { Vec } from './field-sampling';

export interface MapView {
  k: number;
  x: number;
  y: number;
}

/** Bounds [x0, y0, x1, y1] (m). */
export type Bounds = readonly [number, number, number, number];

/** The bounds of the rings' points, or null when there are none. */
export function ringsBounds(rings: ReadonlyArray<ReadonlyArray<Vec>>): Bounds | null {
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const ring of rings) for (const [x, y] of ring) {
    x0 = Math.min(x0, x); y0 = Math.min(y0, y); x1 = Math.max(x1, x); y1 = Math.max(y1, y);
  }
  return Number.isFinite(x0) ? [x0, y0, x1, y1] : null;
}

/** The view that fits the bounds, centred, into a w × h box with `margin` px clear on every side. */
export function fitView([x0, y0, x1, y1]: Bounds, w: number, h: number, margin: number): MapView {
  const k = Math.min((w - 2 * margin) / Math.max(x1 - x0, 1e-12), (h - 2 * margin) / Math.max(y1 - y0, 1e-12));
  return { k, x: (w - k * (x1 - x0)) / 2 - k * x0, y: (h + k * (y1 - y0)) / 2 + k * y0 };
}

/** A layout point (m) on the screen (px). */
export function toScreen(v: MapView, p: Vec): [number, number] {
  return [v.x + v.k * p[0], v.y - v.k * p[1]];
}

/** A screen point (px from the map's top left) on the layout (m). */
export function toWorld(v: MapView, X: number, Y: number): Vec {
  return [(X - v.x) / v.k, (v.y - Y) / v.k];
}
