import { validityWarnings } from './validity';

const ok = { debyeLength: 3e-9, narrowestWidth: 5e-5, depth: 2e-5, reynolds: 0.05, powerPerLength: 0.2, maxPortVoltage: 10, cellsAcrossNarrowest: 10 };

describe('validity warnings (physics.md §6)', () => {
  it('stays quiet for a typical chip', () => {
    expect(validityWarnings(ok)).toEqual([]);
  });

  it('fires each check at its threshold and names the numbers', () => {
    const codes = (over: Partial<typeof ok>) => validityWarnings({ ...ok, ...over }).map((w) => w.code);
    expect(codes({ debyeLength: 2.1e-7 })).toEqual(['thin-edl']); // 210 nm / 20 µm = 1.05 %
    expect(codes({ debyeLength: 1.9e-7 })).toEqual([]);
    expect(codes({ reynolds: 1.1 })).toEqual(['creeping-flow']);
    expect(codes({ powerPerLength: 1.5 })).toEqual(['joule-heating']);
    expect(codes({ maxPortVoltage: 51 })).toEqual(['high-voltage']);
    expect(codes({ maxPortVoltage: 50 })).toEqual([]);
    expect(codes({ cellsAcrossNarrowest: 7 })).toEqual(['resolution']);
    const hv = validityWarnings({ ...ok, maxPortVoltage: 1200 })[0].message;
    expect(hv).toContain('1200 V');
    expect(hv).toMatch(/local electrical-safety rules/);
  });
});
