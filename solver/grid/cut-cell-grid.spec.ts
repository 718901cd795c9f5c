import { makeDesign } from '../../tests/fixtures/designs';
import { fluidRegion } from '../geometry/fluid-region';
import { chooseGrid } from './choose-grid';
import { labelComponents } from './components';
import { cellCentre, cellOf, cutIndex, faceXIndex, faceYIndex, fluidCentroid, segmentRange } from './cut-cell-grid';
import { rasterise } from './rasterise';

function gridOf(shapes: unknown[], cells: number) {
  const region = fluidRegion(makeDesign({ shapes: shapes as never, ports: [] }).shapes);
  return rasterise(region, chooseGrid(region, { cells })).grid;
}

describe('cut-cell grid helpers', () => {
  const grid = gridOf([{ op: 'add', type: 'circle', center: [0, 0], radius: 1e-4 }], 20); // h = 10 µm

  it('locates points', () => {
    const square = gridOf([{ op: 'add', type: 'rect', x: 0, y: -1e-4, width: 2e-4, height: 2e-4 }], 20); // h = 10 µm
    const c = cellOf(square, 1e-6, -1e-6);
    expect(c).toBe(1 + 10 * square.nx);
    expect(cellCentre(square, c)).toEqual([expect.closeTo(5e-6, 15), expect.closeTo(-5e-6, 15)]);
    expect(cellOf(square, 1, 0)).toBe(-1);
    expect(cellOf(square, square.x0 - 1e-9, 0)).toBe(-1);
    expect(cellOf(square, Number.NaN, 0)).toBe(-1);
  });

  it('indexes faces as documented', () => {
    expect(faceXIndex(grid, 3, 2)).toBe(3 + 2 * (grid.nx + 1));
    expect(faceYIndex(grid, 3, 2)).toBe(3 + 2 * grid.nx);
  });

  it('finds the segments and the fluid centroid of a cut cell', () => {
    const c = cellOf(grid, 9.5e-5, 5e-6); // the circle's edge crosses this cell
    expect(cutIndex(grid, c)).toBeGreaterThanOrEqual(0);
    const [s0, s1] = segmentRange(grid, c);
    expect(s1).toBeGreaterThan(s0);
    for (let s = s0; s < s1; s++) expect(grid.segments.cell[s]).toBe(c);
    const [x] = fluidCentroid(grid, c);
    expect(x).toBeLessThan(cellCentre(grid, c)[0]); // the fluid is on the inner side
    const inner = cellOf(grid, 5e-6, 5e-6);
    expect(cutIndex(grid, inner)).toBe(-1);
    expect(fluidCentroid(grid, inner)).toEqual(cellCentre(grid, inner));
    expect(segmentRange(grid, inner)).toEqual([expect.any(Number), expect.any(Number)]);
    const [a, b] = segmentRange(grid, inner);
    expect(b - a).toBe(0);
  });

  it('labels connected pieces through open faces', () => {
    const two = gridOf([
      { op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5 },
      { op: 'add', type: 'rect', x: 0, y: 1e-4, width: 1e-3, height: 5e-5 },
      { op: 'add', type: 'rect', x: 5e-4, y: 0, width: 5e-5, height: 1.5e-4 },
      { op: 'add', type: 'circle', center: [2e-4, 5e-4], radius: 3e-5 },
    ], 100);
    const parts = labelComponents(two);
    expect(parts.count).toBe(2);
    expect(Math.abs(parts.size[0] + parts.size[1] - two.fraction.reduce((s, f) => s + f, 0))).toBeLessThan(1e-9);
  });
});
