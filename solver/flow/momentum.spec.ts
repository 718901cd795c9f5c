import { makeDesign } from '../../tests/fixtures/designs';
import { cellCentre } from '../grid/cut-cell-grid';
import { discretiseDesign } from '../grid/discretise';
import { apply } from '../multigrid/operator';
import { cellFieldFromFaces, faceField, wallSlip } from './face-field';
import { flowProblemFromDesign, mobility } from './flow-problem';
import { assembleMomentum } from './momentum';
import { portFaces } from './port-faces';
import { components } from './staggered';

/** A grid-aligned straight channel 400 × 50 µm with a uniform field E along x (linear potential). */
function channel(zeta: { side: number; floor?: number; lid?: number }) {
  const L = 4e-4, w = 5e-5, E = 2e4, V0 = 8;
  const design = makeDesign({
    zeta,
    shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: L, height: w }],
    ports: [
      { id: 'a', from: [0, 0], to: [0, w], potential: V0, pressure: 0 },
      { id: 'b', from: [L, 0], to: [L, w], potential: V0 - E * L, pressure: 0 },
    ],
  });
  const grid = discretiseDesign(design, { cells: 80 }).grid!;
  const phi = new Float64Array(grid.nx * grid.ny);
  for (let c = 0; c < phi.length; c++) phi[c] = grid.fraction[c] > 0 ? V0 - E * cellCentre(grid, c)[0] : Number.NaN;
  const problem = flowProblemFromDesign(design, grid, phi, [V0, V0 - E * L]);
  const comps = components(grid);
  const ports = portFaces(problem, comps);
  const slip = wallSlip(problem, cellFieldFromFaces(grid, phi));
  const blocks = comps.map((comp) => {
    const rhs = new Float64Array(comp.n1 * comp.n2);
    const { op } = assembleMomentum(problem, comp, ports, faceField(grid, comp, phi, new Float64Array(rhs.length)), comp.axis === 0 ? slip.x : slip.y, rhs);
    return { op, rhs };
  });
  return { problem, blocks, E };
}

describe('staggered momentum operator', () => {
  it('is satisfied by the plug flow u = μ_eo E when every wall has the same zeta (Cummings et al. 2000), port nodes included', () => {
    const { problem, blocks, E } = channel({ side: -0.05 });
    const U = mobility(problem, -0.05) * E;
    for (const [axis, { op, rhs }] of blocks.entries()) {
      const x = new Float64Array(rhs.length);
      for (let k = 0; k < x.length; k++) x[k] = op.active[k] && axis === 0 ? U : 0;
      const ax = new Float64Array(rhs.length);
      apply(op, x, ax);
      let scale = 0;
      for (let k = 0; k < x.length; k++) scale = Math.max(scale, Math.abs(rhs[k]), Math.abs(op.diag[k] * U));
      for (let k = 0; k < x.length; k++) expect(Math.abs(ax[k] - rhs[k])).toBeLessThan(1e-12 * scale);
    }
  });

  it('drives the depth average towards the floor-and-lid plug flow and the walls towards their own slip', () => {
    // Side walls uncharged: the wall rows are pulled to 0, the friction towards μ_eo_tb E.
    const { problem, blocks, E } = channel({ side: 0, floor: -0.05, lid: -0.03 });
    const { op, rhs } = blocks[0];
    const mTB = mobility(problem, -0.04);
    const alpha = (12 * problem.viscosity) / problem.depth ** 2;
    const h = problem.grid.spacing;
    const interior = alpha * h * h * mTB * E;
    let checked = 0;
    for (let k = 0; k < rhs.length; k++) {
      // Nodes on open faces away from the walls (port nodes have half a control volume).
      if (!op.active[k] || op.boundary[k] > 0 || problem.grid.apertureX[k] !== 1) continue;
      expect(Math.abs(rhs[k] - interior)).toBeLessThan(1e-12 * interior);
      checked++;
    }
    expect(checked).toBeGreaterThan(100);
    // The wall rows are pulled towards the walls' own slip, here 0: their right-hand side is the friction alone.
    for (let k = 0; k < rhs.length; k++) {
      if (op.active[k] && op.boundary[k] > 0 && problem.grid.apertureX[k] === 1) expect(Math.abs(rhs[k] - interior)).toBeLessThan(1e-12 * interior);
    }
  });

  it('is symmetric positive definite with a positive diagonal on every node', () => {
    const { blocks } = channel({ side: -0.05 });
    for (const { op } of blocks) {
      for (let k = 0; k < op.diag.length; k++) if (op.active[k]) expect(op.diag[k]).toBeGreaterThan(0);
      let seed = 7;
      const rand = () => ((seed = (seed * 16807) % 2147483647) / 2147483647) - 0.5;
      const n = op.n1 * op.n2;
      const x = Float64Array.from({ length: n }, (_, k) => (op.active[k] ? rand() : 0));
      const y = Float64Array.from({ length: n }, (_, k) => (op.active[k] ? rand() : 0));
      const ax = new Float64Array(n), ay = new Float64Array(n);
      apply(op, x, ax);
      apply(op, y, ay);
      let xay = 0, yax = 0, xax = 0;
      for (let k = 0; k < n; k++) {
        xay += x[k] * ay[k];
        yax += y[k] * ax[k];
        xax += x[k] * ax[k];
      }
      expect(Math.abs(xay - yax)).toBeLessThan(1e-12 * Math.abs(xax));
      expect(xax).toBeGreaterThan(0);
    }
  });
});
