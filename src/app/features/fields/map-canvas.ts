/**
 * Canvas drawing shared by the layout maps: a canvas sized for the screen's pixel ratio, the field as an image of
 * one pixel a cell, placed on the layout and clipped to the fluid outline.
 */
import type { SolveFields } from '../../../../shared/result';
import { fieldImage } from './field-image';
import type { ColourRange } from './field-maps';
import type { Vec } from './field-sampling';
import { toScreen, type MapView } from './map-view';

/**
 * The canvas's 2D context for drawing in CSS pixels on a w × h box, cleared: the backing store follows the
 * device pixel ratio (resized only when it changes). Null where there is no 2D context (jsdom).
 */
export function prepareCanvas(canvas: HTMLCanvasElement, w: number, h: number): CanvasRenderingContext2D | null {
  const dpr = typeof devicePixelRatio === 'number' ? devicePixelRatio : 1;
  if (canvas.width !== Math.round(w * dpr) || canvas.height !== Math.round(h * dpr)) {
    canvas.width = Math.round(w * dpr);
    canvas.height = Math.round(h * dpr);
    canvas.style.width = `${w}px`;
    canvas.style.height = `${h}px`;
  }
  const ctx = canvas.getContext('2d');
  if (!ctx) return null;
  ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
  ctx.clearRect(0, 0, w, h);
  return ctx;
}

/** The values as an off-screen canvas of nx × ny pixels in the range's colours; null outside a browser. */
export function fieldCanvas(f: Pick<SolveFields, 'nx' | 'ny'>, values: Float32Array, range: ColourRange): HTMLCanvasElement | null {
  if (typeof document === 'undefined') return null;
  const off = document.createElement('canvas');
  off.width = f.nx;
  off.height = f.ny;
  const ctx = off.getContext('2d');
  if (!ctx) return null;
  ctx.putImageData(new ImageData(fieldImage(values, f.nx, f.ny, range), f.nx, f.ny), 0, 0);
  return off;
}

/** The rings (m) as one screen path, for an even-odd clip (holes stay out). */
export function ringsClip(rings: ReadonlyArray<ReadonlyArray<Vec>>, v: MapView): Path2D {
  const clip = new Path2D();
  for (const ring of rings) {
    ring.forEach((p, k) => {
      const [X, Y] = toScreen(v, p);
      if (k === 0) clip.moveTo(X, Y);
      else clip.lineTo(X, Y);
    });
    clip.closePath();
  }
  return clip;
}

/** The field's image over its grid on the layout: smooth when cells are larger than a few pixels, crisp otherwise. */
export function drawFieldImage(ctx: CanvasRenderingContext2D, image: CanvasImageSource, f: Pick<SolveFields, 'nx' | 'ny' | 'spacing' | 'x0' | 'y0'>, v: MapView): void {
  ctx.imageSmoothingEnabled = v.k * f.spacing > 3;
  const [left, top] = toScreen(v, [f.x0, f.y0 + f.ny * f.spacing]);
  ctx.drawImage(image, left, top, f.nx * f.spacing * v.k, f.ny * f.spacing * v.k);
}
