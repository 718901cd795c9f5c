/** What every part of the API shares: ids and timestamps, people, paged lists, the error body, health. */

/** Ids are integers; timestamps are ISO 8601 strings (UTC). */
export type Id = number;
export type Timestamp = string;

/** Who did something, as lists and details show it. */
export interface PersonRef {
  id: Id;
  name: string;
}

/**
 * Lists that can grow answer `{ items, total }`. Every list takes `?limit=&offset=&sort=&order=asc|desc`;
 * lists answered as plain arrays also send the total in the `X-Total-Count` header.
 */
export interface Page<T> {
  items: T[];
  total: number;
}

export interface ListQuery {
  limit?: number;
  offset?: number;
  sort?: string;
  order?: 'asc' | 'desc';
}

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
