/**
 * Circular arcs as polygons that keep the exact area.
 *
 * A chord polygon inscribed in a circle loses area. We instead place the
 * interior vertices on a slightly larger radius f·r, chosen so that the fan
 * of triangles from the centre has exactly the area of the true sector:
 *
 *   open arc, n segments of angle δ, both end vertices on r:
 *     ½ r² sin δ · (2f + (n − 2) f²) = ½ r² Θ        (Θ = n δ)
 *   closed circle, every vertex on f·r:
 *     ½ n f² r² sin δ = π r²   ⇒   f² = δ / sin δ
 *
 * The polygon then deviates from the true circle by about r δ²/12 at most,
 * so δ = √(12 · tolerance) keeps the deviation below tolerance·r while the
 * cut-cell fractions still sum to the exact area of bends and pillars.
 * End vertices stay exactly on the circle so that straight leads meet a bend
 * without a step.
 */
import { cosSinDeg, DEG } from './angles';
import type { Ring } from './ring';

/** Largest deviation of an arc polygon from its circle, relative to the radius. */
export const ARC_TOLERANCE = 1e-5;

/**
 * Arcs of a grid of spacing h (solver/grid/discretise.ts): the polygon keeps within GRID_ARC_DEVIATION·h of its
 * circle, so the cut-cell fractions and apertures it gives differ from the exact circle's by at most that
 * fraction of a cell, while the polygon keeps the exact area. The tolerance relative to the radius is never
 * finer than ARC_TOLERANCE (what a tighter grid would need) nor coarser than COARSE_ARC_TOLERANCE.
 * Measured on the annular sector of tests/verification/potential.test.ts: a deviation of 1/40 of a cell (a
 * fixed 1e-4 of the radius at 256 cells) doubled the mean field error there and broke its convergence; 1/400
 * leaves the errors of the convergence table as they were.
 */
export const GRID_ARC_DEVIATION = 2.5e-3;
/** The coarsest arc tolerance, relative to the radius (a polygon of 58 sides for a circle). */
export const COARSE_ARC_TOLERANCE = 1e-3;

/** Arc tolerance (relative to the radius) for an arc of this radius on a grid of this spacing. */
export function gridArcTolerance(radius: number, spacing: number): number {
  if (!(radius > 0 && spacing > 0)) return ARC_TOLERANCE;
  return Math.min(COARSE_ARC_TOLERANCE, Math.max(ARC_TOLERANCE, (GRID_ARC_DEVIATION * spacing) / radius));
}

/** Segments for an arc of `sweep` radians so that the deviation stays below tolerance·r. */
export function arcSegmentCount(sweep: number, tolerance = ARC_TOLERANCE, minimum = 2): number {
  const step = Math.sqrt(12 * tolerance);
  return Math.max(minimum, Math.ceil(Math.abs(sweep) / step));
}

/** Radius factor f for the interior vertices of an open arc of n segments of angle δ (area-exact). */
export function openArcRadiusFactor(n: number, step: number): number {
  const ratio = (n * step) / Math.sin(step); // Θ / sin δ
  if (n === 2) return ratio / 2;
  // (n − 2) f² + 2 f − Θ/sin δ = 0, positive root
  return (-1 + Math.sqrt(1 + (n - 2) * ratio)) / (n - 2);
}

/**
 * Vertices of an arc about (cx, cy) of radius r from startDeg to endDeg
 * (counter-clockwise when endDeg > startDeg), both ends included.
 */
export function arcVertices(
  cx: number,
  cy: number,
  r: number,
  startDeg: number,
  endDeg: number,
  tolerance = ARC_TOLERANCE,
): Ring {
  const sweep = (endDeg - startDeg) * DEG;
  const n = arcSegmentCount(sweep, tolerance);
  const step = sweep / n;
  const f = openArcRadiusFactor(n, Math.abs(step));
  const [c0, s0] = cosSinDeg(startDeg);
  const [c1, s1] = cosSinDeg(endDeg);
  const out: Ring = [[cx + r * c0, cy + r * s0]];
  const a0 = startDeg * DEG;
  for (let k = 1; k < n; k++) {
    const a = a0 + k * step;
    out.push([cx + f * r * Math.cos(a), cy + f * r * Math.sin(a)]);
  }
  out.push([cx + r * c1, cy + r * s1]);
  return out;
}

/** A whole circle, counter-clockwise, with the exact area π r². */
export function circleVertices(cx: number, cy: number, r: number, tolerance = ARC_TOLERANCE): Ring {
  const n = arcSegmentCount(2 * Math.PI, tolerance, 8);
  const step = (2 * Math.PI) / n;
  const fr = r * Math.sqrt(step / Math.sin(step));
  const out: Ring = [];
  for (let k = 0; k < n; k++) out.push([cx + fr * Math.cos(k * step), cy + fr * Math.sin(k * step)]);
  return out;
}
