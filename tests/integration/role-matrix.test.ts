import { randomBytes } from 'node:crypto';
import type { Role } from '../../shared/api';
import { appLocals } from '../../server/app';
import { call, invite, linkToken, makeTeam, PASSWORD, signIn, signUp, startTestServer, uniqueEmail, validDocument, waitForMail, type Person, type Team, type TestServer } from './harness';

/**
 * Every route of the API against every role of a workspace and a signed-in non-member, from ONE table.
 * The first test checks that the table has a row for each route the server registers, so a new route without
 * a row fails here.
 */

type Actor = Role | 'outsider';
const ACTORS: Actor[] = ['owner', 'editor', 'reviewer', 'viewer', 'outsider'];

/** Who may: the roles allowed (members with another role get 403, non-members 404), or the special cases. */
type Who = readonly Role[] | 'public' | 'signed-in' | 'nobody';

interface Request {
  method: string;
  path: string;
  body?: unknown;
  /** Defaults to the actor's token; null sends none. */
  token?: string | null;
  cookie?: string;
  /** A multipart form (uploads), made fresh for each request. */
  form?: FormData;
}

interface Row {
  route: string;
  variant?: string;
  who: Who;
  ok: number;
  /** Builds the request for one actor, making a fresh target where the request uses one up. */
  make(actor: Actor, me: Person): Promise<Request>;
}

const ALL: readonly Role[] = ['owner', 'editor', 'reviewer', 'viewer'];
const REVIEWERS: readonly Role[] = ['owner', 'editor', 'reviewer'];
const EDITORS: readonly Role[] = ['owner', 'editor'];
const OWNER: readonly Role[] = ['owner'];

let t: TestServer;
let team: Team;
let designId: number;
let reviewDesignId: number;
let revisionId: number;
let runId: number;
let libraryId: number;
let builtInId: number;
let fileId: number;

/** A small drawing to upload (a 1 mm channel with two ports, in um). */
function drawing(): FormData {
  const f = new FormData();
  const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="1mm" height="0.05mm" viewBox="0 -50 1000 50"><rect x="0" y="-50" width="1000" height="50"/></svg>';
  f.append('file', new Blob([svg]), 'matrix.svg');
  return f;
}
let sweepId: number;

const owner = () => team.owner.token;

async function freshLibraryItem(): Promise<number> {
  const r = await call(t.base, 'POST', `/api/workspaces/${team.wid}/library`, { token: owner(), body: { kind: 'wall', name: 'Etched glass', values: { zeta: -0.06 } } });
  return r.body.id;
}

/** A sweep over a port potential: answered at once by superposition, so it is finished when made. */
const sweepBody = () => ({ revisionId, parameters: [{ pointer: '/ports/0/potential', range: { kind: 'list', values: [100, 200] } }], outputs: ['portCurrents'], cells: 40 });

