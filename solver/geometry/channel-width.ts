/**
 * Local channel width by ray casting.
 *
 * From sample points along every outline edge a ray is cast along the inward
 * normal to the first wall it meets. The distance counts as a channel width
 * only where the two walls face each other (the ray meets the far wall within
 * 45° of its normal) and the far edge is not a neighbour of the start edge
 * (which would be a wedge, not a channel). The narrowest such width is the
 * channel that limits the grid resolution; widths far below the drawn
 * features are slivers left by overlapping shapes.
 * Edges are binned in a uniform bucket grid so each ray visits few edges.
 */
import type { FluidRegion } from './fluid-region';
import type { Vec2 } from './ring';

export interface WidthSample {
  /** Wall-to-wall distance (m). */
  width: number;
  /** Middle of the measuring ray (m). */
  at: Vec2;
}

export interface ChannelWidths {
  /** Narrowest width not below `sliverWidth`; null if no facing walls were found. */
  narrowest: WidthSample | null;
  /** Narrowest width of all, slivers included. */
  thinnest: WidthSample | null;
}

const FACING = Math.SQRT1_2; // cos 45°

interface EdgeTable {
  x0: Float64Array; y0: Float64Array; x1: Float64Array; y1: Float64Array;
  ring: Int32Array; index: Int32Array; ringSize: Int32Array;
}

function edgeTable(region: FluidRegion): EdgeTable {
  let count = 0;
  for (const poly of region.polygons) for (const ring of poly) count += ring.length;
  const t: EdgeTable = {
    x0: new Float64Array(count), y0: new Float64Array(count), x1: new Float64Array(count), y1: new Float64Array(count),
    ring: new Int32Array(count), index: new Int32Array(count), ringSize: new Int32Array(count),
  };
  let e = 0, r = 0;
  for (const poly of region.polygons) {
    for (const ring of poly) {
      for (let k = 0, n = ring.length; k < n; k++, e++) {
        const a = ring[k], b = ring[(k + 1) % n];
        t.x0[e] = a[0]; t.y0[e] = a[1]; t.x1[e] = b[0]; t.y1[e] = b[1];
        t.ring[e] = r; t.index[e] = k; t.ringSize[e] = n;
      }
      r++;
    }
  }
  return t;
}

