/**
 * The Compare tab's pure pieces: the port it starts on, one colour range shared by the slip and the pressure
 * maps, a first cut line across the chosen port's channel, and the rows of the side-by-side table.
 */
import type { DesignDocument } from '../../../../shared/design';
import type { Comparison, ComparisonSide } from '../../../../solver/compare';
import type { SolveFields } from '../../../../solver/result/types';
import type { Dimension } from '../../ui/units';
import { colourRange, magnitude, MAPS, type ColourRange } from '../fields/field-maps';
import { insideFluid, type Vec } from '../fields/field-sampling';

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
      hint: 'Depth-wise dispersion of the reference species, 1 + (|u − u_tb| d)² / (210 D²), area mean (physics.md §5).',
    }),
  ];
}
