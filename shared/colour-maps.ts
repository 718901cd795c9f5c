/**
 * The one colour-map module of Osmolane: perceptually ordered maps for field maps, colour bars and exported
 * figures (product.md, "Look": cividis or viridis for magnitudes, a diverging map for signed values, never a
 * rainbow).
 *
 * Each map is a list of evenly spaced sRGB control points, interpolated linearly between neighbours (dense
 * enough that the sRGB interpolation stays close to the published map):
 * - cividis: J. R. Nuñez, C. R. Anderton, R. S. Renslow, "Optimizing colormaps with consideration for color
 *   vision deficiency", PLoS ONE 13 (2018) e0199239; eleven samples of the published map, written from memory
 *   of its table and checked here only for a lightness that rises monotonically (colour-maps.spec.ts);
 * - viridis: S. van der Walt and N. Smith, the matplotlib default map (2015); its nine evenly spaced samples,
 *   likewise from memory and checked the same way;
 * - cool-warm: K. Moreland, "Diverging Color Maps for Scientific Visualization", ISVC 2009; blue
 *   (59, 76, 192) through grey (221, 221, 221) to red (180, 4, 38), intermediate points from memory of his
 *   table; checked for lightness peaking in the middle.
 *
 * Imports nothing: the app, the worker, the server's figures and reports all use it.
 */

export type Rgb = readonly [number, number, number];

export const COLOUR_MAP_NAMES = ['cividis', 'viridis', 'cool-warm'] as const;
export type ColourMapName = (typeof COLOUR_MAP_NAMES)[number];

export interface ColourMap {
  name: ColourMapName;
  /** Diverging maps are centred on zero by their users (symmetric range). */
  diverging: boolean;
  stops: ReadonlyArray<Rgb>;
}

export const COLOUR_MAPS: Readonly<Record<ColourMapName, ColourMap>> = {
  cividis: {
    name: 'cividis',
    diverging: false,
    stops: [
      [0, 34, 78], [18, 53, 112], [59, 73, 108], [87, 92, 109], [110, 111, 116], [124, 123, 120],
      [149, 145, 119], [174, 165, 114], [202, 186, 106], [229, 209, 88], [254, 232, 56],
    ],
  },
  viridis: {
    name: 'viridis',
    diverging: false,
    stops: [
      [68, 1, 84], [71, 44, 122], [59, 81, 139], [44, 113, 142], [33, 144, 141], [39, 173, 129],
      [92, 200, 99], [170, 220, 50], [253, 231, 37],
    ],
  },
  'cool-warm': {
    name: 'cool-warm',
    diverging: true,
    stops: [
      [59, 76, 192], [98, 130, 234], [141, 176, 254], [184, 208, 249], [221, 221, 221],
      [245, 196, 173], [244, 154, 123], [222, 96, 77], [180, 4, 38],
    ],
  },
};

/** The colour at t in [0, 1] (clamped; NaN gives the lowest colour). */
export function colourAt(name: ColourMapName, t: number): [number, number, number] {
  const stops = COLOUR_MAPS[name].stops;
  const last = stops.length - 1;
  const x = Number.isFinite(t) ? Math.min(1, Math.max(0, t)) * last : 0;
  const k = Math.min(last - 1, Math.floor(x));
  const f = x - k;
  const a = stops[k], b = stops[k + 1];
  return [
    Math.round(a[0] + (b[0] - a[0]) * f),
    Math.round(a[1] + (b[1] - a[1]) * f),
    Math.round(a[2] + (b[2] - a[2]) * f),
  ];
}

/** A table of n colours (RGB bytes, 3n long) for fast per-pixel lookup. */
export function colourTable(name: ColourMapName, n = 256): Uint8Array {
  const out = new Uint8Array(3 * n);
  for (let k = 0; k < n; k++) out.set(colourAt(name, n === 1 ? 0 : k / (n - 1)), 3 * k);
  return out;
}

/** `#rrggbb` of the colour at t. */
export function colourHex(name: ColourMapName, t: number): string {
  return '#' + colourAt(name, t).map((v) => v.toString(16).padStart(2, '0')).join('');
}

/** CIE L* (D65) of an sRGB colour: the lightness used to check the maps' ordering. */
export function lightness(rgb: Rgb): number {
  const lin = (c: number) => {
    const v = c / 255;
    return v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4;
  };
  const y = 0.2126 * lin(rgb[0]) + 0.7152 * lin(rgb[1]) + 0.0722 * lin(rgb[2]);
  return y > 216 / 24389 ? 116 * Math.cbrt(y) - 16 : (24389 / 27) * y;
}
