/** Types and names shared by the app, the server and other API clients (see ../shared/api.md). */

export const ROLES = ['owner', 'editor', 'reviewer', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export const REVIEW_STATES = ['draft', 'in review', 'mask-ready'] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];

export const RUN_STATES = ['queued', 'solving', 'solved', 'failed', 'cancelled'] as const;
export type RunState = (typeof RUN_STATES)[number];

/** Error codes of the `{ error: { code, message, field? } }` body, with their HTTP status. */
export const ERROR_STATUS = {
  invalid: 400,
  'not-signed-in': 401,
  forbidden: 403,
  'not-found': 404,
  conflict: 409,
  'too-large': 413,
  'rate-limited': 429,
  internal: 500,
  unavailable: 503,
} as const;
export type ErrorCode = keyof typeof ERROR_STATUS;

export interface ApiErrorBody {
  error: { code: ErrorCode; message: string; field?: string };
}

export interface HealthResponse {
  status: 'ok' | 'degraded';
  version: string;
  database: 'ok' | 'unreachable';
}
