/**
 * SVG path data for design shapes in drawing units (micrometres, y up: the drawing group flips y), and a
 * point-in-outline test used to put labels on the open side of a port.
 */
import type { Region, Shape } from '../../../../shared/design';
import { rectCorners } from './shape-transform';
import { cosSin, type Vec } from './tool-geometry';

/** Drawing units per metre. */
export const UM = 1e6;

const n = (v: number) => +(v * UM).toPrecision(10);

function move(p: Vec): string {
  return `M${n(p[0])},${n(p[1])}`;
}

function line(p: Vec): string {
  return `L${n(p[0])},${n(p[1])}`;
}

function arc(r: number, sweepDeg: number, ccw: boolean, to: Vec): string {
  return `A${n(r)},${n(r)} 0 ${sweepDeg > 180 ? 1 : 0} ${ccw ? 1 : 0} ${n(to[0])},${n(to[1])}`;
}

function circlePath(c: readonly [number, number], r: number, ccw = true): string {
  const a: Vec = [c[0] + r, c[1]], b: Vec = [c[0] - r, c[1]];
  return `${move(a)}${arc(r, 180, ccw, b)}${arc(r, 180, ccw, a)}Z`;
}

/** Path data of a shape or region; subtract shapes are drawn the same way (the caller colours them). */
export function shapePath(shape: Region | Shape): string {
  switch (shape.type) {
    case 'rect':
      return `${rectCorners(shape).map((p, k) => (k === 0 ? move(p) : line(p))).join('')}Z`;
    case 'polygon':
      return `${shape.points.map((p, k) => (k === 0 ? move(p as Vec) : line(p as Vec))).join('')}Z`;
    case 'circle':
      return circlePath(shape.center, shape.radius);
    case 'sector': {
      const { center: c, innerRadius: ri, outerRadius: ro, startAngle: a0, endAngle: a1 } = shape;
      const sweep = a1 - a0;
      if (sweep >= 360) return circlePath(c, ro) + (ri > 0 ? circlePath(c, ri, false) : '');
      const at = (r: number, a: number): Vec => {
        const [co, si] = cosSin(a);
        return [c[0] + r * co, c[1] + r * si];
      };
      let d = `${move(at(ro, a0))}${arc(ro, sweep, true, at(ro, a1))}`;
      d += ri > 0 ? `${line(at(ri, a1))}${arc(ri, sweep, false, at(ri, a0))}` : line([c[0], c[1]]);
      return `${d}Z`;
    }
  }
}

/** Path data of closed rings given in metres. */
export function ringsPath(rings: ReadonlyArray<ReadonlyArray<readonly [number, number]>>): string {
  return rings.map((ring) => `${ring.map((p, k) => (k === 0 ? move(p as Vec) : line(p as Vec))).join('')}Z`).join('');
}

/** Even-odd point-in-rings test (rings in metres, open vertex lists). */
export function insideRings(rings: ReadonlyArray<ReadonlyArray<readonly [number, number]>>, p: Vec): boolean {
  let inside = false;
  for (const ring of rings) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const a = ring[i], b = ring[j];
      if (a[1] > p[1] !== b[1] > p[1] && p[0] < ((b[0] - a[0]) * (p[1] - a[1])) / (b[1] - a[1]) + a[0]) inside = !inside;
    }
  }
  return inside;
}
