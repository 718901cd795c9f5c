import { makeDesign } from '../../tests/fixtures/designs';
import { channelWidths } from '../geometry/channel-width';
import { fluidRegion } from '../geometry/fluid-region';
import { cellsForWidth, chooseGrid } from './choose-grid';

const channel = fluidRegion(
  makeDesign({ shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5 }], ports: [] }).shapes,
);

describe('chooseGrid', () => {
  it('puts --cells N cells along the longer side, plus a one-cell margin', () => {
    const g = chooseGrid(channel, { cells: 200 });
    expect(g.spacing).toBeCloseTo(5e-6, 18);
    expect([g.nx, g.ny]).toEqual([202, 12]);
    expect(g.x0).toBeCloseTo(-5e-6, 18);
    expect(g.y0).toBeCloseTo(-5e-6, 18);
    expect(g.capped).toBe(false);
  });

  it('by default gives about 10 cells across the narrowest channel', () => {
    const widths = channelWidths(channel);
    const g = chooseGrid(channel, { narrowest: widths.narrowest });
    expect(g.cellsAcross).toBeCloseTo(10, 6);
    expect(g.cells).toBe(200);
  });

  it('caps the grid and says so', () => {
    const g = chooseGrid(channel, { cells: 100000, maxCells: 100000 });
    expect(g.capped).toBe(true);
    expect(g.nx * g.ny).toBeLessThanOrEqual(100000);
    expect(g.nx * g.ny).toBeGreaterThan(90000);
  });

  it('refuses a cell count that is not a whole number', () => {
    expect(() => chooseGrid(channel, { cells: 0 })).toThrow(/whole number/);
    expect(() => chooseGrid(channel, { cells: 2.5 })).toThrow(/whole number/);
  });

  it('works out the --cells value for 8 cells across a channel', () => {
    expect(cellsForWidth(channel, 5e-5)).toBe(160);
  });
});
