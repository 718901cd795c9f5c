/**
 * The Port tool: a click near the outline of the fluid becomes a port that spans the straight stretch of
 * outline under the click (for a channel end, exactly the end of the channel), with its ends on outline vertices.
 */
import type { Port } from '../../../../shared/design';
import type { Vec } from './tool-geometry';

export interface Segment {
  from: Vec;
  to: Vec;
}

function distanceToSegment(p: Vec, a: Vec, b: Vec): number {
  const ex = b[0] - a[0], ey = b[1] - a[1];
  const len2 = ex * ex + ey * ey;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * ex + (p[1] - a[1]) * ey) / len2));
  return Math.hypot(a[0] + t * ex - p[0], a[1] + t * ey - p[1]);
}

/** Whether the edges a→b and b→c run on in the same direction (within `toleranceDeg`). */
function collinear(a: Vec, b: Vec, c: Vec, toleranceDeg: number): boolean {
  const u0 = b[0] - a[0], u1 = b[1] - a[1], v0 = c[0] - b[0], v1 = c[1] - b[1];
  const cross = u0 * v1 - u1 * v0, dot = u0 * v0 + u1 * v1;
  return dot > 0 && Math.abs(Math.atan2(cross, dot)) <= (toleranceDeg * Math.PI) / 180;
}

/**
 * The straight stretch of outline nearest to `click`, or null when no outline is within `maxDistance`.
 * `rings` are the closed outlines of the fluid (open vertex lists). Edges that continue in the same direction
 * (a side split where another shape meets it) are joined; curved outlines, drawn as many short chords, give
 * a single chord.
 */
export function portSegmentNear(rings: ReadonlyArray<ReadonlyArray<Vec>>, click: Vec, maxDistance: number, toleranceDeg = 0.5): Segment | null {
  let best: { ring: ReadonlyArray<Vec>; edge: number; d: number } | null = null;
  for (const ring of rings) {
    for (let k = 0; k < ring.length; k++) {
      const d = distanceToSegment(click, ring[k], ring[(k + 1) % ring.length]);
      if (d <= maxDistance && (!best || d < best.d)) best = { ring, edge: k, d };
    }
  }
  if (!best) return null;
  const { ring } = best;
  const n = ring.length;
  const at = (k: number) => ring[((k % n) + n) % n];
  let first = best.edge; // the stretch starts at vertex `first`
  let last = best.edge + 1; // and ends at vertex `last`
  for (let guard = 0; guard < n && collinear(at(first - 1), at(first), at(first + 1), toleranceDeg); guard++) first--;
  for (let guard = 0; guard < n && collinear(at(last - 1), at(last), at(last + 1), toleranceDeg); guard++) last++;
  const from = at(first), to = at(last);
  if (from[0] === to[0] && from[1] === to[1]) return null;
  return { from: [from[0], from[1]], to: [to[0], to[1]] };
}

/** The next free port id: A, B, … Z, then A2, B2, … */
export function nextPortId(ports: ReadonlyArray<Pick<Port, 'id'>>): string {
  const used = new Set(ports.map((p) => p.id));
  for (let round = 1; ; round++) {
    for (let k = 0; k < 26; k++) {
      const id = String.fromCharCode(65 + k) + (round === 1 ? '' : String(round));
      if (!used.has(id)) return id;
    }
  }
}

/** Whether two segments cover the same stretch (either way round, within `tolerance`). */
export function sameSegment(a: Segment, b: Segment, tolerance: number): boolean {
  const near = (p: Vec, q: Vec) => Math.hypot(p[0] - q[0], p[1] - q[1]) <= tolerance;
  return (near(a.from, b.from) && near(a.to, b.to)) || (near(a.from, b.to) && near(a.to, b.from));
}
