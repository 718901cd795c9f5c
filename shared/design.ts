/**
 * The Osmolane design document, version 1 ("osmolane.design/1").
 *
 * One JSON document describes a chip layout: the channel depth, the buffer,
 * the zeta potentials, the shapes that make up the fluid, the ports and the
 * wall zones. All values are SI (metres, volts, pascals, kelvin, S/m,
 * mol/m^3); angles are degrees, counter-clockwise from +x.
 *
 * `designSchema` is the zod schema; `parseDesign` validates any JSON value
 * and either returns the design with defaults filled in or a list of
 * `{ field, message }` refusals, where `field` is a path such as
 * `ports[1].potential` and `message` says the reason in plain words.
 *
 * Later versions only add optional fields, so unknown keys are ignored.
 * This file imports nothing of ours (only zod): the app, the server, the
 * solver and the command line all share it.
 */
import { z } from 'zod';

export const DESIGN_FORMAT = 'osmolane.design/1';

/** Coordinates further than this from the origin are surely a unit mistake. */
const MAX_COORDINATE = 1; // metres

const coordinate = z
  .number()
  .refine((v) => Math.abs(v) <= MAX_COORDINATE, {
    message: `is more than ${MAX_COORDINATE} m from the origin; coordinates are in metres`,
  });

const point = z.tuple([coordinate, coordinate]);

const positive = (unit: string) => z.number().positive({ message: `must be greater than 0 (${unit})` });
const nonNegative = (unit: string) => z.number().nonnegative({ message: `must not be negative (${unit})` });
const length = positive('metres').refine((v) => v <= MAX_COORDINATE * 2, {
  message: `is longer than ${MAX_COORDINATE * 2} m; lengths are in metres`,
});
const angle = z.number().refine((v) => Math.abs(v) <= 36000, { message: 'is not a sensible angle in degrees' });

// ---- Geometry: the same four shapes serve as fluid shapes and as wall-zone regions.

const rectGeometry = z.object({
  type: z.literal('rect'),
  /** Lower-left corner before rotation (m). */
  x: coordinate,
  y: coordinate,
  width: length,
  height: length,
  /** Rotation about the lower-left corner, degrees counter-clockwise. */
  angle: angle.default(0),
});

const sectorGeometry = z
  .object({
    type: z.literal('sector'),
    center: point,
    /** 0 gives a pie slice. */
    innerRadius: nonNegative('metres'),
    outerRadius: length,
    /** Degrees; the sector sweeps counter-clockwise from startAngle to endAngle. */
    startAngle: angle,
    endAngle: angle,
  })
  .superRefine((s, ctx) => {
    if (s.innerRadius >= s.outerRadius) {
      ctx.addIssue({ code: 'custom', path: ['innerRadius'], message: 'must be smaller than outerRadius' });
    }
    const sweep = s.endAngle - s.startAngle;
    if (!(sweep > 0 && sweep <= 360)) {
      ctx.addIssue({
        code: 'custom',
        path: ['endAngle'],
        message: 'must be greater than startAngle by at most 360 degrees (the sector sweeps counter-clockwise)',
      });
    }
  });

const circleGeometry = z.object({
  type: z.literal('circle'),
  center: point,
  radius: length,
});

const polygonGeometry = z.object({
  type: z.literal('polygon'),
  points: z
    .array(point)
    .min(3, { message: 'needs at least 3 points' })
    .max(100000, { message: 'has more than 100000 points' }),
});

const shapeOp = z.enum(['add', 'subtract'], { message: 'must be "add" or "subtract"' });

export const regionSchema = z.discriminatedUnion(
  'type',
  [rectGeometry, sectorGeometry, circleGeometry, polygonGeometry],
  { message: 'must be one of "rect", "sector", "circle", "polygon"' },
);

export const shapeSchema = z.discriminatedUnion(
  'type',
  [
    rectGeometry.extend({ op: shapeOp }),
    sectorGeometry.safeExtend({ op: shapeOp }),
    circleGeometry.extend({ op: shapeOp }),
    polygonGeometry.extend({ op: shapeOp }),
  ],
  { message: 'must be one of "rect", "sector", "circle", "polygon"' },
);

