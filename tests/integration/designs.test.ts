import { randomBytes } from 'node:crypto';
import { call, makeTeam, startTestServer, validDocument, waitForMail, type Team, type TestServer } from './harness';

let t: TestServer;
let team: Team;

beforeAll(async () => {
  t = await startTestServer({ jsonLimit: '12mb' });
  team = await makeTeam(t.base, 'Designs lab');
});

afterAll(async () => {
  await t.close();
});

async function createDesign(name: string, document: unknown = validDocument()) {
  const r = await call(t.base, 'POST', `/api/workspaces/${team.wid}/designs`, { token: team.editor.token, body: { name, document } });
  expect(r.status).toBe(201);
  return r.body as { id: number; version: number };
}

describe('designs', () => {
  it('creates, reads and lists designs with paging, sorting and a name filter', async () => {
    const made = await createDesign('Cross A');
    expect(made).toMatchObject({ id: expect.any(Number), name: 'Cross A', version: 1, reviewState: 'draft', workspaceId: team.wid, role: 'editor' });
    await createDesign('Bend B');
    await createDesign('cross C');
    const one = await call(t.base, 'GET', `/api/designs/${made.id}`, { token: team.viewer.token });
    expect(one.status).toBe(200);
    expect(one.body).toMatchObject({ id: made.id, name: 'Cross A', version: 1, reviewState: 'draft', role: 'viewer', updatedBy: { id: team.editor.id } });
    // Stored exactly as sent (key order included).
    expect(JSON.stringify(one.body.document)).toBe(JSON.stringify(validDocument()));

    const byName = await call(t.base, 'GET', `/api/workspaces/${team.wid}/designs?sort=name&order=asc&q=cross`, { token: team.viewer.token });
    expect(byName.body.total).toBe(2);
    expect(byName.body.items.map((d: { name: string }) => d.name)).toEqual(['Cross A', 'cross C']);
    expect(Object.keys(byName.body.items[0]).sort()).toEqual(['id', 'name', 'reviewState', 'updatedAt', 'updatedBy', 'version']);
    const page = await call(t.base, 'GET', `/api/workspaces/${team.wid}/designs?limit=1&offset=1&sort=name&order=desc`, { token: team.viewer.token });
    expect(page.body.items).toHaveLength(1);
    expect(page.body.total).toBeGreaterThanOrEqual(3);
    const bad = await call(t.base, 'GET', `/api/workspaces/${team.wid}/designs?sort=colour`, { token: team.viewer.token });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('sort');
  });

  it('lists an empty workspace, a page past the end, and refuses outsiders and unknown workspaces alike with 404', async () => {
    const owner = team.owner;
    const made = await call(t.base, 'POST', '/api/workspaces', { token: owner.token, body: { name: 'Empty lab' } });
    expect(made.status).toBe(201);
    const empty = await call(t.base, 'GET', `/api/workspaces/${made.body.id}/designs`, { token: owner.token });
    expect(empty.status).toBe(200);
    expect(empty.body).toEqual({ items: [], total: 0 });
    expect((await call(t.base, 'GET', `/api/workspaces/${made.body.id}/designs?offset=5`, { token: owner.token })).body).toEqual({ items: [], total: 0 });

    await createDesign('Past the end');
    const all = await call(t.base, 'GET', `/api/workspaces/${team.wid}/designs`, { token: team.viewer.token });
    const past = await call(t.base, 'GET', `/api/workspaces/${team.wid}/designs?offset=${all.body.total + 10}`, { token: team.viewer.token });
    expect(past.status).toBe(200);
    expect(past.body).toEqual({ items: [], total: all.body.total });
    const filtered = await call(t.base, 'GET', `/api/workspaces/${team.wid}/designs?q=past%20the&offset=3`, { token: team.viewer.token });
    expect(filtered.body).toEqual({ items: [], total: 1 });

    const outsider = await call(t.base, 'GET', `/api/workspaces/${made.body.id}/designs`, { token: team.viewer.token });
    const unknown = await call(t.base, 'GET', '/api/workspaces/2000000000/designs', { token: team.viewer.token });
    const unknownPast = await call(t.base, 'GET', '/api/workspaces/2000000000/designs?offset=10', { token: team.viewer.token });
    for (const r of [outsider, unknown, unknownPast]) {
      expect(r.status).toBe(404);
      expect(r.body.error.code).toBe('not-found');
    }
    expect(outsider.body).toEqual(unknown.body);
    const design = await call(t.base, 'GET', `/api/designs/${all.body.items[0].id}`, { token: owner.token });
    expect(design.status).toBe(200);
    expect(design.body.role).toBe('owner');
    const notMine = await call(t.base, 'GET', `/api/designs/${all.body.items[0].id}`, { token: team.outsider.token });
    const missing = await call(t.base, 'GET', '/api/designs/2000000000', { token: owner.token });
    expect(notMine.status).toBe(404);
    expect(notMine.body).toEqual(missing.body);
  });

  it('refuses an invalid design with 400 naming the field, and nothing is stored', async () => {
    const doc = validDocument();
    (doc['ports'] as { potential: unknown }[])[1]!.potential = 'high';
    const r = await call(t.base, 'POST', `/api/workspaces/${team.wid}/designs`, { token: team.editor.token, body: { name: 'Broken', document: doc } });
    expect(r.status).toBe(400);
    expect(r.body).toEqual({ error: { code: 'invalid', message: expect.stringContaining('ports[1].potential'), field: 'document.ports[1].potential' } });
    const missing = await call(t.base, 'POST', `/api/workspaces/${team.wid}/designs`, { token: team.editor.token, body: { name: 'No document' } });
    expect(missing.status).toBe(400);
    expect(missing.body.error.field).toBe('document');
    const list = await call(t.base, 'GET', `/api/workspaces/${team.wid}/designs?q=Broken`, { token: team.editor.token });
    expect(list.body.total).toBe(0);
  });

  it('answers 400 for malformed JSON and 413 for an oversized body', async () => {
    const malformed = await call(t.base, 'POST', `/api/workspaces/${team.wid}/designs`, { token: team.editor.token, raw: '{"name": "x", "document": {' });
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.code).toBe('invalid');
    const huge = JSON.stringify({ name: 'Huge', document: { ...validDocument(), padding: 'x'.repeat(13 * 1024 * 1024) } });
    const big = await call(t.base, 'POST', `/api/workspaces/${team.wid}/designs`, { token: team.editor.token, raw: huge });
    expect(big.status).toBe(413);
    expect(big.body).toEqual({ error: { code: 'too-large', message: expect.any(String) } });
  });

  it('lets exactly one of two editors saving the same version at once win; the other gets 409 and nothing is lost', async () => {
    const d = await createDesign('Race');
    const mine = { ...validDocument(), name: 'mine' };
    const theirs = { ...validDocument(), name: 'theirs' };
    const [a, b] = await Promise.all([
      call(t.base, 'PUT', `/api/designs/${d.id}`, { token: team.editor.token, body: { document: mine, version: 1 } }),
      call(t.base, 'PUT', `/api/designs/${d.id}`, { token: team.owner.token, body: { document: theirs, version: 1 } }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const [winner, loser] = a.status === 200 ? [a, b] : [b, a];
    const winnerDoc = a.status === 200 ? mine : theirs;
    expect(loser.body.error.code).toBe('conflict');
    expect(winner.body.version).toBe(2);
    const now = await call(t.base, 'GET', `/api/designs/${d.id}`, { token: team.viewer.token });
    expect(now.body.version).toBe(2);
    expect(now.body.document).toEqual(winnerDoc);
    // The loser reloads and saves on top: both edits are kept in order.
    const retry = await call(t.base, 'PUT', `/api/designs/${d.id}`, { token: team.editor.token, body: { document: { ...winnerDoc, name: 'merged' }, version: 2 } });
    expect(retry.status).toBe(200);
    expect(retry.body.version).toBe(3);
  });

  it('gives exactly one win to six saves racing from the same version, round after round', async () => {
    const d = await createDesign('Crowd');
    for (let version = 1; version <= 3; version++) {
      const tokens = [team.editor.token, team.owner.token];
      const saves = await Promise.all(
        Array.from({ length: 6 }, (_, k) =>
          call(t.base, 'PUT', `/api/designs/${d.id}`, { token: tokens[k % 2], body: { document: { ...validDocument(), name: `round ${version} save ${k}` }, version } }),
        ),
      );
      const statuses = saves.map((r) => r.status);
      expect(statuses.filter((s) => s === 200)).toHaveLength(1);
      expect(statuses.filter((s) => s === 409)).toHaveLength(5);
      const won = saves.findIndex((r) => r.status === 200);
      const now = await call(t.base, 'GET', `/api/designs/${d.id}`, { token: team.viewer.token });
      expect(now.body.version).toBe(version + 1);
      expect(now.body.document.name).toBe(`round ${version} save ${won}`);
    }
  });

  it('refuses a save from a stale version even one at a time', async () => {
    const d = await createDesign('Stale');
    expect((await call(t.base, 'PUT', `/api/designs/${d.id}`, { token: team.editor.token, body: { document: validDocument(), version: 1, name: 'Stale 2' } })).status).toBe(200);
    const stale = await call(t.base, 'PUT', `/api/designs/${d.id}`, { token: team.editor.token, body: { document: validDocument(), version: 1 } });
    expect(stale.status).toBe(409);
    expect((await call(t.base, 'GET', `/api/designs/${d.id}`, { token: team.editor.token })).body).toMatchObject({ name: 'Stale 2', version: 2 });
  });
});

describe('review', () => {
  it('moves draft → in review → mask-ready, mails the reviewers, and a later save sends it back to draft', async () => {
    const d = await createDesign('Review me');
    const early = await call(t.base, 'POST', `/api/designs/${d.id}/review`, { token: team.reviewer.token, body: { state: 'mask-ready' } });
    expect(early.status).toBe(409);
    const inReview = await call(t.base, 'POST', `/api/designs/${d.id}/review`, { token: team.editor.token, body: { state: 'in review' } });
    expect(inReview.status).toBe(200);
    expect(inReview.body.reviewState).toBe('in review');
    const mail = await waitForMail(t.base, team.reviewer.email, 'In review: Review me');
    expect(mail.text).toContain(`/designs/${d.id}`);
    await waitForMail(t.base, team.owner.email, 'In review: Review me');
    expect(t.mail.mailbox.list().some((m) => m.subject === 'In review: Review me' && m.to.includes(team.viewer.email))).toBe(false);
    const editorApproves = await call(t.base, 'POST', `/api/designs/${d.id}/review`, { token: team.editor.token, body: { state: 'mask-ready' } });
    expect(editorApproves.status).toBe(403);
    const approved = await call(t.base, 'POST', `/api/designs/${d.id}/review`, { token: team.reviewer.token, body: { state: 'mask-ready' } });
    expect(approved.body.reviewState).toBe('mask-ready');
    const saved = await call(t.base, 'PUT', `/api/designs/${d.id}`, { token: team.editor.token, body: { document: validDocument(), version: 1 } });
    expect(saved.body).toMatchObject({ version: 2, reviewState: 'draft' });
  });
});

describe('revisions, runs and comments', () => {
  it('numbers revisions, lists them newest first, and keeps each one frozen', async () => {
    const d = await createDesign('Frozen');
    const r1 = await call(t.base, 'POST', `/api/designs/${d.id}/revisions`, { token: team.editor.token, body: { note: 'first' } });
    await call(t.base, 'PUT', `/api/designs/${d.id}`, { token: team.editor.token, body: { document: { ...validDocument(), name: 'changed' }, version: 1 } });
    const r2 = await call(t.base, 'POST', `/api/designs/${d.id}/revisions`, { token: team.editor.token, body: { note: 'second' } });
    expect([r1.status, r1.body.number, r2.body.number]).toEqual([201, 1, 2]);
    const list = await call(t.base, 'GET', `/api/designs/${d.id}/revisions`, { token: team.viewer.token });
    expect(list.body.map((r: { number: number }) => r.number)).toEqual([2, 1]);
    expect(list.body[0]).toEqual({ id: r2.body.id, number: 2, note: 'second', createdAt: expect.any(String), author: { id: team.editor.id, name: team.editor.name } });
    expect(list.headers.get('x-total-count')).toBe('2');
    const first = await call(t.base, 'GET', `/api/revisions/${r1.body.id}`, { token: team.viewer.token });
    expect(first.body.document).toEqual(validDocument());

    // The database refuses to change a revision, even by a direct SQL UPDATE.
    const sql = t.orm.em.fork().getConnection();
    await expect(sql.execute(`update revisions set note = 'rewritten' where id = ${r1.body.id}`)).rejects.toThrow(/frozen/);
    await expect(sql.execute(`update revisions set document = '{}'::json where id = ${r1.body.id}`)).rejects.toThrow(/frozen/);
    const again = await call(t.base, 'GET', `/api/revisions/${r1.body.id}`, { token: team.viewer.token });
    expect(again.body).toMatchObject({ note: 'first', document: validDocument() });
  });

  it('stores a run with an 8 MB field blob and gives the blob back bit for bit', async () => {
    const d = await createDesign('Runs');
    const rev = await call(t.base, 'POST', `/api/designs/${d.id}/revisions`, { token: team.editor.token, body: { note: 'for runs' } });
    const blob = randomBytes(8 * 1024 * 1024);
    const summary = { ports: [{ id: 'S', potential: 400, current: 1.2e-6, flowRate: 3.1e-12 }], metrics: { joulePower: 1.5e-4 }, warnings: [{ code: 'thin-edl', message: 'ok' }] };
    const made = await call(t.base, 'POST', `/api/revisions/${rev.body.id}/runs`, {
      token: team.editor.token,
      body: { settings: { cells: 400 }, summary, fields: blob.toString('base64') },
    });
    expect(made.status).toBe(201);
    expect(made.body).toEqual({ id: expect.any(Number) });
    const back = await call(t.base, 'GET', `/api/runs/${made.body.id}/fields`, { token: team.viewer.token });
    expect(back.status).toBe(200);
    expect(back.headers.get('content-type')).toBe('application/octet-stream');
    expect(Buffer.compare(back.body as Buffer, blob)).toBe(0);
    const detail = await call(t.base, 'GET', `/api/runs/${made.body.id}`, { token: team.viewer.token });
    expect(detail.body).toMatchObject({ revisionId: rev.body.id, status: 'solved', settings: { cells: 400 }, summary, hasFields: true, fieldsBytes: blob.length });
    const list = await call(t.base, 'GET', `/api/revisions/${rev.body.id}/runs`, { token: team.viewer.token });
    expect(list.body).toEqual([expect.objectContaining({ id: made.body.id, status: 'solved', summary, createdAt: expect.any(String) })]);

    const plain = await call(t.base, 'POST', `/api/revisions/${rev.body.id}/runs`, { token: team.editor.token, body: { settings: {}, summary: {}, status: 'failed' } });
    expect((await call(t.base, 'GET', `/api/runs/${plain.body.id}/fields`, { token: team.viewer.token })).status).toBe(404);
    const badBase64 = await call(t.base, 'POST', `/api/revisions/${rev.body.id}/runs`, { token: team.editor.token, body: { settings: {}, summary: {}, fields: 'not base64!' } });
    expect(badBase64.status).toBe(400);
    expect(badBase64.body.error.field).toBe('fields');
  });

  it('keeps comments on a revision, optionally pinned to a point', async () => {
    const d = await createDesign('Comments');
    const rev = await call(t.base, 'POST', `/api/designs/${d.id}/revisions`, { token: team.editor.token, body: {} });
    const pinned = await call(t.base, 'POST', `/api/revisions/${rev.body.id}/comments`, { token: team.reviewer.token, body: { body: 'Corner too sharp', at: [1e-4, 2.5e-5] } });
    expect(pinned.status).toBe(201);
    await call(t.base, 'POST', `/api/revisions/${rev.body.id}/comments`, { token: team.owner.token, body: { body: 'Agreed' } });
    const list = await call(t.base, 'GET', `/api/revisions/${rev.body.id}/comments`, { token: team.viewer.token });
    expect(list.body).toEqual([
      { id: pinned.body.id, body: 'Corner too sharp', at: [1e-4, 2.5e-5], createdAt: expect.any(String), author: { id: team.reviewer.id, name: team.reviewer.name } },
      expect.objectContaining({ body: 'Agreed', at: null }),
    ]);
    const empty = await call(t.base, 'POST', `/api/revisions/${rev.body.id}/comments`, { token: team.reviewer.token, body: { body: '  ' } });
    expect(empty.body.error.field).toBe('body');
  });

  it('logs what happened in the activity of the workspace and of a design', async () => {
    const d = await createDesign('Logged');
    await call(t.base, 'POST', `/api/designs/${d.id}/revisions`, { token: team.editor.token, body: { note: 'n' } });
    const r = await call(t.base, 'GET', `/api/workspaces/${team.wid}/activity?designId=${d.id}`, { token: team.viewer.token });
    expect(r.body.items.map((a: { kind: string }) => a.kind)).toEqual(['revision.created', 'design.created']);
    expect(r.body.items[0]).toMatchObject({ actor: { id: team.editor.id, name: team.editor.name }, designId: d.id });
    expect(r.body.total).toBe(2);

    // Saves in a row by one person make one line, which tells the latest version.
    for (const version of [1, 2, 3]) await call(t.base, 'PUT', `/api/designs/${d.id}`, { token: team.editor.token, body: { document: validDocument(), version } });
    await call(t.base, 'PUT', `/api/designs/${d.id}`, { token: team.owner.token, body: { document: validDocument(), version: 4 } });
    const after = await call(t.base, 'GET', `/api/workspaces/${team.wid}/activity?designId=${d.id}&limit=2`, { token: team.viewer.token });
    expect(after.body.items.map((a: { kind: string; message: string; actor: { id: number } }) => [a.kind, a.actor.id, a.message])).toEqual([
      ['design.saved', team.owner.id, 'saved "Logged" as version 5'],
      ['design.saved', team.editor.id, 'saved "Logged" as version 4'],
    ]);
    expect(after.body.total).toBe(4);
  });
});
