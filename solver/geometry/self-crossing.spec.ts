import { findSelfCrossing } from './self-crossing';

describe('findSelfCrossing', () => {
  it('finds the crossing of a bow-tie', () => {
    expect(findSelfCrossing([[0, 0], [2, 2], [2, 0], [0, 2]])).toEqual([1, 1]);
  });

  it('accepts simple polygons, convex or not, in either direction', () => {
    expect(findSelfCrossing([[0, 0], [4, 0], [4, 4], [2, 1], [0, 4]])).toBeNull();
    expect(findSelfCrossing([[0, 4], [2, 1], [4, 4], [4, 0], [0, 0]])).toBeNull();
    expect(findSelfCrossing([[0, 0], [1, 0], [0, 1]])).toBeNull();
  });

  it('reports a vertex that touches another edge, a fold-back, and a polygon with no area', () => {
    expect(findSelfCrossing([[0, 0], [4, 0], [4, 4], [2, 0], [0, 4]])).toEqual([2, 0]);
    expect(findSelfCrossing([[0, 0], [4, 0], [2, 0], [2, 3]])).not.toBeNull();
    expect(findSelfCrossing([[0, 0], [1, 1], [2, 2]])).toEqual([0, 0]);
  });

  it('ignores repeated points and a repeated closing point', () => {
    expect(findSelfCrossing([[0, 0], [1, 0], [1, 0], [1, 1], [0, 1], [0, 0]])).toBeNull();
  });
});
