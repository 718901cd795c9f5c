/**
 * Quantities as engineers type them ("50 um", "1.2 kV", "-40 mV", "3 mm" of water) and as the app shows them.
 *
 * This is the app's one unit parser and one unit formatter. Parsing is done by js-quantities after a small
 * normalisation (micro signs, middle dots, superscripts, "x 10^-8", "/V/s", "°C"); every value comes back in SI,
 * the units of the design document (m, V, Pa, Pa s, kg/m^3, S/m, mol/m^3, K, m^2/(V s), degrees).
 * Formatting picks an SI prefix so the number reads naturally and the text parses back to the same value.
 */
import Qty from 'js-quantities';

/** Standard acceleration of gravity (m/s^2), the conventional value (CGPM 1901). */
export const STANDARD_GRAVITY = 9.80665;

export type Dimension =
  | 'length'
  | 'potential'
  | 'pressure'
  | 'viscosity'
  | 'density'
  | 'conductivity'
  | 'concentration'
  | 'temperature'
  | 'mobility'
  | 'angle'
  | 'dimensionless'
  // Results of a solve (shown, not typed in).
  | 'fieldStrength'
  | 'velocity'
  | 'current'
  | 'flowRate'
  | 'vorticity'
  | 'shearRate'
  | 'streamfunction'
  | 'power'
  // Tracer and double layer.
  | 'diffusivity'
  | 'time';

interface DimensionInfo {
  /** What the user is asked for, in words ("a length"). */
  readonly noun: string;
  /** The SI unit in js-quantities' spelling; values are converted to it. */
  readonly si: string;
  /** An example in the way engineers type it. */
  readonly example: string;
  /** Display units (label shown, js-quantities spelling, factor to SI), ordered from small to large. */
  readonly display: ReadonlyArray<{ label: string; factor: number }>;
  /** The display unit used for zero. */
  readonly zero: string;
  /** Significant digits shown by default. */
  readonly digits: number;
}

