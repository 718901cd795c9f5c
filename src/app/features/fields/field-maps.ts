/**
 * The maps of the Fields tab: which values each one shows, its unit, its colour map and its colour range.
 * Magnitudes use cividis or viridis from 0 up; signed quantities centred on zero (vorticity, and pressure when
 * it changes sign) use the diverging cool-warm map over a range symmetric about 0 (product.md, "Look").
 */
import type { ColourMapName } from '../../../../shared/colour-maps';
import type { SolveFields } from '../../../../shared/result';
import type { Dimension } from '../../ui/units';

export const MAP_IDS = ['potential', 'fieldStrength', 'speed', 'vorticity', 'pressure', 'streamfunction'] as const;
export type MapId = (typeof MAP_IDS)[number];

export interface MapSpec {
  id: MapId;
  /** Tab label. */
  label: string;
  /** Name with its symbol, for colour bars, plots and the readout. */
  title: string;
  /** The symbol alone (colour bar heading). */
  symbol: string;
  dimension: Dimension;
  /** How the range is chosen: from 0 up (magnitude), symmetric about 0 (signed), or the values' own range. */
  scale: 'magnitude' | 'signed' | 'range';
}

export const MAPS: Readonly<Record<MapId, MapSpec>> = {
  potential: { id: 'potential', label: 'Potential', title: 'Potential φ', symbol: 'φ', dimension: 'potential', scale: 'range' },
  fieldStrength: { id: 'fieldStrength', label: 'Field |E|', title: 'Field strength |E|', symbol: '|E|', dimension: 'fieldStrength', scale: 'magnitude' },
  speed: { id: 'speed', label: 'Speed |u|', title: 'Speed |u|', symbol: '|u|', dimension: 'velocity', scale: 'magnitude' },
  vorticity: { id: 'vorticity', label: 'Vorticity', title: 'Vorticity ω', symbol: 'ω', dimension: 'vorticity', scale: 'signed' },
  pressure: { id: 'pressure', label: 'Pressure', title: 'Pressure p (gauge)', symbol: 'p', dimension: 'pressure', scale: 'signed' },
  streamfunction: { id: 'streamfunction', label: 'Streamfunction', title: 'Streamfunction ψ', symbol: 'ψ', dimension: 'streamfunction', scale: 'range' },
};

/** Share of the largest values left above the colour range (singular corners would otherwise wash the map out). */
export const CLIP_SHARE = 0.005;

/** The values a map shows, per cell (NaN outside the fluid). */
export function mapValues(fields: SolveFields, id: MapId): Float32Array {
  switch (id) {
    case 'potential':
      return fields.potential;
    case 'fieldStrength':
      return magnitude(fields.fieldX, fields.fieldY);
    case 'speed':
      return magnitude(fields.velocityX, fields.velocityY);
    case 'vorticity':
      return fields.vorticity;
    case 'pressure':
      return fields.pressure;
    case 'streamfunction':
      return fields.streamfunction;
  }
}

export function magnitude(x: Float32Array, y: Float32Array): Float32Array {
  const out = new Float32Array(x.length);
  for (let k = 0; k < x.length; k++) out[k] = Math.hypot(x[k], y[k]);
  return out;
}

export interface ColourRange {
  min: number;
  max: number;
  /** Values beyond the ends exist (shown in the end colour, marked on the bar). */
  belowMin: boolean;
  aboveMax: boolean;
  colourMap: ColourMapName;
  /** Whether any value is finite. */
  empty: boolean;
}

/**
 * The colour range of a map's values: magnitudes from 0 to the value below which all but CLIP_SHARE of the cells
 * lie; signed values symmetric about 0 (diverging map) when they change sign; otherwise their own min to max.
 */
export function colourRange(values: ArrayLike<number>, spec: Pick<MapSpec, 'scale'>): ColourRange {
  const finite: number[] = [];
  for (let k = 0; k < values.length; k++) if (Number.isFinite(values[k])) finite.push(values[k]);
  if (finite.length === 0) return { min: 0, max: 1, belowMin: false, aboveMax: false, colourMap: 'cividis', empty: true };
  const sorted = Float64Array.from(finite).sort();
  const lo = sorted[0], hi = sorted[sorted.length - 1];
  const quantile = (q: number) => sorted[Math.min(sorted.length - 1, Math.ceil(q * (sorted.length - 1)))];
  let out: ColourRange;
  if (spec.scale === 'magnitude') {
    const top = quantile(1 - CLIP_SHARE);
    out = { min: 0, max: top, belowMin: false, aboveMax: hi > top, colourMap: 'cividis', empty: false };
  } else if (spec.scale === 'signed' && lo < 0 && hi > 0) {
    const abs = Float64Array.from(sorted, Math.abs).sort();
    const top = abs[Math.min(abs.length - 1, Math.ceil((1 - CLIP_SHARE) * (abs.length - 1)))];
    out = { min: -top, max: top, belowMin: lo < -top, aboveMax: hi > top, colourMap: 'cool-warm', empty: false };
  } else {
    out = { min: lo, max: hi, belowMin: false, aboveMax: false, colourMap: 'viridis', empty: false };
  }
  if (!(out.max > out.min)) {
    // A uniform field (e.g. equal pressures everywhere): a small range around the value, so it still reads.
    const pad = Math.abs(out.max) > 0 ? Math.abs(out.max) * 0.01 : 1e-12;
    out = { ...out, min: out.min - pad, max: out.max + pad, belowMin: false, aboveMax: false };
    if (spec.scale === 'magnitude') out.min = 0;
  }
  return out;
}

/** Where v falls in the range, in [0, 1] (clamped); NaN stays NaN. */
export function rangePosition(v: number, range: Pick<ColourRange, 'min' | 'max'>): number {
  if (!Number.isFinite(v)) return NaN;
  return Math.min(1, Math.max(0, (v - range.min) / (range.max - range.min)));
}