async function freshSweep(): Promise<number> {
  const r = await call(t.base, 'POST', '/api/sweeps', { token: owner(), body: sweepBody() });
  if (r.status !== 201) throw new Error(`sweep setup failed: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body.id;
}

async function setReview(state: string): Promise<void> {
  const r = await call(t.base, 'POST', `/api/designs/${reviewDesignId}/review`, { token: owner(), body: { state } });
  if (r.status !== 200) throw new Error(`review setup failed: ${r.status}`);
}

async function invitationToken(): Promise<string> {
  const email = uniqueEmail('invitee');
  await call(t.base, 'POST', `/api/workspaces/${team.wid}/invitations`, { token: owner(), body: { email, role: 'viewer' } });
  return linkToken(await waitForMail(t.base, email, 'invited you'), 'invite');
}

const ROWS: Row[] = [
  { route: 'GET /api/health', who: 'public', ok: 200, make: async () => ({ method: 'GET', path: '/api/health' }) },
  {
    route: 'POST /api/auth/sign-in', who: 'public', ok: 200,
    make: async (_a, me) => ({ method: 'POST', path: '/api/auth/sign-in', body: { email: me.email, password: PASSWORD }, token: null }),
  },
  {
    route: 'POST /api/auth/sign-up', who: 'public', ok: 201,
    make: async () => ({ method: 'POST', path: '/api/auth/sign-up', body: { email: uniqueEmail('new'), name: 'New', password: PASSWORD }, token: null }),
  },
  {
    route: 'POST /api/auth/refresh', who: 'public', ok: 200,
    make: async (_a, me) => ({ method: 'POST', path: '/api/auth/refresh', cookie: (await signIn(t.base, me.email)).cookie, token: null }),
  },
  {
    // A session of its own, so the actor's main token keeps working.
    route: 'POST /api/auth/sign-out', who: 'public', ok: 204,
    make: async (_a, me) => {
      const session = await signIn(t.base, me.email);
      return { method: 'POST', path: '/api/auth/sign-out', token: session.token, cookie: session.cookie };
    },
  },
  {
    // Changing a password ends the account's other sessions, so this uses an account of its own.
    route: 'POST /api/auth/password', who: 'signed-in', ok: 204,
    make: async () => {
      const someone = await signUp(t.base, 'pw');
      return { method: 'POST', path: '/api/auth/password', token: someone.token, body: { currentPassword: PASSWORD, newPassword: 'another passphrase' } };
    },
  },
  {
    route: 'POST /api/auth/reset-request', who: 'public', ok: 202,
    make: async (_a, me) => ({ method: 'POST', path: '/api/auth/reset-request', body: { email: me.email }, token: null }),
  },
  {
    route: 'POST /api/auth/reset', who: 'public', ok: 204,
    make: async () => {
      const someone = await signUp(t.base, 'reset');
      await call(t.base, 'POST', '/api/auth/reset-request', { body: { email: someone.email } });
      const token = linkToken(await waitForMail(t.base, someone.email, 'Reset'), 'reset');
      return { method: 'POST', path: '/api/auth/reset', body: { token, newPassword: 'fresh passphrase' }, token: null };
    },
  },
  { route: 'GET /api/me', who: 'signed-in', ok: 200, make: async () => ({ method: 'GET', path: '/api/me' }) },
  { route: 'GET /api/workspaces', who: 'signed-in', ok: 200, make: async () => ({ method: 'GET', path: '/api/workspaces' }) },
  { route: 'POST /api/workspaces', who: 'signed-in', ok: 201, make: async () => ({ method: 'POST', path: '/api/workspaces', body: { name: 'Another lab' } }) },
  { route: 'GET /api/workspaces/:wid', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/workspaces/${team.wid}` }) },
  { route: 'GET /api/workspaces/:wid/members', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/workspaces/${team.wid}/members` }) },
  {
    route: 'PATCH /api/workspaces/:wid/members/:userId', who: OWNER, ok: 200,
    make: async () => ({ method: 'PATCH', path: `/api/workspaces/${team.wid}/members/${team.viewer.id}`, body: { role: 'viewer' } }),
  },
  {
    route: 'DELETE /api/workspaces/:wid/members/:userId', who: OWNER, ok: 204,
    make: async () => ({ method: 'DELETE', path: `/api/workspaces/${team.wid}/members/${(await invite(t.base, team.owner, team.wid, 'viewer', 'removable')).id}` }),
  },
  { route: 'GET /api/workspaces/:wid/invitations', who: OWNER, ok: 200, make: async () => ({ method: 'GET', path: `/api/workspaces/${team.wid}/invitations` }) },
  {
    route: 'POST /api/workspaces/:wid/invitations', who: OWNER, ok: 201,
    make: async () => ({ method: 'POST', path: `/api/workspaces/${team.wid}/invitations`, body: { email: uniqueEmail('matrix'), role: 'viewer' } }),
  },
  {
    route: 'DELETE /api/workspaces/:wid/invitations/:id', who: OWNER, ok: 204,
    make: async () => {
      const r = await call(t.base, 'POST', `/api/workspaces/${team.wid}/invitations`, { token: owner(), body: { email: uniqueEmail('withdrawn'), role: 'viewer' } });
      return { method: 'DELETE', path: `/api/workspaces/${team.wid}/invitations/${r.body.id}` };
    },
  },
  { route: 'GET /api/invitations/:token', who: 'public', ok: 200, make: async () => ({ method: 'GET', path: `/api/invitations/${await invitationToken()}` }) },
  {
    route: 'POST /api/invitations/:token/accept', who: 'public', ok: 200,
    make: async () => ({ method: 'POST', path: `/api/invitations/${await invitationToken()}/accept`, body: { name: 'Joiner', password: PASSWORD }, token: null }),
  },
  { route: 'GET /api/workspaces/:wid/activity', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/workspaces/${team.wid}/activity` }) },
  { route: 'GET /api/workspaces/:wid/designs', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/workspaces/${team.wid}/designs` }) },
  {
    route: 'POST /api/workspaces/:wid/designs', who: EDITORS, ok: 201,
    make: async () => ({ method: 'POST', path: `/api/workspaces/${team.wid}/designs`, body: { name: 'Matrix design', document: validDocument() } }),
  },
  { route: 'GET /api/designs/:id', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/designs/${designId}` }) },
  {
    route: 'PUT /api/designs/:id', who: EDITORS, ok: 200,
    make: async () => {
      const version = (await call(t.base, 'GET', `/api/designs/${designId}`, { token: owner() })).body.version;
      return { method: 'PUT', path: `/api/designs/${designId}`, body: { document: validDocument(), version } };
    },
  },
  {
    route: 'POST /api/designs/:id/review', variant: 'draft to in review', who: REVIEWERS, ok: 200,
    make: async () => (await setReview('draft'), { method: 'POST', path: `/api/designs/${reviewDesignId}/review`, body: { state: 'in review' } }),
  },
  {
    route: 'POST /api/designs/:id/review', variant: 'in review to mask-ready', who: ['owner', 'reviewer'], ok: 200,
    make: async () => (await setReview('in review'), { method: 'POST', path: `/api/designs/${reviewDesignId}/review`, body: { state: 'mask-ready' } }),
  },
  {
    route: 'POST /api/designs/:id/review', variant: 'back to draft', who: REVIEWERS, ok: 200,
    make: async () => (await setReview('in review'), { method: 'POST', path: `/api/designs/${reviewDesignId}/review`, body: { state: 'draft' } }),
  },
  { route: 'POST /api/designs/:id/revisions', who: EDITORS, ok: 201, make: async () => ({ method: 'POST', path: `/api/designs/${designId}/revisions`, body: { note: 'matrix' } }) },
  { route: 'GET /api/designs/:id/revisions', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/designs/${designId}/revisions` }) },
  { route: 'GET /api/revisions/:id', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/revisions/${revisionId}` }) },
  { route: 'GET /api/revisions/:id/comments', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/revisions/${revisionId}/comments` }) },
  { route: 'POST /api/revisions/:id/comments', who: REVIEWERS, ok: 201, make: async () => ({ method: 'POST', path: `/api/revisions/${revisionId}/comments`, body: { body: 'Looks right', at: [0, 0] } }) },
  {
    route: 'POST /api/revisions/:id/runs', who: EDITORS, ok: 201,
    make: async () => ({ method: 'POST', path: `/api/revisions/${revisionId}/runs`, body: { settings: {}, summary: { ports: [] }, fields: randomBytes(64).toString('base64') } }),
  },
  { route: 'GET /api/revisions/:id/runs', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/revisions/${revisionId}/runs` }) },
  { route: 'GET /api/runs/:id', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/runs/${runId}` }) },
  { route: 'GET /api/runs/:id/fields', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/runs/${runId}/fields` }) },
  { route: 'GET /api/workspaces/:wid/library', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/workspaces/${team.wid}/library` }) },
  {
    route: 'POST /api/workspaces/:wid/library', who: EDITORS, ok: 201,
    make: async () => ({ method: 'POST', path: `/api/workspaces/${team.wid}/library`, body: { kind: 'buffer', name: 'Borate 20 mM', values: { conductivity: 0.08 } } }),
  },
  {
    route: 'PUT /api/library/:id', who: EDITORS, ok: 200,
    make: async () => ({ method: 'PUT', path: `/api/library/${libraryId}`, body: { kind: 'wall', name: 'Etched glass', values: { zeta: -0.07 }, source: 'our lab' } }),
  },
  {
    route: 'PUT /api/library/:id', variant: 'built-in entry', who: 'nobody', ok: 200,
    make: async () => ({ method: 'PUT', path: `/api/library/${builtInId}`, body: { kind: 'wall', name: 'Mine now', values: { zeta: 0 } } }),
  },
  { route: 'DELETE /api/library/:id', who: EDITORS, ok: 204, make: async () => ({ method: 'DELETE', path: `/api/library/${await freshLibraryItem()}` }) },
  { route: 'DELETE /api/library/:id', variant: 'built-in entry', who: 'nobody', ok: 204, make: async () => ({ method: 'DELETE', path: `/api/library/${builtInId}` }) },
  { route: 'POST /api/sweeps', who: EDITORS, ok: 201, make: async () => ({ method: 'POST', path: '/api/sweeps', body: sweepBody() }) },
  { route: 'GET /api/designs/:id/sweeps', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/designs/${designId}/sweeps` }) },
  { route: 'GET /api/sweeps/:id', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/sweeps/${sweepId}` }) },
  // The sweep has finished, so its event stream sends the snapshot and ends.
  { route: 'GET /api/sweeps/:id/events', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/sweeps/${sweepId}/events` }) },
  { route: 'POST /api/sweeps/:id/cancel', who: EDITORS, ok: 200, make: async () => ({ method: 'POST', path: `/api/sweeps/${sweepId}/cancel` }) },
  {
    route: 'POST /api/sweeps/:id/points/:index/run', who: EDITORS, ok: 201,
    make: async () => ({ method: 'POST', path: `/api/sweeps/${await freshSweep()}/points/0/run` }),
  },
  { route: 'POST /api/workspaces/:wid/designs/import', who: EDITORS, ok: 201, make: async () => ({ method: 'POST', path: `/api/workspaces/${team.wid}/designs/import`, form: drawing() }) },
  {
    route: 'DELETE /api/designs/:id', who: EDITORS, ok: 204,
    make: async () => {
      const r = await call(t.base, 'POST', `/api/workspaces/${team.wid}/designs`, { token: owner(), body: { name: 'Doomed', document: validDocument() } });
      return { method: 'DELETE', path: `/api/designs/${r.body.id}` };
    },
  },
  { route: 'GET /api/designs/:id/files', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/designs/${designId}/files` }) },
  { route: 'GET /api/files/:id', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/files/${fileId}` }) },
  { route: 'GET /api/designs/:id/outline', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/designs/${designId}/outline?format=svg` }) },
  { route: 'GET /api/runs/:id/export', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/runs/${runId}/export?format=csv` }) },
  { route: 'GET /api/runs/:id/report.pdf', who: ALL, ok: 200, make: async () => ({ method: 'GET', path: `/api/runs/${runId}/report.pdf` }) },
  { route: 'GET /api/dev/mailbox', who: 'public', ok: 200, make: async () => ({ method: 'GET', path: '/api/dev/mailbox', token: null }) },
  { route: 'GET /api/dev/mailbox/:id', who: 'public', ok: 200, make: async () => ({ method: 'GET', path: `/api/dev/mailbox/${t.mail.mailbox.list()[0]!.id}`, token: null }) },
];

