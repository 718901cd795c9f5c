import { makeDesign } from '../../tests/fixtures/designs';
import { discretiseDesign } from '../grid/discretise';
import { MERGE_FRACTION, mergeSmallCells } from './cell-merging';

describe('small-cell merging', () => {
  const design = makeDesign({
    shapes: [
      { op: 'add', type: 'circle', center: [0, 0], radius: 1e-4 },
      { op: 'subtract', type: 'circle', center: [3e-5, 0], radius: 2.1e-5 },
    ],
    ports: [{ id: 'a', from: [-1e-4, -1e-5], to: [-1e-4, 1e-5], potential: 0, pressure: 0 }],
  });
  const grid = discretiseDesign(design, { cells: 37 }).grid!;
  const { cell, into } = mergeSmallCells(grid);
  const merged = new Set(cell);

  it('merges every sliver that has an open face, and nothing else', () => {
    expect(cell.length).toBeGreaterThan(0);
    for (const c of cell) expect(grid.fraction[c]).toBeLessThan(MERGE_FRACTION);
    const { nx, apertureX: ax, apertureY: ay } = grid;
    for (const c of grid.cutCells) {
      const i = c % nx, j = (c - i) / nx;
      const open = ax[i + j * (nx + 1)] + ax[i + 1 + j * (nx + 1)] + ay[c] + ay[c + nx] > 0;
      if (grid.fraction[c] > 0 && grid.fraction[c] < MERGE_FRACTION && open) {
        // merged, or the largest of a cluster of slivers (its own root)
        expect(merged.has(c) || into.includes(c)).toBe(true);
      }
    }
  });

  it('sends each merged cell to a larger cell that is not itself merged', () => {
    cell.forEach((c, k) => {
      expect(merged.has(into[k])).toBe(false);
      expect(grid.fraction[into[k]]).toBeGreaterThanOrEqual(grid.fraction[c]);
    });
  });
});
