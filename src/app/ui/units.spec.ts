import { STANDARD_GRAVITY, displayUnit, formatQuantity, headToPressure, parsePressureOrHead, parseQuantity, pressureToHead, type Dimension } from './units';

function value(text: string, dimension: Dimension, defaultUnit?: string): number {
  const r = parseQuantity(text, dimension, { defaultUnit });
  if (!r.ok) throw new Error(r.message);
  return r.value;
}

function message(text: string, dimension: Dimension): string {
  const r = parseQuantity(text, dimension);
  if (r.ok) throw new Error(`expected "${text}" to be refused, got ${r.value}`);
  return r.message;
}

describe('parseQuantity', () => {
  it('reads lengths as engineers type them, in metres', () => {
    expect(value('50 um', 'length')).toBeCloseTo(5e-5, 15);
    expect(value('50 µm', 'length')).toBeCloseTo(5e-5, 15);
    expect(value('50µm', 'length')).toBeCloseTo(5e-5, 15);
    expect(value('1.2 mm', 'length')).toBeCloseTo(1.2e-3, 15);
    expect(value('.5 mm', 'length')).toBeCloseTo(5e-4, 15);
    expect(value('5e-5 m', 'length')).toBeCloseTo(5e-5, 15);
  });

  it('reads potentials in volts, with sign', () => {
    expect(value('1.2 kV', 'potential')).toBeCloseTo(1200, 9);
    expect(value('-40 mV', 'potential')).toBeCloseTo(-0.04, 12);
    expect(value('−40 mV', 'potential')).toBeCloseTo(-0.04, 12); // typographic minus
    expect(value(' 250 V ', 'potential')).toBe(250);
  });

  it('takes the default unit for a bare number and refuses a bare number without one', () => {
    expect(value('50', 'length', 'um')).toBeCloseTo(5e-5, 15);
    expect(message('50', 'length')).toBe('"50" has no unit; enter a length, e.g. 50 um or 1.2 mm');
  });

  it('converts the buffer properties to SI', () => {
    expect(value('0.89 mPa s', 'viscosity')).toBeCloseTo(8.9e-4, 12);
    expect(value('0.89 cP', 'viscosity')).toBeCloseTo(8.9e-4, 12);
    expect(value('997 kg/m3', 'density')).toBeCloseTo(997, 9);
    expect(value('1.4 mS/cm', 'conductivity')).toBeCloseTo(0.14, 12);
    expect(value('10 mM', 'concentration')).toBeCloseTo(10, 12);
    expect(value('10 mmol/L', 'concentration')).toBeCloseTo(10, 12);
    expect(value('78.4', 'dimensionless')).toBe(78.4);
  });

  it('reads temperatures in Celsius or kelvin', () => {
    expect(value('25 °C', 'temperature')).toBeCloseTo(298.15, 9);
    expect(value('25 C', 'temperature')).toBeCloseTo(298.15, 9);
    expect(value('298.15 K', 'temperature')).toBeCloseTo(298.15, 9);
    expect(message('-300 C', 'temperature')).toContain('absolute zero');
  });

  it('reads mobilities however the units are grouped', () => {
    for (const text of ['4.5e-8 m^2/V/s', '4.5e-8 m2/(V s)', '4.5e-4 cm^2/(V*s)', '4.5 × 10⁻⁸ m²/(V·s)', '4.5x10^-8 m^2/V/s']) {
      expect(value(text, 'mobility')).toBeCloseTo(4.5e-8, 20);
    }
  });

  it('reads angles in degrees', () => {
    expect(value('30°', 'angle')).toBeCloseTo(30, 12);
    expect(value('30 deg', 'angle')).toBeCloseTo(30, 12);
    expect(value(`${Math.PI / 2} rad`, 'angle')).toBeCloseTo(90, 9);
  });

  it('explains what is wrong with bad input', () => {
    expect(message('', 'length')).toBe('Enter a length, e.g. 50 um or 1.2 mm');
    expect(message('fifty', 'length')).toBe('"fifty" is not a length I can read; enter a length, e.g. 50 um or 1.2 mm');
    expect(message('50 qq', 'length')).toBe('"50 qq" is not a length I can read; enter a length, e.g. 50 um or 1.2 mm');
    expect(message('3 kV', 'length')).toBe('"3 kV" is a potential; enter a length, e.g. 50 um or 1.2 mm');
    expect(message('50 um', 'potential')).toBe('"50 um" is a length; enter a potential, e.g. 1.2 kV or -40 mV');
    expect(message('78 mm', 'dimensionless')).toContain('plain number');
  });
});

