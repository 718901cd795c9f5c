/**
 * Electroosmotic flow with Smoluchowski slip (physics.md §3) against closed forms and the similitude theorem.
 */
import { makeDesign } from '../fixtures/designs';
import { faceField } from '../../solver/flow/face-field';
import { flowFields } from '../../solver/flow/flow-fields';
import { mobility } from '../../solver/flow/flow-problem';
import { portDistance } from '../../solver/flow/port-faces';
import { components } from '../../solver/flow/staggered';
import { cellCentre } from '../../solver/grid/cut-cell-grid';
import { runFlow, type FlowRun } from './flow-helpers';

const um = 1e-6;

describe('uniform zeta, equal port pressures: u = μ_eo E (Cummings, Griffiths, Nilson & Paul, Anal. Chem. 72, 2526 (2000))', () => {
  // A 50 µm channel that widens into a 150 µm chamber, narrows again and turns through a 90° bend
  // (reference-values.md §9: all conditions of the similitude hold).
  const zeta = -0.05;
  const design = makeDesign({
    zeta: { side: zeta },
    shapes: [
      { op: 'add', type: 'rect', x: 0, y: 0, width: 600 * um, height: 50 * um },
      { op: 'add', type: 'rect', x: 600 * um, y: -50 * um, width: 300 * um, height: 150 * um },
      { op: 'add', type: 'rect', x: 900 * um, y: 0, width: 300 * um, height: 50 * um },
      { op: 'add', type: 'sector', center: [1200 * um, 250 * um], innerRadius: 200 * um, outerRadius: 250 * um, startAngle: -90, endAngle: 0 },
      { op: 'add', type: 'rect', x: 1400 * um, y: 250 * um, width: 50 * um, height: 300 * um },
    ],
    ports: [
      { id: 'in', from: [0, 0], to: [0, 50 * um], potential: 100, pressure: 0 },
      { id: 'out', from: [1400 * um, 550 * um], to: [1450 * um, 550 * um], potential: 0, pressure: 0 },
    ],
  });
  const w = 50 * um;
  // The expansion's four re-entrant corners make E singular (r^(-1/3)); "bulk" is farther than 2w from them.
  const corners = [[600, 0], [600, 50], [900, 0], [900, 50]].map(([x, y]) => [x * um, y * um]);
  const bulk = (x: number, y: number) => corners.every(([cx, cy]) => Math.hypot(x - cx, y - cy) > 2 * w);

  function measure(run: FlowRun) {
    const { grid, problem, solution } = run;
    const m = mobility(problem, zeta);
    let se = 0, sn = 0;
    for (const comp of components(grid)) {
      const E = faceField(grid, comp, problem.potential, new Float64Array(comp.n1 * comp.n2));
      const vel = comp.axis === 0 ? solution.u : solution.v;
      for (let b = 0; b < comp.nb; b++) {
        for (let a = 1; a < comp.cellsA; a++) {
          const n = comp.node(a, b), ap = comp.normalAperture[n];
          if (!(ap > 0)) continue;
          const along = comp.facePlane(a), across = comp.tangentialPlane(b) + grid.spacing / 2;
          const [x, y] = comp.axis === 0 ? [along, across] : [across, along];
          if (!bulk(x, y)) continue;
          se += ap * (vel[n] - m * E[n]) ** 2;
          sn += ap * (m * E[n]) ** 2;
        }
      }
    }
    const fields = flowFields(problem, solution);
    let U = 0, wSum = 0, count = 0, pMin = Infinity, pMax = -Infinity;
    for (let c = 0; c < grid.nx * grid.ny; c++) {
      if (!(grid.fraction[c] > 0)) continue;
      U = Math.max(U, Math.hypot(fields.velocityX[c], fields.velocityY[c]));
      const [x, y] = cellCentre(grid, c);
      if (!bulk(x, y)) continue;
      wSum += fields.vorticity[c] ** 2;
      count++;
      pMin = Math.min(pMin, fields.pressure[c]);
      pMax = Math.max(pMax, fields.pressure[c]);
    }
    // The pressure that would drive a speed U through the layout's length (≈ 2 mm) in Hele-Shaw flow.
    const pressureScale = (12 * problem.viscosity * U * 2e-3) / problem.depth ** 2;
    return {
      velocity: Math.sqrt(se / sn),
      vorticity: Math.sqrt(wSum / count) / (U / w),
      pressure: (pMax - pMin) / pressureScale,
    };
  }

  it('matches μ_eo E, with constant pressure and no vorticity in the bulk, to discretisation error', () => {
    const coarse = measure(runFlow(design, 200, { tolerance: 1e-10 }));
    const fine = measure(runFlow(design, 400, { tolerance: 1e-10 }));
    const show = (k: keyof typeof coarse) => `${coarse[k].toExponential(2)} → ${fine[k].toExponential(2)}`;
    console.log(
      'Similitude on an expansion and a bend (h = 7.3 → 3.6 µm): relative L2 error of u against μ_eo E ' + show('velocity') +
        '; rms vorticity / (U/w) ' + show('vorticity') + '; pressure variation / (12 μ U L/d²) ' + show('pressure'),
    );
    expect(fine.velocity).toBeLessThan(5e-3);
    expect(fine.velocity).toBeLessThan(coarse.velocity);
    expect(fine.vorticity).toBeLessThan(0.03);
    expect(fine.vorticity).toBeLessThan(coarse.vorticity);
    expect(fine.pressure).toBeLessThan(3e-3);
  });

  it('carries Q = μ_eo I / σ through each port, the flux of μ_eo E through the current-carrying port', () => {
    const run = runFlow(design, 300, { tolerance: 1e-10 });
    const { grid, problem, solution } = run;
    const seg = grid.segments;
    const current = [0, 0]; // per σ d
    for (let s = 0; s < seg.count; s++) {
      const k = seg.port[s];
      if (k >= 0) current[k] += (seg.length[s] / portDistance(grid, s)) * (design.ports[k].potential! - problem.potential[seg.cell[s]]);
    }
    const m = mobility(problem, zeta);
    for (const k of [0, 1]) {
      const expected = m * problem.depth * current[k];
      console.log(`Port ${design.ports[k].id}: Q / (μ_eo I/σ) = ${(solution.portFlowRate[k] / expected).toFixed(5)}`);
      expect(Math.abs(solution.portFlowRate[k] / expected - 1)).toBeLessThan(5e-3);
    }
  });
});

