/** Physical constants, SI. Exact values are those fixed by the 2019 SI; ε₀ is CODATA 2022. */
export const BOLTZMANN = 1.380649e-23; // J/K, exact
export const ELEMENTARY_CHARGE = 1.602176634e-19; // C, exact
export const AVOGADRO = 6.02214076e23; // 1/mol, exact
export const VACUUM_PERMITTIVITY = 8.8541878188e-12; // F/m, CODATA 2022
export const FARADAY = AVOGADRO * ELEMENTARY_CHARGE; // C/mol
export const GAS_CONSTANT = AVOGADRO * BOLTZMANN; // J/(mol K)
export const STANDARD_GRAVITY = 9.80665; // m/s², exact by definition (CGPM 1901)
