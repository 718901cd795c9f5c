import { labelIn, rangeTicks } from './colour-bar-ticks';

describe('rangeTicks', () => {
  it('puts round values in one unit picked for the largest magnitude', () => {
    const t = rangeTicks(0, 2.5e5, 'fieldStrength');
    expect(t.unit).toBe('kV/m');
    expect(t.ticks.map((k) => k.label)).toEqual(['0', '50', '100', '150', '200', '250']);
    expect(t.ticks[2].value).toBeCloseTo(1e5, 6);
  });

  it('shows as many decimals as the step needs, and no more', () => {
    const t = rangeTicks(0, 1.23e-3, 'velocity');
    expect(t.unit).toBe('mm/s');
    expect(t.ticks.map((k) => k.label)).toEqual(['0.0', '0.2', '0.4', '0.6', '0.8', '1.0', '1.2']);
  });

  it('writes negative values with a minus sign, symmetric ranges through zero', () => {
    const t = rangeTicks(-3000, 3000, 'vorticity', 4);
    expect(t.unit).toBe('1/s');
    expect(t.ticks.map((k) => k.label)).toEqual(['\u22122000', '0', '2000']);
  });

  it('picks millivolts for a small potential range and kilovolts for a large one', () => {
    expect(rangeTicks(0.01, 0.35, 'potential').unit).toBe('mV');
    const kv = rangeTicks(-200, 1500, 'potential');
    expect(kv.unit).toBe('kV');
    expect(kv.ticks.map((k) => k.label)).toEqual(['0.0', '0.5', '1.0', '1.5']);
    expect(rangeTicks(-1500, 1500, 'potential', 4).ticks.map((k) => k.label)).toEqual(['\u22121', '0', '1']);
  });

  it('gives no ticks for an empty or reversed range', () => {
    expect(rangeTicks(1, 1, 'pressure').ticks).toEqual([]);
    expect(rangeTicks(NaN, 1, 'pressure').ticks).toEqual([]);
  });

  it('labels a single value in the set unit', () => {
    const t = rangeTicks(0, 2.5e5, 'fieldStrength');
    expect(labelIn(t, 263_456)).toBe('263');
    expect(labelIn(t, -1234, 2)).toBe('\u22121.2');
  });
});
