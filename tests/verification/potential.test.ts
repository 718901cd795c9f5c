/**
 * The electric potential on cut cells against closed forms (physics.md §2, reference-values.md §8).
 * Each check names its source; convergence orders are printed.
 */
import type { DesignDocument } from '../../shared/design';
import { discretiseDesign } from '../../solver/grid/discretise';
import { cutIndex, fluidCentroid } from '../../solver/grid/cut-cell-grid';
import { electricField, electrodePower, fieldPower, solvePotential } from '../../solver/potential';
import { electroosmoticMobility } from '../../solver/physics/electrokinetics';
import { solveDesign } from '../../solver/solve';
import { loadFixture, makeDesign } from '../fixtures/designs';

function potentialOf(design: DesignDocument, cells: number, tolerance = 1e-8) {
  const disc = discretiseDesign(design, { cells });
  if (!disc.ok) throw new Error(disc.problems.map((p) => p.message).join('; '));
  const grid = disc.grid!;
  const sol = solvePotential(grid, disc.components!, design.ports, design.buffer.conductivity * design.depth, { tolerance });
  const field = electricField(grid, sol.active, sol.potential, sol.portPotential);
  return { grid, sol, field };
}

/** Least-squares slope of log(error) against log(h): the observed order of convergence. */
function fittedOrder(h: number[], e: number[]): number {
  const x = h.map(Math.log), y = e.map(Math.log);
  const mx = x.reduce((a, b) => a + b) / x.length, my = y.reduce((a, b) => a + b) / y.length;
  let sxy = 0, sxx = 0;
  x.forEach((xi, k) => { sxy += (xi - mx) * (y[k] - my); sxx += (xi - mx) ** 2; });
  return sxy / sxx;
}

describe('linear potential in a rectangle (exact: φ = V_A (1 − x/L), the discrete solution is linear too)', () => {
  const L = 1e-3, w = 1e-4, V = 10;
  const design = makeDesign({
    shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: L, height: w }],
    ports: [
      { id: 'A', from: [0, 0], to: [0, w], potential: V },
      { id: 'B', from: [L, 0], to: [L, w], potential: 0 },
    ],
  });
  const { grid, sol, field } = potentialOf(design, 400, 1e-13);
  const sigmaDepth = design.buffer.conductivity * design.depth;

  it('reproduces φ, E and the current to round-off', () => {
    let worstPhi = 0, worstE = 0;
    for (let c = 0; c < grid.nx * grid.ny; c++) {
      if (!sol.active[c]) continue;
      const [x] = fluidCentroid(grid, c);
      worstPhi = Math.max(worstPhi, Math.abs(sol.potential[c] - V * (1 - x / L)));
      worstE = Math.max(worstE, Math.abs(field.x[c] - V / L), Math.abs(field.y[c]));
    }
    expect(worstPhi / V).toBeLessThan(1e-11);
    expect(worstE / (V / L)).toBeLessThan(1e-9);
    // Ohm's law for the bar, R = L / (σ d w); current positive where it enters the fluid (physics.md §2).
    expect(sol.portCurrent[0] / ((sigmaDepth * w * V) / L)).toBeCloseTo(1, 11);
    expect(sol.portCurrent[1] / ((-sigmaDepth * w * V) / L)).toBeCloseTo(1, 11);
  });

  it('gives the same Joule power from Σ V_k I_k and from ∫ σ|E|² dV (physics.md §2)', () => {
    const electrodes = electrodePower(sol.portPotential, sol.portCurrent);
    const heat = fieldPower(grid, sol.active, field, design.buffer.conductivity, design.depth);
    expect(electrodes).toBeCloseTo((sigmaDepth * w * V * V) / L, 15);
    expect(heat / electrodes).toBeCloseTo(1, 9);
  });
});