// ---- Physics

export const bufferSchema = z.object({
  relativePermittivity: z.number().min(1, { message: 'must be at least 1 (relative permittivity)' }),
  viscosity: positive('Pa s'),
  density: positive('kg/m^3'),
  conductivity: positive('S/m'),
  ionicStrength: positive('mol/m^3'),
  temperature: positive('kelvin'),
});

const zetaValue = z.number().refine((v) => Math.abs(v) <= 1, {
  message: 'is larger than 1 V in size; zeta potentials are in volts (typically -0.1 to 0.1)',
});

/** floor and lid default to side. */
export const zetaSchema = z
  .object({ side: zetaValue, floor: zetaValue.optional(), lid: zetaValue.optional() })
  .transform((v) => ({ side: v.side, floor: v.floor ?? v.side, lid: v.lid ?? v.side }));

export const portSchema = z
  .object({
    id: z.string().min(1, { message: 'must not be empty' }).max(64, { message: 'is longer than 64 characters' }),
    name: z.string().max(200, { message: 'is longer than 200 characters' }).optional(),
    from: point,
    to: point,
    /** Volts, or null for a floating port (no electrode, zero net current). */
    potential: z
      .number({
        error: (issue) =>
          issue.input === undefined
            ? 'is required: a number in volts, or null for a floating port'
            : 'must be a number in volts, or null for a floating port',
      })
      .nullable(),
    /** Gauge pressure, pascals. */
    pressure: z.number().default(0),
  })
  .superRefine((p, ctx) => {
    if (p.from[0] === p.to[0] && p.from[1] === p.to[1]) {
      ctx.addIssue({ code: 'custom', path: ['to'], message: 'must differ from "from" (a port is a segment)' });
    }
  });

export const wallZoneSchema = z.object({
  region: regionSchema,
  /** Zeta of the side walls inside the region (V). */
  zeta: zetaValue,
});

export const designSchema = z
  .object({
    format: z.literal(DESIGN_FORMAT, { message: `must be "${DESIGN_FORMAT}"` }),
    name: z.string().max(200, { message: 'is longer than 200 characters' }),
    /** Channel depth, floor to lid (m). */
    depth: length,
    buffer: bufferSchema,
    zeta: zetaSchema,
    shapes: z.array(shapeSchema).max(10000, { message: 'has more than 10000 shapes' }),
    ports: z.array(portSchema).max(1000, { message: 'has more than 1000 ports' }),
    wallZones: z.array(wallZoneSchema).max(10000, { message: 'has more than 10000 wall zones' }).default([]),
  })
  .superRefine((d, ctx) => {
    const seen = new Map<string, number>();
    d.ports.forEach((p, k) => {
      const first = seen.get(p.id);
      if (first !== undefined) {
        ctx.addIssue({
          code: 'custom',
          path: ['ports', k, 'id'],
          message: `"${p.id}" is already used by ports[${first}]; port ids must be unique`,
        });
      } else {
        seen.set(p.id, k);
      }
    });
  });

export type Point = [number, number];
export type DesignDocument = z.output<typeof designSchema>;
/** What a file may contain: defaults (angle, pressure, floor/lid zeta, wallZones) may be left out. */
export type DesignInput = z.input<typeof designSchema>;
export type Shape = z.output<typeof shapeSchema>;
export type ShapeOp = Shape['op'];
export type Region = z.output<typeof regionSchema>;
export type RectShape = Extract<Shape, { type: 'rect' }>;
export type SectorShape = Extract<Shape, { type: 'sector' }>;
export type CircleShape = Extract<Shape, { type: 'circle' }>;
export type PolygonShape = Extract<Shape, { type: 'polygon' }>;
export type Port = z.output<typeof portSchema>;
export type WallZone = z.output<typeof wallZoneSchema>;
export type Buffer = z.output<typeof bufferSchema>;
export type Zeta = z.output<typeof zetaSchema>;

export interface DesignFieldError {
  /** Path of the offending value, e.g. `ports[1].potential`; empty for the document itself. */
  field: string;
  /** The reason, in plain words. */
  message: string;
}

