import { regionContains } from './region-contains';

describe('regionContains', () => {
  it('turns a rect about its lower-left corner', () => {
    const rect = { type: 'rect' as const, x: 1, y: 1, width: 2, height: 1, angle: 90 };
    expect(regionContains(rect, 0.5, 2)).toBe(true);
    expect(regionContains(rect, 2, 1.5)).toBe(false);
    expect(regionContains(rect, 1, 3)).toBe(true); // on the boundary
  });

  it('handles sectors that wrap through 0°', () => {
    const sector = { type: 'sector' as const, center: [0, 0] as [number, number], innerRadius: 1, outerRadius: 2, startAngle: 300, endAngle: 390 };
    expect(regionContains(sector, 1.5, 0)).toBe(true);
    expect(regionContains(sector, 0, 1.5)).toBe(false);
    expect(regionContains(sector, 0.5, 0)).toBe(false);
    expect(regionContains(sector, 1.5 * Math.cos(0.5), 1.5 * Math.sin(0.5))).toBe(true);
  });

  it('tests circles and polygons', () => {
    expect(regionContains({ type: 'circle', center: [0, 0], radius: 1 }, 0.6, 0.6)).toBe(true);
    expect(regionContains({ type: 'circle', center: [0, 0], radius: 1 }, 0.8, 0.8)).toBe(false);
    const tri = { type: 'polygon' as const, points: [[0, 0], [2, 0], [0, 2]] as Array<[number, number]> };
    expect(regionContains(tri, 0.5, 0.5)).toBe(true);
    expect(regionContains(tri, 1.5, 1.5)).toBe(false);
    expect(regionContains(tri, 1, 1)).toBe(true);
  });
});
