/**
 * Pressure-driven flow in straight channels against closed forms (physics.md §3; reference-values.md §5).
 *
 * In a straight channel of width w and depth d under a pressure gradient G = Δp/L the depth-averaged
 * Brinkman model has, across the width (Gondret, Rakotomalala, Rabaud, Salin & Watzky, Phys. Fluids 9, 1841
 * (1997); reference-values.md §5, "depth-averaged model"):
 *   u(y) = G d²/(12 μ) (1 − cosh(k y)/cosh(k w/2)),  k = √12/d,  Q = f_B w d³ G/(12 μ),
 *   f_B = 1 − (2/(k w)) tanh(k w/2),
 * and for d ≫ w plane Poiseuille flow between the side walls, u(y) = G y (w − y)/(2 μ) (White, Viscous Fluid
 * Flow, 3rd ed. 2006, ch. 3). The exact rectangular duct (White 2006 §3-3; Bruus, Theoretical Microfluidics,
 * 2008) has f = 1 − (192/π⁵)(d/w) Σ_{n odd} tanh(nπw/2d)/n⁵; the model's error against it is reported.
 */
import { makeDesign } from '../fixtures/designs';
import { flowFields } from '../../solver/flow/flow-fields';
import { flowMetrics } from '../../solver/flow/flow-metrics';
import { reynolds } from '../../solver/physics/electrokinetics';
import { convergenceOrder, runFlow, type FlowRun } from './flow-helpers';

const MU = 8.9002e-4; // WATER_25C viscosity

function channel(w: number, L: number, d: number, dp: number) {
  return makeDesign({
    depth: d,
    zeta: { side: 0, floor: 0, lid: 0 },
    shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: L, height: w }],
    ports: [
      { id: 'in', from: [0, 0], to: [0, w], potential: 0, pressure: dp },
      { id: 'out', from: [L, 0], to: [L, w], potential: 0, pressure: 0 },
    ],
  });
}

/** Largest |u − exact| over the x-faces of the column nearest mid-length, relative to the largest exact value. */
function profileError(run: FlowRun, L: number, w: number, exact: (y: number) => number): number {
  const { grid, solution } = run;
  const i = Math.round((L / 2 - grid.x0) / grid.spacing);
  let err = 0, top = 0;
  for (let j = 0; j < grid.ny; j++) {
    const f = i + j * (grid.nx + 1);
    if (!(grid.apertureX[f] > 0)) continue;
    // The node sits in the middle of its face's open part.
    const y = Math.min(grid.y0 + (j + 0.5) * grid.spacing, grid.y0 + j * grid.spacing + grid.apertureX[f] * grid.spacing / 2);
    err = Math.max(err, Math.abs(solution.u[f] - exact(y)));
    top = Math.max(top, Math.abs(exact(y)));
  }
  expect(top).toBeGreaterThan(0);
  return err / top;
}

function brinkman(w: number, d: number, G: number) {
  const k = Math.sqrt(12) / d;
  return {
    profile: (y: number) => ((G * d * d) / (12 * MU)) * (1 - Math.cosh(k * (y - w / 2)) / Math.cosh((k * w) / 2)),
    factor: 1 - (2 / (k * w)) * Math.tanh((k * w) / 2),
  };
}

/** Exact duct factor f(d/w), series over odd n (White 2006; Bruus 2008), d ≤ w. */
function ductFactor(ratio: number): number {
  let sum = 0;
  for (let n = 1; n < 2000; n += 2) sum += Math.tanh((n * Math.PI) / (2 * ratio)) / n ** 5;
  return 1 - (192 / Math.PI ** 5) * ratio * sum;
}

