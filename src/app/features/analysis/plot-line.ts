import { line } from 'd3';

/** Maps a value to a pixel (a d3 linear scale). */
type Scale = (value: number) => number;

/** SVG path data through the points (xs[k], ys[k]) on the scales; a point with a non-finite coordinate leaves a gap. */
export function linePath(xs: ArrayLike<number>, ys: ArrayLike<number>, x: Scale, y: Scale): string {
  const n = Math.min(xs.length, ys.length);
  const pts = Array.from({ length: n }, (_, k) => [xs[k], ys[k]] as [number, number]);
  return (
    line<[number, number]>()
      .defined((q) => Number.isFinite(q[0]) && Number.isFinite(q[1]))
      .x((q) => x(q[0]))
      .y((q) => y(q[1]))(pts) ?? ''
  );
}
