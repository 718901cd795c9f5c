/**
 * What each drawing tool makes, as pure functions from the points the user gave (metres, degrees) to the
 * shapes of the design document (shared/design.ts, design-format.md): the tools never build shapes elsewhere.
 */
import type { CircleShape, PolygonShape, RectShape, SectorShape, Shape } from '../../../../shared/design';

export type Vec = [number, number];

const DEG = Math.PI / 180;

/** Angle of a direction in degrees, counter-clockwise from +x, in (-180, 180]. */
export function directionDeg(from: Vec, to: Vec): number {
  return Math.atan2(to[1] - from[1], to[0] - from[0]) / DEG;
}

/** Cosine and sine of an angle in degrees, exact at whole quarter turns. */
export function cosSin(deg: number): Vec {
  const turn = ((deg % 360) + 360) % 360;
  if (turn === 0) return [1, 0];
  if (turn === 90) return [0, 1];
  if (turn === 180) return [-1, 0];
  if (turn === 270) return [0, -1];
  return [Math.cos(deg * DEG), Math.sin(deg * DEG)];
}

/** Rounds an angle to 1e-9 degrees so that directions such as 90° come out exact. */
function cleanAngle(deg: number): number {
  const r = Math.round(deg * 1e9) / 1e9;
  return r === 0 ? 0 : r;
}

/**
 * Straight: a channel along the centre line start → end with the given width.
 * The rect's lower-left corner (before rotation) sits half a width to the right of the start point, and the
 * rect is turned about that corner by the direction of the centre line. Null when start and end coincide.
 */
export function straightChannel(start: Vec, end: Vec, width: number, op: Shape['op'] = 'add'): RectShape | null {
  const length = Math.hypot(end[0] - start[0], end[1] - start[1]);
  if (!(length > 0) || !(width > 0)) return null;
  const angle = cleanAngle(directionDeg(start, end));
  const [c, s] = cosSin(angle);
  // The corner is start − (w/2) n, with n = (−sin, cos) the left normal of the centre line.
  const x = start[0] + (width / 2) * s;
  const y = start[1] - (width / 2) * c;
  return { op, type: 'rect', x, y, width: length, height: width, angle };
}

/** The centre line and width of a rect read as a straight channel along its `width` side (inverse of straightChannel). */
export function rectCentreLine(rect: Pick<RectShape, 'x' | 'y' | 'width' | 'height' | 'angle'>): { start: Vec; end: Vec; width: number } {
  const [c, s] = cosSin(rect.angle);
  const start: Vec = [rect.x - (rect.height / 2) * s, rect.y + (rect.height / 2) * c];
  const end: Vec = [start[0] + rect.width * c, start[1] + rect.width * s];
  return { start, end, width: rect.height };
}

/**
 * Bend: an annular sector about `centre` whose centre line passes through `startPoint` (which also sets the
 * radius) and turns towards `endPoint`, the shorter way round. Null when the points do not make a bend
 * (the radius is not larger than half the width, or the points are in line with the centre).
 */
export function bendFromPoints(centre: Vec, startPoint: Vec, endPoint: Vec, width: number, op: Shape['op'] = 'add'): SectorShape | null {
  const radius = Math.hypot(startPoint[0] - centre[0], startPoint[1] - centre[1]);
  if (!(width > 0) || !(radius > width / 2) || Math.hypot(endPoint[0] - centre[0], endPoint[1] - centre[1]) === 0) return null;
  const a0 = directionDeg(centre, startPoint);
  const a1 = directionDeg(centre, endPoint);
  let sweep = (((a1 - a0) % 360) + 360) % 360; // counter-clockwise from a0 to a1
  if (sweep === 0) return null;
  let startAngle = a0;
  if (sweep > 180) {
    // The shorter way is clockwise: the same sector, swept counter-clockwise from a1.
    startAngle = a1;
    sweep = 360 - sweep;
  }
  startAngle = cleanAngle(startAngle);
  return bend(centre, radius, width, startAngle, cleanAngle(startAngle + sweep), op);
}

/** Bend from its centre-line radius and width. */
export function bend(centre: Vec, radius: number, width: number, startAngle: number, endAngle: number, op: Shape['op'] = 'add'): SectorShape {
  return {
    op,
    type: 'sector',
    center: [centre[0], centre[1]],
    innerRadius: radius - width / 2,
    outerRadius: radius + width / 2,
    startAngle,
    endAngle,
  };
}

export type JunctionKind = 'cross' | 'tee' | 'wye';

export const JUNCTION_KINDS: ReadonlyArray<{ kind: JunctionKind; label: string }> = [
  { kind: 'cross', label: 'Cross' },
  { kind: 'tee', label: 'T' },
  { kind: 'wye', label: 'Y' },
];

