/**
 * Moving and turning shapes, ports and wall-zone regions of a design (metres, degrees), and measuring them:
 * bounds, the point a shape turns about, the distance from a point to a shape's outline. Pure functions that
 * return new objects; the design document is never changed in place.
 */
import type { Port, Region, Shape } from '../../../../shared/design';
import { cosSin, type Vec } from './tool-geometry';

export type Bounds = [number, number, number, number]; // xmin, ymin, xmax, ymax

type AnyRegion = Region | Shape;

function rotatePoint(p: readonly [number, number], pivot: Vec, deg: number): Vec {
  const [c, s] = cosSin(deg);
  const dx = p[0] - pivot[0], dy = p[1] - pivot[1];
  return [pivot[0] + dx * c - dy * s, pivot[1] + dx * s + dy * c];
}

/** Wraps an angle into (-180, 180], keeping whole numbers whole. */
export function wrapAngle(deg: number): number {
  let a = ((deg % 360) + 360) % 360;
  if (a > 180) a -= 360;
  return Math.round(a * 1e9) / 1e9 || 0;
}

export function translateShape<T extends AnyRegion>(shape: T, dx: number, dy: number): T {
  switch (shape.type) {
    case 'rect':
      return { ...shape, x: shape.x + dx, y: shape.y + dy };
    case 'circle':
    case 'sector':
      return { ...shape, center: [shape.center[0] + dx, shape.center[1] + dy] };
    case 'polygon':
      return { ...shape, points: shape.points.map((p) => [p[0] + dx, p[1] + dy] as Vec) };
  }
}

/** Turns a shape by `deg` counter-clockwise about `pivot`. */
export function rotateShape<T extends AnyRegion>(shape: T, deg: number, pivot: Vec): T {
  switch (shape.type) {
    case 'rect': {
      const [x, y] = rotatePoint([shape.x, shape.y], pivot, deg);
      return { ...shape, x, y, angle: wrapAngle(shape.angle + deg) };
    }
    case 'circle':
      return { ...shape, center: rotatePoint(shape.center, pivot, deg) };
    case 'sector': {
      // Keep the start angle in (-180, 180] and the sweep as it was.
      const start = wrapAngle(shape.startAngle + deg);
      return { ...shape, center: rotatePoint(shape.center, pivot, deg), startAngle: start, endAngle: start + (shape.endAngle - shape.startAngle) };
    }
    case 'polygon':
      return { ...shape, points: shape.points.map((p) => rotatePoint(p, pivot, deg)) };
  }
}

export function translatePort(port: Port, dx: number, dy: number): Port {
  return { ...port, from: [port.from[0] + dx, port.from[1] + dy], to: [port.to[0] + dx, port.to[1] + dy] };
}

export function rotatePort(port: Port, deg: number, pivot: Vec): Port {
  return { ...port, from: rotatePoint(port.from, pivot, deg), to: rotatePoint(port.to, pivot, deg) };
}

/** Angles (degrees) at which an arc from a0 sweeping counter-clockwise to a1 reaches its extremes in x or y. */
function arcExtremeAngles(a0: number, a1: number): number[] {
  const out = [a0, a1];
  for (let k = Math.ceil(a0 / 90) * 90; k < a1; k += 90) out.push(k);
  return out;
}

export function rectCorners(shape: { x: number; y: number; width: number; height: number; angle: number }): Vec[] {
  const [c, s] = cosSin(shape.angle);
  const { x, y, width: w, height: h } = shape;
  return [
    [x, y],
    [x + w * c, y + w * s],
    [x + w * c - h * s, y + w * s + h * c],
    [x - h * s, y + h * c],
  ];
}

function pointsBounds(points: ReadonlyArray<readonly [number, number]>): Bounds {
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const [x, y] of points) {
    x0 = Math.min(x0, x);
    y0 = Math.min(y0, y);
    x1 = Math.max(x1, x);
    y1 = Math.max(y1, y);
  }
  return [x0, y0, x1, y1];
}

