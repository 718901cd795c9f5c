import { displayUnit, formatQuantity, parseQuantity } from './units';

const value = (text: string, dimension: Parameters<typeof parseQuantity>[1]) => {
  const r = parseQuantity(text, dimension);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};

describe('units of the tracer and the double layer', () => {
  it('reads diffusivities as engineers write them and shows them like mobilities', () => {
    expect(value('1e-9 m2/s', 'diffusivity')).toBeCloseTo(1e-9, 22);
    expect(value('1000 um^2/s', 'diffusivity')).toBeCloseTo(1e-9, 22);
    expect(value('1e-5 cm²/s', 'diffusivity')).toBeCloseTo(1e-9, 22);
    expect(formatQuantity(1e-9, 'diffusivity')).toBe('1 × 10⁻⁹ m²/s');
    expect(value(formatQuantity(4.2e-10, 'diffusivity'), 'diffusivity')).toBeCloseTo(4.2e-10, 22);
    expect(displayUnit(1e-9, 'diffusivity')).toEqual({ label: 'm²/s', factor: 1 });
    expect(parseQuantity('1 m/s', 'diffusivity').ok).toBe(false);
    // Bare numbers in the Tracer's fields take SI.
    expect(parseQuantity('2e-10', 'diffusivity', { defaultUnit: 'm^2/s' })).toEqual({ ok: true, value: 2e-10 });
    const mobility = parseQuantity('-2e-8', 'mobility', { defaultUnit: 'm^2/V*s' });
    expect(mobility.ok && mobility.value).toBeCloseTo(-2e-8, 20);
  });

  it('reads and shows times', () => {
    expect(value('50 ms', 'time')).toBeCloseTo(0.05, 12);
    expect(value('1.5 s', 'time')).toBe(1.5);
    expect(formatQuantity(0.0123, 'time')).toBe('12.3 ms');
    expect(formatQuantity(2.5, 'time')).toBe('2.5 s');
    expect(displayUnit(4e-4, 'time').label).toBe('µs');
  });
});
