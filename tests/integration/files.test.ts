import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import { appLocals } from '../../server/app';
import { loadConfig } from '../../server/config';
import { queryRow } from '../../server/db/sql';
import type { S3BlobStore } from '../../server/storage/s3-blob-store';
import { parseDesign } from '../../shared/design';
import { designToDxf, designToSvg } from '../../solver/io';
import { loadFixture } from '../fixtures/designs';
import { call, makeTeam, startTestServer, type Team, type TestServer } from './harness';
import { pdfText } from './pdf-text';

/**
 * Drawings in and out through the API with object storage on the local S3 stand-in: import (and preview),
 * refusals that store nothing, the original kept and served as a sandboxed attachment, outline export, run
 * exports, the PDF report, and deleting a design with its objects.
 */

// Exports and the report solve the run's revision again (a few seconds on a busy machine).
jest.setTimeout(60_000);

let t: TestServer;
let team: Team;

beforeAll(async () => {
  const storage = { ...loadConfig().storage, mode: 's3' as const, endpoint: null, dataDir: mkdtempSync(join(tmpdir(), 'osmolane-s3-')) };
  t = await startTestServer({ storage }, { storage: true });
  team = await makeTeam(t.base, 'Files lab');
});

afterAll(async () => {
  await t.close();
});

function form(fileName: string, text: string | Buffer, fields: Record<string, string> = {}): FormData {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.append(k, v);
  f.append('file', new Blob([text]), fileName);
  return f;
}

async function objects(): Promise<number> {
  const store = t.storage!.blobs as S3BlobStore;
  const r = await store.client.send(new ListObjectsV2Command({ Bucket: store.settings.bucket }));
  return r.KeyCount ?? 0;
}

async function counts() {
  const em = t.orm.em.fork();
  const n = async (sql: string) => Number((await queryRow<{ n: string }>(em, sql, [team.wid]))!.n);
  return {
    designs: await n('select count(*) as n from designs where workspace_id = ?'),
    files: await n('select count(*) as n from design_files f join designs d on d.id = f.design_id where d.workspace_id = ?'),
    activity: await n('select count(*) as n from activity_events where workspace_id = ?'),
    objects: await objects(),
  };
}

const importPath = () => `/api/workspaces/${team.wid}/designs/import`;