export type ParseDesignResult = { ok: true; design: DesignDocument } | { ok: false; errors: DesignFieldError[] };

/** `['ports', 1, 'potential']` → `ports[1].potential`. */
export function fieldPath(path: ReadonlyArray<PropertyKey>): string {
  let out = '';
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`;
    else out += out === '' ? String(key) : `.${String(key)}`;
  }
  return out;
}

function describeValue(v: unknown): string {
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'a list';
  if (typeof v === 'number' && !Number.isFinite(v)) return String(v);
  if (typeof v === 'object') return 'an object';
  return `a ${typeof v}`;
}

const KIND_WORDS: Record<string, string> = {
  number: 'a number',
  string: 'text',
  object: 'an object',
  array: 'a list',
  tuple: 'a list',
  boolean: 'true or false',
};

/** Plain-word messages for zod's built-in issues (our own checks carry their own). */
function plainMessage(issue: z.core.$ZodRawIssue): string | undefined {
  const input = issue.input;
  switch (issue.code) {
    case 'invalid_type': {
      if (input === undefined) return 'is required';
      const expected = KIND_WORDS[String(issue.expected)] ?? String(issue.expected);
      if (issue.expected === 'number' && typeof input === 'number') return 'must be a finite number';
      return `must be ${expected}, not ${describeValue(input)}`;
    }
    case 'too_small': {
      if (issue.origin === 'array') return `needs at least ${String(issue.minimum)} items`;
      if (issue.origin === 'string') return 'must not be empty';
      return `must be ${issue.inclusive ? 'at least' : 'greater than'} ${String(issue.minimum)}`;
    }
    case 'too_big': {
      if (issue.origin === 'array') return `has more than ${String(issue.maximum)} items`;
      if (issue.origin === 'string') return `is longer than ${String(issue.maximum)} characters`;
      return `must be ${issue.inclusive ? 'at most' : 'less than'} ${String(issue.maximum)}`;
    }
    case 'invalid_value':
      return `must be one of ${issue.values.map((v) => JSON.stringify(v)).join(', ')}`;
    case 'invalid_union':
      return 'does not match any allowed form';
    default:
      return undefined;
  }
}

/**
 * Validates a design. Accepts the parsed JSON value (a JSON string is parsed first).
 * On success the design has every default filled in.
 */
export function parseDesign(json: unknown): ParseDesignResult {
  let value = json;
  if (typeof value === 'string') {
    try {
      value = JSON.parse(value);
    } catch {
      return { ok: false, errors: [{ field: '', message: 'is not valid JSON' }] };
    }
  }
  if (value === null || typeof value !== 'object' || Array.isArray(value)) {
    return { ok: false, errors: [{ field: '', message: 'a design must be a JSON object' }] };
  }
  const result = designSchema.safeParse(value, {
    // Our own messages (given with `message`) win; this map only words zod's defaults.
    error: (issue) => plainMessage(issue),
  });
  if (result.success) return { ok: true, design: result.data };
  const errors = result.error.issues.map((issue) => ({ field: fieldPath(issue.path), message: issue.message }));
  return { ok: false, errors };
}

// ---- Problems found in a valid design (geometry checks, resolution); shown on the drawing.

export const DESIGN_PROBLEM_CODES = [
  'empty-layout',
  'self-crossing-polygon',
  'port-off-outline',
  'port-partly-off-outline',
  'ports-overlap',
  'unconnected-fluid',
  'no-drive',
  'under-resolved',
  'grid-capped',
  'thin-sliver',
  'geometry-failed',
] as const;

export type DesignProblemCode = (typeof DESIGN_PROBLEM_CODES)[number];

export interface DesignProblem {
  code: DesignProblemCode;
  /** An error stops the solve; a warning is shown beside the result. */
  severity: 'error' | 'warning';
  /** Plain words, with the remedy where there is one. */
  message: string;
  /** Where to point on the drawing (m), when the problem has a place. */
  at?: Point;
  /** The design field concerned, e.g. `shapes[2]` or `ports[0]`, when there is one. */
  field?: string;
}
