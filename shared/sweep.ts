/**
 * Sweeps: the request schema (zod), JSON pointers into a design document (RFC 6901), the values of a range, the
 * points of a sweep, and the numeric fields of a document with readable labels. Pure code shared by the app
 * (the Sweeps tab lists fields and previews point counts), the server (validation) and the solver's workers.
 */
import { z } from 'zod';
import { SWEEP_OUTPUTS, type SweepOutput, type SweepRange, type SweepRequest } from './api';
import type { DesignDocument } from './design';

/** Points per sweep, for one parameter or the product of two. */
export const MAX_SWEEP_POINTS = 400;
export const SWEEP_CELLS = { min: 16, max: 600, default: 120 } as const;

const finite = z.number().refine(Number.isFinite, 'must be a finite number');
const steps = z
  .number()
  .int('must be a whole number')
  .min(2, 'must be at least 2')
  .max(MAX_SWEEP_POINTS, `must be at most ${MAX_SWEEP_POINTS}`);

export const sweepRangeSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('linear'), from: finite, to: finite, steps }),
    z
      .object({ kind: z.literal('log'), from: finite, to: finite, steps })
      .refine((r) => r.from !== 0 && r.to !== 0 && Math.sign(r.from) === Math.sign(r.to), {
        message: 'a logarithmic range needs from and to of one sign, neither zero',
        path: ['to'],
      }),
    z.object({
      kind: z.literal('list'),
      values: z.array(finite).min(1, 'needs at least 1 value').max(MAX_SWEEP_POINTS, `has more than ${MAX_SWEEP_POINTS} values`),
    }),
  ],
  { message: 'must be "linear", "log" or "list"' },
);

export const sweepParameterSchema = z.object({
  pointer: z.string().max(300, 'is longer than 300 characters').regex(/^(\/[^/]*)+$/, 'must be a JSON pointer such as /ports/0/potential'),
  range: sweepRangeSchema,
});

export const sweepRequestSchema = z.object({
  revisionId: z.number().int('must be a whole number').positive('must be positive'),
  parameters: z
    .array(sweepParameterSchema)
    .min(1, 'needs one parameter')
    .max(2, 'takes at most two parameters')
    .refine((ps) => ps.length < 2 || ps[0].pointer !== ps[1].pointer, 'must name two different fields'),
  outputs: z
    .array(z.enum(SWEEP_OUTPUTS))
    .min(1, 'needs at least one output')
    .transform((os) => SWEEP_OUTPUTS.filter((o) => os.includes(o))),
  cells: z
    .number()
    .int('must be a whole number')
    .min(SWEEP_CELLS.min, `must be at least ${SWEEP_CELLS.min}`)
    .max(SWEEP_CELLS.max, `must be at most ${SWEEP_CELLS.max}`)
    .default(SWEEP_CELLS.default),
});

/** The request after parsing: outputs in their canonical order, cells filled in. */
export type ParsedSweepRequest = Omit<SweepRequest, 'outputs' | 'cells'> & { outputs: SweepOutput[]; cells: number };
// The schema and the wire type must agree.
type Agrees<A, B> = A extends B ? (B extends A ? true : false) : false;
const _parsed: Agrees<z.output<typeof sweepRequestSchema>, ParsedSweepRequest> = true;
void _parsed;

// ---- Ranges and points

/** The values a range takes, in order. */
export function rangeValues(range: SweepRange): number[] {
  if (range.kind === 'list') return [...range.values];
  const { from, to, steps: n } = range;
  if (range.kind === 'linear') return Array.from({ length: n }, (_, k) => (k === n - 1 ? to : from + ((to - from) * k) / (n - 1)));
  const ratio = Math.log(to / from);
  return Array.from({ length: n }, (_, k) => (k === n - 1 ? to : from * Math.exp((ratio * k) / (n - 1))));
}

/** How many values a range takes, without making them. */
export function rangeCount(range: SweepRange): number {
  return range.kind === 'list' ? range.values.length : range.steps;
}

