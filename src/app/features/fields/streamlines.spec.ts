import { centreAcross, rk2Step, seeds, traceStreamlines } from './streamlines';
import { makeFields } from './test-fields';

const h = 1e-5;

describe('streamlines', () => {
  it('in a uniform flow along a channel: straight lines along x, from upstream to downstream, kept apart', () => {
    const inChannel = (_x: number, y: number) => y > 0 && y < 2e-4;
    const f = makeFields(100, 20, h, { velocityX: () => 1e-3, velocityY: () => 0 }, inChannel);
    const sep = 4e-5;
    const lines = traceStreamlines(f, { separation: sep });
    expect(lines.length).toBeGreaterThanOrEqual(3);
    expect(lines.length).toBeLessThanOrEqual(6);
    const ys: number[] = [];
    for (const line of lines) {
      const y0 = line[1];
      for (let k = 1; k < line.length; k += 2) expect(line[k]).toBeCloseTo(y0, 12);
      expect(line[line.length - 2]).toBeGreaterThan(line[0]); // runs with the flow
      expect(line[line.length - 2] - line[0]).toBeGreaterThan(8e-4); // nearly the channel's length
      ys.push(y0);
    }
    ys.sort((a, b) => a - b);
    for (let k = 1; k < ys.length; k++) expect(ys[k] - ys[k - 1]).toBeGreaterThanOrEqual(sep / 2 - 1e-12);
  });

  it('RK2 keeps a line of a solid-body rotation on its circle to second order in the step', () => {
    // u = Ω × r about the centre of a 1 mm box: every streamline is a circle.
    const c = 5e-4;
    const f = makeFields(100, 100, h, { velocityX: (x, y) => -(y - c), velocityY: (x) => x - c });
    const drift = (ds: number) => {
      let p: [number, number] = [c + 3e-4, c];
      const steps = Math.round((2 * Math.PI * 3e-4) / ds);
      for (let k = 0; k < steps; k++) p = rk2Step(f, p, ds, 0)!;
      return Math.abs(Math.hypot(p[0] - c, p[1] - c) - 3e-4);
    };
    const coarse = drift(2e-5), fine = drift(1e-5);
    expect(coarse).toBeLessThan(3e-4 * 0.01);
    // Halving the step cuts the radial drift by about 4 (second order), allowing for the bilinear field's error.
    expect(coarse / fine).toBeGreaterThan(2.5);
  });

  it('stops a closed line when it comes round to its seed', () => {
    const c = 5e-4;
    const f = makeFields(100, 100, h, { velocityX: (x, y) => -(y - c), velocityY: (x) => x - c }, (x, y) => Math.hypot(x - c, y - c) < 4.5e-4);
    const lines = traceStreamlines(f, { separation: 1e-4 });
    expect(lines.length).toBeGreaterThan(0);
    // Steps of half a cell: one turn of the largest circle at most, not two (the forward half stops at the backward one).
    for (const line of lines) expect(line.length / 2).toBeLessThan((2 * Math.PI * 4.5e-4) / (h / 2) + 20);
  });

  it('seeds only where the cell is mostly fluid, and gives no lines without flow', () => {
    const f = makeFields(10, 10, h, {}, (x) => x < 5e-5);
    expect(seeds(f, 2e-5, 100).every(([x]) => x < 5e-5)).toBe(true);
    expect(traceStreamlines(f, { separation: 2e-5 })).toEqual([]);
  });
});

describe('centreAcross', () => {
  it('moves a seed to the middle of a channel narrower than the separation, and leaves it in a wide one', () => {
    const narrow = makeFields(100, 20, h, { velocityX: () => 1e-3, velocityY: () => 0 }, (_x, y) => y > 5e-5 && y < 1e-4);
    const [x, y] = centreAcross(narrow, [5e-4, 6e-5], 1e-4);
    expect(x).toBeCloseTo(5e-4, 12);
    expect(Math.abs(y - 7.5e-5)).toBeLessThanOrEqual(h / 4); // the walk steps a quarter cell
    const wide = makeFields(100, 100, h, { velocityX: () => 1e-3, velocityY: () => 0 });
    expect(centreAcross(wide, [5e-4, 3e-4], 1e-4)).toEqual([5e-4, 3e-4]);
  });
});
