/**
 * The Compare tab's pure pieces: the port it starts on, one colour range shared by the slip and the pressure
 * maps, a first cut line across the chosen port's channel, the rows of the side-by-side table and the two
 * arrival-time curves of the tracer's band.
 */
import type { DesignDocument } from '../../../../shared/design';
import type { Comparison, ComparisonSide } from '../../../workers/solver-api';
import type { SolveFields } from '../../../../shared/result';
import type { Dimension } from '../../ui/units';
import { colourRange, magnitude, MAPS, type ColourRange } from '../fields/field-maps';
import { insideFluid, type Vec } from '../fields/field-sampling';
import type { PlotSeries } from '../analysis/series-plot';

export type CompareMap = 'speed' | 'vorticity';

/** The electrode with the largest |potential| (the flow passes it whenever it drives anything); else the first port. */
export function defaultComparePort(doc: DesignDocument): string | null {
  const electrodes = doc.ports.filter((p) => p.potential !== null && p.potential !== 0);
  if (electrodes.length === 0) return doc.ports[0]?.id ?? null;
  return electrodes.reduce((a, b) => (Math.abs(b.potential!) > Math.abs(a.potential!) ? b : a)).id;
}

/** The values a Compare map shows: |u| or ω per cell (NaN outside the fluid). */
export function compareValues(fields: SolveFields, map: CompareMap): Float32Array {
  return map === 'speed' ? magnitude(fields.velocityX, fields.velocityY) : fields.vorticity;
}

/** One colour range over both maps, so equal colours mean equal values side by side. */
export function sharedRange(a: Float32Array, b: Float32Array, map: CompareMap): ColourRange {
  const both = new Float32Array(a.length + b.length);
  both.set(a);
  both.set(b, a.length);
  return colourRange(both, MAPS[map]);
}

/**
 * A cut line across the channel at a port, three channel widths inside: the port's own segment moved inwards,
 * lengthened by a fifth at each end so that it crosses both walls.
 */
export function defaultCut(doc: DesignDocument, portId: string, fields: SolveFields): readonly [Vec, Vec] | null {
  const port = doc.ports.find((p) => p.id === portId);
  if (!port) return null;
  const [ax, ay] = port.from, [bx, by] = port.to;
  const w = Math.hypot(bx - ax, by - ay);
  if (!(w > 0)) return null;
  const tx = (bx - ax) / w, ty = (by - ay) / w;
  const mx = (ax + bx) / 2, my = (ay + by) / 2;
  // The normal that points into the fluid.
  let nx = -ty, ny = tx;
  if (!insideFluid(fields, [mx + nx * 0.5 * w, my + ny * 0.5 * w])) [nx, ny] = [-nx, -ny];
  const d = 3 * w, half = 0.7 * w;
  const cx = mx + nx * d, cy = my + ny * d;
  return [
    [cx - tx * half, cy - ty * half],
    [cx + tx * half, cy + ty * half],
  ];
}

export interface CompareRow {
  label: string;
  dimension: Dimension;
  slip: number;
  pressure: number;
  hint?: string;
  testId?: string;
}

export function compareRows(c: Comparison): CompareRow[] {
  const row = (label: string, dimension: Dimension, of: (s: ComparisonSide) => number, extra: Partial<CompareRow> = {}): CompareRow => ({
    label,
    dimension,
    slip: of(c.slip),
    pressure: of(c.pressure),
    ...extra,
  });
  return [
    row(`Flow rate through ${c.port}`, 'flowRate', (s) => s.flowRate, { testId: 'row-flow', hint: 'Positive into the chip; the two drives are matched here.' }),
    row('Largest speed', 'velocity', (s) => s.result.metrics.maxSpeed),
    row('Mean |vorticity|', 'vorticity', (s) => s.meanVorticity, { hint: 'Area-weighted over the fluid.' }),
    row('Largest |vorticity|', 'vorticity', (s) => s.maxVorticity),
    row('Wall shear rate (largest)', 'vorticity', (s) => s.wallShear, { testId: 'row-shear', hint: '|ω| in the fluid cells along the side walls.' }),
    row('Taylor–Aris D_eff / D', 'dimensionless', (s) => s.dispersionRatio, {
      testId: 'row-dispersion',
      hint: 'Closed-form estimate: depth-wise dispersion of the reference species, 1 + (|u − u_tb| d)² / (210 D²), area mean over the chip (physics.md §5). No tracer.',
    }),
    ...(c.slip.band && c.pressure.band ? bandRows(c) : []),
  ];
}

type Band = NonNullable<ComparisonSide['band']>;

/** The tracer's band, per side: the same release line, detector, particles and seed for both drives. */
function bandRows(c: Comparison): CompareRow[] {
  const row = (label: string, dimension: Dimension, of: (b: Band) => number, extra: Partial<CompareRow> = {}): CompareRow => ({
    label,
    dimension,
    slip: of(c.slip.band!),
    pressure: of(c.pressure.band!),
    ...extra,
  });
  const D = c.referenceDiffusivity;
  return [
    row('Band: plate height H', 'length', (b) => b.plateHeight, { testId: 'row-band-plate', hint: 'From the tracer: H = U σ_t² / t̄ at the detector line.' }),
    row('Band: arrival spread σ_t', 'time', (b) => Math.sqrt(b.timeVariance), { testId: 'row-band-spread', hint: 'Square root of the arrival-time variance at the detector.' }),
    row('Band: mean arrival time t̄', 'time', (b) => b.meanTime, { testId: 'row-band-mean', hint: 'From the release line to the detector line.' }),
    row('Band: D_app / D', 'dimensionless', (b) => b.effectiveDiffusivity / D, {
      testId: 'row-band-dispersion',
      hint: 'From the tracer: D_app = H U / 2, along the chosen port’s channel (depth-wise Taylor–Aris, side walls and diffusion together).',
    }),
    row('Band: tilt', 'length', (b) => b.tilt, { hint: 'Arrival-time skew across the detector times U.' }),
  ];
}

/** The two arrival-time curves on the band's shared bins: particles per bin against the bin's mid time. */
export function arrivalSeries(c: Comparison): PlotSeries[] {
  const edges = c.band?.edges ?? [];
  if (!c.slip.band || !c.pressure.band || edges.length < 2) return [];
  const mids = Float64Array.from(edges.slice(1), (e, k) => (e + edges[k]) / 2);
  return [
    { label: 'slip-driven', x: mids, y: Float64Array.from(c.slip.band.counts) },
    { label: 'pressure-driven', x: mids, y: Float64Array.from(c.pressure.band.counts), tone: 'tertiary', dashed: true },
  ];
}
