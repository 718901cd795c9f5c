import { quantityControl, quantityError, readQuantity } from './quantity-validator';

describe('quantity validator', () => {
  it('accepts a value in range and gives it in SI', () => {
    expect(readQuantity('50 um', { dimension: 'length', min: 0, minExclusive: true })).toEqual({ ok: true, value: 5e-5 });
  });

  it('explains a value out of range with its unit', () => {
    expect(readQuantity('0 um', { dimension: 'length', min: 0, minExclusive: true })).toEqual({ ok: false, message: 'Must be greater than 0 µm' });
    expect(readQuantity('2 kV', { dimension: 'potential', max: 1000 })).toEqual({ ok: false, message: 'Must be at most 1 kV' });
  });

  it('puts the message on the control and shows the value with the shared formatter', () => {
    const control = quantityControl(5e-5, { dimension: 'length', defaultUnit: 'um' });
    expect(control.value).toBe('50 µm');
    expect(control.valid).toBe(true);
    control.setValue('3 kV');
    expect(quantityError(control)).toBe('"3 kV" is a potential; enter a length, e.g. 50 um or 1.2 mm');
    control.setValue('75');
    expect(control.valid).toBe(true);
  });
});