describe('straight channel under a pressure drop: the Brinkman profile across the width', () => {
  const w = 1e-4, L = 4e-4, d = 5e-5, dp = 100;
  const G = dp / L;
  const exact = brinkman(w, d, G);

  it('converges at second order on a grid-aligned channel (profile and flow rate; Gondret et al. 1997)', () => {
    const h: number[] = [], profile: number[] = [], rate: number[] = [];
    for (const cells of [64, 128, 256]) {
      const run = runFlow(channel(w, L, d, dp), cells, { tolerance: 1e-11 });
      h.push(run.grid.spacing);
      profile.push(profileError(run, L, w, exact.profile));
      const q = exact.factor * (w * d ** 3 * G) / (12 * MU);
      rate.push(Math.abs(run.solution.portFlowRate[0] / q - 1));
      expect(run.solution.portFlowRate[0]).toBeGreaterThan(0); // the high-pressure port feeds the channel
    }
    const pOrder = convergenceOrder(h, profile), qOrder = convergenceOrder(h, rate);
    console.log(
      `Brinkman channel (d/w = 0.5), grid-aligned walls: cells across ${h.map((x) => Math.round(w / x)).join(', ')}; ` +
        `profile max error ${profile.map((e) => e.toExponential(2)).join(', ')} (order ${pOrder.toFixed(2)}); ` +
        `flow rate error ${rate.map((e) => e.toExponential(2)).join(', ')} (order ${qOrder.toFixed(2)})`,
    );
    expect(pOrder).toBeGreaterThan(1.8);
    expect(qOrder).toBeGreaterThan(1.8);
    expect(profile[profile.length - 1]).toBeLessThan(2e-3);
  });

  it('converges at least at first order when the side wall cuts the cells (half-cell offset)', () => {
    // 4 cells of L per w: with cells ≡ 2 (mod 4) the top wall lies half-way through a row of cells.
    const h: number[] = [], profile: number[] = [];
    for (const cells of [62, 126, 254]) {
      const run = runFlow(channel(w, L, d, dp), cells, { tolerance: 1e-11 });
      h.push(run.grid.spacing);
      profile.push(profileError(run, L, w, exact.profile));
    }
    const order = convergenceOrder(h, profile);
    console.log(
      `Brinkman channel, cut top wall: cells across ${h.map((x) => (w / x).toFixed(1)).join(', ')}; ` +
        `profile max error ${profile.map((e) => e.toExponential(2)).join(', ')} (order ${order.toFixed(2)})`,
    );
    expect(order).toBeGreaterThan(1.2);
    expect(profile[profile.length - 1]).toBeLessThan(5e-3);
  });
});

describe('a channel at 30° to the grid: cut walls everywhere and oblique (staircase) ports', () => {
  it('converges to the closed-form flow rate, as a Stokes channel (d ≫ w, about first order) and as a Brinkman one', () => {
    const w = 1e-4, L = 1e-3, dp = 100, G = dp / L;
    const c = Math.cos(Math.PI / 6), s = Math.sin(Math.PI / 6);
    const rotated = (d: number) => makeDesign({
      depth: d,
      zeta: { side: 0, floor: 0, lid: 0 },
      shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: L, height: w, angle: 30 }],
      ports: [
        { id: 'in', from: [0, 0], to: [-s * w, c * w], potential: 0, pressure: dp },
        { id: 'out', from: [c * L, s * L], to: [c * L - s * w, s * L + c * w], potential: 0, pressure: 0 },
      ],
    });
    const lines: string[] = [];
    for (const d of [2, 5e-5]) {
      const exact = d > 1 ? (d * G * w ** 3) / (12 * MU) : (brinkman(w, d, G).factor * w * d ** 3 * G) / (12 * MU);
      const h: number[] = [], err: number[] = [];
      for (const cells of [100, 200, 400]) {
        const run = runFlow(rotated(d), cells, { tolerance: 1e-10 });
        h.push(run.grid.spacing);
        err.push(Math.abs(run.solution.portFlowRate[0] / exact - 1));
      }
      const order = convergenceOrder(h, err);
      lines.push(`d = ${d} m: flow rate error ${err.map((e) => e.toExponential(2)).join(', ')} at ${h.map((x) => (w / x).toFixed(0)).join(', ')} cells across (order ${order.toFixed(2)})`);
      expect(err[2]).toBeLessThan(err[0]);
      expect(err[2]).toBeLessThan(0.015);
      if (d > 1) expect(order).toBeGreaterThan(0.7);
    }
    console.log(`Channel at 30°:\n  ${lines.join('\n  ')}`);
  });
});

