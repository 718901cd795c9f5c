/**
 * A field map as a figure: the map itself as an RGBA image (one colour per grid cell, nearest-cell sampling,
 * transparent outside the fluid) plus what goes round it: the title, the colour bar with ticks and units and a
 * scale bar. The browser draws the layout on a canvas (PNG by canvas.toBlob), figure-svg.ts writes it as SVG
 * and the server's report draws it into the PDF: one layout, three outputs.
 */
import { COLOUR_MAPS, colourTable, type ColourMapName } from '../../shared/colour-maps';
import type { SolveFields } from '../result/types';

export const MAP_QUANTITIES = ['potential', 'fieldStrength', 'speed', 'vorticity', 'pressure', 'streamfunction'] as const;
export type MapQuantity = (typeof MAP_QUANTITIES)[number];

export const QUANTITY_INFO: Readonly<Record<MapQuantity, { label: string; unit: string; map: ColourMapName; signed: boolean }>> = {
  potential: { label: 'Potential', unit: 'V', map: 'viridis', signed: false },
  fieldStrength: { label: 'Field strength |E|', unit: 'V/m', map: 'cividis', signed: false },
  speed: { label: 'Speed |u|', unit: 'm/s', map: 'cividis', signed: false },
  vorticity: { label: 'Vorticity', unit: '1/s', map: 'cool-warm', signed: true },
  pressure: { label: 'Pressure', unit: 'Pa', map: 'cool-warm', signed: true },
  streamfunction: { label: 'Streamfunction', unit: 'm²/s', map: 'viridis', signed: false },
};

/** Per-cell values of a quantity (NaN outside the fluid). */
export function quantityValues(f: SolveFields, q: MapQuantity): Float32Array {
  const n = f.nx * f.ny;
  const out = new Float32Array(n);
  for (let c = 0; c < n; c++) {
    if (!(f.fraction[c] > 0)) {
      out[c] = NaN;
      continue;
    }
    switch (q) {
      case 'potential': out[c] = f.potential[c]; break;
      case 'fieldStrength': out[c] = Math.hypot(f.fieldX[c], f.fieldY[c]); break;
      case 'speed': out[c] = Math.hypot(f.velocityX[c], f.velocityY[c]); break;
      case 'vorticity': out[c] = f.vorticity[c]; break;
      case 'pressure': out[c] = f.pressure[c]; break;
      case 'streamfunction': out[c] = f.streamfunction[c]; break;
    }
  }
  return out;
}

export interface Tick {
  /** Position along the bar, 0 (low end) to 1. */
  at: number;
  label: string;
}

export interface FigureLayout {
  title: string;
  quantity: MapQuantity;
  colourMap: ColourMapName;
  /** The map: width × height RGBA, rows top (largest y) to bottom. */
  map: { width: number; height: number; rgba: Uint8ClampedArray };
  /** Metres per map pixel. */
  metresPerPixel: number;
  range: [number, number];
  unit: string;
  ticks: Tick[];
  scaleBar: { pixels: number; label: string };
  /** True when the quantity has no finite value anywhere (e.g. pressure before the flow solver). */
  empty: boolean;
}

/** 1, 2 or 5 × 10^k nearest below x. */
export function niceBelow(x: number): number {
  const p = 10 ** Math.floor(Math.log10(x));
  const m = x / p;
  return (m >= 5 ? 5 : m >= 2 ? 2 : 1) * p;
}

/** A number for a tick or label: 3 significant figures, exponent form only when very small or large. */
export function formatNumber(v: number): string {
  if (v === 0 || !Number.isFinite(v)) return v === 0 ? '0' : '–';
  const a = Math.abs(v);
  if (a >= 1e-3 && a < 1e5) return String(Number(v.toPrecision(3)));
  const [m, e] = v.toExponential(2).split('e');
  return `${Number(m)}e${Number(e)}`;
}

