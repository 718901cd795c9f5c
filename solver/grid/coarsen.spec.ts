import { loadFixture } from '../../tests/fixtures/designs';
import { fluidRegion } from '../geometry/fluid-region';
import { chooseGrid } from './choose-grid';
import { closureDefect } from './closure';
import { coarsen, gridHierarchy } from './coarsen';
import { rasterise } from './rasterise';

function fixtureGrid(cells: number) {
  const design = loadFixture('serpentine');
  const region = fluidRegion(design.shapes);
  return rasterise(region, chooseGrid(region, { cells }), { ports: design.ports, sideZeta: -0.05 }).grid;
}

const area = (g: { fraction: Float64Array; spacing: number }) => g.fraction.reduce((s, f) => s + f, 0) * g.spacing ** 2;

describe('coarsen', () => {
  const fine = fixtureGrid(512);

  it('keeps the fluid area and the port lengths on every level', () => {
    const levels = gridHierarchy(fine);
    expect(levels.length).toBeGreaterThan(4);
    for (const g of levels) {
      expect(Math.abs(area(g) / area(fine) - 1)).toBeLessThan(1e-12);
      const ports = new Float64Array(2);
      for (let s = 0; s < g.segments.count; s++) if (g.segments.port[s] >= 0) ports[g.segments.port[s]] += g.segments.length[s];
      expect(ports[0]).toBeCloseTo(1e-4, 15);
      expect(ports[1]).toBeCloseTo(1e-4, 15);
    }
    const last = levels[levels.length - 1];
    expect(last.nx * last.ny <= 64 || last.nx <= 2 || last.ny <= 2).toBe(true);
  });

  it('keeps every level closed (discrete divergence theorem)', () => {
    for (const g of gridHierarchy(fine)) {
      const d = closureDefect(g);
      expect(Math.max(d.x, d.y)).toBeLessThan(1e-10);
    }
  });

  it('averages the two fine faces under a coarse face and the four fine cells under a coarse cell', () => {
    const coarse = coarsen(fine);
    expect(coarse.spacing).toBe(2 * fine.spacing);
    expect([coarse.nx, coarse.ny]).toEqual([Math.ceil(fine.nx / 2), Math.ceil(fine.ny / 2)]);
    expect(coarse.level).toBe(1);
    const fx = fine.nx;
    for (const [I, J] of [[100, 50], [37, 11], [200, 90]]) {
      const f = (i: number, j: number) => fine.fraction[i + j * fx];
      expect(coarse.fraction[I + J * coarse.nx]).toBeCloseTo((f(2 * I, 2 * J) + f(2 * I + 1, 2 * J) + f(2 * I, 2 * J + 1) + f(2 * I + 1, 2 * J + 1)) / 4, 15);
      const ax = (i: number, j: number) => fine.apertureX[i + j * (fx + 1)];
      expect(coarse.apertureX[I + J * (coarse.nx + 1)]).toBeCloseTo((ax(2 * I, 2 * J) + ax(2 * I, 2 * J + 1)) / 2, 15);
      const ay = (i: number, j: number) => fine.apertureY[i + j * fx];
      expect(coarse.apertureY[I + J * coarse.nx]).toBeCloseTo((ay(2 * I, 2 * J) + ay(2 * I + 1, 2 * J)) / 2, 15);
    }
  });

  it('places coarse centroids at the fraction-weighted mean of the children', () => {
    const coarse = coarsen(fine);
    // First moment of the fluid is the same on both levels.
    const moment = (g: typeof fine) => {
      const cut = new Map<number, number>();
      g.cutCells.forEach((c, k) => cut.set(c, k));
      let m = 0;
      for (let c = 0; c < g.nx * g.ny; c++) {
        if (!(g.fraction[c] > 0)) continue;
        const k = cut.get(c), i = c % g.nx;
        m += g.fraction[c] * g.spacing ** 2 * (k !== undefined ? g.cutCentroidX[k] : g.x0 + (i + 0.5) * g.spacing);
      }
      return m;
    };
    expect(Math.abs(moment(coarse) / moment(fine) - 1)).toBeLessThan(1e-12);
  });
});
