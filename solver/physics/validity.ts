/**
 * The validity checks Osmolane reports with every solve (physics.md §6). Thresholds that are common practice or
 * from memory say so; the high-voltage caution defers to local electrical-safety rules.
 */
import { HIGH_VOLTAGE_CAUTION, LIMITS } from '../../shared/physics';

export type WarningCode = 'thin-edl' | 'creeping-flow' | 'joule-heating' | 'high-voltage' | 'resolution';

export interface ValidityWarning {
  code: WarningCode;
  message: string;
}

export interface ValidityInput {
  debyeLength: number;
  /** Narrowest channel width in the layout and the channel depth (m). */
  narrowestWidth: number;
  depth: number;
  /** Largest Reynolds number ρ U D_h / μ found in the layout; undefined when no flow was solved. */
  reynolds?: number;
  /** Largest Joule power per unit channel length (W/m). */
  powerPerLength?: number;
  /** Largest |port potential| (V). */
  maxPortVoltage: number;
  /** Grid cells across the narrowest channel. */
  cellsAcrossNarrowest: number;
}

/** Thresholds (physics.md §6) and the high-voltage caution live in shared/physics.ts (the app shows them). */
export { HIGH_VOLTAGE_CAUTION, LIMITS } from '../../shared/physics';

export function validityWarnings(v: ValidityInput): ValidityWarning[] {
  const out: ValidityWarning[] = [];
  const smallest = Math.min(v.narrowestWidth, v.depth);
  const ratio = v.debyeLength / smallest;
  if (ratio > LIMITS.thinEdl) {
    out.push({
      code: 'thin-edl',
      message: `Debye length ${fmt(v.debyeLength * 1e9)} nm is ${fmt(ratio * 100)} % of the smallest channel dimension (${fmt(smallest * 1e6)} µm); the thin-double-layer slip model needs well under 1 %.`,
    });
  }
  if (v.reynolds !== undefined && v.reynolds > LIMITS.reynolds) {
    out.push({
      code: 'creeping-flow',
      message: `Reynolds number ${fmt(v.reynolds)} is above 1; the creeping-flow model neglects inertia that matters here.`,
    });
  }
  if (v.powerPerLength !== undefined && v.powerPerLength > LIMITS.powerPerLength) {
    out.push({
      code: 'joule-heating',
      message: `Joule heating reaches ${fmt(v.powerPerLength)} W/m of channel (above about 1 W/m); the buffer warms and its conductivity and viscosity change, which this model does not couple back.`,
    });
  }
  if (v.maxPortVoltage > LIMITS.highVoltage) {
    out.push({ code: 'high-voltage', message: `A port is at ${fmt(v.maxPortVoltage)} V. ${HIGH_VOLTAGE_CAUTION}` });
  }
  if (v.cellsAcrossNarrowest < LIMITS.cellsAcross) {
    out.push({
      code: 'resolution',
      message: `Only ${fmt(v.cellsAcrossNarrowest)} grid cells across the narrowest channel (at least 8 are needed for trustworthy fields); raise the resolution.`,
    });
  }
  return out;
}

function fmt(x: number): string {
  return Number(x.toPrecision(3)).toString();
}
