/**
 * The command line end to end (design-format.md): two spawns only, as tsx takes a while to start.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
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
    expect(Object.keys(result.ports[0]).sort()).toEqual(['current', 'flowRate', 'id', 'meanSpeed', 'potential']);
    // Added fields: the mean speed of port A's 100 µm × 20 µm leg is |Q| / (w d); the wall shear rate is a number.
    expect(result.ports[0].meanSpeed / (Math.abs(result.ports[0].flowRate) / (1e-4 * 2e-5))).toBeCloseTo(1, 9);
    expect(typeof result.metrics.maxWallShearRate).toBe('number');
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

describe('osmolane export and import', () => {
  it('exports the outline, imports it back, and refuses a hostile file with exit 2 and one error: line', () => {
    const dir = mkdtempSync(join(tmpdir(), 'osmolane-'));
    const svg = join(dir, 'bend.svg');
    const back = join(dir, 'bend.json');
    const out = run(['export', 'tests/fixtures/designs/bend-90.json', '--format', 'svg', '--out', svg]);
    expect(out.stderr).toBe('');
    expect(out.status).toBe(0);
    expect(readFileSync(svg, 'utf8')).toMatch(/^<\?xml[^]*<svg [^>]*width="[\d.]+mm"/);
    const imp = run(['import', svg, '--out', back]);
    expect(imp.stderr).toBe('');
    expect(imp.status).toBe(0);
    expect(imp.stdout).toMatch(/1 add and 0 subtract shapes.*2 ports/);
    expect(JSON.parse(readFileSync(back, 'utf8')).format).toBe('osmolane.design/1');
    writeFileSync(join(dir, 'evil.svg'), '<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"><rect width="1" height="1"/></svg>');
    const bad = run(['import', join(dir, 'evil.svg'), '--scale', '1e-6', '--out', join(dir, 'evil.json')]);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/^error: .*evil\.svg: the SVG has an event handler \(onload\)[^\n]*\n$/);
    expect(existsSync(join(dir, 'evil.json'))).toBe(false);
  });
});