function along(at: Vec, deg: number, distance: number): Vec {
  const [c, s] = cosSin(deg);
  return [at[0] + distance * c, at[1] + distance * s];
}

/**
 * Junction presets centred on `at`; each leg reaches `legLength` from the centre point, `width` wide.
 * `angle` turns the whole junction (degrees).
 * - cross: two straight channels crossing at right angles;
 * - tee: a through channel and a side leg from its middle (pointing to −y before turning);
 * - wye: three legs 120° apart (one pointing to −y before turning).
 */
export function junctionShapes(kind: JunctionKind, at: Vec, legLength: number, width: number, angle = 0): Shape[] {
  if (!(legLength > width / 2) || !(width > 0)) return [];
  const channel = (deg: number, fromDistance: number, toDistance: number) =>
    straightChannel(along(at, angle + deg, fromDistance), along(at, angle + deg, toDistance), width)!;
  switch (kind) {
    case 'cross':
      return [channel(0, -legLength, legLength), channel(90, -legLength, legLength)];
    case 'tee':
      // The side leg runs into the middle of the through channel, so the two overlap by half a width.
      return [channel(0, -legLength, legLength), channel(-90, 0, legLength)];
    case 'wye':
      // Legs 120° apart cover the centre between them (every direction is within 60° of a leg), so no hub is needed.
      return [channel(-90, 0, legLength), channel(30, 0, legLength), channel(150, 0, legLength)];
  }
}

/** Chamber: a rect from two opposite corners of a drag (axis-aligned). Null when it has no area. */
export function chamberFromCorners(a: Vec, b: Vec, op: Shape['op'] = 'add'): RectShape | null {
  const width = Math.abs(b[0] - a[0]);
  const height = Math.abs(b[1] - a[1]);
  if (!(width > 0) || !(height > 0)) return null;
  return { op, type: 'rect', x: Math.min(a[0], b[0]), y: Math.min(a[1], b[1]), width, height, angle: 0 };
}

/** Pillar: a circle cut out of the fluid. */
export function pillarAt(centre: Vec, radius: number): CircleShape | null {
  if (!(radius > 0)) return null;
  return { op: 'subtract', type: 'circle', center: [centre[0], centre[1]], radius };
}

function segmentsCross(a: Vec, b: Vec, c: Vec, d: Vec): boolean {
  const orient = (p: Vec, q: Vec, r: Vec) => Math.sign((q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0]));
  const o1 = orient(a, b, c), o2 = orient(a, b, d), o3 = orient(c, d, a), o4 = orient(c, d, b);
  return o1 * o2 < 0 && o3 * o4 < 0;
}

/** Whether any two non-neighbouring edges of the closed polygon cross. */
export function polygonSelfCrosses(points: ReadonlyArray<Vec>): boolean {
  const n = points.length;
  for (let i = 0; i < n; i++) {
    for (let j = i + 2; j < n; j++) {
      if (i === 0 && j === n - 1) continue; // neighbours through the closing edge
      if (segmentsCross(points[i], points[(i + 1) % n], points[j], points[(j + 1) % n])) return true;
    }
  }
  return false;
}

export type FreeformResult = { ok: true; shape: PolygonShape } | { ok: false; reason: string };

/** Freeform: the clicked points as a closed polygon; repeated points (a double-click) are dropped. */
export function freeformPolygon(points: ReadonlyArray<Vec>, tolerance = 0): FreeformResult {
  const kept: Vec[] = [];
  for (const p of points) {
    const last = kept[kept.length - 1];
    if (!last || Math.hypot(p[0] - last[0], p[1] - last[1]) > tolerance) kept.push([p[0], p[1]]);
  }
  while (kept.length > 1 && Math.hypot(kept[0][0] - kept[kept.length - 1][0], kept[0][1] - kept[kept.length - 1][1]) <= tolerance) kept.pop();
  if (kept.length < 3) return { ok: false, reason: 'A freeform shape needs at least 3 distinct points' };
  let twiceArea = 0;
  for (let k = 0; k < kept.length; k++) {
    const a = kept[k], b = kept[(k + 1) % kept.length];
    twiceArea += a[0] * b[1] - b[0] * a[1];
  }
  if (polygonSelfCrosses(kept)) return { ok: false, reason: 'The outline crosses itself; click the points in order around the shape' };
  if (twiceArea === 0) return { ok: false, reason: 'The points lie on one line; the shape has no area' };
  return { ok: true, shape: { op: 'add', type: 'polygon', points: kept } };
}
