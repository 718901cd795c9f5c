/**
 * Streamlines of the depth-averaged velocity: curves tangent to u, traced from seeds spread evenly over the fluid
 * and kept apart by an occupancy grid (a simple form of evenly spaced streamline placement, after B. Jobard and
 * W. Lefer, "Creating evenly-spaced streamlines of arbitrary density", 1997).
 *
 * Each line is integrated in arc length s, dx/ds = u/|u|, with the second-order midpoint rule (RK2):
 *   d1 = û(x),  d2 = û(x + ½ Δs d1),  x ← x + Δs d2,
 * forward and backward from its seed, stopping outside the fluid, where the flow stalls, near another line,
 * or after a number of steps.
 */
import type { SolveFields } from '../../../../shared/result';
import { sampleAt } from './field-sampling';

export interface StreamlineOptions {
  /** Distance between neighbouring lines (m). */
  separation: number;
  /** Arc length of one step (m); default a third of the separation or half a cell, the smaller. */
  step?: number;
  /** A line stops where |u| falls below this share of the largest speed. */
  stallShare?: number;
  /** A line stops nearer than this share of the separation to another line. */
  nearShare?: number;
  /** Steps per direction at most. */
  maxSteps?: number;
  /** Seeds at most (the densest layouts are thinned). */
  maxSeeds?: number;
}

type Fields = Pick<SolveFields, 'nx' | 'ny' | 'spacing' | 'x0' | 'y0' | 'fraction' | 'velocityX' | 'velocityY'>;

/** The direction of u at (x, y), or null outside the fluid or where the flow stalls. */
function direction(f: Fields, x: number, y: number, minSpeed: number): [number, number] | null {
  const i = Math.floor((x - f.x0) / f.spacing), j = Math.floor((y - f.y0) / f.spacing);
  if (i < 0 || j < 0 || i >= f.nx || j >= f.ny || !(f.fraction[i + j * f.nx] > 0)) return null;
  const u = sampleAt(f, f.velocityX, x, y), v = sampleAt(f, f.velocityY, x, y);
  const speed = Math.hypot(u, v);
  if (!(speed > minSpeed)) return null;
  return [u / speed, v / speed];
}

/** One RK2 (midpoint) step of length ds along ±û from p; null when it leaves the fluid or stalls. */
export function rk2Step(f: Fields, p: readonly [number, number], ds: number, minSpeed: number): [number, number] | null {
  const d1 = direction(f, p[0], p[1], minSpeed);
  if (!d1) return null;
  const d2 = direction(f, p[0] + 0.5 * ds * d1[0], p[1] + 0.5 * ds * d1[1], minSpeed);
  if (!d2) return null;
  return [p[0] + ds * d2[0], p[1] + ds * d2[1]];
}

