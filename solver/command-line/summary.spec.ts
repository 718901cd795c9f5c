import { formatFlow, formatSI } from './summary';

describe('the summary units', () => {
  it('writes values with an SI prefix and 4 significant digits', () => {
    expect(formatSI(-5.698215e-5, 'A')).toBe('-56.98 µA');
    expect(formatSI(1000, 'V')).toBe('1 kV');
    expect(formatSI(0, 'V')).toBe('0 V');
    expect(formatSI(null, 'V')).toBe('—');
    expect(formatSI(NaN, 'Pa')).toBe('—');
    expect(formatSI(3.04e-9, 'm')).toBe('3.04 nm');
    expect(formatSI(999.99999, 'V')).toBe('1 kV');
  });
  it('gives flow rates per minute', () => {
    expect(formatFlow(3.351e-12)).toBe('201.1 nL/min');
  });
});
