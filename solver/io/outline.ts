/**
 * Outlines as drawing files carry them: loops of straight and circular-arc segments, in metres (design axes,
 * y up), with a report of everything that was found and everything that was not used.
 *
 * An arc runs from `a` to `b` about `center`, starting at angle `start` (radians) and turning by `sweep`
 * (radians, positive counter-clockwise).
 */
import { arcVertices, ARC_TOLERANCE } from '../geometry/arc';
import type { Ring, Vec2 } from '../geometry/ring';

export interface LineSegment {
  kind: 'line';
  a: Vec2;
  b: Vec2;
}

export interface ArcSegment {
  kind: 'arc';
  a: Vec2;
  b: Vec2;
  center: Vec2;
  radius: number;
  start: number;
  sweep: number;
}

export type Segment = LineSegment | ArcSegment;

/** A closed chain of segments (each ends where the next begins; the last ends at the first's start). */
export interface Loop {
  segments: Segment[];
  /** What it came from, e.g. `path#channel`, `LWPOLYLINE (handle 2F)`, for the report. */
  source: string;
}

/** A thing in the file that became no part of the outline, with where it is (m), when it has a place. */
export interface Skipped {
  entity: string;
  at: Vec2 | null;
  reason: string;
}

export function line(a: Vec2, b: Vec2): LineSegment {
  return { kind: 'line', a, b };
}

/** An arc about `center` from angle `start` turning by `sweep` (radians). */
export function arc(center: Vec2, radius: number, start: number, sweep: number): ArcSegment {
  const end = start + sweep;
  return {
    kind: 'arc',
    center,
    radius,
    start,
    sweep,
    a: [center[0] + radius * Math.cos(start), center[1] + radius * Math.sin(start)],
    b: [center[0] + radius * Math.cos(end), center[1] + radius * Math.sin(end)],
  };
}

export function reverseSegment(s: Segment): Segment {
  if (s.kind === 'line') return line(s.b, s.a);
  return { ...s, a: s.b, b: s.a, start: s.start + s.sweep, sweep: -s.sweep };
}

/**
 * The loop as one ring of vertices (the first not repeated). Arcs become area-exact polygons
 * (geometry/arc.ts), so the ring's area matches the arcs' to the arc tolerance.
 */
export function loopRing(loop: Loop, tolerance = ARC_TOLERANCE): Ring {
  const out: Ring = [];
  for (const s of loop.segments) {
    if (s.kind === 'line') {
      out.push(s.a);
      continue;
    }
    const a0 = (s.start * 180) / Math.PI;
    const a1 = ((s.start + s.sweep) * 180) / Math.PI;
    const ccw = s.sweep > 0;
    const pts = arcVertices(s.center[0], s.center[1], s.radius, ccw ? a0 : a1, ccw ? a1 : a0, tolerance);
    if (!ccw) pts.reverse();
    pts.pop(); // the next segment starts there
    out.push(...pts);
  }
  return out;
}

/** Distance between two points. */
export function gap(p: Vec2, q: Vec2): number {
  return Math.hypot(p[0] - q[0], p[1] - q[1]);
}

/** Largest |coordinate| over the segments (arcs by their circle's extent). */
export function segmentExtent(s: Segment): number {
  if (s.kind === 'line') return Math.max(Math.abs(s.a[0]), Math.abs(s.a[1]), Math.abs(s.b[0]), Math.abs(s.b[1]));
  return Math.max(Math.abs(s.center[0]), Math.abs(s.center[1])) + s.radius;
}
