import { linePath } from './plot-line';

const x = (v: number) => 10 * v;
const y = (v: number) => 100 - v;

describe('linePath', () => {
  it('joins the points on the scales', () => {
    expect(linePath([0, 1, 2], [0, 10, 20], x, y)).toBe('M0,100L10,90L20,80');
  });

  it('leaves a gap at a point without a finite coordinate', () => {
    expect(linePath([0, 1, 2, 3], [0, NaN, 20, 30], x, y)).toBe('M0,100ZM20,80L30,70');
    expect(linePath([0, Infinity, 2], [0, 1, 2], x, y)).toBe('M0,100ZM20,98Z');
  });

  it('is empty without points', () => {
    expect(linePath([], [], x, y)).toBe('');
  });
});
