/**
 * The fluid outline for a photomask: the union of the design's shapes (geometry/fluid-region.ts) as closed
 * loops of lines and circular arcs. The boolean operations work on polygons, so arcs come back as runs of
 * short edges; every run whose vertices lie on one of the design's circles (circle shapes, sector radii) is
 * turned back into one arc, with its ends put exactly on the circle, and a ring that lies wholly on a circle
 * becomes that circle.
 */
import type { DesignDocument, Region } from '../../shared/design';
import { cosSinDeg } from '../geometry/angles';
import { fluidRegion } from '../geometry/fluid-region';
import { rectRing } from '../geometry/shape-outline';
import type { Ring, Vec2 } from '../geometry/ring';
import { arc, line, type Loop, type Segment } from './outline';

interface Circle {
  c: Vec2;
  r: number;
}

export interface MaskPolygon {
  /** Outer loop (counter-clockwise) then holes (clockwise). */
  loops: Loop[];
}

export interface MaskOutline {
  polygons: MaskPolygon[];
  bounds: [number, number, number, number];
  area: number;
}

/** Radial tolerance, relative to the radius, for a vertex to count as on a circle. */
const ON_CIRCLE = 1e-4;
/** Largest turn of one polygon edge of an arc (rad); the fluid region's arcs turn about 0.011 rad an edge. */
const MAX_STEP = 0.06;

function circlesOf(design: DesignDocument): Circle[] {
  const out: Circle[] = [];
  for (const s of design.shapes) {
    if (s.type === 'circle') out.push({ c: s.center, r: s.radius });
    if (s.type === 'sector') {
      out.push({ c: s.center, r: s.outerRadius });
      if (s.innerRadius > 0) out.push({ c: s.center, r: s.innerRadius });
    }
  }
  return out;
}

function onCircle(p: Vec2, k: Circle): boolean {
  return Math.abs(Math.hypot(p[0] - k.c[0], p[1] - k.c[1]) - k.r) <= ON_CIRCLE * k.r;
}

function angleOf(p: Vec2, k: Circle): number {
  return Math.atan2(p[1] - k.c[1], p[0] - k.c[0]);
}

function turn(a: number, b: number): number {
  let d = b - a;
  while (d > Math.PI) d -= 2 * Math.PI;
  while (d <= -Math.PI) d += 2 * Math.PI;
  return d;
}

function snap(p: Vec2, k: Circle): Vec2 {
  const t = angleOf(p, k);
  return [k.c[0] + k.r * Math.cos(t), k.c[1] + k.r * Math.sin(t)];
}

/** A ring as segments, with arcs recovered on the given circles. */
export function ringToLoop(ring: Ring, circles: ReadonlyArray<Circle>, source: string): Loop {
  const n = ring.length;
  const label = new Array<number>(n).fill(-1);
  for (let k = 0; k < n; k++) {
    const a = ring[k], b = ring[(k + 1) % n];
    label[k] = circles.findIndex((c) => onCircle(a, c) && onCircle(b, c) && Math.abs(turn(angleOf(a, c), angleOf(b, c))) <= MAX_STEP);
  }
  if (label.every((l) => l >= 0 && l === label[0])) {
    const k = circles[label[0]];
    let sweep = 0;
    for (let i = 0; i < n; i++) sweep += turn(angleOf(ring[i], k), angleOf(ring[(i + 1) % n], k));
    return { source, segments: [arc(k.c, k.r, 0, sweep > 0 ? 2 * Math.PI : -2 * Math.PI)] };
  }
  // Start where the labels change, so no run wraps round the end.
  let start = 0;
  for (let k = 0; k < n; k++) if (label[k] !== label[(k + n - 1) % n]) { start = k; break; }
  const segments: Segment[] = [];
  let k = 0;
  const vertex = (i: number): Vec2 => ring[(start + i) % n];
  const pending: Segment[] = [];
  while (k < n) {
    const l = label[(start + k) % n];
    let j = k;
    while (j + 1 < n && label[(start + j + 1) % n] === l) j++;
    const edges = j - k + 1;
    if (l >= 0 && edges >= 2) {
      const c = circles[l];
      let sweep = 0;
      for (let i = k; i <= j; i++) sweep += turn(angleOf(vertex(i), c), angleOf(vertex(i + 1), c));
      const seg = arc(c.c, c.r, angleOf(vertex(k), c), sweep);
      pending.push({ ...seg, a: snap(vertex(k), c), b: snap(vertex(j + 1), c) });
    } else {
      for (let i = k; i <= j; i++) pending.push(line(vertex(i), vertex(i + 1)));
    }
    k = j + 1;
  }
  // Make the chain continuous where an arc's snapped end meets a line.
  for (let i = 0; i < pending.length; i++) {
    const s = pending[i], next = pending[(i + 1) % pending.length];
    const cur = segments.length ? { ...s, a: segments[segments.length - 1].b } : s;
    segments.push(next.kind === 'arc' && s.kind === 'line' ? { ...cur, b: next.a } : cur);
  }
  if (segments.length) segments[0] = { ...segments[0], a: segments[segments.length - 1].b };
  return { source, segments };
}

/** The design's fluid as closed loops of lines and arcs. */
export function maskOutline(design: DesignDocument): MaskOutline {
  const region = fluidRegion(design.shapes);
  const circles = circlesOf(design);
  const polygons = region.polygons.map((rings, p) => ({
    loops: rings.map((r, h) => ringToLoop(r, circles, h === 0 ? `piece ${p + 1}` : `piece ${p + 1} hole ${h}`)),
  }));
  return { polygons, bounds: region.bounds, area: region.area };
}

/** A wall-zone region (or any design region) as one closed loop with arcs as arcs. */
export function regionLoop(region: Region, source: string): Loop {
  const rad = Math.PI / 180;
  switch (region.type) {
    case 'rect': {
      const r = rectRing(region.x, region.y, region.width, region.height, region.angle);
      return { source, segments: r.map((p, k) => line(p, r[(k + 1) % 4])) };
    }
    case 'polygon':
      return { source, segments: region.points.map((p, k) => line(p, region.points[(k + 1) % region.points.length])) };
    case 'circle':
      return { source, segments: [arc(region.center, region.radius, 0, 2 * Math.PI)] };
    case 'sector': {
      const { center: c, innerRadius: ri, outerRadius: ro, startAngle: a0, endAngle: a1 } = region;
      const sweep = (a1 - a0) * rad;
      const outer = arc(c, ro, a0 * rad, sweep);
      const [c1, s1] = cosSinDeg(a1), [c0, s0] = cosSinDeg(a0);
      if (ri <= 0) return { source, segments: [outer, line(outer.b, c), line(c, outer.a)] };
      const inner = arc(c, ri, a1 * rad, -sweep);
      const innerEnd: Vec2 = [c[0] + ri * c1, c[1] + ri * s1];
      const innerStart: Vec2 = [c[0] + ri * c0, c[1] + ri * s0];
      return { source, segments: [outer, line(outer.b, innerEnd), { ...inner, a: innerEnd, b: innerStart }, line(innerStart, outer.a)] };
    }
  }
}
