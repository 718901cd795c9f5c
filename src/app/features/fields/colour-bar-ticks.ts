/**
 * Ticks for a colour bar or a plot axis: round values (1, 2 or 5 × 10^k) inside the range, written in one display
 * unit chosen by the app's unit formatter for the largest magnitude, with just enough decimals for the step.
 */
import { tickStep, ticks } from 'd3';
import { displayUnit, type Dimension } from '../../ui/units';

export interface Tick {
  /** The value in SI. */
  value: number;
  /** The number shown (in `unit`). */
  label: string;
}

export interface TickSet {
  /** The display unit of every label, e.g. "kV/m". */
  unit: string;
  factor: number;
  ticks: Tick[];
}

/** Typographic minus: "−12" rather than "-12" in labels. */
function signed(text: string): string {
  return text.startsWith('-') ? `\u2212${text.slice(1)}` : text;
}

/** Round ticks over [min, max] (about `count` of them) with labels in one unit. */
export function rangeTicks(min: number, max: number, dimension: Dimension, count = 5): TickSet {
  const unit = displayUnit(Math.max(Math.abs(min), Math.abs(max)), dimension);
  if (!(Number.isFinite(min) && Number.isFinite(max)) || !(max > min)) return { unit: unit.label, factor: unit.factor, ticks: [] };
  const lo = min / unit.factor, hi = max / unit.factor;
  const step = tickStep(lo, hi, count);
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  const values = ticks(lo, hi, count);
  return {
    unit: unit.label,
    factor: unit.factor,
    ticks: values.map((v) => {
      const text = v.toFixed(Math.min(decimals, 20));
      return { value: v * unit.factor, label: signed(Number(text) === 0 ? (0).toFixed(Math.min(decimals, 20)) : text) };
    }),
  };
}

/** One value in a set's unit, with a few more digits than the ticks (for end labels of a clipped range). */
export function labelIn(set: Pick<TickSet, 'factor'>, value: number, digits = 3): string {
  const v = value / set.factor;
  return signed(Number(v.toPrecision(digits)).toString());
}
