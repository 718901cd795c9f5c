/**
 * The command line end to end (design-format.md): two spawns only, as tsx takes a while to start.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

const root = resolve(__dirname, '../..');
const run = (args: string[]) =>
  spawnSync(process.execPath, [join(root, 'node_modules/tsx/dist/cli.mjs'), '--tsconfig', 'tsconfig.server.json', 'solver/cli.ts', ...args], {
    cwd: root,
    encoding: 'utf8',
    timeout: 60000,
  });

describe('osmolane solve', () => {
  it('prints only the JSON result with --json, and writes the VTK file', () => {
    const vtk = join(mkdtempSync(join(tmpdir(), 'osmolane-')), 'fields.vtk');
    const out = run(['solve', 'tests/fixtures/designs/t-junction.json', '--cells', '240', '--probe', '1e-3,5e-5', '--probe', '1,1', '--json', '--vtk', vtk]);
    expect(out.stderr).toBe('');
    expect(out.status).toBe(0);
    const result = JSON.parse(out.stdout);
    expect(Object.keys(result).sort()).toEqual(['grid', 'metrics', 'ports', 'probes', 'solver', 'warnings']);
    expect(result.grid).toMatchObject({ nx: 242, spacing: 1.25e-5 });
    expect(result.ports.map((p: { id: string }) => p.id)).toEqual(['A', 'B', 'C']);
    expect(Object.keys(result.ports[0]).sort()).toEqual(['current', 'flowRate', 'id', 'potential']);
    expect(result.ports[2].potential).toBeCloseTo(250, 3);
    expect(result.probes[0]).toMatchObject({ at: [1e-3, 5e-5], inside: true });
    expect(Object.keys(result.probes[0]).sort()).toEqual(['at', 'field', 'inside', 'potential', 'pressure', 'velocity', 'vorticity']);
    expect(result.probes[1]).toEqual({ at: [1, 1], inside: false });
    expect(result.warnings.every((w: object) => Object.keys(w).sort().join() === 'code,message')).toBe(true);
    expect(result.warnings.map((w: { code: string }) => w.code)).toContain('high-voltage');
    expect(readFileSync(vtk, 'utf8')).toMatch(/^# vtk DataFile Version 3\.0\n.*\nASCII\nDATASET STRUCTURED_POINTS\nDIMENSIONS 243 /);
  });

  it('exits 2 with one error: line for a file that does not exist', () => {
    const out = run(['solve', 'tests/fixtures/designs/no-such-design.json']);
    expect(out.status).toBe(2);
    expect(out.stdout).toBe('');
    expect(out.stderr).toBe('error: cannot read tests/fixtures/designs/no-such-design.json: no such file\n');
  });
});
