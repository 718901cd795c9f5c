import * as clippingModule from 'polygon-clipping';
import type { RectShape, Shape } from '../../../../shared/design';
import { rectCorners } from './shape-transform';
import { bendFromPoints, chamberFromCorners, freeformPolygon, junctionShapes, pillarAt, rectCentreLine, straightChannel, type JunctionKind, type Vec } from './tool-geometry';

const clipping = ((clippingModule as unknown as { default?: typeof clippingModule }).default ?? clippingModule);

function close(a: number, b: number, digits = 12): void {
  expect(a).toBeCloseTo(b, digits);
}

describe('straightChannel', () => {
  it('puts the corner half a width to the right of the start and turns the rect along the centre line', () => {
    const r = straightChannel([0, 0], [1e-3, 0], 5e-5)!;
    expect(r).toEqual({ op: 'add', type: 'rect', x: 0, y: -2.5e-5, width: 1e-3, height: 5e-5, angle: 0 });
  });

  it('handles a channel drawn upwards', () => {
    const r = straightChannel([1e-4, 0], [1e-4, 2e-4], 4e-5)!;
    expect(r.angle).toBe(90);
    close(r.x, 1.2e-4);
    close(r.y, 0);
    close(r.width, 2e-4);
  });

  it('handles any direction, and its corners follow from the centre line', () => {
    const start: Vec = [3e-4, -1e-4], end: Vec = [-2e-4, 4e-4];
    const r = straightChannel(start, end, 6e-5)!;
    close(r.angle, 135, 9);
    const back = rectCentreLine(r);
    close(back.start[0], start[0]);
    close(back.start[1], start[1]);
    close(back.end[0], end[0]);
    close(back.end[1], end[1]);
    close(back.width, 6e-5);
    // The end of the channel is the segment start ± w/2 across the line.
    const corners = rectCorners(r);
    const mid03: Vec = [(corners[0][0] + corners[3][0]) / 2, (corners[0][1] + corners[3][1]) / 2];
    close(mid03[0], start[0]);
    close(mid03[1], start[1]);
  });

  it('refuses a zero-length line', () => {
    expect(straightChannel([1, 1], [1, 1], 5e-5)).toBeNull();
  });
});

describe('bendFromPoints', () => {
  it('makes a quarter bend about the centre, centre line through the first point', () => {
    const s = bendFromPoints([0, 0], [2e-4, 0], [0, 5e-4], 5e-5)!;
    expect(s).toMatchObject({ type: 'sector', center: [0, 0], startAngle: 0, endAngle: 90 });
    close(s.innerRadius, 1.75e-4);
    close(s.outerRadius, 2.25e-4);
  });

  it('goes the shorter way round when the end is clockwise from the start', () => {
    const s = bendFromPoints([0, 0], [0, 2e-4], [2e-4, 0], 5e-5)!;
    expect(s.startAngle).toBe(0);
    expect(s.endAngle).toBe(90);
  });

  it('refuses a radius smaller than half the width', () => {
    expect(bendFromPoints([0, 0], [1e-5, 0], [0, 1e-5], 5e-5)).toBeNull();
  });
});

function unionPieces(shapes: Shape[]): number {
  const polys = shapes.map((s) => {
    const corners = rectCorners(s as RectShape);
    return [[...corners, corners[0]]] as [number, number][][];
  });
  return clipping.union(polys[0], ...polys.slice(1)).length;
}

describe('junctionShapes', () => {
  const kinds: JunctionKind[] = ['cross', 'tee', 'wye'];

  it.each(kinds)('%s: shapes whose union is one connected piece, at any angle', (kind) => {
    for (const angle of [0, 17, 90, 200]) {
      const shapes = junctionShapes(kind, [1e-3, 2e-3], 5e-4, 5e-5, angle);
      expect(shapes.length).toBeGreaterThan(1);
      expect(unionPieces(shapes)).toBe(1);
    }
  });

  it('cross: legs reach the leg length from the centre on four sides', () => {
    const [h, v] = junctionShapes('cross', [0, 0], 5e-4, 5e-5) as RectShape[];
    expect(h).toMatchObject({ x: -5e-4, y: -2.5e-5, width: 1e-3, height: 5e-5, angle: 0 });
    expect(v.angle).toBe(90);
    close(v.x, 2.5e-5);
    close(v.y, -5e-4);
  });

  it('tee: the side leg runs from the centre of the through channel', () => {
    const [, side] = junctionShapes('tee', [0, 0], 5e-4, 5e-5) as RectShape[];
    const line = rectCentreLine(side);
    close(line.start[0], 0);
    close(line.start[1], 0);
    close(line.end[1], -5e-4);
  });

  it('gives nothing when the legs are shorter than half a width', () => {
    expect(junctionShapes('cross', [0, 0], 1e-5, 5e-5)).toEqual([]);
  });
});

describe('chamber, pillar and freeform', () => {
  it('chamber: a rect from two corners dragged either way', () => {
    const c = chamberFromCorners([3e-4, 1e-4], [1e-4, 4e-4])!;
    expect(c).toMatchObject({ op: 'add', type: 'rect', x: 1e-4, y: 1e-4, angle: 0 });
    close(c.width, 2e-4);
    close(c.height, 3e-4);
    expect(chamberFromCorners([0, 0], [1e-4, 0])).toBeNull();
  });

  it('pillar: a circle cut out of the fluid', () => {
    expect(pillarAt([1e-4, 2e-4], 2e-5)).toEqual({ op: 'subtract', type: 'circle', center: [1e-4, 2e-4], radius: 2e-5 });
  });

  it('freeform: drops the repeated point of a double-click and closes the outline', () => {
    const r = freeformPolygon([[0, 0], [1e-4, 0], [1e-4, 1e-4], [1e-4, 1e-4]]);
    expect(r).toEqual({ ok: true, shape: { op: 'add', type: 'polygon', points: [[0, 0], [1e-4, 0], [1e-4, 1e-4]] } });
  });

  it('freeform: refuses too few points, no area and a crossing outline, saying why', () => {
    expect(freeformPolygon([[0, 0], [1, 0]])).toEqual({ ok: false, reason: 'A freeform shape needs at least 3 distinct points' });
    expect(freeformPolygon([[0, 0], [1e-4, 0], [2e-4, 0]])).toMatchObject({ ok: false, reason: expect.stringContaining('no area') });
    expect(freeformPolygon([[0, 0], [1e-4, 1e-4], [1e-4, 0], [0, 1e-4]])).toMatchObject({ ok: false, reason: expect.stringContaining('crosses itself') });
  });
});