describe('annular-sector bend (reference-values.md §8: φ linear in angle, |E| = ΔV/(Θ r), R = Θ/(σ d ln(r_o/r_i)))', () => {
  const ri = 1e-4, ro = 2e-4, dV = 10, theta = Math.PI / 2;
  const design = makeDesign({
    shapes: [{ op: 'add', type: 'sector', center: [0, 0], innerRadius: ri, outerRadius: ro, startAngle: 0, endAngle: 90 }],
    ports: [
      { id: 'A', from: [ri, 0], to: [ro, 0], potential: dV },
      { id: 'B', from: [0, ri], to: [0, ro], potential: 0 },
    ],
  });
  const R = theta / (design.buffer.conductivity * design.depth * Math.log(ro / ri));

  it('has the published resistance of the worked example (8.019e5 Ω with σ = 0.1413 S/m, d = 20 µm)', () => {
    expect(R / 8.019e5).toBeCloseTo(1, 3);
  });

  it('converges in φ, |E| and R at least at first order with curved cut-cell walls (orders printed)', () => {
    const rows: Array<{ cells: number; h: number; phiL2: number; eMean: number; eMax: number; r: number }> = [];
    for (const cells of [32, 64, 128, 256]) {
      const { grid, sol, field } = potentialOf(design, cells, 1e-12);
      let area = 0, phi2 = 0, eSum = 0, eMax = 0;
      const eScale = dV / (theta * ri); // the largest field, at the inner wall
      for (let c = 0; c < grid.nx * grid.ny; c++) {
        if (!sol.active[c]) continue;
        const [x, y] = fluidCentroid(grid, c);
        const f = grid.fraction[c];
        const exactPhi = dV * (1 - Math.atan2(y, x) / theta);
        const exactE = dV / (theta * Math.hypot(x, y));
        const eErr = Math.abs(Math.hypot(field.x[c], field.y[c]) - exactE) / eScale;
        area += f;
        phi2 += f * ((sol.potential[c] - exactPhi) / dV) ** 2;
        eSum += f * eErr;
        eMax = Math.max(eMax, eErr);
      }
      rows.push({ cells, h: grid.spacing, phiL2: Math.sqrt(phi2 / area), eMean: eSum / area, eMax, r: Math.abs(dV / sol.portCurrent[0] / R - 1) });
    }
    const order = (key: 'phiL2' | 'eMean' | 'r') => fittedOrder(rows.map((r) => r.h), rows.map((r) => r[key]));
    const lines = rows.map((r, k) => {
      const o = (key: 'phiL2' | 'eMean' | 'eMax' | 'r') => (k === 0 ? '   —' : Math.log2(rows[k - 1][key] / r[key]).toFixed(2).padStart(5));
      return `${String(r.cells).padStart(5)} ${(r.h * 1e6).toFixed(3).padStart(8)} µm  φ L2 ${r.phiL2.toExponential(2)} (${o('phiL2')})  ` +
        `|E| mean ${r.eMean.toExponential(2)} (${o('eMean')})  |E| max ${r.eMax.toExponential(2)} (${o('eMax')})  R ${r.r.toExponential(2)} (${o('r')})`;
    });
    console.log(
      'Annular sector r_i = 100 µm, r_o = 200 µm, 90°: relative errors (order against the previous row)\n' +
        lines.join('\n') +
        `\nfitted orders: φ L2 ${order('phiL2').toFixed(2)}, |E| mean ${order('eMean').toFixed(2)}, R ${order('r').toFixed(2)}`,
    );
    expect(order('phiL2')).toBeGreaterThan(1);
    expect(order('eMean')).toBeGreaterThan(1);
    expect(order('r')).toBeGreaterThan(1);
    const finest = rows[rows.length - 1];
    expect(finest.r).toBeLessThan(1e-4);
    expect(finest.phiL2).toBeLessThan(1e-4);
    // Worst cell (a sliver at a curved wall): a few per cent of the largest field, not more.
    expect(finest.eMax).toBeLessThan(0.05);
  });
});

describe('cross junction with long legs against the resistor network', () => {
  // Four legs of width w and length L from the centre to each port: conductance σ d w / L each,
  // Kirchhoff at the centre node. The network ignores how current spreads in the junction itself,
  // an error of order w/L (common knowledge of network models; checked here by halving w/L).
  const w = 5e-5;
  const potentials = [0, 100, 30, 60];
  const cross = (L: number) =>
    makeDesign({
      shapes: [
        { op: 'add', type: 'rect', x: -L, y: -w / 2, width: 2 * L, height: w },
        { op: 'add', type: 'rect', x: -w / 2, y: -L, width: w, height: 2 * L },
      ],
      ports: [
        { id: 'W', from: [-L, -w / 2], to: [-L, w / 2], potential: potentials[0] },
        { id: 'E', from: [L, -w / 2], to: [L, w / 2], potential: potentials[1] },
        { id: 'S', from: [-w / 2, -L], to: [w / 2, -L], potential: potentials[2] },
        { id: 'N', from: [-w / 2, L], to: [w / 2, L], potential: potentials[3] },
      ],
    });
  const deviation = (legsInWidths: number) => {
    const L = legsInWidths * w;
    const design = cross(L);
    const result = solveDesign(design, { cells: 2 * legsInWidths * 8 });
    const g = (design.buffer.conductivity * design.depth * w) / L;
    const centre = potentials.reduce((a, b) => a + b) / 4;
    const network = potentials.map((v) => g * (v - centre));
    const scale = Math.max(...network.map(Math.abs));
    return Math.max(...result.ports.map((p, k) => Math.abs(p.current - network[k]))) / scale;
  };

  it('agrees to O(w/L), and the difference halves when the legs double', () => {
    const d20 = deviation(20);
    const d40 = deviation(40);
    console.log(`cross junction: largest current deviation from the network ${(d20 * 100).toFixed(3)} % (L = 20 w), ${(d40 * 100).toFixed(3)} % (L = 40 w)`);
    expect(d20).toBeLessThan(1 / 20);
    expect(d40).toBeLessThan(1 / 40);
    expect(d40 / d20).toBeGreaterThan(0.35);
    expect(d40 / d20).toBeLessThan(0.65);
  });
});

