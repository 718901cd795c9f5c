import { makeDesign } from '../../tests/fixtures/designs';
import type { Shape } from '../../shared/design';
import { fluidRegion } from './fluid-region';
import { polygonsContain, ringArea } from './ring';

const shapesOf = (shapes: unknown[]): Shape[] =>
  makeDesign({ shapes: shapes as never, ports: [] }).shapes;

describe('fluidRegion', () => {
  it('applies add and subtract in order', () => {
    const region = fluidRegion(shapesOf([
      { op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 1e-4 },
      { op: 'subtract', type: 'rect', x: 4e-4, y: 0, width: 2e-4, height: 1e-4 },
      { op: 'add', type: 'rect', x: 4.5e-4, y: 0, width: 1e-4, height: 1e-4 },
    ]));
    // 1e-3·1e-4 − 2e-4·1e-4 + 1e-4·1e-4
    expect(region.area).toBeCloseTo(0.9e-7, 20);
    expect(region.polygons).toHaveLength(3);
    expect(polygonsContain(region.polygons, 5e-4, 5e-5)).toBe(true);
    expect(polygonsContain(region.polygons, 4.2e-4, 5e-5)).toBe(false);
  });

  it('keeps holes clockwise and outer rings counter-clockwise (fluid on the left)', () => {
    const region = fluidRegion(shapesOf([
      { op: 'add', type: 'circle', center: [0, 0], radius: 1e-4 },
      { op: 'subtract', type: 'circle', center: [2e-5, -1e-5], radius: 3e-5 },
    ]));
    expect(region.polygons).toHaveLength(1);
    const [outer, hole] = region.polygons[0];
    expect(ringArea(outer)).toBeGreaterThan(0);
    expect(ringArea(hole)).toBeLessThan(0);
    expect(Math.abs(region.area / (Math.PI * (1e-8 - 9e-10)) - 1)).toBeLessThan(1e-12);
    expect(region.bounds.map((v) => v * 1e4)).toEqual([
      expect.closeTo(-1, 4), expect.closeTo(-1, 4), expect.closeTo(1, 4), expect.closeTo(1, 4),
    ]);
  });

  it('ignores a subtraction before anything was added', () => {
    const region = fluidRegion(shapesOf([
      { op: 'subtract', type: 'circle', center: [0, 0], radius: 1e-4 },
      { op: 'add', type: 'rect', x: 0, y: 0, width: 1e-4, height: 1e-4 },
    ]));
    expect(region.area).toBeCloseTo(1e-8, 20);
  });

  it('is empty when everything is subtracted', () => {
    const region = fluidRegion(shapesOf([
      { op: 'add', type: 'rect', x: 0, y: 0, width: 1e-4, height: 1e-4 },
      { op: 'subtract', type: 'rect', x: -1e-4, y: -1e-4, width: 1e-3, height: 1e-3 },
    ]));
    expect(region.area).toBe(0);
    expect(region.polygons).toEqual([]);
  });
});
