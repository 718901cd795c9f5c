/**
 * The size of an SVG drawing's user unit in metres: from the root's width/height and viewBox (CSS absolute
 * units: 1 in = 2.54 cm = 72 pt = 6 pc = 96 px), or a scale the user types, which wins.
 */
import { ImportError } from './limits';

const PX = 0.0254 / 96;

const UNIT_METRES: Record<string, number> = {
  '': PX,
  px: PX,
  pt: 0.0254 / 72,
  pc: 0.0254 / 6,
  in: 0.0254,
  cm: 0.01,
  mm: 0.001,
  q: 0.00025,
};

/** A length attribute as metres and its unit, or null when absent or relative (%, em, ex). */
export function absoluteLength(text: string | null): { metres: number; unit: string } | null {
  if (text === null) return null;
  const m = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*([a-zA-Z%]*)\s*$/.exec(text);
  if (!m) return null;
  const unit = m[2].toLowerCase();
  const per = UNIT_METRES[unit];
  const v = Number(m[1]);
  if (per === undefined || !(v > 0) || !Number.isFinite(v)) return null;
  return { metres: v * per, unit: unit || 'px' };
}

/** A length inside the drawing (user units): a number, or one with an absolute unit turned into px. */
export function userLength(text: string | null, fallback = 0): number {
  if (text === null || text.trim() === '') return fallback;
  const m = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*([a-zA-Z]*)\s*$/.exec(text);
  if (!m) throw new ImportError('malformed', `"${text.slice(0, 30)}" is not a length`);
  const per = UNIT_METRES[m[2].toLowerCase()];
  if (per === undefined) throw new ImportError('unsupported', `the unit "${m[2]}" in "${text.slice(0, 30)}" is not supported inside a drawing`);
  return (Number(m[1]) * per) / PX;
}

export function parseViewBox(text: string | null): [number, number, number, number] | null {
  if (text === null) return null;
  const v = text.trim().split(/[\s,]+/).map(Number);
  if (v.length !== 4 || v.some((x) => !Number.isFinite(x)) || !(v[2] > 0) || !(v[3] > 0)) {
    throw new ImportError('malformed', `the viewBox "${text.slice(0, 60)}" must be four numbers with a positive width and height`);
  }
  return [v[0], v[1], v[2], v[3]];
}

export interface DrawingUnits {
  metresPerUnit: number;
  /** How the scale was found, in words for the preview. */
  source: string;
}

/** metres per user unit of the root <svg> (width, height, viewBox), unless `given` is set. */
export function svgUnits(width: string | null, height: string | null, viewBox: string | null, given?: number): DrawingUnits {
  if (given !== undefined) return { metresPerUnit: given, source: `typed: ${given} m per drawing unit` };
  const vb = parseViewBox(viewBox);
  const w = absoluteLength(width);
  const h = absoluteLength(height);
  if (vb && (w || h)) {
    const sx = w ? w.metres / vb[2] : null;
    const sy = h ? h.metres / vb[3] : null;
    const s = sx ?? sy!;
    const note = sx !== null && sy !== null && Math.abs(sx - sy) > 1e-6 * s ? ' (height gives another scale; the width was used)' : '';
    return { metresPerUnit: s, source: `from the document: ${width ?? height} over a viewBox ${vb[2]} units wide, ${Number(s.toPrecision(6))} m per unit${note}` };
  }
  return { metresPerUnit: PX, source: 'the document states no absolute size: 1 unit = 1 CSS px (1/96 in); type a scale if that is wrong' };
}
