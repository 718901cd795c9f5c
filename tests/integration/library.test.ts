import type { LibraryItem } from '../../shared/api';
import { call, makeTeam, startTestServer, type Team, type TestServer } from './harness';

let t: TestServer;
let team: Team;

beforeAll(async () => {
  t = await startTestServer();
  team = await makeTeam(t.base, 'Library lab');
});

afterAll(async () => {
  await t.close();
});

describe('library', () => {
  it('lists the built-in entries with their reference values and sources', async () => {
    const r = await call<LibraryItem[]>(t.base, 'GET', `/api/workspaces/${team.wid}/library`, { token: team.viewer.token });
    const builtIn = r.body.filter((i) => i.builtIn);
    const byName = Object.fromEntries(builtIn.map((i) => [i.name, i]));
    // IAPWS 2008 viscosities at 0.1 MPa (reference-values.md §1).
    expect(byName['Water, 20 °C']!.values).toMatchObject({ viscosity: 1.0016e-3, temperature: 293.15 });
    expect(byName['Water, 25 °C']!.values).toMatchObject({ viscosity: 8.9002e-4, temperature: 298.15 });
    expect(byName['Water, 25 °C']!.source).toContain('IAPWS');
    // 0.01 mol/L KCl standard, 1413 µS/cm at 25 °C (reference-values.md §7).
    expect(byName['KCl 10 mM, 25 °C']!.values).toMatchObject({ conductivity: 0.1413, ionicStrength: 10 });
    for (const wall of ['Glass / fused silica', 'PDMS', 'SU-8']) {
      expect(byName[wall]!.kind).toBe('wall');
      expect((byName[wall]!.values as { note: string }).note).toContain('measure your own chip');
      expect(byName[wall]!.source.length).toBeGreaterThan(20);
    }
    const walls = await call<LibraryItem[]>(t.base, 'GET', `/api/workspaces/${team.wid}/library?kind=wall`, { token: team.viewer.token });
    expect(walls.body.every((i) => i.kind === 'wall')).toBe(true);
  });

  it('keeps each workspace’s own entries to itself, and checks the values', async () => {
    const made = await call<LibraryItem>(t.base, 'POST', `/api/workspaces/${team.wid}/library`, {
      token: team.editor.token,
      body: { kind: 'wall', name: 'Our PDMS, plasma 30 s', values: { zeta: -0.082, note: 'measured by current monitoring' }, source: 'lab notebook 14' },
    });
    expect(made.status).toBe(201);
    expect(made.body).toEqual({ id: expect.any(Number), kind: 'wall', name: 'Our PDMS, plasma 30 s', values: { zeta: -0.082, note: 'measured by current monitoring' }, source: 'lab notebook 14', builtIn: false });
    const theirs = await call<LibraryItem[]>(t.base, 'GET', `/api/workspaces/${team.wid}/library`, { token: team.viewer.token });
    expect(theirs.body.map((i) => i.id)).toContain(made.body.id);
    const elsewhere = (await call(t.base, 'GET', '/api/workspaces', { token: team.outsider.token })).body[0].id;
    const others = await call<LibraryItem[]>(t.base, 'GET', `/api/workspaces/${elsewhere}/library`, { token: team.outsider.token });
    expect(others.body.map((i) => i.id)).not.toContain(made.body.id);
    expect(others.body.some((i) => i.builtIn)).toBe(true);

    const unknownKey = await call(t.base, 'POST', `/api/workspaces/${team.wid}/library`, { token: team.editor.token, body: { kind: 'buffer', name: 'x', values: { viscocity: 1e-3 } } });
    expect(unknownKey.status).toBe(400);
    expect(unknownKey.body.error.field).toBe('values');
    const negative = await call(t.base, 'POST', `/api/workspaces/${team.wid}/library`, { token: team.editor.token, body: { kind: 'buffer', name: 'x', values: { viscosity: -1 } } });
    expect(negative.body.error.field).toBe('values.viscosity');

    const changed = await call<LibraryItem>(t.base, 'PUT', `/api/library/${made.body.id}`, { token: team.editor.token, body: { kind: 'wall', name: 'Our PDMS', values: { zeta: -0.08 } } });
    expect(changed.body).toMatchObject({ name: 'Our PDMS', values: { zeta: -0.08 }, source: '' });
    expect((await call(t.base, 'DELETE', `/api/library/${made.body.id}`, { token: team.editor.token })).status).toBe(204);
    expect((await call(t.base, 'DELETE', `/api/library/${made.body.id}`, { token: team.editor.token })).status).toBe(404);
  });
});