describe('importing a drawing', () => {
  it('creates a design from an SVG and keeps the original, served only as a sandboxed attachment', async () => {
    const before = await counts();
    const svg = designToSvg(loadFixture('cross-injector'));
    const r = await call(t.base, 'POST', importPath(), { token: team.editor.token, form: form('cross.svg', svg, { name: 'Imported cross' }) });
    expect(r.status).toBe(201);
    expect(r.body.design.name).toBe('Imported cross');
    expect(parseDesign(r.body.design.document).ok).toBe(true);
    expect(r.body.report.found).toMatchObject({ add: 1, ports: 4 });
    expect(await counts()).toEqual({ ...before, designs: before.designs + 1, files: before.files + 1, activity: before.activity + 1, objects: before.objects + 1 });

    const files = await call(t.base, 'GET', `/api/designs/${r.body.design.id}/files`, { token: team.viewer.token });
    expect(files.body).toEqual([expect.objectContaining({ fileName: 'cross.svg', contentType: 'image/svg+xml', size: Buffer.byteLength(svg) })]);
    const original = await fetch(`${t.base}/api/files/${files.body[0].id}`, { headers: { authorization: `Bearer ${team.viewer.token}` } });
    expect(original.status).toBe(200);
    expect(original.headers.get('content-disposition')).toMatch(/^attachment; filename="cross.svg"/);
    expect(original.headers.get('content-security-policy')).toMatch(/^sandbox/);
    expect(original.headers.get('x-content-type-options')).toBe('nosniff');
    expect(await original.text()).toBe(svg);
  });

  it('previews a DXF without storing anything, with the units and what was skipped', async () => {
    const before = await counts();
    const dxf = designToDxf(loadFixture('bend-90')).replace('0\nENDSEC\n0\nEOF', '0\nPOINT\n8\n0\n10\n1\n20\n2\n30\n0\n0\nENDSEC\n0\nEOF');
    const r = await call(t.base, 'POST', importPath(), { token: team.editor.token, form: form('bend.dxf', dxf, { preview: '1' }) });
    expect(r.status).toBe(200);
    expect(r.body.report.unitsSource).toMatch(/micrometres/);
    expect(r.body.report.skipped).toEqual([expect.objectContaining({ entity: expect.stringMatching(/^POINT/), at: [1e-6, 2e-6] })]);
    expect(parseDesign(r.body.document).ok).toBe(true);
    expect(await counts()).toEqual(before);
  });

  const hostile = [
    ['an SVG with a script', 'x.svg', '<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script><rect width="9" height="9"/></svg>', 400, /script/],
    ['an SVG with onload', 'x.svg', '<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"><rect width="9" height="9"/></svg>', 400, /event handler/],
    ['an SVG with an external href', 'x.svg', '<svg xmlns="http://www.w3.org/2000/svg"><image href="https://example.invalid/a.png"/><rect width="9" height="9"/></svg>', 400, /outside the file/],
    ['an SVG with entities', 'x.svg', '<!DOCTYPE svg [<!ENTITY e SYSTEM "file:///etc/passwd">]><svg xmlns="http://www.w3.org/2000/svg"><text>&e;</text></svg>', 400, /entities/],
    ['a truncated SVG', 'x.svg', '<svg xmlns="http://www.w3.org/2000/svg"><rect width="9"', 400, /not well-formed/],
    ['a DXF with absurd coordinates', 'x.dxf', '0\nSECTION\n2\nENTITIES\n0\nCIRCLE\n8\n0\n10\n1e300\n20\n0\n30\n0\n40\n5\n0\nENDSEC\n0\nEOF\n', 400, /coordinate/],
    ['a truncated DXF', 'x.dxf', '0\nSECTION\n2\nENTITIES\n0\nLINE\n8\n0\n10\n0', 400, /truncated/],
    ['a wrong extension', 'x.exe', 'MZ\u0000\u0001', 400, /neither \.svg nor \.dxf/],
    ['a renamed binary', 'x.svg', Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 0, 0xff, 0xfe]), 400, /not text|binary|not XML/],
    ['a huge file', 'x.svg', `<svg xmlns="http://www.w3.org/2000/svg"><!--${'x'.repeat(6 * 1024 * 1024)}--></svg>`, 413, /larger than/],
  ] as const;

  it.each(hostile)('refuses %s with a clear message and stores nothing', async (_what, name, body, status, message) => {
    const before = await counts();
    const r = await call(t.base, 'POST', importPath(), { token: team.editor.token, form: form(name, body) });
    expect(r.status).toBe(status);
    expect(r.body).toEqual({ error: { code: status === 413 ? 'too-large' : 'invalid', message: expect.stringMatching(message), field: 'file' } });
    expect(await counts()).toEqual(before);
  });

  it('refuses a request without a file', async () => {
    const r = await call(t.base, 'POST', importPath(), { token: team.editor.token, form: new FormData() });
    expect(r.status).toBe(400);
    expect(r.body.error.field).toBe('file');
  });

  it('leaves no orphan object when the database refuses the new design', async () => {
    const before = await counts();
    const activity = appLocals(t.app).services.activity;
    const spy = jest.spyOn(activity, 'record').mockRejectedValueOnce(new Error('simulated database failure'));
    try {
      const r = await call(t.base, 'POST', importPath(), { token: team.editor.token, form: form('cross.svg', designToSvg(loadFixture('cross-injector'))) });
      expect(r.status).toBe(500);
    } finally {
      spy.mockRestore();
    }
    expect(await counts()).toEqual(before);
  });
});

