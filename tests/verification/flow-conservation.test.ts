/**
 * Discrete mass balance, linearity and the streamfunction of a multiply connected layout (physics.md §3, §7).
 */
import { loadFixture } from '../fixtures/designs';
import { addDivergence } from '../../solver/flow/divergence';
import { streamfunctionCorners } from '../../solver/flow/streamfunction';
import { runFlow } from './flow-helpers';

describe('mass balance', () => {
  it('sums the port flow rates to zero to round-off of the continuity residual (cross injector, four ports)', () => {
    const design = loadFixture('cross-injector');
    design.ports[0].pressure = 300;
    design.ports[2].pressure = -150;
    const { grid, solution, problem } = runFlow(design, 240, { tolerance: 1e-12 });
    const q = solution.portFlowRate;
    const net = q.reduce((s, v) => s + v, 0);
    const total = q.reduce((s, v) => s + Math.abs(v), 0);
    // The aperture-weighted divergence telescopes: Σ_k Q_k = −d Σ_c (B u)_c exactly, whatever the residual.
    const div = new Float64Array(grid.nx * grid.ny);
    addDivergence(grid, solution.ports, null, solution.u, solution.v, div, 1);
    const residualSum = -problem.depth * div.reduce((s, v) => s + v, 0);
    console.log(
      `Cross injector: Q = ${[...q].map((v) => v.toExponential(4)).join(', ')} m³/s; Σ Q / Σ |Q| = ${(net / total).toExponential(2)}; ` +
        `Σ Q − (−d Σ div) = ${(net - residualSum).toExponential(2)} m³/s; MINRES ${solution.iterations} iterations`,
    );
    expect(Math.abs(net - residualSum)).toBeLessThan(1e-12 * total);
    expect(Math.abs(net) / total).toBeLessThan(1e-10);
    expect(solution.massImbalance).toBeLessThan(1e-10);
  });
});

describe('linearity (physics.md §7)', () => {
  it('solves slip plus a pressure head as the sum of the two separate solves (expansion chamber with pillars and a wall zone)', () => {
    const both = loadFixture('expansion-chamber'); // inlet at 200 V and 500 Pa
    const slipOnly = loadFixture('expansion-chamber');
    slipOnly.ports.forEach((p) => { p.pressure = 0; });
    const headOnly = loadFixture('expansion-chamber');
    headOnly.ports.forEach((p) => { p.potential = 0; });
    const options = { tolerance: 1e-12 };
    const [a, b, c] = [slipOnly, headOnly, both].map((d) => runFlow(d, 300, options).solution);
    let err = 0, top = 0;
    for (const key of ['u', 'v'] as const) {
      for (let k = 0; k < c[key].length; k++) {
        err = Math.max(err, Math.abs(c[key][k] - a[key][k] - b[key][k]));
        top = Math.max(top, Math.abs(c[key][k]));
      }
    }
    let perr = 0, ptop = 0;
    for (let k = 0; k < c.pressure.length; k++) {
      if (!Number.isFinite(c.pressure[k])) continue;
      perr = Math.max(perr, Math.abs(c.pressure[k] - a.pressure[k] - b.pressure[k]));
      ptop = Math.max(ptop, Math.abs(c.pressure[k]));
    }
    const qSum = a.portFlowRate[0] + b.portFlowRate[0];
    console.log(
      `Linearity: Q(slip) = ${a.portFlowRate[0].toExponential(4)}, Q(head) = ${b.portFlowRate[0].toExponential(4)}, ` +
        `Q(both) = ${c.portFlowRate[0].toExponential(4)} m³/s; largest velocity difference / max |u| = ${(err / top).toExponential(2)}, ` +
        `pressure ${(perr / ptop).toExponential(2)}`,
    );
    expect(err / top).toBeLessThan(1e-8);
    expect(perr / ptop).toBeLessThan(1e-8);
    expect(Math.abs(c.portFlowRate[0] / qSum - 1)).toBeLessThan(1e-8);
  });
});

describe('streamfunction around pillars', () => {
  it('is single-valued: constant inside each pillar, and the two outer walls differ by Q/d', () => {
    const design = loadFixture('expansion-chamber');
    const { grid, solution, problem } = runFlow(design, 450, { tolerance: 1e-12 });
    const psi = streamfunctionCorners(grid, solution.ports, solution.u);
    const q = solution.portFlowRate[0] / problem.depth; // m²/s
    const { nx, spacing: h, x0, y0 } = grid;
    const at = (x: number, y: number) => psi[Math.round((x - x0) / h) + Math.round((y - y0) / h) * (nx + 1)];
    const pillars = design.shapes.filter((s) => s.op === 'subtract' && s.type === 'circle');
    expect(pillars.length).toBe(12);
    const inside: number[] = [];
    for (const pillar of pillars) {
      if (pillar.type !== 'circle') continue;
      const [cx, cy] = pillar.center;
      const values: number[] = [];
      for (let j = 0; j <= grid.ny; j++) {
        for (let i = 0; i <= nx; i++) {
          if (Math.hypot(x0 + i * h - cx, y0 + j * h - cy) < pillar.radius - 1.05 * h) values.push(psi[i + j * (nx + 1)]);
        }
      }
      expect(values.length).toBeGreaterThan(4);
      const spread = Math.max(...values) - Math.min(...values);
      expect(spread).toBeLessThan(1e-8 * Math.abs(q));
      inside.push(values[0]);
    }
    // The outer walls of the chamber, mid-chamber.
    const bottom = at(1.5e-3, -3e-4), top = at(1.5e-3, 3e-4); // corners on the walls
    console.log(
      `Streamfunction: ψ_top − ψ_bottom = ${(top - bottom).toExponential(5)} m²/s, Q/d = ${q.toExponential(5)} m²/s; ` +
        `pillars at ψ/(Q/d) = ${inside.map((v) => ((v - bottom) / q).toFixed(3)).join(' ')}`,
    );
    expect(Math.abs((top - bottom) / q - 1)).toBeLessThan(1e-8);
    for (const v of inside) {
      expect((v - bottom) / q).toBeGreaterThan(0);
      expect((v - bottom) / q).toBeLessThan(1);
    }
  });
});

describe('iterations independent of the resolution', () => {
  it('needs about as many MINRES iterations on the serpentine at 128 and at 256 cells (counted, not timed)', () => {
    const design = loadFixture('serpentine');
    const counts = [128, 256].map((cells) => runFlow(design, cells).solution.iterations);
    console.log(`Serpentine: MINRES iterations ${counts.join(' → ')} (128 → 256 cells, tolerance 1e-9)`);
    expect(counts[1]).toBeLessThanOrEqual(counts[0] + 5);
  });
});
