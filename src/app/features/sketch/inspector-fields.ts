/**
 * The exact dimensions the side panel shows for each kind of shape and for a port: a label, a dimension and
 * a pure getter and setter over the design objects. A setter returns the edited object, or a message when the
 * value does not fit the rest of the shape.
 */
import type { Port, Shape } from '../../../../shared/design';
import { formatQuantity, type Dimension } from '../../ui/units';
import { rotateShape, shapePivot } from './shape-transform';

export interface FieldSpec<T> {
  key: string;
  label: string;
  dimension: Dimension;
  defaultUnit: string;
  /** Values must be greater than zero. */
  positive?: boolean;
  get: (item: T) => number;
  set: (item: T, value: number) => T | string;
}

type Rect = Extract<Shape, { type: 'rect' }>;
type Sector = Extract<Shape, { type: 'sector' }>;
type Circle = Extract<Shape, { type: 'circle' }>;
type Polygon = Extract<Shape, { type: 'polygon' }>;

const RECT: FieldSpec<Rect>[] = [
  { key: 'x', label: 'Corner x', dimension: 'length', defaultUnit: 'um', get: (s) => s.x, set: (s, v) => ({ ...s, x: v }) },
  { key: 'y', label: 'Corner y', dimension: 'length', defaultUnit: 'um', get: (s) => s.y, set: (s, v) => ({ ...s, y: v }) },
  { key: 'width', label: 'Length (along)', dimension: 'length', defaultUnit: 'um', positive: true, get: (s) => s.width, set: (s, v) => ({ ...s, width: v }) },
  { key: 'height', label: 'Width (across)', dimension: 'length', defaultUnit: 'um', positive: true, get: (s) => s.height, set: (s, v) => ({ ...s, height: v }) },
  {
    key: 'angle',
    label: 'Angle',
    dimension: 'angle',
    defaultUnit: 'deg',
    get: (s) => s.angle,
    set: (s, v) => rotateShape(s, v - s.angle, shapePivot(s)),
  },
];

const SECTOR: FieldSpec<Sector>[] = [
  { key: 'cx', label: 'Centre x', dimension: 'length', defaultUnit: 'um', get: (s) => s.center[0], set: (s, v) => ({ ...s, center: [v, s.center[1]] }) },
  { key: 'cy', label: 'Centre y', dimension: 'length', defaultUnit: 'um', get: (s) => s.center[1], set: (s, v) => ({ ...s, center: [s.center[0], v] }) },
  {
    key: 'radius',
    label: 'Radius (centre line)',
    dimension: 'length',
    defaultUnit: 'um',
    positive: true,
    get: (s) => (s.innerRadius + s.outerRadius) / 2,
    set: (s, v) => {
      const half = (s.outerRadius - s.innerRadius) / 2;
      return v < half ? `Must be at least half the width (${formatQuantity(half, 'length')})` : { ...s, innerRadius: v - half, outerRadius: v + half };
    },
  },
  {
    key: 'width',
    label: 'Width',
    dimension: 'length',
    defaultUnit: 'um',
    positive: true,
    get: (s) => s.outerRadius - s.innerRadius,
    set: (s, v) => {
      const r = (s.innerRadius + s.outerRadius) / 2;
      return v / 2 > r ? 'Must be at most twice the radius' : { ...s, innerRadius: r - v / 2, outerRadius: r + v / 2 };
    },
  },
  {
    key: 'start',
    label: 'Start angle',
    dimension: 'angle',
    defaultUnit: 'deg',
    get: (s) => s.startAngle,
    set: (s, v) => (s.endAngle - v > 0 && s.endAngle - v <= 360 ? { ...s, startAngle: v } : 'Must be below the end angle by at most 360°'),
  },
  {
    key: 'end',
    label: 'End angle',
    dimension: 'angle',
    defaultUnit: 'deg',
    get: (s) => s.endAngle,
    set: (s, v) => (v - s.startAngle > 0 && v - s.startAngle <= 360 ? { ...s, endAngle: v } : 'Must be above the start angle by at most 360° (the bend turns counter-clockwise)'),
  },
];

const CIRCLE: FieldSpec<Circle>[] = [
  { key: 'cx', label: 'Centre x', dimension: 'length', defaultUnit: 'um', get: (s) => s.center[0], set: (s, v) => ({ ...s, center: [v, s.center[1]] }) },
  { key: 'cy', label: 'Centre y', dimension: 'length', defaultUnit: 'um', get: (s) => s.center[1], set: (s, v) => ({ ...s, center: [s.center[0], v] }) },
  { key: 'radius', label: 'Radius', dimension: 'length', defaultUnit: 'um', positive: true, get: (s) => s.radius, set: (s, v) => ({ ...s, radius: v }) },
];

/** Vertices shown one by one; longer outlines (imports) are edited by moving and turning. */
export const MAX_VERTEX_FIELDS = 24;

function polygonFields(s: Polygon): FieldSpec<Polygon>[] {
  const out: FieldSpec<Polygon>[] = [];
  s.points.slice(0, MAX_VERTEX_FIELDS).forEach((_p, k) => {
    for (const axis of [0, 1] as const) {
      out.push({
        key: `p${k}${axis === 0 ? 'x' : 'y'}`,
        label: `Point ${k + 1} ${axis === 0 ? 'x' : 'y'}`,
        dimension: 'length',
        defaultUnit: 'um',
        get: (q) => q.points[k][axis],
        set: (q, v) => ({ ...q, points: q.points.map((p, j) => (j === k ? (axis === 0 ? [v, p[1]] : [p[0], v]) : p)) as Polygon['points'] }),
      });
    }
  });
  return out;
}

/** The dimension fields of a shape. */
export function shapeFields(shape: Shape): FieldSpec<Shape>[] {
  switch (shape.type) {
    case 'rect':
      return RECT as unknown as FieldSpec<Shape>[];
    case 'sector':
      return SECTOR as unknown as FieldSpec<Shape>[];
    case 'circle':
      return CIRCLE as unknown as FieldSpec<Shape>[];
    case 'polygon':
      return polygonFields(shape) as unknown as FieldSpec<Shape>[];
  }
}

export const PORT_FIELDS: FieldSpec<Port>[] = [
  { key: 'fx', label: 'From x', dimension: 'length', defaultUnit: 'um', get: (p) => p.from[0], set: (p, v) => ({ ...p, from: [v, p.from[1]] }) },
  { key: 'fy', label: 'From y', dimension: 'length', defaultUnit: 'um', get: (p) => p.from[1], set: (p, v) => ({ ...p, from: [p.from[0], v] }) },
  { key: 'tx', label: 'To x', dimension: 'length', defaultUnit: 'um', get: (p) => p.to[0], set: (p, v) => ({ ...p, to: [v, p.to[1]] }) },
  { key: 'ty', label: 'To y', dimension: 'length', defaultUnit: 'um', get: (p) => p.to[1], set: (p, v) => ({ ...p, to: [p.to[0], v] }) },
];

/** Plain words for a shape in lists and headings. */
export function describeShape(shape: Shape): string {
  const kind = { rect: 'Rectangle', sector: 'Bend', circle: 'Circle', polygon: 'Freeform outline' }[shape.type];
  if (shape.op === 'subtract') return shape.type === 'circle' ? 'Pillar (hole)' : `${kind} (hole)`;
  return kind;
}
