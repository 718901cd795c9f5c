import { loadFixture, makeDesign } from '../tests/fixtures/designs';
import { resultJson, SolveError, solveDesign, type SolveProgress } from './solve';

function refusal(fn: () => unknown): SolveError {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(SolveError);
    return error as SolveError;
  }
  throw new Error('expected a SolveError');
}

const channel = (over: Record<string, unknown> = {}) =>
  makeDesign({
    shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 1e-4 }],
    ports: [
      { id: 'A', from: [0, 0], to: [0, 1e-4], potential: 10 },
      { id: 'B', from: [1e-3, 0], to: [1e-3, 1e-4], potential: 0 },
    ],
    ...over,
  });

describe('solveDesign', () => {
  it('returns the result of design-format.md with per-cell fields', () => {
    const r = solveDesign(channel(), { cells: 80, probes: [[5e-4, 5e-5], [5e-4, 2e-4]] });
    expect(Object.keys(resultJson(r)).sort()).toEqual(['grid', 'metrics', 'ports', 'probes', 'solver', 'warnings']);
    expect(r.grid).toEqual({ nx: 82, ny: 10, spacing: 1.25e-5, fluidCells: 640 });
    expect(r.ports.map((p) => p.id)).toEqual(['A', 'B']);
    expect(r.ports[0].current).toBeGreaterThan(0);
    expect(Object.keys(r.metrics).sort()).toEqual(['debyeLength', 'joulePower', 'maxField', 'maxSpeed', 'maxWallShearRate', 'reynolds']);
    expect(r.ports.map((p) => Object.keys(p))).toEqual([0, 1].map(() => ['id', 'potential', 'current', 'flowRate', 'meanSpeed']));
    expect(Object.keys(r.solver).sort()).toEqual(['flowIterations', 'flowSeconds', 'potentialIterations', 'potentialSeconds', 'residual', 'seconds']);
    expect(r.metrics.maxField).toBeCloseTo(1e4, 3);
    const [inside, outside] = r.probes;
    expect(inside.inside).toBe(true);
    expect(inside.potential).toBeCloseTo(5, 9);
    expect(inside.field![0]).toBeCloseTo(1e4, 2);
    expect(outside).toEqual({ at: [5e-4, 2e-4], inside: false });
    const f = r.fields;
    for (const a of [f.fraction, f.potential, f.fieldX, f.fieldY, f.velocityX, f.velocityY, f.pressure, f.vorticity, f.streamfunction]) {
      expect(a).toBeInstanceOf(Float32Array);
      expect(a.length).toBe(f.nx * f.ny);
    }
    expect(Number.isNaN(f.potential[0])).toBe(true); // the empty margin
    expect(Number.isNaN(f.velocityX[0])).toBe(true);
    const mid = 41 + 5 * f.nx;
    expect(f.fraction[mid]).toBe(1);
    expect(f.pressure[mid]).toBe(0);
  });

  it('gives a streamfunction that rises by Q/d across a channel (u = ∂ψ/∂y)', () => {
    const design = channel();
    const r = solveDesign(design, { cells: 80 });
    const f = r.fields;
    const i = 41;
    const bottom = f.streamfunction[i + 1 * f.nx], top = f.streamfunction[i + 8 * f.nx];
    // Cell values are corner means: the rows next to the walls sit half a row in, 7 of 8 rows apart.
    expect((top - bottom) / (r.ports[0].flowRate / design.depth)).toBeCloseTo(7 / 8, 5);
  });

  it('gives the mean speed of each port’s leg, |Q| / (width × depth), and the side-wall shear rate of the closed form', () => {
    // Pressure-driven Brinkman channel, 100 µm wide and deep, 20 cells across: physics.md §3 gives
    // u(y) = U (1 − cosh(k y)/cosh(k w/2)), U = G d²/(12 μ), k = √12/d, so the wall shear rate is U k tanh(k w/2).
    const w = 1e-4, L = 4e-4, d = 1e-4, dp = 5;
    const design = channel({
      depth: d,
      shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: L, height: w }],
      ports: [
        { id: 'A', from: [0, 0], to: [0, w], potential: 0, pressure: dp },
        { id: 'B', from: [L, 0], to: [L, w], potential: 0, pressure: 0 },
      ],
    });
    const r = solveDesign(design, { cells: 80 });
    const [a, b] = r.ports;
    expect(a.flowRate).toBeGreaterThan(0);
    expect(a.meanSpeed! / (Math.abs(a.flowRate) / (w * d))).toBeCloseTo(1, 12);
    expect(b.meanSpeed! / (Math.abs(b.flowRate) / (w * d))).toBeCloseTo(1, 12);
    // The mean speed sits below the centre-line speed: 0.70 of it for this profile (k w/2 = 1.73).
    expect(a.meanSpeed! / r.metrics.maxSpeed).toBeGreaterThan(0.6);
    expect(a.meanSpeed! / r.metrics.maxSpeed).toBeLessThan(0.8);
    const mu = design.buffer.viscosity, k = Math.sqrt(12) / d, U = ((dp / L) * d * d) / (12 * mu);
    expect(Math.abs(r.metrics.maxWallShearRate! / (U * k * Math.tanh((k * w) / 2)) - 1)).toBeLessThan(0.01);
    const json = JSON.parse(JSON.stringify(resultJson(r)));
    expect(json.ports[0].meanSpeed).toBe(a.meanSpeed);
    expect(json.metrics.maxWallShearRate).toBe(r.metrics.maxWallShearRate);
  });

  it('reports progress through the stages in order', () => {
    const stages: string[] = [];
    solveDesign(channel(), { cells: 40, onProgress: (p: SolveProgress) => stages.push(p.stage) });
    expect([...new Set(stages)]).toEqual(['geometry', 'potential', 'flow', 'fields']);
  });

  it('refuses an invalid design, naming the field', () => {
    const e = refusal(() => solveDesign({ ...channel(), depth: -1 }));
    expect(e.code).toBe('invalid-design');
    expect(e.kind).toBe('refused');
    expect(e.field).toBe('depth');
    expect(e.message).toMatch(/^depth must be greater than 0/);
    expect(refusal(() => solveDesign('not json')).message).toMatch(/not valid JSON/);
  });

  it('refuses a geometry problem with its code and message', () => {
    const design = channel({
      ports: [
        { id: 'A', from: [0, 0], to: [0, 1e-4], potential: 10 },
        { id: 'B', from: [5e-4, 5e-4], to: [6e-4, 5e-4], potential: 0 },
      ],
    });
    const e = refusal(() => solveDesign(design, { cells: 40 }));
    expect(e.code).toBe('port-off-outline');
    expect(e.field).toBe('ports[1]');
    expect(e.message).toMatch(/Port "B" is not on the outline/);
    expect(JSON.stringify(e)).not.toMatch(/stack|at Object/);
  });

  it('refuses invalid options', () => {
    expect(refusal(() => solveDesign(channel(), { cells: 0 })).code).toBe('invalid-option');
    expect(refusal(() => solveDesign(channel(), { cells: 12.5 })).code).toBe('invalid-option');
    expect(refusal(() => solveDesign(channel(), { probes: [[NaN, 0]] })).message).toMatch(/probe 1/);
  });

  it('stops when asked', () => {
    let polls = 0;
    const e = refusal(() => solveDesign(loadFixture('serpentine'), { cells: 256, shouldStop: () => ++polls > 3 }));
    expect(e.code).toBe('cancelled');
    expect(e.kind).toBe('cancelled');
  });

  it('solves a design without electrodes (pressure only): zero current and field, potential undefined', () => {
    const design = channel({
      ports: [
        { id: 'A', from: [0, 0], to: [0, 1e-4], potential: null, pressure: 100 },
        { id: 'B', from: [1e-3, 0], to: [1e-3, 1e-4], potential: null, pressure: 0 },
      ],
    });
    const r = solveDesign(design, { cells: 40, probes: [[5e-4, 5e-5]] });
    expect(r.ports.map((p) => [p.potential, p.current])).toEqual([[null, 0], [null, 0]]);
    expect(r.metrics.maxField).toBe(0);
    expect(r.probes[0].potential).toBeNull();
    expect(r.probes[0].field).toEqual([0, 0]);
    expect(r.warnings.map((w) => w.code)).toContain('no-electrode');
    // The pressure difference alone drives the flow, from A (100 Pa) to B.
    expect(r.ports[0].flowRate).toBeGreaterThan(0);
    expect(Math.abs(r.ports[1].flowRate + r.ports[0].flowRate)).toBeLessThan(1e-6 * r.ports[0].flowRate);
    expect(r.probes[0].velocity![0]).toBeGreaterThan(0);
    expect(r.warnings.map((w) => w.code)).not.toContain('flow-model-interim');
  });

  it('gives the high-voltage caution for a floating port that floats above 50 V', () => {
    const design = makeDesign({
      shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 2e-3, height: 1e-4 }, { op: 'add', type: 'rect', x: 9.5e-4, y: 1e-4, width: 1e-4, height: 5e-4 }],
      ports: [
        { id: 'A', from: [0, 0], to: [0, 1e-4], potential: 40 },
        { id: 'B', from: [2e-3, 0], to: [2e-3, 1e-4], potential: 120 },
        { id: 'F', from: [9.5e-4, 6e-4], to: [1.05e-3, 6e-4], potential: null },
      ],
    });
    const r = solveDesign(design, { cells: 200 });
    expect(r.ports[2].potential).toBeCloseTo(80, 4);
    expect(r.warnings.find((w) => w.code === 'high-voltage')?.message).toMatch(/120 V/);
  });
});
