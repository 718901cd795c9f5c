import { randomUUID } from 'node:crypto';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';
import type { MikroORM } from '@mikro-orm/postgresql';
import type { MailDetail, MailSummary, Role, SignInResponse } from '../../shared/api';
import { appLocals, createApp } from '../../server/app';
import { loadConfig, type ServerConfig } from '../../server/config';
import { openDatabase } from '../../server/db/orm';
import { startMail, type MailSystem } from '../../server/mail';
import { startStorage, type Storage } from '../../server/storage';
import { demoDesigns } from '../../server/seed/designs';

/**
 * The server in-process on a free loopback port, with the real PostgreSQL test database and the local SMTP
 * stand-in. Each test file starts its own and makes its own users (unique e-mails), so files can run in parallel.
 */
export interface TestServer {
  base: string;
  app: Express;
  orm: MikroORM;
  config: ServerConfig;
  mail: MailSystem;
  storage: Storage | null;
  close(): Promise<void>;
}

export async function startTestServer(overrides: Partial<ServerConfig> = {}, options: { storage?: boolean } = {}): Promise<TestServer> {
  const orm = await openDatabase();
  const config: ServerConfig = {
    ...loadConfig(),
    logRequests: false,
    passwordHashCost: 4,
    rateLimits: { signIn: { limit: 10_000, windowMs: 60_000 }, reset: { limit: 10_000, windowMs: 60_000 } },
    ...overrides,
  };
  const mail = await startMail(config);
  // Object storage (the local S3 stand-in) only where a test asks for it; otherwise blobs stay in PostgreSQL.
  const storage = options.storage ? await startStorage(config, orm) : null;
  const app = createApp({ config, orm, mail, blobs: storage?.blobs });
  const server: Server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return {
    base,
    app,
    orm,
    config,
    mail,
    storage,
    async close() {
      await appLocals(app).stop();
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      await mail.close();
      await storage?.close();
      await orm.close(true);
    },
  };
}

export interface Reply<T = any> {
  status: number;
  body: T;
  headers: Headers;
  /** The `osm_refresh=...` pair when the answer set that cookie. */
  cookie?: string;
}

export interface CallOptions {
  token?: string | null;
  body?: unknown;
  /** A raw body sent as is with content-type JSON (for malformed and oversized bodies). */
  raw?: string;
  /** A multipart form (uploads); fetch sets the content type. */
  form?: FormData;
  cookie?: string;
}

export async function call<T = any>(base: string, method: string, path: string, opts: CallOptions = {}): Promise<Reply<T>> {
  const headers: Record<string, string> = {};
  if (opts.token) headers['authorization'] = `Bearer ${opts.token}`;
  if (opts.cookie) headers['cookie'] = opts.cookie;
  let payload: string | undefined;
  if (opts.raw !== undefined) payload = opts.raw;
  else if (opts.body !== undefined) payload = JSON.stringify(opts.body);
  if (payload !== undefined) headers['content-type'] = 'application/json';
  const r = await fetch(`${base}${path}`, { method, headers, body: opts.form ?? payload });
  const type = r.headers.get('content-type') ?? '';
  const binary = type.includes('octet-stream') || type.includes('pdf') || type.includes('image/png');
  const body = type.includes('json') ? await r.json() : binary ? Buffer.from(await r.arrayBuffer()) : await r.text();
  const set = r.headers.getSetCookie().find((c) => c.startsWith('osm_refresh='));
  return { status: r.status, body: body as T, headers: r.headers, cookie: set?.split(';')[0] };
}

export function uniqueEmail(tag: string): string {
  return `${tag}-${randomUUID().slice(0, 8)}@example.test`;
}

export const PASSWORD = 'correct horse battery';

export interface Person {
  id: number;
  email: string;
  name: string;
  token: string;
  cookie: string;
}