/** Every point's parameter values; parameter 1 varies fastest (point k = i1 + n1 * i2). */
export function sweepPoints(values: number[][]): number[][] {
  const [first, second] = values;
  if (!second) return first.map((v) => [v]);
  return second.flatMap((v2) => first.map((v1) => [v1, v2]));
}

// ---- JSON pointers (RFC 6901)

/** `/shapes/0/width` → ['shapes', '0', 'width'] (with ~1 → / and ~0 → ~). */
export function pointerTokens(pointer: string): string[] {
  if (pointer === '') return [];
  if (!pointer.startsWith('/')) throw new Error(`"${pointer}" is not a JSON pointer (it must start with /)`);
  return pointer
    .slice(1)
    .split('/')
    .map((t) => t.replace(/~1/g, '/').replace(/~0/g, '~'));
}

export function pointerOf(tokens: ReadonlyArray<string | number>): string {
  return tokens.map((t) => '/' + String(t).replace(/~/g, '~0').replace(/\//g, '~1')).join('');
}

function child(node: unknown, token: string): unknown {
  if (Array.isArray(node)) return /^(0|[1-9][0-9]*)$/.test(token) ? node[Number(token)] : undefined;
  if (node !== null && typeof node === 'object' && Object.prototype.hasOwnProperty.call(node, token)) {
    return (node as Record<string, unknown>)[token];
  }
  return undefined;
}

/** The value a pointer names in a document, or undefined when it names nothing. */
export function valueAt(document: unknown, pointer: string): unknown {
  let node = document;
  for (const token of pointerTokens(pointer)) {
    node = child(node, token);
    if (node === undefined) return undefined;
  }
  return node;
}

/** A copy of the document with the number at `pointer` replaced (only the path to it is copied). */
export function withValueAt<T>(document: T, pointer: string, value: number): T {
  const tokens = pointerTokens(pointer);
  const set = (node: unknown, k: number): unknown => {
    if (k === tokens.length) return value;
    const token = tokens[k];
    const next = child(node, token);
    if (next === undefined) throw new Error(`${pointer} names nothing in the document`);
    if (Array.isArray(node)) {
      const copy = [...node];
      copy[Number(token)] = set(next, k + 1);
      return copy;
    }
    return { ...(node as Record<string, unknown>), [token]: set(next, k + 1) };
  };
  return set(document, 0) as T;
}

/** Port potentials and pressures: the drives the fields are linear in (physics.md §7). */
export function isLinearPointer(pointer: string): boolean {
  return /^\/ports\/(0|[1-9][0-9]*)\/(potential|pressure)$/.test(pointer);
}

// ---- Numeric fields of a document, with readable labels

export interface NumericField {
  pointer: string;
  label: string;
  /** The app's unit dimension for the value ('length', 'potential', 'pressure', 'angle', ...). */
  dimension: string;
  value: number;
}

const BUFFER_WORDS: Record<string, [string, string]> = {
  relativePermittivity: ['Buffer relative permittivity', 'dimensionless'],
  viscosity: ['Buffer viscosity', 'viscosity'],
  density: ['Buffer density', 'density'],
  conductivity: ['Buffer conductivity', 'conductivity'],
  ionicStrength: ['Buffer ionic strength', 'concentration'],
  temperature: ['Buffer temperature', 'temperature'],
};

const ZETA_WORDS: Record<string, string> = { side: 'Side-wall zeta', floor: 'Floor zeta', lid: 'Lid zeta' };

/** Words for a shape's or region's own fields. */
const SHAPE_WORDS: Record<string, [string, string]> = {
  x: ['corner x', 'length'],
  y: ['corner y', 'length'],
  width: ['width', 'length'],
  height: ['height', 'length'],
  angle: ['angle', 'angle'],
  radius: ['radius', 'length'],
  innerRadius: ['inner radius', 'length'],
  outerRadius: ['outer radius', 'length'],
  startAngle: ['start angle', 'angle'],
  endAngle: ['end angle', 'angle'],
};

/** Polygon corners listed per shape, at most (a traced outline can have thousands). */
const MAX_POLYGON_POINTS = 12;

function geometryFields(prefix: (string | number)[], name: string, shape: Record<string, unknown>): NumericField[] {
  const out: NumericField[] = [];
  const add = (path: (string | number)[], label: string, dimension: string, value: unknown) => {
    if (typeof value === 'number') out.push({ pointer: pointerOf([...prefix, ...path]), label: `${name} ${label}`, dimension, value });
  };
  for (const [key, [words, dimension]] of Object.entries(SHAPE_WORDS)) add([key], words, dimension, shape[key]);
  const center = shape['center'];
  if (Array.isArray(center)) {
    add(['center', 0], 'centre x', 'length', center[0]);
    add(['center', 1], 'centre y', 'length', center[1]);
  }
  const points = shape['points'];
  if (Array.isArray(points)) {
    points.slice(0, MAX_POLYGON_POINTS).forEach((p, k) => {
      if (!Array.isArray(p)) return;
      add(['points', k, 0], `point ${k + 1} x`, 'length', p[0]);
      add(['points', k, 1], `point ${k + 1} y`, 'length', p[1]);
    });
  }
  return out;
}

/**
 * Every number of a design a sweep can vary, in the order an engineer thinks of them: ports (potential and
 * pressure first), depth, zeta, buffer, then shapes and wall zones. Shapes and zones are numbered from 1.
 */
export function numericFields(design: DesignDocument): NumericField[] {
  const out: NumericField[] = [];
  const push = (pointer: string, label: string, dimension: string, value: unknown) => {
    if (typeof value === 'number' && Number.isFinite(value)) out.push({ pointer, label, dimension, value });
  };
  design.ports.forEach((p, k) => {
    push(pointerOf(['ports', k, 'potential']), `Port ${p.id} potential`, 'potential', p.potential);
    push(pointerOf(['ports', k, 'pressure']), `Port ${p.id} pressure`, 'pressure', p.pressure);
  });
  push('/depth', 'Depth', 'length', design.depth);
  for (const [key, label] of Object.entries(ZETA_WORDS)) push(`/zeta/${key}`, label, 'potential', (design.zeta as Record<string, unknown>)[key]);
  for (const [key, [label, dimension]] of Object.entries(BUFFER_WORDS)) push(`/buffer/${key}`, label, dimension, (design.buffer as Record<string, unknown>)[key]);
  design.shapes.forEach((s, k) => out.push(...geometryFields(['shapes', k], `Shape ${k + 1}`, s as unknown as Record<string, unknown>)));
  design.wallZones.forEach((z, k) => {
    push(pointerOf(['wallZones', k, 'zeta']), `Wall zone ${k + 1} zeta`, 'potential', z.zeta);
    out.push(...geometryFields(['wallZones', k, 'region'], `Wall zone ${k + 1} region`, z.region as unknown as Record<string, unknown>));
  });
  design.ports.forEach((p, k) => {
    push(pointerOf(['ports', k, 'from', 0]), `Port ${p.id} start x`, 'length', p.from[0]);
    push(pointerOf(['ports', k, 'from', 1]), `Port ${p.id} start y`, 'length', p.from[1]);
    push(pointerOf(['ports', k, 'to', 0]), `Port ${p.id} end x`, 'length', p.to[0]);
    push(pointerOf(['ports', k, 'to', 1]), `Port ${p.id} end y`, 'length', p.to[1]);
  });
  return out;
}

/** The label and dimension of a pointer in a design; a pointer outside the list gets itself as its label. */
export function describePointer(design: DesignDocument, pointer: string): { label: string; dimension: string } {
  const hit = numericFields(design).find((f) => f.pointer === pointer);
  return hit ? { label: hit.label, dimension: hit.dimension } : { label: pointer, dimension: 'dimensionless' };
}