describe('derived numbers of the Brinkman channel', () => {
  it('gives the wall shear rate, the floor shear rate, the top speed, the mean speed per port and the Reynolds number', () => {
    const w = 1e-4, L = 4e-4, d = 5e-5, dp = 100, G = dp / L, k = Math.sqrt(12) / d;
    const run = runFlow(channel(w, L, d, dp), 256, { tolerance: 1e-11 });
    const fields = flowFields(run.problem, run.solution);
    const m = flowMetrics(run.problem, run.solution, fields, { density: 997.047, narrowestWidth: w });
    const U = (G * d * d) / (12 * MU);
    const top = U * (1 - 1 / Math.cosh((k * w) / 2)); // centre of the channel
    // From the closed form: du/dy at the side wall = U k tanh(k w/2); at floor and lid the Poiseuille part of
    // the depth profile with mean ū has shear 6 ū/d (plane Poiseuille, White 2006).
    const wallShear = U * k * Math.tanh((k * w) / 2);
    const mean = run.solution.portFlowRate[0] / (w * d);
    console.log(
      `Brinkman channel metrics at 64 cells across: wall shear ${m.maxWallShearRate.toFixed(1)} 1/s (closed form ${wallShear.toFixed(1)}), ` +
        `floor shear ${m.maxFloorShearRate.toFixed(1)} 1/s (6 u_max/d = ${((6 * top) / d).toFixed(1)}), top speed ${m.maxSpeed.toExponential(4)} m/s ` +
        `(${top.toExponential(4)}), mean speed at the inlet ${m.portMeanSpeed[0].toExponential(4)} m/s, Re ${m.reynolds.toFixed(3)}`,
    );
    expect(Math.abs(m.maxWallShearRate / wallShear - 1)).toBeLessThan(5e-3);
    expect(Math.abs(m.maxFloorShearRate / ((6 * top) / d) - 1)).toBeLessThan(1e-3);
    expect(Math.abs(m.maxSpeed / top - 1)).toBeLessThan(1e-3);
    expect(m.portMeanSpeed[0]).toBeCloseTo(mean, 12);
    expect(m.portMeanSpeed[1]).toBeCloseTo(mean, 9);
    expect(m.reynolds).toBeCloseTo(reynolds(997.047, m.maxSpeed, w, d, MU), 12);
  });
});

describe('depth-averaged model against the exact rectangular duct (reported, not asserted to vanish)', () => {
  it('reproduces its own flow factor f_B and shows its error against the duct series for d/w = 0.1 to 1', () => {
    // reference-values.md §5 table: (f_B − f)/f = +0.56 %, +1.57 %, +3.77 %, +8.53 % for d/w = 0.1, 0.25, 0.5, 1.
    const table = new Map([[0.1, 0.0056], [0.25, 0.0157], [0.5, 0.0377], [1, 0.0853]]);
    const w = 1e-4, L = 2e-4, dp = 100, G = dp / L;
    const lines: string[] = [];
    for (const [ratio, published] of table) {
      const d = ratio * w;
      const run = runFlow(channel(w, L, d, dp), 128, { tolerance: 1e-11 });
      const fNum = (run.solution.portFlowRate[0] * 12 * MU) / (w * d ** 3 * G);
      const fB = brinkman(w, d, G).factor;
      const f = ductFactor(ratio);
      lines.push(
        `d/w = ${ratio}: model on the grid f = ${fNum.toFixed(5)}, closed form f_B = ${fB.toFixed(5)}, exact duct f = ${f.toFixed(5)}, ` +
          `model error (f_num − f)/f = ${(100 * (fNum / f - 1)).toFixed(2)} % (table: +${(100 * published).toFixed(2)} %)`,
      );
      expect(Math.abs(fNum / fB - 1)).toBeLessThan(3e-3);
      expect(Math.abs(fB / f - 1 - published)).toBeLessThan(5e-5);
    }
    console.log(`Flow factor of the depth-averaged model against the exact duct (64 cells across w):\n  ${lines.join('\n  ')}`);
  });
});

describe('deep channel (d ≫ w): plane Poiseuille flow between the side walls', () => {
  it('matches u = G y (w − y)/(2 μ) and q = G w³/(12 μ) per unit depth (White 2006), at second order', () => {
    const w = 1e-4, L = 4e-4, d = 2, dp = 1;
    const G = dp / L;
    const exact = (y: number) => (G * y * (w - y)) / (2 * MU);
    const h: number[] = [], profile: number[] = [];
    let last = 0;
    for (const cells of [32, 64, 128]) {
      const run = runFlow(channel(w, L, d, dp), cells, { tolerance: 1e-11 });
      h.push(run.grid.spacing);
      profile.push(profileError(run, L, w, exact));
      last = run.solution.portFlowRate[0] / d / ((G * w ** 3) / (12 * MU));
    }
    const order = convergenceOrder(h, profile);
    console.log(
      `Deep channel (d/w = 2·10⁴): profile max error ${profile.map((e) => e.toExponential(2)).join(', ')} (order ${order.toFixed(2)}); ` +
        `flow rate / plane Poiseuille = ${last.toFixed(5)} at ${Math.round(w / h[h.length - 1])} cells across`,
    );
    expect(order).toBeGreaterThan(1.8);
    expect(Math.abs(last - 1)).toBeLessThan(2e-3);
  });
});