describe('exports, the report and deleting a design', () => {
  let designId: number;
  let runId: number;

  beforeAll(async () => {
    const r = await call(t.base, 'POST', importPath(), { token: team.owner.token, form: form('cross.svg', designToSvg(loadFixture('cross-injector')), { name: 'Report cross' }) });
    designId = r.body.design.id;
    const rev = await call(t.base, 'POST', `/api/designs/${designId}/revisions`, { token: team.owner.token, body: { note: 'for the mask' } });
    const run = await call(t.base, 'POST', `/api/revisions/${rev.body.id}/runs`, {
      token: team.owner.token,
      body: { settings: { cells: 120 }, summary: { ports: [] }, fields: Buffer.from('field blob').toString('base64') },
    });
    runId = run.body.id;
    await call(t.base, 'POST', `/api/designs/${designId}/review`, { token: team.owner.token, body: { state: 'in review' } });
    const ok = await call(t.base, 'POST', `/api/designs/${designId}/review`, { token: team.reviewer.token, body: { state: 'mask-ready' } });
    expect(ok.status).toBe(200);
  });

  it('exports the outline as DXF and SVG attachments with units stated', async () => {
    const dxf = await call(t.base, 'GET', `/api/designs/${designId}/outline?format=dxf`, { token: team.viewer.token });
    expect(dxf.status).toBe(200);
    expect(dxf.headers.get('content-disposition')).toMatch(/attachment; filename="Report cross outline\.dxf"/);
    expect(dxf.body).toContain('$INSUNITS\n70\n13');
    const svg = await call(t.base, 'GET', `/api/designs/${designId}/outline?format=svg`, { token: team.viewer.token });
    expect(svg.body).toMatch(/width="[\d.]+mm"/);
  });

  it('exports the run as CSV, VTK and map figures', async () => {
    const csv = await call(t.base, 'GET', `/api/runs/${runId}/export?format=csv`, { token: team.viewer.token });
    expect(csv.status).toBe(200);
    expect(csv.body).toContain('table,port,potential_V,current_A,flow_rate_m3_per_s');
    const vtk = await call(t.base, 'GET', `/api/runs/${runId}/export?format=vtk`, { token: team.viewer.token });
    expect(vtk.body.toString()).toMatch(/^# vtk DataFile Version 3\.0\n/);
    const svg = await call(t.base, 'GET', `/api/runs/${runId}/export?format=svg&quantity=vorticity`, { token: team.viewer.token });
    expect(svg.body).toContain('<linearGradient id="bar"');
    const png = await call(t.base, 'GET', `/api/runs/${runId}/export?format=png&quantity=speed`, { token: team.viewer.token });
    expect(png.body.subarray(0, 4).toString('latin1')).toBe('\x89PNG');
    const bad = await call(t.base, 'GET', `/api/runs/${runId}/export?format=xls`, { token: team.viewer.token });
    expect(bad.status).toBe(400);
  });

  it('writes a PDF report with the port table, conditions, the caution and who approved it', async () => {
    const r = await call(t.base, 'GET', `/api/runs/${runId}/report.pdf`, { token: team.viewer.token });
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toBe('application/pdf');
    expect(r.body.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const text = pdfText(r.body);
    expect(text).toContain('Run report: Report cross');
    expect(text).toContain('Port table');
    expect(text).toContain('Current (µA)');
    expect(text).toContain('Flow rate (nL/min)');
    for (const id of ['S', 'W', 'B', 'F']) expect(text).toMatch(new RegExp(`\\b${id}\\b`));
    expect(text).toContain('positive when they enter the fluid');
    expect(text).toContain(`mask-ready, approved by ${team.reviewer.name}`);
    expect(text).toContain('High-voltage caution');
    expect(text).toMatch(/exact rectangular duct .* an error of [\d.]+ %/);
  });

  it('deletes the design with its original and run blob, rows and objects alike', async () => {
    const before = await counts();
    expect(before.objects).toBeGreaterThanOrEqual(2);
    const denied = await call(t.base, 'DELETE', `/api/designs/${designId}`, { token: team.viewer.token });
    expect(denied.status).toBe(403);
    const r = await call(t.base, 'DELETE', `/api/designs/${designId}`, { token: team.editor.token });
    expect(r.status).toBe(204);
    const after = await counts();
    expect(after).toMatchObject({ designs: before.designs - 1, files: before.files - 1, objects: before.objects - 2 });
    expect((await call(t.base, 'GET', `/api/designs/${designId}`, { token: team.owner.token })).status).toBe(404);
    expect((await call(t.base, 'GET', `/api/runs/${runId}/fields`, { token: team.owner.token })).status).toBe(404);
  });
});