const DIMENSIONS: Record<Dimension, DimensionInfo> = {
  length: {
    noun: 'a length',
    si: 'm',
    example: '50 um or 1.2 mm',
    display: [
      { label: 'nm', factor: 1e-9 },
      { label: 'µm', factor: 1e-6 },
      { label: 'mm', factor: 1e-3 },
      { label: 'm', factor: 1 },
    ],
    zero: 'µm',
    digits: 4,
  },
  potential: {
    noun: 'a potential',
    si: 'V',
    example: '1.2 kV or -40 mV',
    display: [
      { label: 'µV', factor: 1e-6 },
      { label: 'mV', factor: 1e-3 },
      { label: 'V', factor: 1 },
      { label: 'kV', factor: 1e3 },
    ],
    zero: 'V',
    digits: 4,
  },
  pressure: {
    noun: 'a pressure',
    si: 'Pa',
    example: '120 Pa or 1.5 kPa',
    display: [
      { label: 'mPa', factor: 1e-3 },
      { label: 'Pa', factor: 1 },
      { label: 'kPa', factor: 1e3 },
      { label: 'MPa', factor: 1e6 },
    ],
    zero: 'Pa',
    digits: 4,
  },
  viscosity: {
    noun: 'a viscosity',
    si: 'Pa*s',
    example: '0.89 mPa s',
    // Buffers are always quoted in mPa s (water: 0.89 mPa s at 25 °C).
    display: [{ label: 'mPa·s', factor: 1e-3 }],
    zero: 'mPa·s',
    digits: 4,
  },
  density: {
    noun: 'a density',
    si: 'kg/m^3',
    example: '997 kg/m3',
    display: [{ label: 'kg/m³', factor: 1 }],
    zero: 'kg/m³',
    digits: 5,
  },
  conductivity: {
    noun: 'a conductivity',
    si: 'S/m',
    example: '0.14 S/m or 1.4 mS/cm',
    display: [
      { label: 'µS/m', factor: 1e-6 },
      { label: 'mS/m', factor: 1e-3 },
      { label: 'S/m', factor: 1 },
    ],
    zero: 'S/m',
    digits: 4,
  },
  concentration: {
    noun: 'a concentration',
    si: 'mol/m^3',
    example: '10 mM',
    display: [
      { label: 'µM', factor: 1e-3 },
      { label: 'mM', factor: 1 },
      { label: 'M', factor: 1e3 },
    ],
    zero: 'mM',
    digits: 4,
  },
  temperature: {
    noun: 'a temperature',
    si: 'tempK',
    example: '25 °C or 298.15 K',
    display: [{ label: '°C', factor: 1 }],
    zero: '°C',
    digits: 5,
  },
  mobility: {
    noun: 'a mobility',
    si: 'm^2/V*s',
    example: '4.5e-8 m2/(V s)',
    display: [{ label: 'm²/(V·s)', factor: 1 }],
    zero: 'm²/(V·s)',
    digits: 4,
  },
  angle: {
    noun: 'an angle',
    si: 'deg',
    example: '30 deg',
    display: [{ label: '°', factor: 1 }],
    zero: '°',
    digits: 5,
  },
  dimensionless: {
    noun: 'a number',
    si: '',
    example: '78.4',
    display: [{ label: '', factor: 1 }],
    zero: '',
    digits: 5,
  },
  fieldStrength: {
    noun: 'a field strength',
    si: 'V/m',
    example: '25 kV/m',
    display: [
      { label: 'V/m', factor: 1 },
      { label: 'kV/m', factor: 1e3 },
      { label: 'MV/m', factor: 1e6 },
    ],
    zero: 'V/m',
    digits: 4,
  },
  velocity: {
    noun: 'a speed',
    si: 'm/s',
    example: '1.2 mm/s',
    display: [
      { label: 'nm/s', factor: 1e-9 },
      { label: 'µm/s', factor: 1e-6 },
      { label: 'mm/s', factor: 1e-3 },
      { label: 'm/s', factor: 1 },
    ],
    zero: 'mm/s',
    digits: 4,
  },
  current: {
    noun: 'a current',
    si: 'A',
    example: '12 uA',
    display: [
      { label: 'pA', factor: 1e-12 },
      { label: 'nA', factor: 1e-9 },
      { label: 'µA', factor: 1e-6 },
      { label: 'mA', factor: 1e-3 },
      { label: 'A', factor: 1 },
    ],
    zero: 'µA',
    digits: 4,
  },
  flowRate: {
    noun: 'a flow rate',
    si: 'm^3/s',
    example: '40 nL/min',
    // Syringe pumps and datasheets quote per minute.
    display: [
      { label: 'pL/min', factor: 1e-15 / 60 },
      { label: 'nL/min', factor: 1e-12 / 60 },
      { label: 'µL/min', factor: 1e-9 / 60 },
      { label: 'mL/min', factor: 1e-6 / 60 },
    ],
    zero: 'nL/min',
    digits: 4,
  },
  vorticity: {
    noun: 'a vorticity',
    si: '1/s',
    example: '120 1/s',
    // Per second only: "3200 1/s" reads more plainly than "3.2 1/ms".
    display: [{ label: '1/s', factor: 1 }],
    zero: '1/s',
    digits: 4,
  },
  shearRate: {
    noun: 'a shear rate',
    si: '1/s',
    example: '500 1/s',
    // Per second, as cell-adhesion and shear-stress papers quote wall shear rates.
    display: [{ label: '1/s', factor: 1 }],
    zero: '1/s',
    digits: 4,
  },
  streamfunction: {
    noun: 'a streamfunction',
    si: 'm^2/s',
    example: '0.05 mm2/s',
    display: [
      { label: 'µm²/s', factor: 1e-12 },
      { label: 'mm²/s', factor: 1e-6 },
      { label: 'm²/s', factor: 1 },
    ],
    zero: 'mm²/s',
    digits: 4,
  },
  power: {
    noun: 'a power',
    si: 'W',
    example: '15 mW',
    display: [
      { label: 'nW', factor: 1e-9 },
      { label: 'µW', factor: 1e-6 },
      { label: 'mW', factor: 1e-3 },
      { label: 'W', factor: 1 },
    ],
    zero: 'mW',
    digits: 4,
  },
  diffusivity: {
    noun: 'a diffusivity',
    si: 'm^2/s',
    example: '1e-9 m2/s or 1000 um2/s',
    // Written like a mobility: "1 × 10⁻⁹ m²/s", the way tables quote molecular diffusivities.
    display: [{ label: 'm²/s', factor: 1 }],
    zero: 'm²/s',
    digits: 4,
  },
  time: {
    noun: 'a time',
    si: 's',
    example: '50 ms or 1.5 s',
    display: [
      { label: 'ns', factor: 1e-9 },
      { label: 'µs', factor: 1e-6 },
      { label: 'ms', factor: 1e-3 },
      { label: 's', factor: 1 },
    ],
    zero: 's',
    digits: 4,
  },
};

