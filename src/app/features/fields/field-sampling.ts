/**
 * Reading the fields at a point and along a line: bilinear interpolation between the cell values (each at its
 * cell's centre) that are defined, and an inside-the-fluid test by the outline when there is one, by the cell's
 * fluid fraction otherwise.
 */
import type { SolveFields } from '../../../../shared/result';

export type Vec = readonly [number, number];

/** Bilinear value at (x, y) (m): the defined neighbours' values weighted by distance; NaN if none is defined. */
export function sampleAt(fields: Pick<SolveFields, 'nx' | 'ny' | 'spacing' | 'x0' | 'y0'>, values: ArrayLike<number>, x: number, y: number): number {
  const { nx, ny, spacing: h, x0, y0 } = fields;
  const fx = (x - x0) / h - 0.5, fy = (y - y0) / h - 0.5;
  const i0 = Math.floor(fx), j0 = Math.floor(fy);
  const tx = fx - i0, ty = fy - j0;
  let sum = 0, weight = 0;
  for (let dj = 0; dj <= 1; dj++) {
    const j = j0 + dj;
    if (j < 0 || j >= ny) continue;
    const wy = dj === 0 ? 1 - ty : ty;
    for (let di = 0; di <= 1; di++) {
      const i = i0 + di;
      if (i < 0 || i >= nx) continue;
      const v = values[i + j * nx];
      if (!Number.isFinite(v)) continue;
      const w = (di === 0 ? 1 - tx : tx) * wy;
      sum += w * v;
      weight += w;
    }
  }
  return weight > 1e-9 ? sum / weight : NaN;
}

/** The cell holding (x, y), or -1 off the grid. */
export function cellAt(fields: Pick<SolveFields, 'nx' | 'ny' | 'spacing' | 'x0' | 'y0'>, x: number, y: number): number {
  const i = Math.floor((x - fields.x0) / fields.spacing), j = Math.floor((y - fields.y0) / fields.spacing);
  return i < 0 || j < 0 || i >= fields.nx || j >= fields.ny ? -1 : i + j * fields.nx;
}

/** Even-odd test against closed rings (m); rings are open vertex lists. */
export function insideRings(rings: ReadonlyArray<ReadonlyArray<Vec>>, p: Vec): boolean {
  let inside = false;
  for (const ring of rings) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const a = ring[i], b = ring[j];
      if (a[1] > p[1] !== b[1] > p[1] && p[0] < ((b[0] - a[0]) * (p[1] - a[1])) / (b[1] - a[1]) + a[0]) inside = !inside;
    }
  }
  return inside;
}

/** Whether (x, y) is in the fluid: by the outline rings when given, else by the cell's fluid fraction. */
export function insideFluid(fields: Pick<SolveFields, 'nx' | 'ny' | 'spacing' | 'x0' | 'y0' | 'fraction'>, p: Vec, rings?: ReadonlyArray<ReadonlyArray<Vec>> | null): boolean {
  if (rings && rings.length > 0) return insideRings(rings, p);
  const c = cellAt(fields, p[0], p[1]);
  return c >= 0 && fields.fraction[c] > 0;
}

/** Every field at a point, as the hover readout shows it (SI); inside: false and nothing else outside the fluid. */
export interface FieldProbe {
  at: Vec;
  inside: boolean;
  potential?: number;
  fieldX?: number;
  fieldY?: number;
  fieldStrength?: number;
  velocityX?: number;
  velocityY?: number;
  speed?: number;
  vorticity?: number;
  pressure?: number;
  streamfunction?: number;
}

export function probeFields(fields: SolveFields, p: Vec, rings?: ReadonlyArray<ReadonlyArray<Vec>> | null): FieldProbe {
  if (!insideFluid(fields, p, rings)) return { at: p, inside: false };
  const at = (v: Float32Array) => sampleAt(fields, v, p[0], p[1]);
  const fieldX = at(fields.fieldX), fieldY = at(fields.fieldY);
  const velocityX = at(fields.velocityX), velocityY = at(fields.velocityY);
  return {
    at: p,
    inside: true,
    potential: at(fields.potential),
    fieldX,
    fieldY,
    fieldStrength: Math.hypot(fieldX, fieldY),
    velocityX,
    velocityY,
    speed: Math.hypot(velocityX, velocityY),
    vorticity: at(fields.vorticity),
    pressure: at(fields.pressure),
    streamfunction: at(fields.streamfunction),
  };
}

export interface LineProfile {
  /** Distance from the line's start (m). */
  distance: Float64Array;
  /** The values (NaN outside the fluid). */
  values: Float64Array;
  length: number;
}

/**
 * Values along the segment a → b at `samples` evenly spaced points (ends included); NaN outside the fluid, so
 * a plot leaves gaps where the line crosses walls. With `normal`, the values are the component of a vector field
 * (given as [vx, vy]) across the line (positive to the left of a → b), i.e. what flows through it.
 */
export function lineProfile(
  fields: SolveFields,
  values: ArrayLike<number> | readonly [ArrayLike<number>, ArrayLike<number>],
  a: Vec,
  b: Vec,
  samples: number,
  rings?: ReadonlyArray<ReadonlyArray<Vec>> | null,
): LineProfile {
  const n = Math.max(2, Math.floor(samples));
  const dx = b[0] - a[0], dy = b[1] - a[1];
  const length = Math.hypot(dx, dy);
  const distance = new Float64Array(n), out = new Float64Array(n);
  // A pair of component arrays (typed arrays are not Arrays).
  const pair = Array.isArray(values) ? (values as unknown as readonly [ArrayLike<number>, ArrayLike<number>]) : null;
  const nxu = length > 0 ? -dy / length : 0, nyu = length > 0 ? dx / length : 0;
  for (let k = 0; k < n; k++) {
    const t = k / (n - 1);
    const p: Vec = [a[0] + t * dx, a[1] + t * dy];
    distance[k] = t * length;
    if (!insideFluid(fields, p, rings)) {
      out[k] = NaN;
      continue;
    }
    if (pair) {
      out[k] = sampleAt(fields, pair[0], p[0], p[1]) * nxu + sampleAt(fields, pair[1], p[0], p[1]) * nyu;
    } else {
      out[k] = sampleAt(fields, values as ArrayLike<number>, p[0], p[1]);
    }
  }
  return { distance, values: out, length };
}
