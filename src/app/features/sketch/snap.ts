/**
 * Grid and snapping for the drawing: the snap step follows the zoom so that grid lines stay a comfortable
 * distance apart on screen, always a round length (1, 2 or 5 times a power of ten metres).
 */
import type { Vec } from './tool-geometry';

/** The smallest of 1, 2, 5 × 10^n that is at least `x` (x > 0). */
export function niceStep(x: number): number {
  if (!(x > 0) || !Number.isFinite(x)) return 1;
  const power = 10 ** Math.floor(Math.log10(x));
  for (const m of [1, 2, 5, 10]) {
    const step = m * power;
    // Round away floating noise such as 2.0000000000000004e-6.
    const clean = Number(step.toPrecision(12));
    if (clean >= x * (1 - 1e-12)) return clean;
  }
  return 10 * power;
}

/** Snap step (m) for a zoom of `pixelsPerMetre`, so that grid lines are at least `minPixels` apart. */
export function snapStep(pixelsPerMetre: number, minPixels = 12): number {
  return niceStep(minPixels / pixelsPerMetre);
}

/** Rounds each coordinate to the nearest multiple of `step`. */
export function snapPoint(p: Vec, step: number): Vec {
  const r = (v: number) => Number((Math.round(v / step) * step).toPrecision(12)) || 0;
  return [r(p[0]), r(p[1])];
}

/** Length of the scale bar (m): a round length close to `targetPixels` on screen. */
export function scaleBarLength(pixelsPerMetre: number, targetPixels = 100): number {
  const raw = targetPixels / pixelsPerMetre;
  const power = 10 ** Math.floor(Math.log10(raw));
  let best = power;
  for (const m of [1, 2, 5]) if (m * power <= raw) best = m * power;
  return Number(best.toPrecision(12));
}

/** Turns an angle to the nearest multiple of `step` degrees. */
export function snapAngle(deg: number, step: number): number {
  return Math.round(deg / step) * step || 0;
}
