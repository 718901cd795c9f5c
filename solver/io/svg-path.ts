/**
 * SVG path data (the `d` attribute, SVG 1.1 §8.3 grammar) to absolute segments in user units: lines, cubic
 * and quadratic Béziers and elliptical arcs, one list per subpath, with whether the subpath was closed.
 * Smooth curves (S, T) get their reflected control point; H and V become lines.
 */
import type { Vec2 } from '../geometry/ring';

export type RawSegment =
  | { t: 'L'; p0: Vec2; p1: Vec2 }
  | { t: 'C'; p0: Vec2; p1: Vec2; p2: Vec2; p3: Vec2 }
  | { t: 'Q'; p0: Vec2; p1: Vec2; p2: Vec2 }
  | { t: 'A'; p0: Vec2; p1: Vec2; rx: number; ry: number; phi: number; large: boolean; sweep: boolean };

export interface Subpath {
  segments: RawSegment[];
  closed: boolean;
  start: Vec2;
}

export class PathSyntaxError extends Error {}

const ARITY: Record<string, number> = { M: 2, L: 2, H: 1, V: 1, C: 6, S: 4, Q: 4, T: 2, A: 7, Z: 0 };

/** Splits path data into commands with their numbers; arc flags may be written without separators. */
function tokens(d: string): Array<{ cmd: string; args: number[] }> {
  const out: Array<{ cmd: string; args: number[] }> = [];
  const num = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?/;
  let k = 0;
  let current: { cmd: string; args: number[] } | null = null;
  while (k < d.length) {
    const c = d[k];
    if (c === ' ' || c === ',' || c === '\t' || c === '\n' || c === '\r' || c === '\f') {
      k++;
      continue;
    }
    if (/[MmLlHhVvCcSsQqTtAaZz]/.test(c)) {
      current = { cmd: c, args: [] };
      out.push(current);
      k++;
      continue;
    }
    if (!current) throw new PathSyntaxError(`path data must start with a command, found "${c}"`);
    const upper = current.cmd.toUpperCase();
    const slot = ARITY[upper] === 0 ? -1 : current.args.length % ARITY[upper];
    if (upper === 'A' && (slot === 3 || slot === 4)) {
      if (c !== '0' && c !== '1') throw new PathSyntaxError(`an arc flag must be 0 or 1, found "${c}"`);
      current.args.push(c === '1' ? 1 : 0);
      k++;
      continue;
    }
    const m = num.exec(d.slice(k, k + 64));
    if (!m) throw new PathSyntaxError(`unexpected "${d.slice(k, k + 12)}" in path data`);
    const v = Number(m[0]);
    if (!Number.isFinite(v)) throw new PathSyntaxError(`number "${m[0]}" in path data is out of range`);
    current.args.push(v);
    k += m[0].length;
  }
  return out;
}

