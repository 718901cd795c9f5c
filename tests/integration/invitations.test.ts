import type { Invitation, Member } from '../../shared/api';
import { call, invite, linkToken, PASSWORD, signUp, startTestServer, uniqueEmail, waitForMail, type Person, type TestServer } from './harness';

let t: TestServer;
let owner: Person;
let wid: number;

beforeAll(async () => {
  t = await startTestServer();
  owner = await signUp(t.base, 'owner');
  wid = (await call(t.base, 'POST', '/api/workspaces', { token: owner.token, body: { name: 'Invite lab' } })).body.id;
});

afterAll(async () => {
  await t.close();
});

async function inviteAndRead(email: string, role: string): Promise<string> {
  const r = await call<Invitation>(t.base, 'POST', `/api/workspaces/${wid}/invitations`, { token: owner.token, body: { email, role } });
  expect(r.status).toBe(201);
  return linkToken(await waitForMail(t.base, email, 'invited you'), 'invite');
}

describe('invitations end to end through the local SMTP server', () => {
  it('mails a link; opening it shows the invitation; accepting makes the account, the membership and a session', async () => {
    const email = uniqueEmail('newcomer');
    const made = await call<Invitation>(t.base, 'POST', `/api/workspaces/${wid}/invitations`, { token: owner.token, body: { email: email.toUpperCase(), role: 'reviewer' } });
    expect(made.body).toEqual({
      id: expect.any(Number),
      email,
      role: 'reviewer',
      createdAt: expect.any(String),
      expiresAt: expect.any(String),
      acceptedAt: null,
      invitedBy: { id: owner.id, name: owner.name },
    });
    const mail = await waitForMail(t.base, email, 'invited you to Invite lab');
    expect(mail.from).toContain('Osmolane');
    expect(mail.text).toContain(`${t.config.publicBaseUrl}/invite?token=`);
    const token = linkToken(mail, 'invite');

    const preview = await call(t.base, 'GET', `/api/invitations/${token}`);
    expect(preview.body).toEqual({ workspaceName: 'Invite lab', email, role: 'reviewer', accountExists: false });

    const noName = await call(t.base, 'POST', `/api/invitations/${token}/accept`, { body: { password: PASSWORD } });
    expect(noName.status).toBe(400);
    expect(noName.body.error.field).toBe('name');
    const weak = await call(t.base, 'POST', `/api/invitations/${token}/accept`, { body: { name: 'New Comer', password: 'short' } });
    expect(weak.body.error.field).toBe('password');

    const accepted = await call(t.base, 'POST', `/api/invitations/${token}/accept`, { body: { name: 'New Comer', password: PASSWORD } });
    expect(accepted.status).toBe(200);
    expect(accepted.body).toMatchObject({ token: expect.any(String), user: { email, name: 'New Comer' } });
    expect(accepted.cookie).toMatch(/^osm_refresh=/);
    const mine = await call(t.base, 'GET', '/api/workspaces', { token: accepted.body.token });
    expect(mine.body).toEqual([{ id: wid, name: 'Invite lab', role: 'reviewer' }]);

    const members = await call<Member[]>(t.base, 'GET', `/api/workspaces/${wid}/members`, { token: owner.token });
    expect(members.body).toContainEqual({ userId: accepted.body.user.id, email, name: 'New Comer', role: 'reviewer' });
    const invitations = await call<Invitation[]>(t.base, 'GET', `/api/workspaces/${wid}/invitations`, { token: owner.token });
    expect(invitations.body.find((i) => i.email === email)?.acceptedAt).toEqual(expect.any(String));

    // The link works once.
    expect((await call(t.base, 'GET', `/api/invitations/${token}`)).status).toBe(404);
    expect((await call(t.base, 'POST', `/api/invitations/${token}/accept`, { body: { name: 'Again', password: PASSWORD } })).status).toBe(404);
  });

  it('adds an existing account with its password, or with its own signed-in token, never another one', async () => {
    const existing = await signUp(t.base, 'existing');
    const token = await inviteAndRead(existing.email, 'editor');
    expect((await call(t.base, 'GET', `/api/invitations/${token}`)).body.accountExists).toBe(true);
    const wrong = await call(t.base, 'POST', `/api/invitations/${token}/accept`, { body: { password: 'wrong password' } });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.field).toBe('password');
    const stranger = await signUp(t.base, 'stranger');
    expect((await call(t.base, 'POST', `/api/invitations/${token}/accept`, { token: stranger.token, body: {} })).status).toBe(403);
    const ok = await call(t.base, 'POST', `/api/invitations/${token}/accept`, { token: existing.token, body: {} });
    expect(ok.status).toBe(200);
    expect(ok.body.user.id).toBe(existing.id);
    const roles = (await call(t.base, 'GET', '/api/workspaces', { token: existing.token })).body;
    expect(roles).toContainEqual({ id: wid, name: 'Invite lab', role: 'editor' });
  });

  it('takes the password of an existing account even when the browser still sends a stale token', async () => {
    const existing = await signUp(t.base, 'stale');
    const token = await inviteAndRead(existing.email, 'viewer');
    const r = await call(t.base, 'POST', `/api/invitations/${token}/accept`, { token: 'stale.access.token', body: { password: PASSWORD } });
    expect(r.status).toBe(200);
    expect(r.body.user.id).toBe(existing.id);
  });

  it('replaces an earlier pending invitation of the same e-mail, and can withdraw one', async () => {
    const email = uniqueEmail('twice');
    const old = await inviteAndRead(email, 'viewer');
    const fresh = await call<Invitation>(t.base, 'POST', `/api/workspaces/${wid}/invitations`, { token: owner.token, body: { email, role: 'editor' } });
    expect((await call(t.base, 'GET', `/api/invitations/${old}`)).status).toBe(404);
    expect((await call(t.base, 'DELETE', `/api/workspaces/${wid}/invitations/${fresh.body.id}`, { token: owner.token })).status).toBe(204);
    expect((await call(t.base, 'DELETE', `/api/workspaces/${wid}/invitations/${fresh.body.id}`, { token: owner.token })).status).toBe(404);
  });

  it('refuses to invite someone who is a member already', async () => {
    const r = await call(t.base, 'POST', `/api/workspaces/${wid}/invitations`, { token: owner.token, body: { email: owner.email, role: 'viewer' } });
    expect(r.status).toBe(409);
    expect(r.body.error.field).toBe('email');
  });

  it('does not accept an expired invitation', async () => {
    const email = uniqueEmail('late');
    const token = await inviteAndRead(email, 'viewer');
    await t.orm.em.fork().getConnection().execute(`update invitations set expires_at = now() - interval '1 minute' where email = '${email}'`);
    expect((await call(t.base, 'GET', `/api/invitations/${token}`)).status).toBe(404);
    expect((await call(t.base, 'POST', `/api/invitations/${token}/accept`, { body: { name: 'Late', password: PASSWORD } })).status).toBe(404);
  });
});