/** Streamlines as flat [x0, y0, x1, y1, ...] arrays (m), from upstream to downstream. */
export function traceStreamlines(f: Fields, options: StreamlineOptions): Float64Array[] {
  const sep = options.separation;
  if (!(sep > 0)) return [];
  const ds = options.step ?? Math.min(sep / 3, f.spacing / 2);
  const near = sep * (options.nearShare ?? 0.5);
  const maxSteps = options.maxSteps ?? Math.ceil((4 * (f.nx + f.ny) * f.spacing) / ds);
  let maxSpeed = 0;
  for (let c = 0; c < f.velocityX.length; c++) {
    const s = Math.hypot(f.velocityX[c], f.velocityY[c]);
    if (s > maxSpeed) maxSpeed = s;
  }
  if (!(maxSpeed > 0)) return [];
  const minSpeed = maxSpeed * (options.stallShare ?? 1e-3);

  // Occupancy: buckets of size `near` holding the points of finished lines.
  const x0 = f.x0, y0 = f.y0;
  const bw = Math.max(1, Math.ceil((f.nx * f.spacing) / near)), bh = Math.max(1, Math.ceil((f.ny * f.spacing) / near));
  const buckets = new Map<number, number[]>();
  const bucketOf = (x: number, y: number) => {
    const i = Math.min(bw - 1, Math.max(0, Math.floor((x - x0) / near))), j = Math.min(bh - 1, Math.max(0, Math.floor((y - y0) / near)));
    return i + j * bw;
  };
  const crowded = (x: number, y: number, limit: number) => {
    const i = Math.floor((x - x0) / near), j = Math.floor((y - y0) / near);
    for (let dj = -1; dj <= 1; dj++) {
      for (let di = -1; di <= 1; di++) {
        const bi = i + di, bj = j + dj;
        if (bi < 0 || bj < 0 || bi >= bw || bj >= bh) continue;
        const pts = buckets.get(bi + bj * bw);
        if (!pts) continue;
        for (let k = 0; k < pts.length; k += 2) if ((pts[k] - x) ** 2 + (pts[k + 1] - y) ** 2 < limit * limit) return true;
      }
    }
    return false;
  };
  const occupy = (line: ArrayLike<number>) => {
    for (let k = 0; k < line.length; k += 2) {
      const b = bucketOf(line[k], line[k + 1]);
      let pts = buckets.get(b);
      if (!pts) buckets.set(b, (pts = []));
      pts.push(line[k], line[k + 1]);
    }
  };

  const half = (seed: readonly [number, number], sign: 1 | -1): { pts: number[]; closed: boolean } => {
    const pts: number[] = [];
    let p: readonly [number, number] = seed;
    for (let n = 0; n < maxSteps; n++) {
      const q = rk2Step(f, p, sign * ds, minSpeed);
      if (!q || crowded(q[0], q[1], near)) break;
      // A closed loop (a vortex) comes back to its seed: close it there.
      if (n > 8 && (q[0] - seed[0]) ** 2 + (q[1] - seed[1]) ** 2 < ds * ds) {
        pts.push(seed[0], seed[1]);
        return { pts, closed: true };
      }
      pts.push(q[0], q[1]);
      p = q;
    }
    return { pts, closed: false };
  };

  const lines: Float64Array[] = [];
  // Candidates on a lattice twice as fine as the separation, so that narrow channels get seeds too.
  for (const candidate of seeds(f, sep / 2, options.maxSeeds ?? 20000)) {
    const seed = centreAcross(f, candidate, sep, minSpeed);
    if (crowded(seed[0], seed[1], sep)) continue;
    const backward = half(seed, -1);
    const back = backward.pts, ahead = backward.closed ? [] : half(seed, 1).pts;
    if (back.length + ahead.length < 4) continue;
    const line = new Float64Array(back.length + 2 + ahead.length);
    // Backward points reversed, then the seed, then forward: upstream to downstream.
    for (let k = back.length - 2, at = 0; k >= 0; k -= 2, at += 2) {
      line[at] = back[k];
      line[at + 1] = back[k + 1];
    }
    line[back.length] = seed[0];
    line[back.length + 1] = seed[1];
    line.set(ahead, back.length + 2);
    occupy(line);
    lines.push(line);
  }
  return lines;
}

/**
 * A seed moved to the middle of its channel when the channel is narrower than the line separation: walk across
 * the flow both ways to the walls (at most sep/2 each way) and take the midpoint. Lines in narrow channels then
 * run down their middles instead of along a wall; in wide regions the seed stays where it is.
 */
export function centreAcross(f: Fields, p: readonly [number, number], sep: number, minSpeed = 0): [number, number] {
  const d = direction(f, p[0], p[1], minSpeed);
  if (!d) return [p[0], p[1]];
  const nx = -d[1], ny = d[0];
  const step = f.spacing / 4, limit = sep / 2;
  const wall = (sign: 1 | -1): number | null => {
    for (let t = step; t <= limit; t += step) {
      const x = p[0] + sign * t * nx, y = p[1] + sign * t * ny;
      const i = Math.floor((x - f.x0) / f.spacing), j = Math.floor((y - f.y0) / f.spacing);
      if (i < 0 || j < 0 || i >= f.nx || j >= f.ny || !(f.fraction[i + j * f.nx] >= 0.5)) return t;
    }
    return null;
  };
  const plus = wall(1), minus = wall(-1);
  if (plus === null || minus === null) return [p[0], p[1]];
  const shift = (plus - minus) / 2;
  return [p[0] + shift * nx, p[1] + shift * ny];
}

/** Seeds at the centres of a lattice of spacing `sep`, kept where the cell there is mostly fluid. */
export function seeds(f: Pick<SolveFields, 'nx' | 'ny' | 'spacing' | 'x0' | 'y0' | 'fraction'>, sep: number, maxSeeds: number): Array<[number, number]> {
  let s = sep;
  const w = f.nx * f.spacing, h = f.ny * f.spacing;
  // Thin the lattice until it fits.
  while ((w / s) * (h / s) > 4 * maxSeeds) s *= 1.5;
  const out: Array<[number, number]> = [];
  for (let y = f.y0 + s / 2; y < f.y0 + h; y += s) {
    for (let x = f.x0 + s / 2; x < f.x0 + w; x += s) {
      const i = Math.floor((x - f.x0) / f.spacing), j = Math.floor((y - f.y0) / f.spacing);
      if (i < f.nx && j < f.ny && f.fraction[i + j * f.nx] >= 0.5) out.push([x, y]);
      if (out.length >= maxSeeds) return out;
    }
  }
  return out;
}
