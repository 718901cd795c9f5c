import { nextPortId, portSegmentNear, type Segment } from './port-placement';
import type { Vec } from './tool-geometry';

describe('portSegmentNear', () => {
  // A T junction outline: through channel y in [-25, 25] um, x in [-500, 500]; side leg x in [-25, 25] down to -500.
  const u = 1e-6;
  const tee: Vec[] = [
    [-500, -25], [-25, -25], [-25, -500], [25, -500], [25, -25], [500, -25], [500, 25], [100, 25], [-500, 25],
  ].map(([x, y]) => [x * u, y * u] as Vec);

  function near(click: Vec, maxDistance = 10 * u): Segment | null {
    return portSegmentNear([tee], [click[0] * u, click[1] * u], maxDistance);
  }

  it('spans the end of a channel', () => {
    expect(near([502, 3])).toEqual({ from: [500 * u, -25 * u], to: [500 * u, 25 * u] });
    expect(near([0, -505])).toEqual({ from: [-25 * u, -500 * u], to: [25 * u, -500 * u] });
  });

  it('joins edges that continue in the same direction', () => {
    // The top side has a vertex at x = 100 um where nothing turns.
    expect(near([0, 27])).toEqual({ from: [500 * u, 25 * u], to: [-500 * u, 25 * u] });
  });

  it('gives nothing far from the outline', () => {
    expect(near([0, 200])).toBeNull();
  });
});

describe('nextPortId', () => {
  it('takes the first free letter, then numbered letters', () => {
    expect(nextPortId([])).toBe('A');
    expect(nextPortId([{ id: 'A' }, { id: 'C' }])).toBe('B');
    const all = Array.from({ length: 26 }, (_, k) => ({ id: String.fromCharCode(65 + k) }));
    expect(nextPortId(all)).toBe('A2');
  });
});