describe('members', () => {
  it('changes roles, keeps at least one owner, removes members, and lets a member leave', async () => {
    const second = await invite(t.base, owner, wid, 'editor', 'second');
    const lastOwner = await call(t.base, 'PATCH', `/api/workspaces/${wid}/members/${owner.id}`, { token: owner.token, body: { role: 'editor' } });
    expect(lastOwner.status).toBe(409);
    expect((await call(t.base, 'DELETE', `/api/workspaces/${wid}/members/${owner.id}`, { token: owner.token })).status).toBe(409);
    const promoted = await call(t.base, 'PATCH', `/api/workspaces/${wid}/members/${second.id}`, { token: owner.token, body: { role: 'owner' } });
    expect(promoted.body).toEqual({ userId: second.id, email: second.email, name: second.name, role: 'owner' });
    // Two owners demoting each other at once: one wins; the other is refused, as the last owner (409) or as
    // no longer an owner (403), depending on which of the two checks it meets first. One owner stays.
    const [a, b] = await Promise.all([
      call(t.base, 'PATCH', `/api/workspaces/${wid}/members/${second.id}`, { token: owner.token, body: { role: 'viewer' } }),
      call(t.base, 'PATCH', `/api/workspaces/${wid}/members/${owner.id}`, { token: second.token, body: { role: 'viewer' } }),
    ]);
    const statuses = [a.status, b.status].sort();
    expect(statuses[0]).toBe(200);
    expect([403, 409]).toContain(statuses[1]);
    const members = (await call<Member[]>(t.base, 'GET', `/api/workspaces/${wid}/members?sort=role`, { token: owner.token })).body;
    expect(members.filter((m) => m.role === 'owner')).toHaveLength(1);
    expect(members[0]!.role).toBe('owner');

    const stillOwner = members[0]!.userId === owner.id ? owner : second;
    const leaver = await invite(t.base, stillOwner, wid, 'viewer', 'leaver');
    expect((await call(t.base, 'DELETE', `/api/workspaces/${wid}/members/${leaver.id}`, { token: leaver.token })).status).toBe(204);
    expect((await call(t.base, 'GET', `/api/workspaces/${wid}`, { token: leaver.token })).status).toBe(404);
  });
});