function expected(row: Row, actor: Actor): number {
  if (row.who === 'public' || row.who === 'signed-in') return row.ok;
  if (row.who === 'nobody') return 403;
  if (actor === 'outsider') return 404;
  return row.who.includes(actor) ? row.ok : 403;
}

beforeAll(async () => {
  t = await startTestServer();
  team = await makeTeam(t.base, 'Matrix lab');
  const made = async (name: string) =>
    (await call(t.base, 'POST', `/api/workspaces/${team.wid}/designs`, { token: owner(), body: { name, document: validDocument() } })).body.id as number;
  designId = await made('Matrix target');
  reviewDesignId = await made('Review target');
  revisionId = (await call(t.base, 'POST', `/api/designs/${designId}/revisions`, { token: owner(), body: { note: 'fixture' } })).body.id;
  runId = (await call(t.base, 'POST', `/api/revisions/${revisionId}/runs`, { token: owner(), body: { settings: { cells: 80 }, summary: {}, fields: 'AAEC' } })).body.id;
  libraryId = await freshLibraryItem();
  const library = await call(t.base, 'GET', `/api/workspaces/${team.wid}/library`, { token: owner() });
  builtInId = library.body.find((i: { builtIn: boolean }) => i.builtIn).id;
  const imported = await call(t.base, 'POST', `/api/workspaces/${team.wid}/designs/import`, { token: owner(), form: drawing() });
  fileId = (await call(t.base, 'GET', `/api/designs/${imported.body.design.id}/files`, { token: owner() })).body[0].id;
  sweepId = await freshSweep();
});

