import { boundedLeastSquares, planSettings, settingsOf, superposeField, superposePorts, unitResponses } from '../../solver/planner';
import { solveDesign } from '../../solver/solve';
import { loadFixture } from '../fixtures/designs';

/**
 * The voltage planner rests on linearity (physics.md §7): the fields are linear in the port potentials and
 * pressures, so unit responses superpose. Checked here against direct solves, and by a round trip.
 */
describe('voltage planner', () => {
  const design = loadFixture('cross-injector');
  const options = { cells: 160, tolerance: 1e-12 };
  const responses = unitResponses(design, options);

  it('superposed port currents, flow rates and fields equal a direct solve to round-off', () => {
    const s = settingsOf(design, responses.drives);
    const direct = solveDesign(design, options);
    const ports = superposePorts(responses, s);
    const scaleI = Math.max(...direct.ports.map((p) => Math.abs(p.current)));
    const scaleQ = Math.max(...direct.ports.map((p) => Math.abs(p.flowRate)));
    direct.ports.forEach((p, j) => {
      expect(Math.abs(ports[j].current - p.current) / scaleI).toBeLessThan(1e-9);
      expect(Math.abs(ports[j].flowRate - p.flowRate) / scaleQ).toBeLessThan(1e-9);
    });
    for (const name of ['potential', 'velocityX', 'velocityY'] as const) {
      const sup = superposeField(responses, name, s);
      const ref = direct.fields[name];
      let worst = 0;
      let scale = 0;
      for (let c = 0; c < ref.length; c++) {
        if (Number.isNaN(ref[c])) {
          expect(Number.isNaN(sup[c])).toBe(true);
          continue;
        }
        worst = Math.max(worst, Math.abs(sup[c] - ref[c]));
        scale = Math.max(scale, Math.abs(ref[c]));
      }
      // Fields are stored in single precision: round-off there is about 1e-7 of the largest value.
      expect(worst / scale).toBeLessThan(1e-5);
    }
  });

  it('recovers the settings from the flows they give (round trip), with the ground port held', () => {
    const truth = [0, 850, 240, 520]; // B, W, S, SW in volts
    const forward = superposePorts(responses, truth);
    const plan = planSettings(responses, {
      targets: forward.filter((p) => p.id !== 'B').map((p) => ({ kind: 'flow' as const, port: p.id, value: p.flowRate })),
      hold: [{ port: 'B', kind: 'potential', value: 0 }],
    });
    plan.settings.forEach((v, k) => expect(v).toBeCloseTo(truth[k], 6));
    for (const t of plan.targets) expect(Math.abs(t.residual)).toBeLessThan(1e-9 * Math.abs(t.wanted) + 1e-30);
    expect(plan.design.ports.find((p) => p.id === 'W')?.potential).toBeCloseTo(850, 6);
  });

  it('pins a leg to zero flow and meets a pinch ratio, within voltage bounds', () => {
    const plan = planSettings(responses, {
      targets: [
        { kind: 'speed', port: 'W', value: -1e-3 }, // 1 mm/s out through the waste port
        { kind: 'flow', port: 'S', value: 0 },
        { kind: 'ratio', port: 'SW', of: 'W', value: 0 },
      ],
      hold: [{ port: 'B', kind: 'potential', value: 0 }],
      bounds: [{ port: 'W', kind: 'potential', min: -2000, max: 2000 }],
    });
    for (const t of plan.targets) expect(Math.abs(t.residual)).toBeLessThan(1e-6 * Math.max(1e-3, Math.abs(t.wanted)) + 1e-18);
    const w = plan.settings[responses.drives.findIndex((d) => d.port === 'W')];
    expect(Math.abs(w)).toBeLessThanOrEqual(2000);
  });
});

describe('bounded least squares', () => {
  it('solves an unconstrained square system exactly and clamps to a bound when the optimum lies outside', () => {
    expect(boundedLeastSquares([[2, 0], [0, 4]], [2, 8], [-10, -10], [10, 10])).toEqual([1, 2].map((v) => expect.closeTo(v, 12)));
    const x = boundedLeastSquares([[1, 0], [0, 1]], [5, -3], [-1, -1], [1, 1]);
    expect(x[0]).toBeCloseTo(1, 12);
    expect(x[1]).toBeCloseTo(-1, 12);
  });

  it('gives the minimum-norm solution when targets leave freedom', () => {
    const x = boundedLeastSquares([[1, 1]], [2], [-Infinity, -Infinity], [Infinity, Infinity]);
    expect(x[0]).toBeCloseTo(1, 12);
    expect(x[1]).toBeCloseTo(1, 12);
  });

  it('releases a variable clamped too early (coupled unknowns)', () => {
    // Optimum of ‖A x − b‖ in the box is x = (1, 0.5): x0 first overshoots, x1 must then move.
    const A = [[1, 1], [1, -1], [0, 1]];
    const b = [3, 0, 0.5];
    const x = boundedLeastSquares(A, b, [-1, -1], [1, 1]);
    // Check optimality against a fine scan of the box.
    const f = (u: number, v: number) => A.reduce((s, r, i) => s + (r[0] * u + r[1] * v - b[i]) ** 2, 0);
    let best = Infinity;
    for (let u = -1; u <= 1.0001; u += 0.01) for (let v = -1; v <= 1.0001; v += 0.01) best = Math.min(best, f(u, v));
    expect(f(x[0], x[1])).toBeLessThanOrEqual(best + 1e-9);
  });
});