describe('side-wall zeta that changes halfway along a deep channel: the one-dimensional balance', () => {
  // d ≫ w (2 m against 50 µm), so floor and lid, which have one zeta for the whole chip, do not matter and the
  // flow is 2D Stokes between the side walls. A wall zone gives the right half zeta ζ₂. Lubrication in each
  // half: q = w u_i − (w³/12 μ) p'_i, the same q in both, p = 0 at both ends, so
  //   q = w (u₁ + u₂)/2 (the length-weighted mobility), p'₁ = −p'₂ = 6 μ (u₁ − u₂)/w²,
  //   p_peak = 3 μ (u₁ − u₂) L / w² at the change (derived here from plane Poiseuille flow, White 2006 ch. 3).
  const w = 50 * um, L = 2e-3, dV = 100, z1 = -0.06, z2 = -0.02;
  const design = makeDesign({
    depth: 2,
    zeta: { side: z1 },
    shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: L, height: w }],
    ports: [
      { id: 'a', from: [0, 0], to: [0, w], potential: dV, pressure: 0 },
      { id: 'b', from: [L, 0], to: [L, w], potential: 0, pressure: 0 },
    ],
    wallZones: [{ region: { type: 'rect', x: L / 2, y: -10 * um, width: L, height: w + 20 * um }, zeta: z2 }],
  });

  it('gives the flow rate of the mean mobility, a pressure peak at the change and the predicted gradients', () => {
    const { grid, problem, solution } = runFlow(design, 800, { tolerance: 1e-11 });
    const E = dV / L, mu = problem.viscosity;
    const u1 = mobility(problem, z1) * E, u2 = mobility(problem, z2) * E;
    const q = (w * problem.depth * (u1 + u2)) / 2;
    const peak = (3 * mu * (u1 - u2) * L) / (w * w);
    const slope = (6 * mu * (u1 - u2)) / (w * w);
    const j = Math.floor((w / 2 - grid.y0) / grid.spacing);
    const column = (x: number) => Math.floor((x - grid.x0) / grid.spacing);
    const p = (i: number) => solution.pressure[i + j * grid.nx];
    const atChange = (p(column(L / 2) - 1) + p(column(L / 2))) / 2; // the two cells either side of x = L/2
    const gradient = (x: number) => (p(column(x) + 5) - p(column(x) - 5)) / (10 * grid.spacing);
    let top = -Infinity, where = 0;
    solution.pressure.forEach((value, c) => {
      if (value > top) {
        top = value;
        where = cellCentre(grid, c)[0];
      }
    });
    console.log(
      `Zeta step ${z1} → ${z2} V: Q/Q_1D = ${(solution.portFlowRate[0] / q).toFixed(5)}, p at the change / p_peak = ${(atChange / peak).toFixed(4)}, ` +
        `gradients / 6μ(u₁−u₂)/w² = ${(gradient(L / 4) / slope).toFixed(4)}, ${(gradient((3 * L) / 4) / slope).toFixed(4)}; ` +
        `highest pressure at x = ${(where / um).toFixed(1)} µm (change at ${(L / 2 / um).toFixed(0)} µm)`,
    );
    expect(Math.abs(solution.portFlowRate[0] / q - 1)).toBeLessThan(1e-3);
    expect(Math.abs(atChange / peak - 1)).toBeLessThan(0.02);
    expect(Math.abs(gradient(L / 4) / slope - 1)).toBeLessThan(0.01);
    expect(Math.abs(gradient((3 * L) / 4) / slope + 1)).toBeLessThan(0.01);
    expect(Math.abs(where - L / 2)).toBeLessThan(3 * grid.spacing);
  });
});