afterAll(async () => {
  await t.close();
});

it('has a row for every route the server registers, and no row for a route it does not', () => {
  const registered = new Set(appLocals(t.app).routes.map((r) => `${r.method} ${r.path}`));
  const table = new Set(ROWS.map((r) => r.route));
  expect([...registered].filter((r) => !table.has(r))).toEqual([]);
  expect([...table].filter((r) => !registered.has(r))).toEqual([]);
  const signedIn = appLocals(t.app).routes.filter((r) => r.signedIn).map((r) => `${r.method} ${r.path}`);
  for (const row of ROWS) if (row.who !== 'public') expect(signedIn).toContain(row.route);
});

const cases = ROWS.flatMap((row) => ACTORS.map((actor) => ({ row, actor, status: expected(row, actor) })));

it.each(cases.map((c) => [`${c.row.route}${c.row.variant ? ` (${c.row.variant})` : ''}`, c.actor, c.status, c] as const))(
  '%s as %s answers %i',
  async (_route, actor, status, c) => {
    const me = actor === 'outsider' ? team.outsider : team[actor];
    const req = await c.row.make(actor, me);
    const r = await call(t.base, req.method, req.path, { token: req.token === undefined ? me.token : req.token, body: req.body, cookie: req.cookie, form: req.form });
    if (r.status !== status) throw new Error(`${req.method} ${req.path} as ${actor}: expected ${status}, got ${r.status} ${JSON.stringify(r.body)}`);
    if (status >= 400) expect(r.body).toEqual({ error: { code: expect.any(String), message: expect.any(String) } });
  },
);

it.each(ROWS.filter((r) => r.who !== 'public').map((r) => [r.route + (r.variant ? ` (${r.variant})` : ''), r] as const))(
  '%s answers 401 without a token',
  async (_route, row) => {
    const req = await row.make('owner', team.owner);
    const r = await call(t.base, req.method, req.path, { token: null, body: req.body, form: req.form });
    expect(r.status).toBe(401);
    expect(r.body.error.code).toBe('not-signed-in');
  },
);
