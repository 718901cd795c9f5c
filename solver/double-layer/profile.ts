import { debyeLength as debye, electroosmoticMobility } from '../physics/electrokinetics';
import { LIMITS } from '../physics/validity';
import { capillaryMeanRatio, slitMeanRatio } from './finite-edl';
import { edlVelocityRatio, gouyChapmanPotential, gouyChapmanSlope } from './gouy-chapman';

export interface DoubleLayerInput {
  /** mol/m³ */
  ionicStrength: number;
  /** V */
  zeta: number;
  /** K */
  temperature: number;
  relativePermittivity: number;
  /** Pa s */
  viscosity: number;
  valence?: number;
  /** Tangential field driving the slip (V/m); default 10 kV/m. */
  field?: number;
  /** Channel depth and narrowest width of the layout (m), for the finite-EDL corrections and the verdict. */
  depth?: number;
  width?: number;
  /** Points across the profile (default 121) and its extent in Debye lengths (default 8). */
  points?: number;
  extent?: number;
}

export interface DoubleLayerReport {
  debyeLength: number;
  mobility: number;
  slipVelocity: number;
  /** Distance from the wall (m) and, at each point: Gouy–Chapman ψ, Debye–Hückel ψ (V), u/u_HS, vorticity (1/s). */
  profile: { y: number[]; potential: number[]; potentialDebyeHuckel: number[]; velocityRatio: number[]; vorticity: number[] };
  /** Vorticity at the wall from the double layer, and that of pressure-driven flow between floor and lid at the same mean speed (6U/d). */
  wallVorticity: number;
  pressureWallVorticity?: number;
  /** Mean-velocity corrections (Debye–Hückel) for the channel's depth as a slit and the width as a capillary diameter. */
  slitCorrection?: number;
  capillaryCorrection?: number;
  /** λ_D over the smallest channel dimension, and whether the thin-EDL model holds (< 1 %, common practice). */
  ratio?: number;
  thinEdlHolds?: boolean;
  verdict: string;
}

/** Everything the Double layer tab and `osmolane edl` report for one buffer and wall. */
export function doubleLayer(input: DoubleLayerInput): DoubleLayerReport {
  const z = input.valence ?? 1;
  const lambda = debye(input.relativePermittivity, input.temperature, input.ionicStrength, z);
  const mobility = electroosmoticMobility(input.relativePermittivity, input.viscosity, input.zeta);
  const field = input.field ?? 1e4;
  const uhs = mobility * field;
  const n = input.points ?? 121;
  const extent = (input.extent ?? 8) * lambda;
  const profile = { y: [] as number[], potential: [] as number[], potentialDebyeHuckel: [] as number[], velocityRatio: [] as number[], vorticity: [] as number[] };
  for (let k = 0; k < n; k++) {
    const y = (extent * k) / (n - 1);
    const psi = gouyChapmanPotential(y, input.zeta, lambda, input.temperature, z);
    profile.y.push(y);
    profile.potential.push(psi);
    profile.potentialDebyeHuckel.push(input.zeta * Math.exp(-y / lambda));
    profile.velocityRatio.push(edlVelocityRatio(psi, input.zeta));
    // ω = −du/dy with u = u_HS (1 − ψ/ζ): ω = u_HS ψ'(y) / ζ.
    profile.vorticity.push(input.zeta === 0 ? 0 : (uhs * gouyChapmanSlope(psi, lambda, input.temperature, z)) / input.zeta);
  }
  const report: DoubleLayerReport = {
    debyeLength: lambda,
    mobility,
    slipVelocity: uhs,
    profile,
    wallVorticity: profile.vorticity[0],
    verdict: '',
  };
  const dims = [input.depth, input.width].filter((v): v is number => v !== undefined && v > 0);
  if (input.depth) {
    report.pressureWallVorticity = (6 * Math.abs(uhs)) / input.depth;
    report.slitCorrection = slitMeanRatio(input.depth / 2 / lambda);
  }
  if (input.width) report.capillaryCorrection = capillaryMeanRatio(input.width / 2 / lambda);
  if (dims.length) {
    const smallest = Math.min(...dims);
    report.ratio = lambda / smallest;
    report.thinEdlHolds = report.ratio < LIMITS.thinEdl;
    const pct = (report.ratio * 100).toPrecision(2);
    report.verdict = report.thinEdlHolds
      ? `The Debye length is ${pct} % of the smallest channel dimension: the thin-double-layer slip model holds (below 1 %, common practice).`
      : `The Debye length is ${pct} % of the smallest channel dimension: above the 1 % rule of thumb, the slip model overestimates the flow; use the finite-EDL correction as a guide.`;
  } else {
    report.verdict = 'Give the channel depth and width to judge the thin-double-layer model.';
  }
  return report;
}
