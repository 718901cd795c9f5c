import type { Port, Shape } from '../../../../shared/design';
import { distanceToOutline, portsOnShape, rotateShape, shapeBounds, shapePivot, translateShape, wrapAngle } from './shape-transform';

describe('shape transforms', () => {
  const rect: Shape = { op: 'add', type: 'rect', x: 0, y: 0, width: 2e-4, height: 1e-4, angle: 0 };

  it('moves every kind of shape', () => {
    expect(translateShape(rect, 1e-4, -1e-4)).toMatchObject({ x: 1e-4, y: -1e-4 });
    expect(translateShape({ op: 'subtract', type: 'circle', center: [0, 0], radius: 1e-5 }, 1e-4, 0)).toMatchObject({ center: [1e-4, 0] });
    expect(translateShape({ op: 'add', type: 'polygon', points: [[0, 0], [1, 0], [0, 1]] }, 1, 1)).toMatchObject({ points: [[1, 1], [2, 1], [1, 2]] });
  });

  it('turns a rect about its centre: the centre stays, the angle adds up', () => {
    const pivot = shapePivot(rect);
    expect(pivot).toEqual([1e-4, 5e-5]);
    const turned = rotateShape(rect, 90, pivot);
    expect(turned.type === 'rect' && turned.angle).toBe(90);
    const b = shapeBounds(turned);
    expect((b[0] + b[2]) / 2).toBeCloseTo(1e-4, 12);
    expect((b[1] + b[3]) / 2).toBeCloseTo(5e-5, 12);
    expect(b[2] - b[0]).toBeCloseTo(1e-4, 12);
    expect(b[3] - b[1]).toBeCloseTo(2e-4, 12);
  });

  it('turns a sector, keeping its sweep', () => {
    const s: Shape = { op: 'add', type: 'sector', center: [0, 0], innerRadius: 1, outerRadius: 2, startAngle: 150, endAngle: 240 };
    const t = rotateShape(s, 60, [0, 0]);
    expect(t).toMatchObject({ startAngle: -150, endAngle: -60 });
  });

  it('wraps angles into (-180, 180]', () => {
    expect(wrapAngle(270)).toBe(-90);
    expect(wrapAngle(-180)).toBe(180);
    expect(wrapAngle(360)).toBe(0);
  });

  it('bounds a quarter bend exactly', () => {
    const s: Shape = { op: 'add', type: 'sector', center: [0, 0], innerRadius: 1, outerRadius: 2, startAngle: 0, endAngle: 90 };
    expect(shapeBounds(s)).toEqual([0, 0, 2, 2]);
  });

  it('measures the distance to an outline and finds the ports on it', () => {
    expect(distanceToOutline(rect, [1e-4, 5e-5])).toBeCloseTo(5e-5, 15);
    const port = (id: string, from: [number, number], to: [number, number]): Port => ({ id, from, to, potential: 0, pressure: 0 });
    const ports = [port('A', [0, 0], [0, 1e-4]), port('B', [5e-4, 0], [5e-4, 1e-4])];
    expect(portsOnShape(rect, ports, 1e-9)).toEqual([0]);
  });
});
