/**
 * Self-crossing test for a closed polygon: any two edges that are not
 * neighbours meeting at their shared vertex must not touch.
 * Edges are sorted by their left end so only edges whose x-ranges overlap are
 * compared (fast for the usual drawn polygons; O(n²) only in the worst case).
 * Orientation test: orient(a, b, c) = (b − a) × (c − a).
 */
import type { Vec2 } from './ring';

function orient(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  return (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
}

function onSegment(ax: number, ay: number, bx: number, by: number, px: number, py: number): boolean {
  return Math.min(ax, bx) <= px && px <= Math.max(ax, bx) && Math.min(ay, by) <= py && py <= Math.max(ay, by);
}

/** Where two segments meet (a point of their intersection), or null. */
export function segmentsMeet(a: Vec2, b: Vec2, c: Vec2, d: Vec2): Vec2 | null {
  const o1 = orient(a[0], a[1], b[0], b[1], c[0], c[1]);
  const o2 = orient(a[0], a[1], b[0], b[1], d[0], d[1]);
  const o3 = orient(c[0], c[1], d[0], d[1], a[0], a[1]);
  const o4 = orient(c[0], c[1], d[0], d[1], b[0], b[1]);
  if (((o1 > 0 && o2 < 0) || (o1 < 0 && o2 > 0)) && ((o3 > 0 && o4 < 0) || (o3 < 0 && o4 > 0))) {
    const t = o3 / (o3 - o4);
    return [a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])];
  }
  if (o1 === 0 && onSegment(a[0], a[1], b[0], b[1], c[0], c[1])) return [c[0], c[1]];
  if (o2 === 0 && onSegment(a[0], a[1], b[0], b[1], d[0], d[1])) return [d[0], d[1]];
  if (o3 === 0 && onSegment(c[0], c[1], d[0], d[1], a[0], a[1])) return [a[0], a[1]];
  if (o4 === 0 && onSegment(c[0], c[1], d[0], d[1], b[0], b[1])) return [b[0], b[1]];
  return null;
}

/**
 * The first place where a closed polygon crosses or touches itself, or null.
 * Repeated consecutive points are ignored; a polygon whose points all lie on
 * one line is reported at its first point.
 */
export function findSelfCrossing(points: ReadonlyArray<Readonly<Vec2>>): Vec2 | null {
  const p: Vec2[] = [];
  for (const q of points) {
    const last = p[p.length - 1];
    if (!last || last[0] !== q[0] || last[1] !== q[1]) p.push([q[0], q[1]]);
  }
  while (p.length > 1 && p[0][0] === p[p.length - 1][0] && p[0][1] === p[p.length - 1][1]) p.pop();
  const n = p.length;
  if (n < 3) return p[0] ?? null;
  const order = Array.from({ length: n }, (_, k) => k);
  const left = (k: number) => Math.min(p[k][0], p[(k + 1) % n][0]);
  const right = (k: number) => Math.max(p[k][0], p[(k + 1) % n][0]);
  order.sort((i, j) => left(i) - left(j));
  for (let s = 0; s < n; s++) {
    const i = order[s];
    const xr = right(i);
    for (let t = s + 1; t < n && left(order[t]) <= xr; t++) {
      const j = order[t];
      const neighbours = (i + 1) % n === j || (j + 1) % n === i;
      const a = p[i], b = p[(i + 1) % n], c = p[j], d = p[(j + 1) % n];
      if (neighbours) {
        // Neighbours share one vertex; they cross only if they fold back onto each other.
        const [shared, u, v] = (i + 1) % n === j ? [b, a, d] : [a, b, c];
        if (orient(shared[0], shared[1], u[0], u[1], v[0], v[1]) === 0) {
          const dot = (u[0] - shared[0]) * (v[0] - shared[0]) + (u[1] - shared[1]) * (v[1] - shared[1]);
          if (dot > 0) return [shared[0], shared[1]];
        }
        continue;
      }
      const meet = segmentsMeet(a, b, c, d);
      if (meet) return meet;
    }
  }
  let twiceArea = 0;
  for (let k = 0; k < n; k++) twiceArea += orient(p[0][0], p[0][1], p[k][0], p[k][1], p[(k + 1) % n][0], p[(k + 1) % n][1]);
  return twiceArea === 0 ? p[0] : null;
}