export async function signUp(base: string, tag: string, password = PASSWORD): Promise<Person> {
  const email = uniqueEmail(tag);
  const r = await call<SignInResponse>(base, 'POST', '/api/auth/sign-up', { body: { email, name: `Test ${tag}`, password } });
  if (r.status !== 201) throw new Error(`sign-up failed: ${r.status} ${JSON.stringify(r.body)}`);
  return { ...r.body.user, token: r.body.token, cookie: r.cookie! };
}

export async function signIn(base: string, email: string, password = PASSWORD): Promise<Person> {
  const r = await call<SignInResponse>(base, 'POST', '/api/auth/sign-in', { body: { email, password } });
  if (r.status !== 200) throw new Error(`sign-in failed: ${r.status} ${JSON.stringify(r.body)}`);
  return { ...r.body.user, token: r.body.token, cookie: r.cookie! };
}

/** Polls the dev mailbox until a mail to `to` whose subject contains `subject` arrives. */
export async function waitForMail(base: string, to: string, subject: string, timeoutMs = 10_000): Promise<MailDetail> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const list = await call<MailSummary[]>(base, 'GET', '/api/dev/mailbox');
    const hit = list.body.find((m) => m.to.includes(to) && m.subject.includes(subject));
    if (hit) return (await call<MailDetail>(base, 'GET', `/api/dev/mailbox/${hit.id}`)).body;
    if (Date.now() > until) throw new Error(`no mail to ${to} about "${subject}" within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** The token of a link such as `/invite?token=...` in a mail's text. */
export function linkToken(mail: MailDetail, page: 'invite' | 'reset'): string {
  const m = new RegExp(`/${page}\\?token=([A-Za-z0-9_-]+)`).exec(mail.text);
  if (!m) throw new Error(`no /${page} link in the mail "${mail.subject}"`);
  return m[1]!;
}

/** Invites a new person by mail and accepts through the mailed link, as a browser would. */
export async function invite(base: string, owner: Person, wid: number, role: Role, tag: string = role): Promise<Person> {
  const email = uniqueEmail(tag);
  const r = await call(base, 'POST', `/api/workspaces/${wid}/invitations`, { token: owner.token, body: { email, role } });
  if (r.status !== 201) throw new Error(`invitation failed: ${r.status} ${JSON.stringify(r.body)}`);
  const token = linkToken(await waitForMail(base, email, 'invited you'), 'invite');
  const a = await call<SignInResponse>(base, 'POST', `/api/invitations/${token}/accept`, { body: { name: `Test ${tag}`, password: PASSWORD } });
  if (a.status !== 200) throw new Error(`accept failed: ${a.status} ${JSON.stringify(a.body)}`);
  return { ...a.body.user, token: a.body.token, cookie: a.cookie! };
}

export interface Team {
  wid: number;
  owner: Person;
  editor: Person;
  reviewer: Person;
  viewer: Person;
  /** Signed in, owner of a workspace of their own, not a member of this one. */
  outsider: Person;
}

export async function makeTeam(base: string, name = 'Test lab'): Promise<Team> {
  const owner = await signUp(base, 'owner');
  const ws = await call(base, 'POST', '/api/workspaces', { token: owner.token, body: { name } });
  const wid = ws.body.id as number;
  const [editor, reviewer, viewer] = await Promise.all([
    invite(base, owner, wid, 'editor'),
    invite(base, owner, wid, 'reviewer'),
    invite(base, owner, wid, 'viewer'),
  ]);
  const outsider = await signUp(base, 'outsider');
  await call(base, 'POST', '/api/workspaces', { token: outsider.token, body: { name: 'Elsewhere' } });
  return { wid, owner, editor, reviewer, viewer, outsider };
}

/** A valid design document (the demo cross injector), deep-copied. */
export function validDocument(): Record<string, unknown> {
  return JSON.parse(JSON.stringify(demoDesigns()[0]!.document)) as Record<string, unknown>;
}
