/**
 * What the Double layer tab shows for a buffer and a wall, computed in the instant worker: the report of
 * solver/double-layer (Debye length, Gouy–Chapman and Debye–Hückel profiles, velocity and vorticity across the
 * EDL, finite-EDL corrections, the thin-EDL verdict), the plot series in nanometres or in Debye lengths, and a
 * check of the closed-form potential against the numerical Poisson–Boltzmann solution.
 */
import { doubleLayer, solvePoissonBoltzmann, gouyChapmanPotential, type DoubleLayerReport } from '../../solver/double-layer';
import type { PlotSeries } from '../app/features/analysis/plot-series';

export interface EdlInputs {
  ionicStrength: number;
  zeta: number;
  temperature: number;
  field: number;
  relativePermittivity: number;
  viscosity: number;
  depth: number;
  /** The layout's narrowest channel (m), when measured. */
  width: number | null;
}

export type DistanceAxis = 'nm' | 'debye';

export interface EdlView {
  report: DoubleLayerReport;
  /** Largest |ψ_GC − ψ_PB| over the numerical grid (V), and the Newton iterations the PB solve took. */
  check: { maxDifference: number; iterations: number };
  potential: PlotSeries[];
  velocity: PlotSeries[];
  vorticity: PlotSeries[];
}

export function edlView(inp: EdlInputs, axis: DistanceAxis): EdlView {
  const report = doubleLayer({
    ionicStrength: inp.ionicStrength,
    zeta: inp.zeta,
    temperature: inp.temperature,
    relativePermittivity: inp.relativePermittivity,
    viscosity: inp.viscosity,
    field: inp.field,
    depth: inp.depth,
    width: inp.width ?? undefined,
  });
  const lambda = report.debyeLength;
  const p = report.profile;
  const x = axis === 'nm' ? p.y : p.y.map((y) => y / lambda);
  const dhVelocity = p.y.map((y) => 1 - Math.exp(-y / lambda));
  const dhVorticity = p.y.map((y) => (-report.slipVelocity * Math.exp(-y / lambda)) / lambda);

  const pb = solvePoissonBoltzmann(inp.zeta, lambda, inp.temperature);
  let maxDifference = 0;
  for (let k = 0; k < pb.y.length; k++) {
    maxDifference = Math.max(maxDifference, Math.abs(pb.psi[k] - gouyChapmanPotential(pb.y[k], inp.zeta, lambda, inp.temperature)));
  }
  return {
    report,
    check: { maxDifference, iterations: pb.iterations },
    potential: [
      { label: 'Gouy–Chapman', x, y: p.potential },
      { label: 'Debye–Hückel', x, y: p.potentialDebyeHuckel, dashed: true, tone: 'tertiary' },
    ],
    velocity: [
      { label: 'Gouy–Chapman', x, y: p.velocityRatio },
      { label: 'Debye–Hückel', x, y: dhVelocity, dashed: true, tone: 'tertiary' },
    ],
    vorticity: [
      { label: 'Gouy–Chapman', x, y: p.vorticity },
      { label: 'Debye–Hückel', x, y: dhVorticity, dashed: true, tone: 'tertiary' },
    ],
  };
}