/** The exact axis-aligned bounds of a shape. */
export function shapeBounds(shape: AnyRegion): Bounds {
  switch (shape.type) {
    case 'rect':
      return pointsBounds(rectCorners(shape));
    case 'circle':
      return [shape.center[0] - shape.radius, shape.center[1] - shape.radius, shape.center[0] + shape.radius, shape.center[1] + shape.radius];
    case 'sector': {
      const [cx, cy] = shape.center;
      const pts: Vec[] = [];
      const end = Math.min(shape.endAngle, shape.startAngle + 360);
      for (const a of arcExtremeAngles(shape.startAngle, end)) {
        const [c, s] = cosSin(a);
        pts.push([cx + shape.outerRadius * c, cy + shape.outerRadius * s], [cx + shape.innerRadius * c, cy + shape.innerRadius * s]);
      }
      return pointsBounds(pts);
    }
    case 'polygon':
      return pointsBounds(shape.points);
  }
}

export function unionBounds(all: ReadonlyArray<Bounds>): Bounds | null {
  if (all.length === 0) return null;
  return [Math.min(...all.map((b) => b[0])), Math.min(...all.map((b) => b[1])), Math.max(...all.map((b) => b[2])), Math.max(...all.map((b) => b[3]))];
}

/** The point a shape turns about: the middle of its bounds (the centre of a circle or of a rect). */
export function shapePivot(shape: AnyRegion): Vec {
  const b = shapeBounds(shape);
  return [(b[0] + b[2]) / 2, (b[1] + b[3]) / 2];
}

function distanceToSegment(p: readonly [number, number], a: readonly [number, number], b: readonly [number, number]): number {
  const ex = b[0] - a[0], ey = b[1] - a[1];
  const len2 = ex * ex + ey * ey;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * ex + (p[1] - a[1]) * ey) / len2));
  return Math.hypot(a[0] + t * ex - p[0], a[1] + t * ey - p[1]);
}

function distanceToRing(p: readonly [number, number], ring: ReadonlyArray<readonly [number, number]>): number {
  let d = Infinity;
  for (let k = 0; k < ring.length; k++) d = Math.min(d, distanceToSegment(p, ring[k], ring[(k + 1) % ring.length]));
  return d;
}

/** The distance from a point to the outline of a shape (exact for arcs). */
export function distanceToOutline(shape: AnyRegion, p: readonly [number, number]): number {
  switch (shape.type) {
    case 'rect':
      return distanceToRing(p, rectCorners(shape));
    case 'circle':
      return Math.abs(Math.hypot(p[0] - shape.center[0], p[1] - shape.center[1]) - shape.radius);
    case 'sector': {
      const [cx, cy] = shape.center;
      const r = Math.hypot(p[0] - cx, p[1] - cy);
      const theta = (Math.atan2(p[1] - cy, p[0] - cx) * 180) / Math.PI;
      const sweep = shape.endAngle - shape.startAngle;
      const within = sweep >= 360 || (((theta - shape.startAngle) % 360) + 360) % 360 <= sweep;
      let d = Infinity;
      if (within) d = Math.min(Math.abs(r - shape.outerRadius), shape.innerRadius > 0 ? Math.abs(r - shape.innerRadius) : Infinity);
      if (sweep < 360) {
        for (const a of [shape.startAngle, shape.endAngle]) {
          const [c, s] = cosSin(a);
          d = Math.min(d, distanceToSegment(p, [cx + shape.innerRadius * c, cy + shape.innerRadius * s], [cx + shape.outerRadius * c, cy + shape.outerRadius * s]));
        }
      } else {
        d = Math.min(Math.abs(r - shape.outerRadius), shape.innerRadius > 0 ? Math.abs(r - shape.innerRadius) : Infinity);
      }
      return d;
    }
    case 'polygon':
      return distanceToRing(p, shape.points);
  }
}

/** Indices of the ports whose both ends lie on the shape's outline (within `tolerance`): they move with it. */
export function portsOnShape(shape: AnyRegion, ports: ReadonlyArray<Port>, tolerance: number): number[] {
  const out: number[] = [];
  ports.forEach((port, k) => {
    if (distanceToOutline(shape, port.from) <= tolerance && distanceToOutline(shape, port.to) <= tolerance) out.push(k);
  });
  return out;
}