/** Dimensions written as mantissa × 10^exponent in their one SI unit. */
const EXPONENT_FORM: ReadonlySet<Dimension> = new Set(['mobility', 'diffusivity']);

/** Zero in Celsius, in kelvin. */
const CELSIUS_ZERO = 273.15;

export type QuantityResult = { ok: true; value: number } | { ok: false; message: string };

export interface ParseOptions {
  /** Unit assumed for a bare number, in any spelling the parser reads (e.g. "um", "V", "deg"). */
  defaultUnit?: string;
}

/** Short description used in hints and messages: "a length, e.g. 50 um or 1.2 mm". */
export function describeDimension(dimension: Dimension): string {
  const info = DIMENSIONS[dimension];
  return `${info.noun}, e.g. ${info.example}`;
}

const SUPERSCRIPTS: Record<string, string> = {
  '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9', '⁻': '-',
};

/** Splits "50 um" into its number and its unit text; undefined when it does not start with a number. */
function splitNumber(text: string): { scalar: number; unit: string } | undefined {
  const m = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?)\s*(.*)$/i.exec(text);
  if (!m) return undefined;
  return { scalar: Number(m[1]), unit: m[2].trim() };
}

/** Rewrites the ways engineers write units into what js-quantities reads. */
function normalise(raw: string): string {
  let s = raw.trim().replace(/\u2212/g, '-').replace(/\u00a0/g, ' ');
  // "4.5 × 10⁻⁸" and "4.5x10^-8" → "4.5e-8"
  s = s.replace(/\s*[×x*]\s*10\s*\^?\s*([⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+|[+-]?\d+)/, (_m, exp: string) => 'e' + exp.replace(/./g, (c) => SUPERSCRIPTS[c] ?? c));
  s = s.replace(/[⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+/g, (sup) => '^' + sup.replace(/./g, (c) => SUPERSCRIPTS[c] ?? c));
  s = s.replace(/[·⋅]/g, '*').replace(/μ/g, 'u').replace(/µ/g, 'u');
  return s;
}

/** "m^2/(V*s)" and "m^2/V/s" both become "m^2/V*s", which js-quantities reads as m^2/(V s). */
function normaliseUnit(unit: string): string {
  const noParens = unit.replace(/[()]/g, ' ').replace(/\s*\*\s*/g, '*').replace(/\s*\/\s*/g, '/').replace(/\s+/g, ' ').trim();
  const [numerator, ...denominator] = noParens.split('/');
  if (denominator.length === 0) return numerator;
  return `${numerator.trim() || '1'}/${denominator.map((d) => d.trim().replace(/ /g, '*')).join('*')}`;
}

function unreadable(text: string, dimension: Dimension): QuantityResult {
  return { ok: false, message: `"${text}" is not ${DIMENSIONS[dimension].noun} I can read; enter ${describeDimension(dimension)}` };
}

function toQty(scalar: number, unit: string): Qty | undefined {
  try {
    return unit === '' ? Qty(scalar, '') : Qty(`${scalar} ${unit}`);
  } catch {
    return undefined;
  }
}

function parseTemperature(scalar: number, unit: string): number | undefined {
  const u = unit.replace(/\s+/g, '');
  if (/^(°?C|degC|celsius)$/i.test(u)) return scalar + CELSIUS_ZERO;
  if (/^(K|kelvin|degK)$/i.test(u)) return scalar;
  if (/^(°?F|degF|fahrenheit)$/i.test(u)) return ((scalar - 32) * 5) / 9 + CELSIUS_ZERO;
  return undefined;
}

/**
 * Reads a quantity of the given dimension and returns it in SI (see the file comment for the units).
 * A bare number takes `options.defaultUnit` (and is refused without one, except for dimensionless values).
 */
export function parseQuantity(text: string, dimension: Dimension, options: ParseOptions = {}): QuantityResult {
  const info = DIMENSIONS[dimension];
  const shown = text.trim();
  if (shown === '') return { ok: false, message: `Enter ${describeDimension(dimension)}` };
  const parts = splitNumber(normalise(shown));
  if (!parts || !Number.isFinite(parts.scalar)) return unreadable(shown, dimension);
  let unit = parts.unit;
  if (unit === '') {
    if (dimension === 'dimensionless') return { ok: true, value: parts.scalar };
    if (!options.defaultUnit) {
      return { ok: false, message: `"${shown}" has no unit; enter ${describeDimension(dimension)}` };
    }
    unit = options.defaultUnit;
  }
  if (dimension === 'dimensionless') {
    return { ok: false, message: `"${shown}" should be a plain number without a unit, e.g. ${info.example}` };
  }
  if (dimension === 'temperature') {
    const kelvin = parseTemperature(parts.scalar, normalise(unit));
    if (kelvin === undefined) return unreadable(shown, dimension);
    if (kelvin <= 0) return { ok: false, message: `${shown} is at or below absolute zero` };
    return { ok: true, value: kelvin };
  }
  if (dimension === 'angle' && /^°$/.test(unit)) unit = 'deg';
  const q = toQty(parts.scalar, normaliseUnit(normalise(unit)));
  if (!q) return unreadable(shown, dimension);
  if (!q.isCompatible(info.si)) {
    const kind = q.kind();
    const what = kind && kind !== 'unitless' ? `is ${/^[aeiou]/.test(kind) ? 'an' : 'a'} ${kind.replace(/_/g, ' ')}` : 'has the wrong unit';
    return { ok: false, message: `"${shown}" ${what}; enter ${describeDimension(dimension)}` };
  }
  const value = q.to(info.si).scalar;
  if (!Number.isFinite(value)) return unreadable(shown, dimension);
  return { ok: true, value };
}

/** Keeps `digits` significant digits, drops trailing zeros, never uses exponent notation for ordinary sizes. */
function trimNumber(v: number, digits: number): string {
  if (v === 0) return '0';
  const fixed = Number(v.toPrecision(digits));
  const abs = Math.abs(fixed);
  if (abs >= 1e-4 && abs < 1e9) {
    // Enough decimals for the significant digits, then strip zeros.
    const decimals = Math.max(0, digits - 1 - Math.floor(Math.log10(abs)));
    return fixed.toFixed(Math.min(decimals, 20)).replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '');
  }
  return String(fixed);
}

const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';

function superscript(n: number): string {
  return String(n)
    .replace('-', '⁻')
    .replace(/\d/g, (d) => SUPERSCRIPT_DIGITS[Number(d)]);
}

export interface FormatOptions {
  /** Significant digits; the dimension's default when absent. */
  digits?: number;
}

/**
 * Formats an SI value for display and for input fields: "50 µm", "1.2 mm", "1.2 kV", "-40 mV", "25 °C",
 * "4.5 × 10⁻⁸ m²/(V·s)". The result parses back with {@link parseQuantity} to the value (to its digits).
 */
export function formatQuantity(value: number, dimension: Dimension, options: FormatOptions = {}): string {
  const info = DIMENSIONS[dimension];
  const digits = options.digits ?? info.digits;
  if (!Number.isFinite(value)) return '–';
  const join = (n: string, unit: string) => (unit === '' ? n : unit === '°' ? `${n}°` : `${n} ${unit}`);
  if (dimension === 'temperature') return join(trimNumber(value - CELSIUS_ZERO, digits), '°C');
  if (EXPONENT_FORM.has(dimension)) {
    if (value === 0) return join('0', info.zero);
    const exp = Math.floor(Math.log10(Math.abs(value)));
    const mantissa = value / 10 ** exp;
    return `${trimNumber(mantissa, digits)} × 10${superscript(exp)} ${info.zero}`;
  }
  if (value === 0) return join('0', info.zero);
  const abs = Math.abs(value);
  const units = info.display;
  let chosen = units[0];
  for (const u of units) {
    // Largest unit in which the number is at least 1 (after rounding to the digits shown).
    if (Number((abs / u.factor).toPrecision(digits)) >= 1) chosen = u;
  }
  return join(trimNumber(value / chosen.factor, digits), chosen.label);
}

/**
 * One display unit for a set of values of a dimension (a colour bar's ticks, a plot's axis): the unit
 * {@link formatQuantity} would pick for the largest magnitude among them. Values are shown as value / factor.
 */
export function displayUnit(maxAbs: number, dimension: Dimension): { label: string; factor: number } {
  const info = DIMENSIONS[dimension];
  if (dimension === 'temperature' || EXPONENT_FORM.has(dimension)) return { label: info.zero, factor: 1 };
  if (!(Number.isFinite(maxAbs) && maxAbs > 0)) return info.display.find((u) => u.label === info.zero) ?? info.display[0];
  let chosen = info.display[0];
  for (const u of info.display) if (Number((maxAbs / u.factor).toPrecision(info.digits)) >= 1) chosen = u;
  return chosen;
}

/** Pressure under a column of liquid: p = rho g h (gauge pressure at the bottom of the column). */
export function headToPressure(head: number, density: number): number {
  return density * STANDARD_GRAVITY * head;
}

/** The height of liquid column that gives the pressure: h = p / (rho g). */
export function pressureToHead(pressure: number, density: number): number {
  return pressure / (density * STANDARD_GRAVITY);
}

export type PressureResult =
  | { ok: true; value: number; /** Set when the text was a liquid head (m). */ head?: number }
  | { ok: false; message: string };

const WATER_SUFFIX = /\s*(?:of\s+water|of\s+buffer|water|buffer|w\.?c\.?|H2O|H₂O)\s*$/i;

/**
 * Reads a reservoir pressure, either as a pressure ("120 Pa", "1.5 kPa", "2 mbar") or as a liquid head
 * ("3 mm", "3 mm of water", "3 mmH2O"), which becomes p = rho g h with the buffer density `density` (kg/m^3).
 */
export function parsePressureOrHead(text: string, density: number, options: ParseOptions = {}): PressureResult {
  const shown = text.trim();
  if (shown === '') return { ok: false, message: 'Enter a pressure (e.g. 120 Pa) or a head of buffer (e.g. 3 mm)' };
  const headText = normalise(shown).replace(/(\d|\s)(mm|cm|um|m)H2O$/i, '$1$2').replace(WATER_SUFFIX, '');
  const asLength = parseQuantity(headText, 'length');
  if (asLength.ok) {
    if (!(density > 0)) return { ok: false, message: 'A head needs the buffer density; set it under Buffer first' };
    return { ok: true, value: headToPressure(asLength.value, density), head: asLength.value };
  }
  const asPressure = parseQuantity(shown, 'pressure', options);
  if (asPressure.ok) return asPressure;
  return {
    ok: false,
    message: `"${shown}" is neither a pressure (e.g. 120 Pa, 1.5 kPa) nor a head of buffer (e.g. 3 mm)`,
  };
}
