import { z } from 'zod';
import { LIBRARY_KINDS, REVIEW_STATES, ROLES, RUN_STATES } from '../../shared/api';
import { passwordProblem } from '../services/auth';

/** Request schemas of the API (zod). Routes parse with these before anything else happens. */

export const email = z.string().trim().max(320, 'is longer than 320 characters').pipe(z.email('is not an e-mail address'));
export const name = z.string().trim().min(1, 'must not be empty').max(200, 'is longer than 200 characters');
/** A password being chosen. */
export const newPassword = z.string().superRefine((p, ctx) => {
  const problem = passwordProblem(p);
  if (problem) ctx.addIssue({ code: 'custom', message: problem });
});
/** A password being checked. */
const password = z.string().min(1, 'must not be empty').max(1000, 'is too long');
const token = z.string().min(1, 'must not be empty').max(200, 'is too long');
const finite = z.number().refine(Number.isFinite, 'must be a finite number');

export const signIn = z.object({ email, password });
export const signUp = z.object({ email, name, password: newPassword });
export const changePassword = z.object({ currentPassword: password, newPassword });
export const resetRequest = z.object({ email });
export const reset = z.object({ token, newPassword });

export const createWorkspace = z.object({ name });
export const changeRole = z.object({ role: z.enum(ROLES) });
export const invite = z.object({ email, role: z.enum(ROLES) });
export const accept = z.object({ name: name.optional(), password: z.string().max(1000).optional() }).default({});

export const createDesign = z.object({ name, document: z.unknown() });
export const saveDesign = z.object({
  document: z.unknown(),
  version: z.number().int('must be a whole number').positive('must be positive'),
  name: name.optional(),
});
export const review = z.object({ state: z.enum(REVIEW_STATES) });
export const createRevision = z.object({ note: z.string().trim().max(2000, 'is longer than 2000 characters').default('') }).default({ note: '' });

const summary = z.looseObject({
  ports: z.array(z.looseObject({ id: z.string() })).optional(),
  metrics: z.record(z.string(), z.number().nullable()).optional(),
  warnings: z.array(z.looseObject({ code: z.string(), message: z.string() })).optional(),
});
export const createRun = z.object({
  settings: z.record(z.string(), z.unknown()),
  summary,
  fields: z.string().optional(),
  status: z.enum(RUN_STATES).optional(),
});

export const createComment = z.object({
  body: z.string().trim().min(1, 'must not be empty').max(5000, 'is longer than 5000 characters'),
  at: z.tuple([finite, finite]).nullable().optional(),
});

const positive = z.number().positive('must be greater than 0');
const bufferValues = z
  .strictObject({
    relativePermittivity: z.number().min(1, 'must be at least 1').optional(),
    viscosity: positive.optional(),
    density: positive.optional(),
    conductivity: positive.optional(),
    ionicStrength: positive.optional(),
    temperature: positive.optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'needs at least one value');
const zeta = z.number().min(-1, 'must be at least -1 V').max(1, 'must be at most 1 V');
const wallValues = z
  .strictObject({
    zeta: zeta.optional(),
    zetaMin: zeta.optional(),
    zetaMax: zeta.optional(),
    mobility: finite.optional(),
    mobilityMin: finite.optional(),
    mobilityMax: finite.optional(),
    note: z.string().max(1000, 'is longer than 1000 characters').optional(),
  })
  .refine((v) => Object.keys(v).some((k) => k !== 'note'), 'needs a zeta or a mobility');
const source = z.string().max(4000, 'is longer than 4000 characters').optional();
export const libraryItem = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('buffer'), name, values: bufferValues, source }),
  z.object({ kind: z.literal('wall'), name, values: wallValues, source }),
]);
export const libraryKind = z.enum(LIBRARY_KINDS);

const order = z.enum(['asc', 'desc']);

/** `?limit=&offset=&sort=&order=` with the sorts a list allows. */
export function listQuery<const S extends readonly [string, ...string[]]>(
  sorts: S,
  defaults: { sort: S[number]; order: 'asc' | 'desc'; limit: number; maxLimit: number },
) {
  return z.object({
    limit: z.coerce.number().int('must be a whole number').min(1, 'must be at least 1').max(defaults.maxLimit, `must be at most ${defaults.maxLimit}`).default(defaults.limit),
    offset: z.coerce.number().int('must be a whole number').min(0, 'must not be negative').default(0),
    sort: z.enum(sorts).default(defaults.sort as never),
    order: order.default(defaults.order),
  });
}
