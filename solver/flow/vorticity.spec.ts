import { makeDesign } from '../../tests/fixtures/designs';
import { discretiseDesign } from '../grid/discretise';
import { flowProblemFromDesign } from './flow-problem';
import { portFaces } from './port-faces';
import { components } from './staggered';
import { streamfunction } from './streamfunction';
import { vorticity } from './vorticity';

function square() {
  const design = makeDesign({
    shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 1e-4, height: 1e-4 }],
    ports: [
      { id: 'a', from: [0, 0], to: [0, 1e-4], potential: 0, pressure: 0 },
      { id: 'b', from: [1e-4, 0], to: [1e-4, 1e-4], potential: 0, pressure: 0 },
    ],
  });
  const grid = discretiseDesign(design, { cells: 20 }).grid!;
  const problem = flowProblemFromDesign(design, grid, new Float64Array(grid.nx * grid.ny), [0, 0]);
  return { grid, ports: portFaces(problem, components(grid)) };
}

describe('vorticity from the circulation around each cell', () => {
  const { grid, ports } = square();
  const { nx, ny, spacing: h, x0, y0 } = grid;
  const noSlip = { x: new Float64Array(grid.segments.count), y: new Float64Array(grid.segments.count) };
  const interior = (c: number) => {
    const i = c % nx, j = (c - i) / nx;
    return i > 1 && i < nx - 2 && j > 1 && j < ny - 2;
  };

  it('is 2Ω for a solid-body rotation u = −Ω y, v = Ω x', () => {
    const omega = 3.5;
    const u = new Float64Array((nx + 1) * ny), v = new Float64Array(nx * (ny + 1));
    for (let j = 0; j < ny; j++) for (let i = 0; i <= nx; i++) u[i + j * (nx + 1)] = -omega * (y0 + (j + 0.5) * h);
    for (let j = 0; j <= ny; j++) for (let i = 0; i < nx; i++) v[i + j * nx] = omega * (x0 + (i + 0.5) * h);
    const w = vorticity(grid, ports, u, v, noSlip);
    for (let c = 0; c < w.length; c++) if (interior(c)) expect(w[c]).toBeCloseTo(2 * omega, 9);
  });

  it('resolves the shear of plane Couette flow at the walls: ω = −du/dy = −U/W in every cell, wall cells included', () => {
    const U = 2e-3, W = 1e-4;
    const slip = { x: new Float64Array(grid.segments.count), y: new Float64Array(grid.segments.count) };
    for (let s = 0; s < grid.segments.count; s++) if (grid.segments.normalY[s] > 0.5) slip.x[s] = U; // the top wall moves
    const u = new Float64Array((nx + 1) * ny), v = new Float64Array(nx * (ny + 1));
    for (let j = 0; j < ny; j++) for (let i = 0; i <= nx; i++) if (grid.apertureX[i + j * (nx + 1)] > 0) u[i + j * (nx + 1)] = (U * (y0 + (j + 0.5) * h)) / W;
    const w = vorticity(grid, ports, u, v, slip);
    for (let j = 1; j < ny - 1; j++) for (let i = 3; i < nx - 3; i++) expect(w[i + j * nx]).toBeCloseTo(-U / W, 6);
  });
});

describe('streamfunction from the face fluxes', () => {
  it('rises by the flux between walls: ψ = U (y − y_wall) for a uniform flow through the square', () => {
    const { grid, ports } = square();
    const { nx, ny, spacing: h } = grid;
    const U = 1e-3;
    const u = new Float64Array((nx + 1) * ny).fill(U);
    const psi = streamfunction(grid, ports, u);
    for (let j = 1; j < ny - 1; j++) {
      for (let i = 1; i < nx - 1; i++) {
        const c = i + j * nx;
        if (grid.fraction[c] > 0) expect(psi[c]).toBeCloseTo(U * (j - 0.5) * h, 15);
      }
    }
  });
});
