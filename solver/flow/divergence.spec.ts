import { makeDesign } from '../../tests/fixtures/designs';
import { discretiseDesign } from '../grid/discretise';
import { mergedCouplings, mergeSmallCells } from './cell-merging';
import { addDivergence, addDivergenceTranspose } from './divergence';
import { flowProblemFromDesign } from './flow-problem';
import { portFaces } from './port-faces';
import { components } from './staggered';

/** A chamber with a pillar and an oblique outlet: cut cells, merged slivers, grid-aligned and staircase ports. */
function setup() {
  const design = makeDesign({
    shapes: [
      { op: 'add', type: 'rect', x: 0, y: 0, width: 6e-4, height: 2e-4 },
      { op: 'add', type: 'rect', x: 5e-4, y: 0, width: 2e-4, height: 1e-4, angle: 30 },
      { op: 'subtract', type: 'circle', center: [2.5e-4, 1e-4], radius: 4.3e-5 },
    ],
    ports: [
      { id: 'in', from: [0, 0], to: [0, 2e-4], potential: 1, pressure: 0 },
      { id: 'out', from: [6.732e-4, 1e-4], to: [6.232e-4, 1.866e-4], potential: 0, pressure: 0 },
    ],
  });
  const grid = discretiseDesign(design, { cells: 70 }).grid!;
  const n = grid.nx * grid.ny;
  const problem = flowProblemFromDesign(design, grid, new Float64Array(n), [1, 0]);
  const comps = components(grid);
  const ports = portFaces(problem, comps);
  const merged = mergedCouplings(grid, mergeSmallCells(grid), ports);
  return { grid, comps, ports, merged };
}

const pseudo = (k: number) => Math.sin(12.9898 * k + 78.233) * 43758.5453 % 1;

describe('aperture-weighted divergence B and its transpose', () => {
  const { grid, comps, ports, merged } = setup();
  const nu = comps[0].n1 * comps[0].n2, nv = comps[1].n1 * comps[1].n2, np = grid.nx * grid.ny;
  const u = Float64Array.from({ length: nu }, (_, k) => pseudo(k));
  const v = Float64Array.from({ length: nv }, (_, k) => pseudo(k + nu));
  const p = Float64Array.from({ length: np }, (_, k) => pseudo(k + nu + nv));
  for (const t of merged.merging.cell) p[t] = 0; // merged cells carry no pressure of their own

  it('has ports on both outlets, the oblique one as a staircase of x- and y-faces', () => {
    expect(ports.count).toBeGreaterThan(0);
    const outAxes = new Set<number>();
    for (let q = 0; q < ports.partFace.length; q++) if (ports.partPort[q] === 1) outAxes.add(ports.axis[ports.partFace[q]]);
    expect([...outAxes].sort()).toEqual([0, 1]);
    expect(merged.merging.cell.length).toBeGreaterThan(0);
  });

  it('is the exact transpose: p·(B u) = u·(Bᵀ p), merged cells included', () => {
    const bu = new Float64Array(np);
    addDivergence(grid, ports, merged, u, v, bu, 1);
    const btU = new Float64Array(nu), btV = new Float64Array(nv);
    addDivergenceTranspose(grid, ports, merged, p, btU, btV, 1);
    let left = 0, right = 0, scale = 0;
    for (let c = 0; c < np; c++) left += p[c] * bu[c];
    for (let k = 0; k < nu; k++) right += u[k] * btU[k];
    for (let k = 0; k < nv; k++) right += v[k] * btV[k];
    for (let c = 0; c < np; c++) scale += Math.abs(p[c] * bu[c]);
    expect(Math.abs(left - right)).toBeLessThan(1e-13 * scale);
  });

  it('telescopes: the net outflow of all cells is the outflow through the port faces (exact mass balance)', () => {
    const bu = new Float64Array(np);
    addDivergence(grid, ports, merged, u, v, bu, 1);
    let total = 0, scale = 0;
    for (let c = 0; c < np; c++) {
      total += bu[c];
      scale += Math.abs(bu[c]);
    }
    let throughPorts = 0;
    for (let f = 0; f < ports.count; f++) throughPorts += ports.sign[f] * ports.length[f] * (ports.axis[f] === 0 ? u : v)[ports.node[f]];
    expect(Math.abs(total - throughPorts)).toBeLessThan(1e-13 * scale);
    for (const t of merged.merging.cell) expect(bu[t]).toBe(0);
  });

  it('gives a uniform flow zero divergence in every cell away from the ports, cut cells included', () => {
    // Uniform (U, V) on every open face; walls are closed, so the only non-zero divergence is where the flow
    // meets the walls: the discrete divergence theorem says Σ_faces a h U n_x = −Σ_segments L U n_x there.
    const U = 0.3, V = -0.7;
    const uu = new Float64Array(nu).fill(U), vv = new Float64Array(nv).fill(V);
    const bu = new Float64Array(np);
    addDivergence(grid, { ...ports, count: 0 }, null, uu, vv, bu, 1);
    const wall = new Float64Array(np);
    const seg = grid.segments;
    for (let s = 0; s < seg.count; s++) wall[seg.cell[s]] += seg.length[s] * (U * seg.normalX[s] + V * seg.normalY[s]);
    for (let c = 0; c < np; c++) expect(bu[c] + wall[c]).toBeCloseTo(0, 15);
  });
});