describe('dead-end slit with floor and lid slip: the back-pressure gradient', () => {
  // A closed slit with electroosmosis carries no net flow; its back-pressure gradient is dp/dx = 12 μ u_eo / h²
  // (reference-values.md §9: 10.41 kPa/m for u_eo = 0.390 mm/s and h = 20 µm). In the depth-averaged model
  // the balance across the depth is built in: with floor and lid slip u_tb and no net flux, the pressure
  // gradient must be 12 μ u_tb / d². Setup: a straight channel, all walls at one zeta, E along it; the
  // electroosmotic solve (equal pressures) and a unit pressure-drop solve give, by linearity, the pressure
  // drop at which the net flow vanishes, the state of a dead-end channel. Side walls add their boundary
  // layers: the model's gradient is 12 μ u_eo /(d² f_B(d/w)), which tends to the slit value as w/d grows.
  const d = 20 * um, E = 1e4, zeta = -0.05;
  const channel = (w: number, L: number, z: number, V: number, p: number) =>
    makeDesign({
      depth: d,
      zeta: { side: z },
      shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: L, height: w }],
      ports: [
        { id: 'a', from: [0, 0], to: [0, w], potential: V, pressure: 0 },
        { id: 'b', from: [L, 0], to: [L, w], potential: 0, pressure: p },
      ],
    });

  it('needs 12 μ u_eo / d² (times 1/f_B for the side walls) to stop the flow', () => {
    const lines: string[] = [];
    for (const [w, cells] of [[200 * um, 160], [1000 * um, 200]]) {
      const L = w * 2 > 1e-3 ? 1e-3 : 2 * w;
      const eo = runFlow(channel(w, L, zeta, E * L, 0), cells, { tolerance: 1e-11 });
      const pressure = runFlow(channel(w, L, 0, 0, 1), cells, { tolerance: 1e-11 });
      const mu = eo.problem.viscosity;
      const ueo = mobility(eo.problem, zeta) * E;
      // Uniform zeta: the electroosmotic part is plug flow (Cummings et al. 2000), Q = u_eo w d.
      expect(Math.abs(eo.solution.portFlowRate[0] / (ueo * w * d) - 1)).toBeLessThan(1e-6);
      const stop = -eo.solution.portFlowRate[0] / pressure.solution.portFlowRate[0]; // Pa, at port b
      const slit = (12 * mu * ueo) / (d * d);
      const k = Math.sqrt(12) / d, fB = 1 - (2 / (k * w)) * Math.tanh((k * w) / 2);
      lines.push(
        `w/d = ${Math.round(w / d)}: gradient ${(stop / L / 1e3).toFixed(3)} kPa/m, slit closed form ${(slit / 1e3).toFixed(3)} kPa/m, ` +
          `ratio ${(stop / L / slit).toFixed(4)} (model 1/f_B = ${(1 / fB).toFixed(4)})`,
      );
      expect(slit / 1e3).toBeCloseTo(10.41, 1); // reference-values.md §9 worked example
      expect(Math.abs((stop / L) * fB / slit - 1)).toBeLessThan(2e-3);
    }
    console.log(`Dead-end back-pressure, u_eo = 0.390 mm/s, d = 20 µm:\n  ${lines.join('\n  ')}`);
  });
});