/** Parses path data; throws PathSyntaxError naming the problem. `maxSegments` bounds the work. */
export function parsePathData(d: string, maxSegments: number): Subpath[] {
  const subpaths: Subpath[] = [];
  let cur: Subpath | null = null;
  let pen: Vec2 = [0, 0];
  let lastCtrl: Vec2 | null = null;
  let lastCmd = '';
  let count = 0;
  const push = (s: RawSegment) => {
    if (++count > maxSegments) throw new PathSyntaxError(`path has more than ${maxSegments} segments`);
    if (!cur) {
      cur = { segments: [], closed: false, start: pen };
      subpaths.push(cur);
    }
    cur.segments.push(s);
  };
  for (const { cmd, args } of tokens(d)) {
    const upper = cmd.toUpperCase();
    const rel = cmd !== upper;
    const n = ARITY[upper];
    if (n === 0) {
      if (args.length) throw new PathSyntaxError('Z takes no numbers');
      if (cur) {
        const c: Subpath = cur;
        if (pen[0] !== c.start[0] || pen[1] !== c.start[1]) push({ t: 'L', p0: pen, p1: c.start });
        c.closed = true;
        pen = c.start;
      }
      cur = null;
      lastCtrl = null;
      lastCmd = 'Z';
      continue;
    }
    if (args.length === 0 || args.length % n !== 0) {
      throw new PathSyntaxError(`${cmd} needs numbers in groups of ${n}, got ${args.length}`);
    }
    for (let g = 0; g < args.length; g += n) {
      const a = args.slice(g, g + n);
      const P = (x: number, y: number): Vec2 => (rel ? [pen[0] + x, pen[1] + y] : [x, y]);
      let kind = upper;
      if (upper === 'M' && g > 0) kind = 'L'; // further pairs after M are lines
      switch (kind) {
        case 'M':
          pen = P(a[0], a[1]);
          cur = { segments: [], closed: false, start: pen };
          subpaths.push(cur);
          lastCtrl = null;
          break;
        case 'L': {
          const p1 = P(a[0], a[1]);
          push({ t: 'L', p0: pen, p1 });
          pen = p1;
          lastCtrl = null;
          break;
        }
        case 'H': {
          const p1: Vec2 = [rel ? pen[0] + a[0] : a[0], pen[1]];
          push({ t: 'L', p0: pen, p1 });
          pen = p1;
          lastCtrl = null;
          break;
        }
        case 'V': {
          const p1: Vec2 = [pen[0], rel ? pen[1] + a[0] : a[0]];
          push({ t: 'L', p0: pen, p1 });
          pen = p1;
          lastCtrl = null;
          break;
        }
        case 'C':
        case 'S': {
          const smooth = kind === 'S';
          const p1: Vec2 = smooth
            ? lastCtrl && /[CS]/i.test(lastCmd) ? [2 * pen[0] - lastCtrl[0], 2 * pen[1] - lastCtrl[1]] : pen
            : P(a[0], a[1]);
          const p2 = smooth ? P(a[0], a[1]) : P(a[2], a[3]);
          const p3 = smooth ? P(a[2], a[3]) : P(a[4], a[5]);
          push({ t: 'C', p0: pen, p1, p2, p3 });
          lastCtrl = p2;
          pen = p3;
          break;
        }
        case 'Q':
        case 'T': {
          const smooth = kind === 'T';
          const p1: Vec2 = smooth
            ? lastCtrl && /[QT]/i.test(lastCmd) ? [2 * pen[0] - lastCtrl[0], 2 * pen[1] - lastCtrl[1]] : pen
            : P(a[0], a[1]);
          const p2 = smooth ? P(a[0], a[1]) : P(a[2], a[3]);
          push({ t: 'Q', p0: pen, p1, p2 });
          lastCtrl = p1;
          pen = p2;
          break;
        }
        case 'A': {
          const p1 = P(a[5], a[6]);
          push({ t: 'A', p0: pen, p1, rx: Math.abs(a[0]), ry: Math.abs(a[1]), phi: a[2], large: a[3] === 1, sweep: a[4] === 1 });
          pen = p1;
          lastCtrl = null;
          break;
        }
      }
      lastCmd = upper === 'M' && g > 0 ? (rel ? 'l' : 'L') : cmd;
    }
  }
  return subpaths.filter((s) => s.segments.length > 0);
}

/**
 * Centre parametrisation of an endpoint arc (SVG 1.1 implementation notes F.6.5), radii enlarged when too
 * small to reach (F.6.6). Angles in radians; `dtheta` positive in the direction of increasing angle.
 * Null for a degenerate arc (zero radius or coincident ends), which SVG draws as a line or nothing.
 */
export function arcCentre(s: Extract<RawSegment, { t: 'A' }>): { cx: number; cy: number; rx: number; ry: number; theta: number; dtheta: number } | null {
  const [x1, y1] = s.p0;
  const [x2, y2] = s.p1;
  let { rx, ry } = s;
  if (rx === 0 || ry === 0 || (x1 === x2 && y1 === y2)) return null;
  const phi = (s.phi * Math.PI) / 180;
  const cos = Math.cos(phi), sin = Math.sin(phi);
  const dx = (x1 - x2) / 2, dy = (y1 - y2) / 2;
  const xp = cos * dx + sin * dy;
  const yp = -sin * dx + cos * dy;
  const lambda = (xp * xp) / (rx * rx) + (yp * yp) / (ry * ry);
  if (lambda > 1) {
    rx *= Math.sqrt(lambda);
    ry *= Math.sqrt(lambda);
  }
  const num = rx * rx * ry * ry - rx * rx * yp * yp - ry * ry * xp * xp;
  const den = rx * rx * yp * yp + ry * ry * xp * xp;
  let coef = Math.sqrt(Math.max(0, num / den));
  if (s.large === s.sweep) coef = -coef;
  const cxp = (coef * rx * yp) / ry;
  const cyp = (-coef * ry * xp) / rx;
  const cx = cos * cxp - sin * cyp + (x1 + x2) / 2;
  const cy = sin * cxp + cos * cyp + (y1 + y2) / 2;
  const angle = (ux: number, uy: number, vx: number, vy: number) => Math.atan2(ux * vy - uy * vx, ux * vx + uy * vy);
  const ux = (xp - cxp) / rx, uy = (yp - cyp) / ry;
  const vx = (-xp - cxp) / rx, vy = (-yp - cyp) / ry;
  const theta = angle(1, 0, ux, uy);
  let dtheta = angle(ux, uy, vx, vy);
  if (!s.sweep && dtheta > 0) dtheta -= 2 * Math.PI;
  if (s.sweep && dtheta < 0) dtheta += 2 * Math.PI;
  return { cx, cy, rx, ry, theta, dtheta };
}
