import jwt from 'jsonwebtoken';
import { call, PASSWORD, signIn, signUp, startTestServer, uniqueEmail, waitForMail, linkToken, type TestServer } from './harness';

let t: TestServer;

beforeAll(async () => {
  t = await startTestServer();
});

afterAll(async () => {
  await t.close();
});

describe('sign-in and the access token', () => {
  it('signs in with the right password and answers who I am', async () => {
    const me = await signUp(t.base, 'alice');
    const r = await call(t.base, 'POST', '/api/auth/sign-in', { body: { email: me.email.toUpperCase(), password: PASSWORD } });
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ token: expect.any(String), user: { id: me.id, email: me.email, name: me.name }, expiresIn: 900 });
    const who = await call(t.base, 'GET', '/api/me', { token: r.body.token });
    expect(who.body).toEqual({ id: me.id, email: me.email, name: me.name });
  });

  it('sets the refresh cookie httpOnly, SameSite=Strict, scoped to /api/auth', async () => {
    const me = await signUp(t.base, 'cookie');
    const r = await fetch(`${t.base}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: me.email, password: PASSWORD }),
    });
    const cookie = r.headers.getSetCookie().find((c) => c.startsWith('osm_refresh='))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Strict/i);
    expect(cookie).toMatch(/Path=\/api\/auth/);
  });

  it('refuses a wrong password and an unknown e-mail alike with 401', async () => {
    const me = await signUp(t.base, 'bob');
    const wrong = await call(t.base, 'POST', '/api/auth/sign-in', { body: { email: me.email, password: 'not the password' } });
    const nobody = await call(t.base, 'POST', '/api/auth/sign-in', { body: { email: uniqueEmail('ghost'), password: PASSWORD } });
    expect(wrong.status).toBe(401);
    expect(nobody.status).toBe(401);
    expect(wrong.body).toEqual({ error: { code: 'not-signed-in', message: expect.any(String) } });
    expect(nobody.body.error.message).toBe(wrong.body.error.message);
  });

  it('answers 401 without a token, with a forged one, with alg none and with an expired one', async () => {
    const me = await signUp(t.base, 'carol');
    const claims = jwt.decode(me.token) as { sub: string; sid: string };
    const opts = { issuer: 'osmolane', audience: 'osmolane-api' } as const;
    const forged = jwt.sign({ sub: claims.sub, sid: claims.sid }, 'not-the-secret', { ...opts, expiresIn: 60 });
    const unsigned = jwt.sign({ sub: claims.sub, sid: claims.sid }, '', { ...opts, algorithm: 'none' });
    const expired = jwt.sign({ sub: claims.sub, sid: claims.sid, exp: Math.floor(Date.now() / 1000) - 60 }, t.config.tokenSecret, opts);
    const otherUser = jwt.sign({ sub: String(me.id + 1), sid: claims.sid }, t.config.tokenSecret, { ...opts, expiresIn: 60 });
    for (const token of [null, 'garbage', forged, unsigned, expired, otherUser]) {
      const r = await call(t.base, 'GET', '/api/me', { token });
      expect(r.status).toBe(401);
      expect(r.body.error.code).toBe('not-signed-in');
    }
    expect((await call(t.base, 'GET', '/api/me', { token: me.token })).status).toBe(200);
  });
});

describe('refresh and sign-out', () => {
  it('trades the cookie for a new access token and rotates it; an old cookie replayed later ends the session', async () => {
    const me = await signUp(t.base, 'dave');
    const first = await call(t.base, 'POST', '/api/auth/refresh', { cookie: me.cookie });
    expect(first.status).toBe(200);
    expect(first.body.user.id).toBe(me.id);
    expect(first.cookie).toBeDefined();
    expect(first.cookie).not.toBe(me.cookie);
    const second = await call(t.base, 'POST', '/api/auth/refresh', { cookie: first.cookie });
    expect(second.status).toBe(200);
    // The cookie from before the last rotation is a copy now: refusing it ends the session for everyone.
    await t.orm.em.fork().getConnection().execute(`update sessions set rotated_at = now() - interval '1 hour' where user_id = ${me.id}`);
    const replay = await call(t.base, 'POST', '/api/auth/refresh', { cookie: first.cookie });
    expect(replay.status).toBe(401);
    expect((await call(t.base, 'POST', '/api/auth/refresh', { cookie: second.cookie })).status).toBe(401);
    expect((await call(t.base, 'GET', '/api/me', { token: second.body.token })).status).toBe(401);
  });

  it('lets two tabs refresh with the same cookie at once', async () => {
    const me = await signUp(t.base, 'tabs');
    const [a, b] = await Promise.all([
      call(t.base, 'POST', '/api/auth/refresh', { cookie: me.cookie }),
      call(t.base, 'POST', '/api/auth/refresh', { cookie: me.cookie }),
    ]);
    expect([a.status, b.status]).toEqual([200, 200]);
    const rotated = a.cookie ?? b.cookie;
    expect((await call(t.base, 'POST', '/api/auth/refresh', { cookie: rotated })).status).toBe(200);
  });

  it('sign-out ends both the refresh cookie and the access tokens of the session, and no other session', async () => {
    const me = await signUp(t.base, 'erin');
    const other = await signIn(t.base, me.email);
    const out = await call(t.base, 'POST', '/api/auth/sign-out', { token: me.token, cookie: me.cookie });
    expect(out.status).toBe(204);
    expect((await call(t.base, 'GET', '/api/me', { token: me.token })).status).toBe(401);
    expect((await call(t.base, 'POST', '/api/auth/refresh', { cookie: me.cookie })).status).toBe(401);
    expect((await call(t.base, 'GET', '/api/me', { token: other.token })).status).toBe(200);
  });

  it('sign-out with only the cookie (expired access token) still ends the session', async () => {
    const me = await signUp(t.base, 'frank');
    expect((await call(t.base, 'POST', '/api/auth/sign-out', { cookie: me.cookie })).status).toBe(204);
    expect((await call(t.base, 'GET', '/api/me', { token: me.token })).status).toBe(401);
  });
});

describe('passwords', () => {
  it('changes the password with the current one, and ends the other sessions', async () => {
    const me = await signUp(t.base, 'gina');
    const laptop = await signIn(t.base, me.email);
    const bad = await call(t.base, 'POST', '/api/auth/password', { token: me.token, body: { currentPassword: 'nope', newPassword: 'a new passphrase' } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('currentPassword');
    const short = await call(t.base, 'POST', '/api/auth/password', { token: me.token, body: { currentPassword: PASSWORD, newPassword: 'short' } });
    expect(short.status).toBe(400);
    expect(short.body.error.field).toBe('newPassword');
    const ok = await call(t.base, 'POST', '/api/auth/password', { token: me.token, body: { currentPassword: PASSWORD, newPassword: 'a new passphrase' } });
    expect(ok.status).toBe(204);
    expect((await call(t.base, 'GET', '/api/me', { token: me.token })).status).toBe(200);
    expect((await call(t.base, 'GET', '/api/me', { token: laptop.token })).status).toBe(401);
    await expect(signIn(t.base, me.email)).rejects.toThrow(/401/);
    await signIn(t.base, me.email, 'a new passphrase');
  });

  it('resets a forgotten password end to end through the mailed link, once', async () => {
    const me = await signUp(t.base, 'hank');
    const asked = await call(t.base, 'POST', '/api/auth/reset-request', { body: { email: me.email } });
    expect(asked.status).toBe(202);
    const mail = await waitForMail(t.base, me.email, 'Reset your Osmolane password');
    expect(mail.text).toContain(`${t.config.publicBaseUrl}/reset?token=`);
    expect(mail.html).toContain('/reset?token=');
    const token = linkToken(mail, 'reset');
    const done = await call(t.base, 'POST', '/api/auth/reset', { body: { token, newPassword: 'reset passphrase' } });
    expect(done.status).toBe(204);
    expect((await call(t.base, 'GET', '/api/me', { token: me.token })).status).toBe(401);
    await signIn(t.base, me.email, 'reset passphrase');
    const again = await call(t.base, 'POST', '/api/auth/reset', { body: { token, newPassword: 'another passphrase' } });
    expect(again.status).toBe(400);
    expect(again.body.error.field).toBe('token');
  });

  it('answers a reset request for an unknown e-mail the same way, and mails nothing', async () => {
    const ghost = uniqueEmail('ghost');
    const r = await call(t.base, 'POST', '/api/auth/reset-request', { body: { email: ghost } });
    expect(r.status).toBe(202);
    await t.mail.mailer.idle();
    expect(t.mail.mailbox.list().some((m) => m.to.includes(ghost))).toBe(false);
  });

  it('refuses a second account with the same e-mail (409 naming the field)', async () => {
    const me = await signUp(t.base, 'ivy');
    const r = await call(t.base, 'POST', '/api/auth/sign-up', { body: { email: me.email, name: 'Ivy again', password: PASSWORD } });
    expect(r.status).toBe(409);
    expect(r.body.error.field).toBe('email');
  });
});

describe('rate limits', () => {
  let limited: TestServer;

  beforeAll(async () => {
    limited = await startTestServer({ rateLimits: { signIn: { limit: 3, windowMs: 60_000 }, reset: { limit: 2, windowMs: 60_000 } } });
  });

  afterAll(async () => {
    await limited.close();
  });

  it('answers 429 with the error body after repeated bad sign-ins', async () => {
    const me = await signUp(limited.base, 'mallory');
    const tries = [];
    for (let i = 0; i < 5; i++) tries.push(await call(limited.base, 'POST', '/api/auth/sign-in', { body: { email: me.email, password: `guess ${i}` } }));
    expect(tries.map((r) => r.status)).toEqual([401, 401, 401, 429, 429]);
    expect(tries[4]!.body).toEqual({ error: { code: 'rate-limited', message: expect.any(String) } });
    expect(tries[4]!.headers.get('ratelimit-policy') ?? tries[4]!.headers.get('ratelimit')).toBeTruthy();
  });

  it('answers 429 after repeated reset requests', async () => {
    const statuses = [];
    for (let i = 0; i < 3; i++) statuses.push((await call(limited.base, 'POST', '/api/auth/reset-request', { body: { email: uniqueEmail('x') } })).status);
    expect(statuses).toEqual([202, 202, 429]);
  });
});
