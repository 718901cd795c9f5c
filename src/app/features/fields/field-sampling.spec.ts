import { cellAt, insideFluid, insideRings, lineProfile, probeFields, sampleAt } from './field-sampling';
import { makeFields } from './test-fields';

const h = 1e-5;
/** A 40 × 20 cell box with a 10-cell-wide channel along x (y in [5h, 15h]) as the fluid. */
const inChannel = (_x: number, y: number) => y > 5 * h && y < 15 * h;
const linear = makeFields(40, 20, h, { potential: (x, y) => 100 - 2e6 * x + 5e5 * y, velocityX: () => 1e-3, velocityY: () => 0 }, inChannel);

describe('sampleAt', () => {
  it('reproduces a linear field exactly between cell centres', () => {
    for (const [x, y] of [[1.23e-4, 9.1e-5], [3.3e-4, 1.01e-4], [2.05e-4, 1.4e-4]]) {
      expect(sampleAt(linear, linear.potential, x, y)).toBeCloseTo(100 - 2e6 * x + 5e5 * y, 3);
    }
  });

  it('leans on the defined neighbours near a wall, and is NaN far outside the fluid', () => {
    // Just inside the wall at y = 5h: the cells below are NaN; the value comes from the row above (y = 5.5h).
    const v = sampleAt(linear, linear.potential, 1e-4, 5.2 * h);
    expect(v).toBeCloseTo(100 - 2e6 * 1e-4 + 5e5 * 5.5 * h, 3);
    expect(sampleAt(linear, linear.potential, 1e-4, 2 * h)).toBeNaN();
    expect(sampleAt(linear, linear.potential, -1, 0)).toBeNaN();
  });
});

describe('inside tests', () => {
  const square = [[[0, 0], [1, 0], [1, 1], [0, 1]] as [number, number][]];
  const withHole = [...square, [[0.4, 0.4], [0.6, 0.4], [0.6, 0.6], [0.4, 0.6]] as [number, number][]];

  it('uses the outline rings even-odd (holes are outside)', () => {
    expect(insideRings(square, [0.5, 0.5])).toBe(true);
    expect(insideRings(withHole, [0.5, 0.5])).toBe(false);
    expect(insideRings(withHole, [0.2, 0.5])).toBe(true);
    expect(insideRings(square, [1.5, 0.5])).toBe(false);
  });

  it('falls back to the fluid fraction of the cell without an outline', () => {
    expect(insideFluid(linear, [1e-4, 1e-4])).toBe(true);
    expect(insideFluid(linear, [1e-4, 2e-5])).toBe(false);
    expect(cellAt(linear, -1e-6, 0)).toBe(-1);
  });
});

describe('probeFields', () => {
  it('reads every field at the point, with magnitudes', () => {
    const f = makeFields(10, 10, h, { fieldX: () => 3e4, fieldY: () => 4e4, velocityX: () => 1e-3, vorticity: () => -2, pressure: () => 12 });
    const p = probeFields(f, [5e-5, 5e-5]);
    expect(p.inside).toBe(true);
    expect(p.fieldStrength).toBeCloseTo(5e4, 2);
    expect(p.speed).toBeCloseTo(1e-3, 9);
    expect(p.vorticity).toBeCloseTo(-2, 6);
    expect(p.pressure).toBeCloseTo(12, 6);
  });

  it('says outside, without values, off the fluid', () => {
    expect(probeFields(linear, [1e-4, 1e-5])).toEqual({ at: [1e-4, 1e-5], inside: false });
  });
});

describe('lineProfile', () => {
  it('samples a cut across the channel with gaps outside the fluid', () => {
    const prof = lineProfile(linear, linear.potential, [2e-4, 0], [2e-4, 2e-4], 21);
    expect(prof.length).toBeCloseTo(2e-4, 12);
    expect(prof.distance[10]).toBeCloseTo(1e-4, 12);
    expect(prof.values[0]).toBeNaN();
    expect(prof.values[20]).toBeNaN();
    expect(prof.values[10]).toBeCloseTo(100 - 2e6 * 2e-4 + 5e5 * 1e-4, 3);
    const inside = Array.from(prof.values).filter(Number.isFinite).length;
    expect(inside).toBeGreaterThanOrEqual(9);
    expect(inside).toBeLessThanOrEqual(11);
  });

  it('takes the component across the line of a vector field (what flows through the cut)', () => {
    // Upwards cut: its left is −x, so a flow along +x counts negative; the reverse cut counts it positive.
    const up = lineProfile(linear, [linear.velocityX, linear.velocityY], [2e-4, 6e-5], [2e-4, 1.4e-4], 5);
    const down = lineProfile(linear, [linear.velocityX, linear.velocityY], [2e-4, 1.4e-4], [2e-4, 6e-5], 5);
    expect(up.values[2]).toBeCloseTo(-1e-3, 9);
    expect(down.values[2]).toBeCloseTo(1e-3, 9);
  });
});
