/**
 * Raw SVG segments (user units) to outline segments (metres, y up) under the element's full transform
 * (element transforms, then the document's scale and the flip of the y axis).
 *
 * Circular arcs stay arcs when the transform maps circles to circles; elliptical arcs, and circular arcs under
 * a shear or unequal scale, become polylines, like Bézier curves, within CURVE_TOLERANCE (m).
 */
import type { Vec2 } from '../geometry/ring';
import { apply, determinant, similarityScale, type Affine } from './affine';
import { CURVE_TOLERANCE } from './limits';
import { arc, line, type Segment } from './outline';
import { arcCentre, type RawSegment } from './svg-path';

const MAX_PIECES = 1000;

/** Uniform pieces of a Bézier curve so the chord error stays below tol (Wang's bound: n = √(d(d−1)/8 · M / tol)). */
function bezierPieces(ctrl: Vec2[], tol: number): number {
  let m = 0;
  for (let k = 0; k + 2 < ctrl.length; k++) {
    const x = ctrl[k][0] - 2 * ctrl[k + 1][0] + ctrl[k + 2][0];
    const y = ctrl[k][1] - 2 * ctrl[k + 1][1] + ctrl[k + 2][1];
    m = Math.max(m, Math.hypot(x, y));
  }
  const d = ctrl.length - 1;
  return Math.min(MAX_PIECES, Math.max(1, Math.ceil(Math.sqrt(((d * (d - 1)) / 8) * (m / tol)))));
}

function bezierPoint(c: Vec2[], t: number): Vec2 {
  const s = 1 - t;
  if (c.length === 3) {
    return [s * s * c[0][0] + 2 * s * t * c[1][0] + t * t * c[2][0], s * s * c[0][1] + 2 * s * t * c[1][1] + t * t * c[2][1]];
  }
  const a = s * s * s, b = 3 * s * s * t, cc = 3 * s * t * t, d = t * t * t;
  return [a * c[0][0] + b * c[1][0] + cc * c[2][0] + d * c[3][0], a * c[0][1] + b * c[1][1] + cc * c[2][1] + d * c[3][1]];
}

function polyline(points: Vec2[]): Segment[] {
  const out: Segment[] = [];
  for (let k = 0; k + 1 < points.length; k++) {
    if (points[k][0] !== points[k + 1][0] || points[k][1] !== points[k + 1][1]) out.push(line(points[k], points[k + 1]));
  }
  return out;
}

/** Points of an ellipse (user units) about (cx, cy) with radii rx, ry turned by phi, from theta by dtheta. */
function ellipsePoints(cx: number, cy: number, rx: number, ry: number, phi: number, theta: number, dtheta: number, n: number): Vec2[] {
  const cos = Math.cos(phi), sin = Math.sin(phi);
  const out: Vec2[] = [];
  for (let k = 0; k <= n; k++) {
    const t = theta + (dtheta * k) / n;
    const x = rx * Math.cos(t), y = ry * Math.sin(t);
    out.push([cx + cos * x - sin * y, cy + sin * x + cos * y]);
  }
  return out;
}

/** Pieces for an elliptical arc whose largest radius maps to `radiusMetres`, within tol. */
function ellipsePieces(radiusMetres: number, dtheta: number): number {
  const step = Math.sqrt((8 * CURVE_TOLERANCE) / Math.max(radiusMetres, 1e-30));
  return Math.min(MAX_PIECES, Math.max(4, Math.ceil(Math.abs(dtheta) / Math.min(step, 0.2))));
}

/** Largest stretch the map gives any direction (its largest singular value). */
export function maxStretch(m: Affine): number {
  const a = m[0], b = m[1], c = m[2], d = m[3];
  const s1 = a * a + b * b + c * c + d * d;
  const det = a * d - b * c;
  return Math.sqrt((s1 + Math.sqrt(Math.max(0, s1 * s1 - 4 * det * det))) / 2);
}

/** An arc of a circle (user units) mapped by m: an arc segment when m is a similarity, else a polyline. */
export function mappedCircleArc(m: Affine, cx: number, cy: number, r: number, theta: number, dtheta: number): Segment[] {
  const k = similarityScale(m);
  if (k !== null) {
    const c = apply(m, [cx, cy]);
    const p = apply(m, [cx + r * Math.cos(theta), cy + r * Math.sin(theta)]);
    const start = Math.atan2(p[1] - c[1], p[0] - c[0]);
    return [arc(c, r * k, start, determinant(m) < 0 ? -dtheta : dtheta)];
  }
  return mappedEllipse(m, cx, cy, r, r, 0, theta, dtheta);
}

export function mappedEllipse(m: Affine, cx: number, cy: number, rx: number, ry: number, phi: number, theta: number, dtheta: number): Segment[] {
  const n = ellipsePieces(Math.max(rx, ry) * maxStretch(m), dtheta);
  return polyline(ellipsePoints(cx, cy, rx, ry, phi, theta, dtheta, n).map((p) => apply(m, p)));
}

/** One raw segment to outline segments under m (m maps user units to metres). */
export function mapSegment(s: RawSegment, m: Affine): Segment[] {
  switch (s.t) {
    case 'L':
      return polyline([apply(m, s.p0), apply(m, s.p1)]);
    case 'C':
    case 'Q': {
      const ctrl = (s.t === 'C' ? [s.p0, s.p1, s.p2, s.p3] : [s.p0, s.p1, s.p2]).map((p) => apply(m, p));
      const n = bezierPieces(ctrl, CURVE_TOLERANCE);
      const pts: Vec2[] = [];
      for (let k = 0; k <= n; k++) pts.push(bezierPoint(ctrl, k / n));
      pts[n] = ctrl[ctrl.length - 1];
      return polyline(pts);
    }
    case 'A': {
      const c = arcCentre(s);
      if (!c) return polyline([apply(m, s.p0), apply(m, s.p1)]);
      const phi = (s.phi * Math.PI) / 180;
      if (Math.abs(c.rx - c.ry) <= 1e-9 * Math.max(c.rx, c.ry)) {
        const out = mappedCircleArc(m, c.cx, c.cy, c.rx, c.theta + phi, c.dtheta);
        // The ends exactly where the path says (the centre form rounds them).
        const [first] = out;
        if (out.length === 1 && first.kind === 'arc') return [{ ...first, a: apply(m, s.p0), b: apply(m, s.p1) }];
        return out;
      }
      const pts = ellipsePoints(c.cx, c.cy, c.rx, c.ry, phi, c.theta, c.dtheta, ellipsePieces(Math.max(c.rx, c.ry) * maxStretch(m), c.dtheta));
      pts[0] = s.p0;
      pts[pts.length - 1] = s.p1;
      return polyline(pts.map((p) => apply(m, p)));
    }
  }
}
