import { brinkmanFactor, ductError, exactDuctFactor } from './duct-model';

describe('model error against the exact rectangular duct', () => {
  it('gives the square duct its known flow rate, Q = 0.0351 a⁴ G / μ (White, Viscous Fluid Flow; value from memory)', () => {
    // Q/Q₀ with Q₀ = a⁴ G / (12 μ): 0.0351 × 12 = 0.4217.
    expect(exactDuctFactor(1e-4, 1e-4)).toBeCloseTo(0.4217, 3);
  });

  it('is symmetric in depth and width as the duct is, and tends to the plates when wide', () => {
    expect(exactDuctFactor(2e-5, 1e-4) * (2e-5) ** 3 * 1e-4).toBeCloseTo(exactDuctFactor(1e-4, 2e-5) * (1e-4) ** 3 * 2e-5, 25);
    expect(exactDuctFactor(1e-6, 1)).toBeCloseTo(1, 5);
    expect(brinkmanFactor(1e-6, 1)).toBeCloseTo(1, 5);
  });

  it('is a few per cent at depth/width 0.5 (physics.md §3) and small for shallow channels', () => {
    expect(ductError(5e-5, 1e-4).error).toBeGreaterThan(0.02);
    expect(ductError(5e-5, 1e-4).error).toBeLessThan(0.06);
    expect(ductError(1e-5, 1e-3).error).toBeLessThan(0.001);
  });
});