export function channelWidths(region: FluidRegion, sliverWidth = 0): ChannelWidths {
  const edges = edgeTable(region);
  const m = edges.x0.length;
  const [bx0, by0, bx1, by1] = region.bounds;
  if (m === 0 || !(bx1 > bx0) || !(by1 > by0)) return { narrowest: null, thinnest: null };
  const span = Math.max(bx1 - bx0, by1 - by0);
  const diag = Math.hypot(bx1 - bx0, by1 - by0);

  // Bucket grid: about 2 edges a bucket along the long side, capped.
  const nb = Math.min(1024, Math.max(16, Math.ceil(Math.sqrt(m) * 2)));
  const b = (span / nb) * 1.000001;
  const nbx = Math.max(1, Math.ceil((bx1 - bx0) / b) + 1), nby = Math.max(1, Math.ceil((by1 - by0) / b) + 1);
  const bucketOf = (x: number, lo: number, n: number) => Math.min(n - 1, Math.max(0, Math.floor((x - lo) / b)));
  const counts = new Int32Array(nbx * nby + 1);
  const forEachBucket = (e: number, visit: (cell: number) => void) => {
    const i0 = bucketOf(Math.min(edges.x0[e], edges.x1[e]), bx0, nbx), i1 = bucketOf(Math.max(edges.x0[e], edges.x1[e]), bx0, nbx);
    const j0 = bucketOf(Math.min(edges.y0[e], edges.y1[e]), by0, nby), j1 = bucketOf(Math.max(edges.y0[e], edges.y1[e]), by0, nby);
    for (let j = j0; j <= j1; j++) for (let i = i0; i <= i1; i++) visit(i + j * nbx);
  };
  for (let e = 0; e < m; e++) forEachBucket(e, (c) => counts[c + 1]++);
  for (let c = 0; c < nbx * nby; c++) counts[c + 1] += counts[c];
  const fill = counts.slice(0, nbx * nby);
  const members = new Int32Array(counts[nbx * nby]);
  for (let e = 0; e < m; e++) forEachBucket(e, (c) => (members[fill[c]++] = e));

  let narrowest: WidthSample | null = null;
  let thinnest: WidthSample | null = null;
  const step = diag / 2000;
  const minT = diag * 1e-12;

  for (let e = 0; e < m; e++) {
    const ex = edges.x1[e] - edges.x0[e], ey = edges.y1[e] - edges.y0[e];
    const len = Math.hypot(ex, ey);
    if (len === 0) continue;
    // Fluid lies on the left of each edge: inward normal (−ey, ex)/len.
    const dx = -ey / len, dy = ex / len;
    const samples = Math.min(256, Math.max(1, Math.ceil(len / step)));
    for (let s = 0; s < samples; s++) {
      const f = (s + 0.5) / samples;
      const ox = edges.x0[e] + f * ex, oy = edges.y0[e] + f * ey;
      const width = castRay(ox, oy, dx, dy, e);
      if (width < 0) continue;
      const at: Vec2 = [ox + (dx * width) / 2, oy + (dy * width) / 2];
      if (!thinnest || width < thinnest.width) thinnest = { width, at };
      if (width >= sliverWidth && (!narrowest || width < narrowest.width)) narrowest = { width, at };
    }
  }
  return { narrowest, thinnest };

  /** Distance to the facing wall along the ray (Amanatides–Woo bucket walk), or −1. */
  function castRay(ox: number, oy: number, dx: number, dy: number, start: number): number {
    let i = bucketOf(ox, bx0, nbx), j = bucketOf(oy, by0, nby);
    const stepI = dx > 0 ? 1 : -1, stepJ = dy > 0 ? 1 : -1;
    const tDeltaX = dx !== 0 ? b / Math.abs(dx) : Infinity, tDeltaY = dy !== 0 ? b / Math.abs(dy) : Infinity;
    let tMaxX = dx !== 0 ? ((bx0 + (i + (dx > 0 ? 1 : 0)) * b - ox) / dx) : Infinity;
    let tMaxY = dy !== 0 ? ((by0 + (j + (dy > 0 ? 1 : 0)) * b - oy) / dy) : Infinity;
    let best = Infinity, bestEdge = -1;
    for (;;) {
      const cell = i + j * nbx;
      for (let k = counts[cell]; k < counts[cell + 1]; k++) {
        const f = members[k];
        if (f === start) continue;
        const t = rayHits(ox, oy, dx, dy, f);
        if (t > minT && t < best) { best = t; bestEdge = f; }
      }
      const tExit = Math.min(tMaxX, tMaxY);
      if (best <= tExit || tExit > diag * 2) break;
      if (tMaxX < tMaxY) { i += stepI; tMaxX += tDeltaX; if (i < 0 || i >= nbx) break; }
      else { j += stepJ; tMaxY += tDeltaY; if (j < 0 || j >= nby) break; }
    }
    if (bestEdge < 0) return -1;
    // Facing walls only: the far edge's outward normal (ey, −ex)/len along the ray.
    const fx = edges.x1[bestEdge] - edges.x0[bestEdge], fy = edges.y1[bestEdge] - edges.y0[bestEdge];
    const flen = Math.hypot(fx, fy);
    if ((dx * fy - dy * fx) / flen < FACING) return -1;
    if (edges.ring[bestEdge] === edges.ring[start]) {
      const n = edges.ringSize[start];
      const gap = Math.abs(edges.index[bestEdge] - edges.index[start]);
      if (gap <= 1 || gap >= n - 1) return -1;
    }
    return best;
  }

  /** Ray parameter where o + t·d meets edge f, or −1. */
  function rayHits(ox: number, oy: number, dx: number, dy: number, f: number): number {
    const ax = edges.x0[f], ay = edges.y0[f];
    const fx = edges.x1[f] - ax, fy = edges.y1[f] - ay;
    const denom = dx * fy - dy * fx;
    if (denom === 0) return -1;
    const qx = ax - ox, qy = ay - oy;
    const t = (qx * fy - qy * fx) / denom;
    const u = (qx * dy - qy * dx) / denom;
    return u >= 0 && u <= 1 ? t : -1;
  }
}
