import {
  capillaryMeanRatio,
  doubleLayer,
  edlVelocityRatio,
  gouyChapmanPotential,
  slitMeanRatio,
  solvePoissonBoltzmann,
} from '../../solver/double-layer';
import { debyeLength } from '../../solver/physics/electrokinetics';

const T = 298.15;
const lambda10mM = debyeLength(78.41, T, 10);

describe('Gouy–Chapman double layer (reference-values.md §4)', () => {
  it('matches the worked profile for ζ = −50 mV, 1:1, 25 °C (computed values in reference-values.md §4)', () => {
    const expected: [number, number, number][] = [
      // y/λ_D, ψ_GC (mV), u/u_HS
      [0.5, -28.88, 0.4225],
      [1, -17.23, 0.6554],
      [2, -6.29, 0.8743],
      [3, -2.31, 0.9538],
      [5, -0.313, 0.9937],
    ];
    for (const [yl, psi, ratio] of expected) {
      const p = gouyChapmanPotential(yl * lambda10mM, -0.05, lambda10mM, T);
      expect(p * 1e3).toBeCloseTo(psi, psi > -1 ? 3 : 2);
      expect(edlVelocityRatio(p, -0.05)).toBeCloseTo(ratio, 4);
    }
  });

  it('agrees with a numerical solution of the nonlinear Poisson–Boltzmann equation', () => {
    for (const zeta of [-0.025, -0.1, -0.2]) {
      const pb = solvePoissonBoltzmann(zeta, lambda10mM, T);
      let worst = 0;
      for (let k = 0; k < pb.y.length; k++) {
        if (pb.y[k] > 10 * lambda10mM) break;
        worst = Math.max(worst, Math.abs(pb.psi[k] - gouyChapmanPotential(pb.y[k], zeta, lambda10mM, T)));
      }
      expect(worst / Math.abs(zeta)).toBeLessThan(1e-4);
      expect(pb.iterations).toBeLessThan(10);
    }
  });

  it('tends to the Debye–Hückel profile ζ e^(−y/λ) for small ζ (reference-values.md §4)', () => {
    const zeta = -0.001;
    for (const yl of [0.5, 1, 2]) {
      expect(gouyChapmanPotential(yl * lambda10mM, zeta, lambda10mM, T) / (zeta * Math.exp(-yl))).toBeCloseTo(1, 4);
    }
  });
});

describe('finite-EDL corrections of the mean velocity (reference-values.md §4 table, Debye–Hückel)', () => {
  const table: [number, number, number][] = [
    [1, 0.23841, 0.10722],
    [2, 0.51799, 0.30223],
    [5, 0.80002, 0.64265],
    [10, 0.9, 0.81028],
    [20, 0.95, 0.90253],
    [50, 0.98, 0.9604],
    [100, 0.99, 0.9801],
  ];
  it.each(table)('κh = %p: slit %p, capillary %p', (k, slit, tube) => {
    expect(slitMeanRatio(k)).toBeCloseTo(slit, 5);
    expect(capillaryMeanRatio(k)).toBeCloseTo(tube, 5);
  });

  it('follows the large-κ limits 1 − 1/(κh) and 1 − 2/(κa)', () => {
    expect(slitMeanRatio(1e4)).toBeCloseTo(1 - 1e-4, 8);
    expect(capillaryMeanRatio(1e4)).toBeCloseTo(1 - 2e-4, 7);
  });
});

describe('the double-layer report', () => {
  it('gives the Debye length, the slip velocity and a verdict for a 20 µm deep, 50 µm wide channel at 10 mM', () => {
    const r = doubleLayer({ ionicStrength: 10, zeta: -0.05, temperature: T, relativePermittivity: 78.41, viscosity: 890.02e-6, depth: 2e-5, width: 5e-5 });
    expect(r.debyeLength * 1e9).toBeCloseTo(3.04, 2);
    expect(r.slipVelocity * 1e3).toBeCloseTo(0.39, 3); // 10 kV/m default field, reference-values.md §3
    expect(r.thinEdlHolds).toBe(true);
    expect(r.profile.velocityRatio[0]).toBeCloseTo(0, 12);
    // The EDL vorticity at the wall dwarfs that of pressure-driven flow at the same mean speed.
    expect(Math.abs(r.wallVorticity) / r.pressureWallVorticity!).toBeGreaterThan(100);
  });

  it('says the thin-EDL model fails in a 100 nm nanochannel at 1 mM', () => {
    const r = doubleLayer({ ionicStrength: 1, zeta: -0.05, temperature: T, relativePermittivity: 78.41, viscosity: 890.02e-6, depth: 1e-7, width: 1e-6 });
    expect(r.thinEdlHolds).toBe(false);
    expect(r.verdict).toMatch(/above the 1 % rule/);
  });
});
