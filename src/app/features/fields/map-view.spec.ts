import { fitView, ringsBounds, toScreen, toWorld } from './map-view';

describe('ringsBounds', () => {
  it('spans the points of every ring', () => {
    expect(ringsBounds([[[0, 1], [2, -1]], [[-3, 0.5]]])).toEqual([-3, -1, 2, 1]);
  });

  it('is null without points', () => {
    expect(ringsBounds([])).toBeNull();
    expect(ringsBounds([[]])).toBeNull();
  });
});

describe('fitView', () => {
  // A 1 m square in a 200 × 100 px box with 20 px clear: the height limits it to 60 px, centred.
  const v = fitView([0, 0, 1, 1], 200, 100, 20);

  it('fits the tighter side inside the margin and centres the other', () => {
    expect(v.k).toBe(60);
    expect(toScreen(v, [0, 1])).toEqual([70, 20]);
    expect(toScreen(v, [1, 0])).toEqual([130, 80]);
  });

  it('keeps a flat layout finite', () => {
    const flat = fitView([0, 0, 1e-3, 0], 200, 100, 20);
    expect(flat.k).toBeCloseTo(160 / 1e-3, 6);
    expect(toScreen(flat, [0, 0])[1]).toBeCloseTo(50, 9);
  });
});

describe('toWorld', () => {
  it('undoes toScreen, with y up on the layout and down on the screen', () => {
    const v = { k: 1e4, x: 12, y: 300 };
    const [X, Y] = toScreen(v, [2e-3, 5e-3]);
    expect(Y).toBeLessThan(300);
    const [x, y] = toWorld(v, X, Y);
    expect(x).toBeCloseTo(2e-3, 12);
    expect(y).toBeCloseTo(5e-3, 12);
  });
});
