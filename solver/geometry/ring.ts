/**
 * Rings and multipolygons in the plane (metres).
 *
 * A ring is an open list of vertices (the last vertex is not repeated).
 * A polygon is [outer, ...holes]; in the fluid region outer rings run
 * counter-clockwise and holes clockwise, so the fluid is always on the left
 * of the direction of travel.
 */
export type Vec2 = [number, number];
export type Ring = Vec2[];
export type PolygonRings = Ring[];

/** Signed area by the shoelace formula: A = ½ Σ (x_k y_{k+1} − x_{k+1} y_k); positive when counter-clockwise. */
export function ringArea(ring: Ring): number {
  const n = ring.length;
  if (n < 3) return 0;
  // Relative to the first vertex, to keep round-off small far from the origin.
  const [ox, oy] = ring[0];
  let twice = 0;
  for (let k = 1; k + 1 < n; k++) {
    const ax = ring[k][0] - ox, ay = ring[k][1] - oy;
    const bx = ring[k + 1][0] - ox, by = ring[k + 1][1] - oy;
    twice += ax * by - bx * ay;
  }
  return twice / 2;
}

export function ringPerimeter(ring: Ring): number {
  let sum = 0;
  for (let k = 0, n = ring.length; k < n; k++) {
    const a = ring[k], b = ring[(k + 1) % n];
    sum += Math.hypot(b[0] - a[0], b[1] - a[1]);
  }
  return sum;
}

/** The ring turned to run counter-clockwise (ccw = true) or clockwise. */
export function orientRing(ring: Ring, ccw: boolean): Ring {
  return ringArea(ring) > 0 === ccw ? ring : ring.slice().reverse();
}

/** Drops a repeated closing vertex and consecutive duplicates. */
export function openRing(ring: ReadonlyArray<ReadonlyArray<number>>): Ring {
  const out: Ring = [];
  for (const p of ring) {
    const last = out[out.length - 1];
    if (!last || last[0] !== p[0] || last[1] !== p[1]) out.push([p[0], p[1]]);
  }
  while (out.length > 1 && out[0][0] === out[out.length - 1][0] && out[0][1] === out[out.length - 1][1]) out.pop();
  return out;
}

/** [xmin, ymin, xmax, ymax] of a set of polygons; NaNs when empty. */
export function polygonsBounds(polygons: ReadonlyArray<PolygonRings>): [number, number, number, number] {
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const poly of polygons) {
    for (const [x, y] of poly[0] ?? []) {
      if (x < x0) x0 = x;
      if (x > x1) x1 = x;
      if (y < y0) y0 = y;
      if (y > y1) y1 = y;
    }
  }
  return x0 <= x1 ? [x0, y0, x1, y1] : [NaN, NaN, NaN, NaN];
}

/**
 * Winding number of the rings about (x, y) (Sunday's crossing rule: count
 * upward crossings to the right as +1, downward as −1). Points on an edge may
 * count either way.
 */
export function windingNumber(rings: ReadonlyArray<Ring>, x: number, y: number): number {
  let w = 0;
  for (const ring of rings) {
    for (let k = 0, n = ring.length; k < n; k++) {
      const a = ring[k], b = ring[(k + 1) % n];
      const side = (b[0] - a[0]) * (y - a[1]) - (x - a[0]) * (b[1] - a[1]);
      if (a[1] <= y) {
        if (b[1] > y && side > 0) w++;
      } else if (b[1] <= y && side < 0) {
        w--;
      }
    }
  }
  return w;
}

/** Whether (x, y) lies in the polygons (outer rings counter-clockwise, holes clockwise). */
export function polygonsContain(polygons: ReadonlyArray<PolygonRings>, x: number, y: number): boolean {
  for (const poly of polygons) if (windingNumber(poly, x, y) !== 0) return true;
  return false;
}

/** Distance from (x, y) to the nearest edge of the polygons (m). */
export function distanceToOutline(polygons: ReadonlyArray<PolygonRings>, x: number, y: number): number {
  let best = Infinity;
  for (const poly of polygons) {
    for (const ring of poly) {
      for (let k = 0, n = ring.length; k < n; k++) {
        const a = ring[k], b = ring[(k + 1) % n];
        const ex = b[0] - a[0], ey = b[1] - a[1];
        const len2 = ex * ex + ey * ey;
        const t = len2 > 0 ? Math.max(0, Math.min(1, ((x - a[0]) * ex + (y - a[1]) * ey) / len2)) : 0;
        const d = Math.hypot(a[0] + t * ex - x, a[1] + t * ey - y);
        if (d < best) best = d;
      }
    }
  }
  return best;
}
