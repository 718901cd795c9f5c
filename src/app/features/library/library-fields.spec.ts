import { FormControl } from '@angular/forms';
import type { LibraryItem } from '../../core/api-types';
import { LIBRARY_FIELDS, fieldValidators, fieldValue, formatRange, shownValue } from './library-fields';

const field = (kind: 'buffer' | 'wall', key: string) => LIBRARY_FIELDS[kind].find((f) => f.key === key)!;
const control = (kind: 'buffer' | 'wall', key: string, text: string) => {
  const c = new FormControl(text, { nonNullable: true, validators: fieldValidators(field(kind, key)) });
  return c.errors;
};

describe('library fields', () => {
  it('reads values typed with units into SI, and bare numbers in the unit shown', () => {
    expect(fieldValue(field('buffer', 'viscosity'), '0.89 mPa s')).toBeCloseTo(8.9e-4, 12);
    expect(fieldValue(field('buffer', 'viscosity'), '0.89')).toBeCloseTo(8.9e-4, 12);
    expect(fieldValue(field('buffer', 'temperature'), '25 °C')).toBeCloseTo(298.15, 9);
    expect(fieldValue(field('wall', 'zeta'), '-50')).toBeCloseTo(-0.05, 12);
    expect(fieldValue(field('wall', 'zeta'), '')).toBeNull();
  });

  it('refuses what is not the quantity, and requires what a buffer needs', () => {
    expect(control('buffer', 'viscosity', '')).toEqual({ required: true });
    expect(control('buffer', 'viscosity', '3 mm')).toHaveProperty('quantity');
    expect(control('buffer', 'viscosity', '-1')).toHaveProperty('quantity');
    expect(control('wall', 'zeta', '')).toBeNull();
  });

  it('shows stored values with units and ranges', () => {
    const glass = { values: { zeta: -0.07, zetaMin: -0.088, zetaMax: -0.066 } } as unknown as LibraryItem;
    expect(formatRange('wall', glass, 'zeta')).toBe('-70 mV (-88 mV to -66 mV)');
    expect(formatRange('wall', glass, 'mobility')).toBe('—');
    const water = { values: { viscosity: 8.9e-4 } } as unknown as LibraryItem;
    expect(shownValue('buffer', water, 'viscosity')).toBe('0.89 mPa·s');
  });
});
