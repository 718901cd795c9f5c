import { debyeLength, electroosmoticMobility, thermalVoltage, zetaFromMobility } from '../../solver/physics/electrokinetics';
import { waterPermittivity, waterViscosity } from '../../solver/physics/water';

describe('water properties', () => {
  it('reproduces the IAPWS 2008 viscosity check value (IAPWS R12-08 check table: 889.735100 µPa·s at 298.15 K, 998 kg/m³)', () => {
    expect(waterViscosity(298.15, 998) * 1e6).toBeCloseTo(889.7351, 4);
  });

  it('gives 890.02 µPa·s at 25 °C and 1001.6 µPa·s at 20 °C at atmospheric density (reference-values.md §1, IAPWS 2008)', () => {
    expect(waterViscosity(298.15, 997.047) * 1e6).toBeCloseTo(890.02, 1);
    expect(waterViscosity(293.15, 998.207) * 1e6).toBeCloseTo(1001.6, 0);
  });

  it('gives ε_r = 78.30 at 25 °C and 80.10 at 20 °C (Malmberg & Maryott 1956)', () => {
    expect(waterPermittivity(298.15)).toBeCloseTo(78.3, 2);
    expect(waterPermittivity(293.15)).toBeCloseTo(80.103, 2);
  });
});

describe('electrokinetic relations', () => {
  it('gives the Debye lengths of reference-values.md §2 (1:1, 25 °C, ε_r 78.41: 9.61, 3.04, 0.961 nm)', () => {
    expect(debyeLength(78.41, 298.15, 1) * 1e9).toBeCloseTo(9.61, 2);
    expect(debyeLength(78.41, 298.15, 10) * 1e9).toBeCloseTo(3.04, 2);
    expect(debyeLength(78.41, 298.15, 100) * 1e9).toBeCloseTo(0.961, 3);
    // Israelachvili's handy form 0.304 nm / sqrt(I in M)
    expect(debyeLength(78.41, 298.15, 10) * 1e9 * Math.sqrt(0.01)).toBeCloseTo(0.304, 3);
  });

  it('gives the Smoluchowski mobility of the worked example (ζ = −50 mV, ε_r 78.41, μ 890.02 µPa·s: 3.9001e-8 m²/(V s))', () => {
    const mu = electroosmoticMobility(78.41, 890.02e-6, -0.05);
    expect(mu / 3.9001e-8).toBeCloseTo(1, 3);
    expect(zetaFromMobility(78.41, 890.02e-6, mu)).toBeCloseTo(-0.05, 12);
    // u = μ_eo E at 10 kV/m: 0.390 mm/s along E (reference-values.md §3)
    expect(mu * 1e4 * 1e3).toBeCloseTo(0.39, 3);
  });

  it('gives the thermal voltage 25.6926 mV at 25 °C', () => {
    expect(thermalVoltage(298.15) * 1e3).toBeCloseTo(25.6926, 3);
  });
});
