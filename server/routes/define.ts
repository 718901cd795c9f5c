import { Router, type Request, type RequestHandler, type Response } from 'express';
import type { z } from 'zod';
import type { AuthMiddleware, SignedInUser } from '../auth/passport';
import { ApiError } from '../errors';

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

/** One route of the API, as the role-matrix test enumerates them. */
export interface RouteInfo {
  method: Uppercase<Method>;
  /** Full path with Express parameters, e.g. `/api/designs/:id`. */
  path: string;
  signedIn: boolean;
}

type Handler = (req: Request, res: Response) => Promise<unknown> | unknown;
type UserHandler = (req: Request, res: Response, user: SignedInUser) => Promise<unknown> | unknown;

/**
 * The API's router plus a list of every route on it. Routes register here, never on a bare Router, so the list
 * is complete; the role-matrix test checks that each listed route has a row in its table.
 */
export class ApiRoutes {
  readonly router = Router();
  readonly routes: RouteInfo[] = [];
  private running = 0;
  private drained: (() => void)[] = [];

  constructor(readonly auth: AuthMiddleware) {}

  /**
   * Resolves when no handler is running. A client that hangs up does not stop its handler, so at shutdown the
   * server waits for this (after closing its sockets) before closing the database.
   */
  idle(): Promise<void> {
    return this.running === 0 ? Promise.resolve() : new Promise((r) => this.drained.push(r));
  }

  private async track(work: () => Promise<unknown> | unknown): Promise<void> {
    this.running++;
    try {
      await work();
    } finally {
      if (--this.running === 0) for (const r of this.drained.splice(0)) r();
    }
  }

  /** A route anyone may call; `before` runs first (rate limits, optional sign-in). */
  open(method: Method, path: string, handler: Handler, ...before: RequestHandler[]): void {
    this.routes.push({ method: method.toUpperCase() as Uppercase<Method>, path: `/api${path}`, signedIn: false });
    this.router[method](path, ...before, (req, res) => this.track(() => handler(req, res)));
  }

  /** A route for signed-in users; the handler gets the user. Role checks happen in the handler (via AccessService). */
  user(method: Method, path: string, handler: UserHandler): void {
    this.routes.push({ method: method.toUpperCase() as Uppercase<Method>, path: `/api${path}`, signedIn: true });
    this.router[method](path, this.auth.requireUser, (req, res) => this.track(() => handler(req, res, req.user!)));
  }
}

function fieldPath(path: ReadonlyArray<PropertyKey>): string {
  let out = '';
  for (const key of path) out += typeof key === 'number' ? `[${key}]` : out ? `.${String(key)}` : String(key);
  return out;
}

/** Parses with zod; the first problem becomes 400 `invalid` naming the field. */
export function parse<S extends z.ZodType>(schema: S, value: unknown, what = 'The request body'): z.output<S> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  const issue = result.error.issues[0]!;
  const field = fieldPath(issue.path);
  if (!field && issue.code === 'invalid_type') throw new ApiError('invalid', `${what} must be a JSON object`);
  throw new ApiError('invalid', field ? `${field}: ${issue.message}` : issue.message, field || undefined);
}

/** A numeric id from the path; anything else cannot name a thing, so it answers 404. */
export function idParam(req: Request, name: string): number {
  const raw = req.params[name];
  const id = typeof raw === 'string' && /^[1-9][0-9]{0,9}$/.test(raw) ? Number(raw) : NaN;
  if (!(id <= 2_147_483_647)) throw new ApiError('not-found', `No such ${name === 'wid' ? 'workspace' : 'thing'}: "${String(raw)}"`);
  return id;
}

/** Answers a list as a plain array with the total in `X-Total-Count` (the shapes fixed by the API plan). */
export function sendList<T>(res: Response, page: { items: T[]; total: number }): void {
  res.setHeader('X-Total-Count', String(page.total));
  res.json(page.items);
}