describe('formatQuantity', () => {
  it('picks a prefix that reads naturally', () => {
    expect(formatQuantity(5e-5, 'length')).toBe('50 µm');
    expect(formatQuantity(1.2e-3, 'length')).toBe('1.2 mm');
    expect(formatQuantity(1200, 'potential')).toBe('1.2 kV');
    expect(formatQuantity(-0.04, 'potential')).toBe('-40 mV');
    expect(formatQuantity(0, 'potential')).toBe('0 V');
    expect(formatQuantity(8.9e-4, 'viscosity')).toBe('0.89 mPa·s');
    expect(formatQuantity(298.15, 'temperature')).toBe('25 °C');
    expect(formatQuantity(4.5e-8, 'mobility')).toBe('4.5 × 10⁻⁸ m²/(V·s)');
    expect(formatQuantity(90, 'angle')).toBe('90°');
    expect(formatQuantity(29.33, 'pressure', { digits: 3 })).toBe('29.3 Pa');
  });

  it('gives text that parses back to the same value', () => {
    const cases: Array<[number, Dimension]> = [
      [5e-5, 'length'], [1.234e-3, 'length'], [2.5e-9, 'length'], [1200, 'potential'], [-0.04, 'potential'],
      [8.9e-4, 'viscosity'], [997, 'density'], [0.14, 'conductivity'], [10, 'concentration'], [298.15, 'temperature'],
      [-4.5e-8, 'mobility'], [1500, 'pressure'], [-30, 'angle'], [78.4, 'dimensionless'],
    ];
    for (const [v, dim] of cases) {
      const back = parseQuantity(formatQuantity(v, dim), dim);
      expect(back.ok && back.value / v).toBeCloseTo(1, 9);
    }
  });
});

describe('result quantities', () => {
  it('format with a fitting prefix and parse back', () => {
    expect(formatQuantity(2.5e5, 'fieldStrength')).toBe('250 kV/m');
    expect(formatQuantity(1.2e-3, 'velocity')).toBe('1.2 mm/s');
    expect(formatQuantity(-2.8e-5, 'current')).toBe('-28 µA');
    expect(formatQuantity(1e-12, 'flowRate')).toBe('60 nL/min');
    expect(formatQuantity(-3200, 'vorticity')).toBe('-3200 1/s');
    expect(formatQuantity(0.0123, 'power')).toBe('12.3 mW');
    expect(formatQuantity(48213.7, 'shearRate')).toBe('48210 1/s');
    const cases: Array<[number, Dimension]> = [
      [2.5e5, 'fieldStrength'], [1.2e-3, 'velocity'], [-2.8e-5, 'current'], [1e-12, 'flowRate'], [-3200, 'vorticity'],
      [5e-8, 'streamfunction'], [0.0123, 'power'], [4821, 'shearRate'],
    ];
    for (const [v, dim] of cases) {
      const back = parseQuantity(formatQuantity(v, dim), dim);
      expect(back.ok && back.value / v).toBeCloseTo(1, 9);
    }
  });

  it('share one display unit across a range (colour bars, plot axes)', () => {
    expect(displayUnit(2.5e5, 'fieldStrength')).toEqual({ label: 'kV/m', factor: 1e3 });
    expect(displayUnit(400, 'potential')).toEqual({ label: 'V', factor: 1 });
    expect(displayUnit(0, 'current').label).toBe('µA');
  });
});

describe('parsePressureOrHead', () => {
  it('turns a head of buffer into pressure with p = rho g h', () => {
    for (const text of ['3 mm', '3 mm of water', '3 mmH2O', '3 mm H2O']) {
      const r = parsePressureOrHead(text, 997);
      expect(r.ok).toBe(true);
      if (r.ok) {
        expect(r.value).toBeCloseTo(29.33, 2); // 997 kg/m3 * 9.80665 m/s2 * 0.003 m
        expect(r.head).toBeCloseTo(0.003, 12);
      }
    }
  });

  it('takes a pressure as it is', () => {
    const r = parsePressureOrHead('1.5 kPa', 997);
    expect(r).toEqual({ ok: true, value: 1500 });
  });

  it('says what it expected for bad input', () => {
    const r = parsePressureOrHead('3 kV', 997);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toBe('"3 kV" is neither a pressure (e.g. 120 Pa, 1.5 kPa) nor a head of buffer (e.g. 3 mm)');
  });

  it('converts between head and pressure both ways', () => {
    expect(headToPressure(0.01, 1000)).toBeCloseTo(1000 * STANDARD_GRAVITY * 0.01, 12);
    expect(pressureToHead(headToPressure(0.004, 997), 997)).toBeCloseTo(0.004, 15);
  });
});
