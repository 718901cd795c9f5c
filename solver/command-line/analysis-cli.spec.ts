/**
 * The analysis commands end to end: three spawns only, as tsx takes a while to start. Argument mistakes are
 * covered by analysis-args.spec.ts; the results themselves by tests/verification.
 */
import { spawnSync } from 'node:child_process';
import { join, resolve } from 'node:path';

const root = resolve(__dirname, '../..');
const run = (args: string[]) =>
  spawnSync(process.execPath, [join(root, 'node_modules/tsx/dist/cli.mjs'), '--tsconfig', 'tsconfig.server.json', 'solver/cli.ts', ...args], {
    cwd: root,
    encoding: 'utf8',
    timeout: 120000,
  });

describe('osmolane edl, plan and compare', () => {
  it('edl --json prints the Debye length of 10 mM at 25 °C, 3.04 nm (Israelachvili; reference-values.md §2), and nothing else', () => {
    const out = run(['edl', '--ionic-strength', '10', '--zeta', '-0.05', '--temperature', '298.15', '--depth', '2e-5', '--width', '5e-5', '--json']);
    expect(out.stderr).toBe('');
    expect(out.status).toBe(0);
    const r = JSON.parse(out.stdout);
    expect(r.debyeLength).toBeCloseTo(3.04e-9, 11);
    expect(r.thinEdlHolds).toBe(true);
    // The worked profile of reference-values.md §4 at y = λ_D: u/u_HS = 0.6554.
    expect(r.profile.find((p: { yOverDebye: number }) => p.yOverDebye === 1).velocityRatio).toBeCloseTo(0.6554, 4);
    expect(JSON.stringify(r).length).toBeLessThan(4000);
  });

  it('plan --json meets a speed target through the waste port with the buffer port held at ground', () => {
    const out = run(['plan', 'tests/fixtures/designs/cross-injector.json', '--target', 'speed:W:-1e-3', '--target', 'flow:S:0', '--hold', 'B=0', '--cells', '80', '--json']);
    expect(out.stderr).toBe('');
    expect(out.status).toBe(0);
    const r = JSON.parse(out.stdout);
    expect(r.drives).toEqual(['B', 'W', 'S', 'SW']);
    expect(r.settings.B).toBe(0);
    expect(r.targets[0]).toMatchObject({ kind: 'speed', port: 'W', wanted: -1e-3 });
    expect(Math.abs(r.targets[0].residual)).toBeLessThan(1e-9);
    expect(Object.keys(r).sort()).toEqual(['drives', 'floating', 'grid', 'ports', 'settings', 'targets']);
  });

  it('compare --json gives each drive its band from the tracer, small enough to read', () => {
    const out = run(['compare', 'tests/fixtures/designs/cross-injector.json', '--port', 'W', '--cells', '80', '--particles', '300', '--seed', '4', '--json']);
    expect(out.stderr).toBe('');
    expect(out.status).toBe(0);
    const r = JSON.parse(out.stdout);
    expect(r.band).toMatchObject({ particles: 300, seed: 4, mobility: 0, diffusivity: 1e-9 });
    for (const side of [r.slip, r.pressure]) {
      expect(Object.keys(side.band).sort()).toEqual(
        ['arrived', 'counts', 'duration', 'effectiveDiffusivity', 'meanTime', 'plateHeight', 'plateNumber', 'speed', 'tilt', 'timeVariance'],
      );
      expect(side.band.counts).toHaveLength(r.band.edges.length - 1);
    }
    expect(r.pressure.band.plateHeight).toBeGreaterThan(r.slip.band.plateHeight);
    expect(JSON.stringify(r).length).toBeLessThan(8000);
  });
});
