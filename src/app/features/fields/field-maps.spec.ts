import { CLIP_SHARE, MAPS, colourRange, magnitude, mapValues, rangePosition } from './field-maps';
import { makeFields } from './test-fields';

describe('field maps', () => {
  it('shows |E| and |u| as magnitudes of the components', () => {
    const f = makeFields(2, 1, 1, { fieldX: () => 3, fieldY: () => -4, velocityX: () => 6e-4, velocityY: () => 8e-4 });
    expect(Array.from(mapValues(f, 'fieldStrength'))).toEqual([5, 5]);
    expect(mapValues(f, 'speed')[0]).toBeCloseTo(1e-3, 9);
    expect(mapValues(f, 'potential')).toBe(f.potential);
    expect(Number.isNaN(magnitude(Float32Array.of(NaN), Float32Array.of(1))[0])).toBe(true);
  });

  it('magnitudes run from 0 to below the few largest values (a corner singularity does not wash the map out)', () => {
    const values = new Float32Array(1000).map((_, k) => k / 999);
    values[999] = 1e6;
    const r = colourRange(values, MAPS.fieldStrength);
    expect(r.min).toBe(0);
    expect(r.max).toBeLessThan(1);
    expect(r.max).toBeGreaterThan(1 - 2 * CLIP_SHARE);
    expect(r.aboveMax).toBe(true);
    expect(r.colourMap).toBe('cividis');
  });

  it('signed values that change sign get the diverging map, symmetric about 0', () => {
    const values = Float32Array.from([-2, -1, 0, 0.5, 1, NaN]);
    const r = colourRange(values, MAPS.vorticity);
    expect(r.colourMap).toBe('cool-warm');
    expect(r.min).toBe(-r.max);
    expect(r.max).toBe(2);
    expect(rangePosition(0, r)).toBe(0.5);
  });

  it('signed values of one sign, and plain ranges, use their own min and max with a sequential map', () => {
    const r = colourRange(Float32Array.from([10, 20, 30]), MAPS.pressure);
    expect([r.min, r.max, r.colourMap]).toEqual([10, 30, 'viridis']);
    const p = colourRange(Float32Array.from([-5, 400]), MAPS.potential);
    expect([p.min, p.max, p.colourMap]).toEqual([-5, 400, 'viridis']);
  });

  it('a uniform field still gets a usable range, and no values at all say so', () => {
    const r = colourRange(Float32Array.from([7, 7, 7]), MAPS.pressure);
    expect(r.max).toBeGreaterThan(r.min);
    expect(rangePosition(7, r)).toBeCloseTo(0.5, 9);
    expect(colourRange(Float32Array.from([NaN, NaN]), MAPS.pressure).empty).toBe(true);
  });

  it('clamps positions to the range and keeps NaN', () => {
    expect(rangePosition(-1, { min: 0, max: 1 })).toBe(0);
    expect(rangePosition(3, { min: 0, max: 1 })).toBe(1);
    expect(rangePosition(NaN, { min: 0, max: 1 })).toBeNaN();
  });
});
