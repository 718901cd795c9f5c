/**
 * Physical constants, the Helmholtz–Smoluchowski relation and the validity thresholds that both the app and the
 * solver need (physics.md §4, §6). Pure: no imports. solver/physics re-exports these.
 */

/** Physical constants, SI. Exact values are those fixed by the 2019 SI; ε₀ is CODATA 2022. */
export const BOLTZMANN = 1.380649e-23; // J/K, exact
export const ELEMENTARY_CHARGE = 1.602176634e-19; // C, exact
export const AVOGADRO = 6.02214076e23; // 1/mol, exact
export const VACUUM_PERMITTIVITY = 8.8541878188e-12; // F/m, CODATA 2022
export const FARADAY = AVOGADRO * ELEMENTARY_CHARGE; // C/mol
export const GAS_CONSTANT = AVOGADRO * BOLTZMANN; // J/(mol K)
export const STANDARD_GRAVITY = 9.80665; // m/s², exact by definition (CGPM 1901)

/**
 * Electroosmotic mobility from the Helmholtz–Smoluchowski relation: μ_eo = −ε ζ / μ
 * (positive for a negatively charged wall: flow towards the cathode).
 */
export function electroosmoticMobility(relativePermittivity: number, viscosity: number, zeta: number): number {
  return (-relativePermittivity * VACUUM_PERMITTIVITY * zeta) / viscosity;
}

/** The zeta potential that gives a mobility (inverse of `electroosmoticMobility`). */
export function zetaFromMobility(relativePermittivity: number, viscosity: number, mobility: number): number {
  return (-mobility * viscosity) / (relativePermittivity * VACUUM_PERMITTIVITY);
}

/** Validity thresholds (physics.md §6). */
export const LIMITS = {
  /** λ_D / min(width, depth): common practice, no single source. */
  thinEdl: 0.01,
  /** Re: common practice. */
  reynolds: 1,
  /** W/m: common practice in capillary electrophoresis, value from memory. */
  powerPerLength: 1,
  /** V: above this a port gets the high-voltage caution. */
  highVoltage: 50,
  /** cells across the narrowest channel. */
  cellsAcross: 8,
} as const;

/** The high-voltage caution; it defers to local electrical-safety rules. */
export const HIGH_VOLTAGE_CAUTION =
  'High voltage: supplies of this size can kill. Use a current-limited supply and an interlocked enclosure that cuts ' +
  'and discharges the voltage when opened; never touch reservoirs, electrodes or liquid while energised. Follow your ' +
  "local electrical-safety rules and the practice of people trained in high-voltage work; Osmolane's numbers do not replace them.";
