/**
 * Closed loops to design shapes. Nesting is even–odd: a loop inside no other loop adds fluid, one inside one
 * loop cuts it out (a pillar or island), one inside two adds again, and so on; shapes are emitted by depth so
 * that applying them in order (design-format.md) gives exactly that set.
 *
 * A loop that is one whole circle becomes a `circle`; an annular sector (arc, radial line, concentric arc back,
 * radial line) or a pie slice becomes a `sector`; every other loop becomes a `polygon` with its arcs flattened
 * area-exactly (geometry/arc.ts).
 */
import type { Shape } from '../../shared/design';
import { ringArea, windingNumber, type Ring, type Vec2 } from '../geometry/ring';
import { gap, loopRing, type ArcSegment, type Loop } from './outline';

const DEG = 180 / Math.PI;

function close(a: number, b: number, tol: number): boolean {
  return Math.abs(a - b) <= tol;
}

/** A sector shape when the loop is one, else null. `tol` is a length (m). */
function asSector(loop: Loop, tol: number): Shape | null {
  const segs = loop.segments;
  const arcs = segs.filter((s): s is ArcSegment => s.kind === 'arc');
  if (arcs.length === 0 || arcs.length > 2 || segs.length > 4 || segs.length < 2) return null;
  const c = arcs[0].center;
  if (arcs.some((a) => gap(a.center, c) > tol)) return null;
  // Lines must be radial: both ends on one ray from the centre (or one end at the centre for a pie slice).
  for (const s of segs) {
    if (s.kind !== 'line') continue;
    const ra = gap(s.a, c), rb = gap(s.b, c);
    if (ra > tol && rb > tol) {
      const cross = (s.a[0] - c[0]) * (s.b[1] - c[1]) - (s.a[1] - c[1]) * (s.b[0] - c[0]);
      if (Math.abs(cross) > tol * Math.max(ra, rb)) return null;
      if ((s.a[0] - c[0]) * (s.b[0] - c[0]) + (s.a[1] - c[1]) * (s.b[1] - c[1]) < 0) return null;
    }
  }
  const outer = arcs.reduce((m, a) => (a.radius > m.radius ? a : m));
  const inner = arcs.length === 2 ? arcs.find((a) => a !== outer)! : null;
  const sweep = Math.abs(outer.sweep);
  if (sweep >= 2 * Math.PI - 1e-9) return null;
  if (inner) {
    if (!close(Math.abs(inner.sweep), sweep, 1e-6) || Math.sign(inner.sweep) === Math.sign(outer.sweep)) return null;
    if (close(inner.radius, outer.radius, tol) || segs.length !== 4) return null;
  } else if (segs.length !== 3) {
    return null;
  }
  const start = outer.sweep > 0 ? outer.start : outer.start + outer.sweep;
  let startAngle = start * DEG;
  startAngle = ((startAngle % 360) + 360) % 360;
  if (startAngle > 180) startAngle -= 360;
  return {
    op: 'add',
    type: 'sector',
    center: [c[0], c[1]],
    innerRadius: inner ? inner.radius : 0,
    outerRadius: outer.radius,
    startAngle,
    endAngle: startAngle + sweep * DEG,
  };
}

/** Consecutive arcs of one circle turning the same way become one arc (a circle drawn as two halves, say). */
export function mergeArcs(loop: Loop, tol: number): Loop {
  const out: Loop['segments'] = [];
  for (const s of loop.segments) {
    const prev = out[out.length - 1];
    if (prev && prev.kind === 'arc' && s.kind === 'arc' && gap(prev.center, s.center) <= tol && close(prev.radius, s.radius, tol) && Math.sign(prev.sweep) === Math.sign(s.sweep)) {
      out[out.length - 1] = { ...prev, sweep: prev.sweep + s.sweep, b: s.b };
    } else {
      out.push(s);
    }
  }
  const first = out[0], last = out[out.length - 1];
  if (out.length > 1 && first.kind === 'arc' && last.kind === 'arc' && gap(first.center, last.center) <= tol && close(first.radius, last.radius, tol) && Math.sign(first.sweep) === Math.sign(last.sweep)) {
    out[0] = { ...last, sweep: last.sweep + first.sweep, b: first.b };
    out.pop();
  }
  return { ...loop, segments: out };
}

/** The loop as a shape (op 'add'; the caller sets the op from the nesting). */
export function loopShape(whole: Loop, ring: Ring, tol: number): Shape {
  const loop = mergeArcs(whole, tol);
  const segs = loop.segments;
  if (segs.length === 1 && segs[0].kind === 'arc' && Math.abs(Math.abs(segs[0].sweep) - 2 * Math.PI) <= 1e-6) {
    return { op: 'add', type: 'circle', center: [segs[0].center[0], segs[0].center[1]], radius: segs[0].radius };
  }
  const sector = asSector(loop, tol);
  if (sector) return sector;
  return { op: 'add', type: 'polygon', points: ring.map((p) => [p[0], p[1]] as [number, number]) };
}

/** A point well inside the loop's edge: the midpoint of its first edge nudged a little to its inner side. */
function probePoint(ring: Ring): Vec2 {
  const a = ring[0], b = ring[1 % ring.length];
  const ccw = ringArea(ring) > 0;
  const dx = b[0] - a[0], dy = b[1] - a[1];
  const len = Math.hypot(dx, dy) || 1;
  const eps = len * 1e-6;
  const nx = ccw ? -dy / len : dy / len, ny = ccw ? dx / len : -dx / len;
  return [(a[0] + b[0]) / 2 + nx * eps, (a[1] + b[1]) / 2 + ny * eps];
}

export interface ShapedLoop {
  shape: Shape;
  depth: number;
  source: string;
}

/** Shapes of the loops in the order to apply them (by nesting depth), with their nesting depth. */
export function loopsToShapes(loops: ReadonlyArray<Loop>, tol: number): ShapedLoop[] {
  const rings = loops.map((l) => loopRing(l));
  const probes = rings.map(probePoint);
  const areas = rings.map((r) => Math.abs(ringArea(r)));
  const out: ShapedLoop[] = loops.map((loop, k) => {
    let depth = 0;
    for (let j = 0; j < loops.length; j++) {
      if (j !== k && areas[j] > areas[k] && windingNumber([rings[j]], probes[k][0], probes[k][1]) !== 0) depth++;
    }
    const shape = loopShape(loop, rings[k], tol);
    return { shape: { ...shape, op: depth % 2 === 0 ? 'add' : 'subtract' } as Shape, depth, source: loop.source };
  });
  return out.sort((p, q) => p.depth - q.depth);
}