export function lengthLabel(metres: number): string {
  if (metres >= 1e-3) return `${Number((metres * 1e3).toPrecision(3))} mm`;
  if (metres >= 1e-6) return `${Number((metres * 1e6).toPrecision(3))} µm`;
  return `${Number((metres * 1e9).toPrecision(3))} nm`;
}

function ticksFor(lo: number, hi: number): Tick[] {
  if (!(hi > lo)) return [{ at: 0.5, label: formatNumber(lo) }];
  const step = niceBelow((hi - lo) / 4);
  const out: Tick[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + step * 1e-9; v += step) {
    const clean = Math.abs(v) < step * 1e-9 ? 0 : v;
    out.push({ at: (clean - lo) / (hi - lo), label: formatNumber(clean) });
  }
  return out;
}

export interface FigureOptions {
  title?: string;
  /** Largest map size in pixels (default 900 × 600). */
  maxWidth?: number;
  maxHeight?: number;
  /** Colour range; default the values' range (symmetric about zero for signed quantities). */
  range?: [number, number];
}

export function mapFigure(f: SolveFields, quantity: MapQuantity, options: FigureOptions = {}): FigureLayout {
  const info = QUANTITY_INFO[quantity];
  const values = quantityValues(f, quantity);
  let lo = Infinity, hi = -Infinity;
  for (const v of values) if (Number.isFinite(v)) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
  const empty = !(hi >= lo);
  if (empty) { lo = 0; hi = 1; }
  if (info.signed && !empty) {
    const m = Math.max(Math.abs(lo), Math.abs(hi)) || 1;
    [lo, hi] = [-m, m];
  }
  if (options.range) [lo, hi] = options.range;
  if (hi === lo) { lo -= 0.5 * (Math.abs(lo) || 1); hi += 0.5 * (Math.abs(hi) || 1); }

  const maxW = options.maxWidth ?? 900, maxH = options.maxHeight ?? 600;
  const scale = Math.min(maxW / f.nx, maxH / f.ny);
  const width = Math.max(1, Math.round(f.nx * scale)), height = Math.max(1, Math.round(f.ny * scale));
  const rgba = new Uint8ClampedArray(width * height * 4);
  const table = colourTable(info.map, 256);
  for (let py = 0; py < height; py++) {
    const j = f.ny - 1 - Math.min(f.ny - 1, Math.floor(((py + 0.5) * f.ny) / height));
    for (let px = 0; px < width; px++) {
      const i = Math.min(f.nx - 1, Math.floor(((px + 0.5) * f.nx) / width));
      const v = values[i + j * f.nx];
      const o = 4 * (px + py * width);
      if (!Number.isFinite(v)) continue; // transparent
      const t = Math.min(255, Math.max(0, Math.round(((v - lo) / (hi - lo)) * 255)));
      rgba[o] = table[3 * t];
      rgba[o + 1] = table[3 * t + 1];
      rgba[o + 2] = table[3 * t + 2];
      rgba[o + 3] = 255;
    }
  }
  const metresPerPixel = (f.nx * f.spacing) / width;
  const bar = niceBelow(width * metresPerPixel * 0.25);
  return {
    title: options.title ?? info.label,
    quantity,
    colourMap: info.map,
    map: { width, height, rgba },
    metresPerPixel,
    range: [lo, hi],
    unit: info.unit,
    ticks: ticksFor(lo, hi),
    scaleBar: { pixels: Math.round(bar / metresPerPixel), label: lengthLabel(bar) },
    empty,
  };
}

/** Colour-bar stops as CSS colours, low to high (for SVG gradients and canvas). */
export function barStops(layout: FigureLayout): Array<{ at: number; colour: string }> {
  const stops = COLOUR_MAPS[layout.colourMap].stops;
  return stops.map((c, k) => ({ at: k / (stops.length - 1), colour: `rgb(${c[0]},${c[1]},${c[2]})` }));
}
