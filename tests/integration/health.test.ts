import type { MikroORM } from '@mikro-orm/postgresql';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { openDatabase } from '../../server/db/orm';

let orm: MikroORM;
let server: Server;
let base: string;

beforeAll(async () => {
  orm = await openDatabase();
  const app = createApp({ config: { ...loadConfig(), logRequests: false, jsonLimit: '1kb' }, orm });
  server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});

afterAll(async () => {
  await new Promise((r) => server.close(r));
  await orm.close(true);
});

describe('GET /api/health', () => {
  it('answers ok after a real round trip to PostgreSQL', async () => {
    const r = await fetch(`${base}/api/health`);
    expect(r.status).toBe(200);
    const body = await r.json();
    expect(body).toEqual({ status: 'ok', version: expect.stringMatching(/^\d+\.\d+\.\d+/), database: 'ok' });
  });
});

describe('error shape of api.md', () => {
  it('answers 404 with the error body for an unknown route', async () => {
    const r = await fetch(`${base}/api/no-such-route`);
    expect(r.status).toBe(404);
    expect(await r.json()).toEqual({ error: { code: 'not-found', message: expect.any(String) } });
  });

  it('answers 400 for malformed JSON and 413 for a body over the limit', async () => {
    const bad = await fetch(`${base}/api/health`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"a":' });
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: { code: string } }).error.code).toBe('invalid');
    const big = await fetch(`${base}/api/health`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ pad: 'x'.repeat(4096) }),
    });
    expect(big.status).toBe(413);
    expect(((await big.json()) as { error: { code: string } }).error.code).toBe('too-large');
  });

  it('sends security headers from helmet', async () => {
    const r = await fetch(`${base}/api/health`);
    expect(r.headers.get('content-security-policy')).toContain("default-src 'self'");
    expect(r.headers.get('x-content-type-options')).toBe('nosniff');
    expect(r.headers.get('x-powered-by')).toBeNull();
  });
});