describe('Kirchhoff: the port currents sum to zero (physics.md §2)', () => {
  it('to round-off once the linear system is solved to round-off', () => {
    const design = loadFixture('cross-injector');
    const { sol } = potentialOf(design, 300, 1e-13);
    const sum = sol.portCurrent.reduce((a, b) => a + b, 0);
    const scale = Math.max(...Array.from(sol.portCurrent, Math.abs));
    expect(Math.abs(sum) / scale).toBeLessThan(1e-11);
  });

  it('to the solver tolerance at the default relative residual 1e-8', () => {
    const result = solveDesign(loadFixture('cross-injector'), { cells: 300 });
    const currents = result.ports.map((p) => p.current);
    const sum = currents.reduce((a, b) => a + b, 0);
    expect(Math.abs(sum) / Math.max(...currents.map(Math.abs))).toBeLessThan(1e-5);
  });
});

describe('floating port (physics.md §2: uniform unknown potential, zero net current)', () => {
  // The T junction is symmetric about its branch, so the branch floats at the mid potential.
  const design = loadFixture('t-junction');
  const result = solveDesign(design, { cells: 600 });
  const [a, b, c] = result.ports;

  it('carries no current', () => {
    expect(Math.abs(c.current)).toBeLessThan(1e-6 * Math.abs(a.current));
    expect(a.current).toBeGreaterThan(0);
    expect(b.current / -a.current).toBeCloseTo(1, 6);
  });

  it('sits at the potential of the junction (250 V by symmetry)', () => {
    expect(c.potential).not.toBeNull();
    expect(c.potential! / 250).toBeCloseTo(1, 6);
  });
});

describe('electroosmotic flow rate Q = μ_eo I / σ for uniform zeta (physics.md §3, reference-values.md §9)', () => {
  const design = loadFixture('cross-injector');
  const result = solveDesign(design, { cells: 600 });
  const mu = electroosmoticMobility(design.buffer.relativePermittivity, design.buffer.viscosity, design.zeta.side);

  // Uniform zeta on every wall, floor and lid and equal port pressures: u = μ_eo E everywhere (similitude,
  // Cummings et al. 2000), so the relation is exact for the model and holds to the discretisation error of
  // whichever flow stage solveDesign runs (identically for the interim u = μ_eo E).
  it('holds at every port, with liquid entering where current enters (μ_eo > 0 for glass)', () => {
    for (const port of result.ports) {
      expect(port.flowRate / ((mu * port.current) / design.buffer.conductivity)).toBeCloseTo(1, 2);
      expect(Math.sign(port.flowRate)).toBe(Math.sign(port.current));
    }
  });

  it('matches the flux of the velocity field across the waste leg', () => {
    // Cut across the right leg at x = 2 mm: Q = d Σ u_x h over the cells of that column.
    const f = result.fields;
    const i = Math.floor((2e-3 - f.x0) / f.spacing);
    let q = 0;
    for (let j = 0; j < f.ny; j++) {
      const c = i + j * f.nx;
      if (f.fraction[c] > 0) q += f.velocityX[c] * f.fraction[c] * f.spacing * design.depth;
    }
    const waste = result.ports.find((p) => p.id === 'W')!;
    // Liquid flows from the leg into the waste port: the cut's flux towards +x is −Q_W (Q_W > 0 enters the chip).
    expect(q / -waste.flowRate).toBeCloseTo(1, 2);
    expect(q / ((-mu * waste.current) / design.buffer.conductivity)).toBeCloseTo(1, 2);
  });
});

describe('Joule power two ways on a bend with cut cells (physics.md §2)', () => {
  it('Σ V_k I_k and ∫ σ|E|² dV agree to the discretisation error', () => {
    const design = loadFixture('bend-90');
    const { grid, sol, field } = potentialOf(design, 256);
    const electrodes = electrodePower(sol.portPotential, sol.portCurrent);
    const heat = fieldPower(grid, sol.active, field, design.buffer.conductivity, design.depth);
    expect(Math.abs(heat / electrodes - 1)).toBeLessThan(2e-3);
    // Every cut cell got a finite field.
    for (let c = 0; c < grid.nx * grid.ny; c++) {
      if (sol.active[c] && cutIndex(grid, c) >= 0) expect(Number.isFinite(field.x[c] + field.y[c])).toBe(true);
    }
  });
});
