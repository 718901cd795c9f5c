/**
 * A map as an image: one pixel per grid cell, coloured from the colour map, transparent outside the fluid. The
 * row order is flipped (image rows go down, y goes up). Cells just outside the fluid take the colour of a fluid
 * neighbour, so that the browser's smoothing does not fade the cells along the walls; the outline clip (drawn by
 * the map) then gives the exact wall.
 */
import { colourTable, type ColourMapName } from '../../../../shared/colour-maps';
import { rangePosition, type ColourRange } from './field-maps';

const TABLE_SIZE = 256;
const tables = new Map<ColourMapName, Uint8Array>();

function table(name: ColourMapName): Uint8Array {
  let t = tables.get(name);
  if (!t) tables.set(name, (t = colourTable(name, TABLE_SIZE)));
  return t;
}

/** RGBA bytes (nx·ny·4) of the values in the range's colour map. */
export function fieldImage(values: ArrayLike<number>, nx: number, ny: number, range: ColourRange): Uint8ClampedArray<ArrayBuffer> {
  const lut = table(range.colourMap);
  const out = new Uint8ClampedArray(nx * ny * 4);
  const paint = (cell: number, pixel: number) => {
    const t = rangePosition(values[cell], range);
    const k = 3 * Math.round(t * (TABLE_SIZE - 1));
    out[pixel] = lut[k];
    out[pixel + 1] = lut[k + 1];
    out[pixel + 2] = lut[k + 2];
    out[pixel + 3] = 255;
  };
  for (let j = 0; j < ny; j++) {
    const row = (ny - 1 - j) * nx;
    for (let i = 0; i < nx; i++) {
      const c = i + j * nx;
      if (Number.isFinite(values[c])) {
        paint(c, 4 * (row + i));
        continue;
      }
      // Borrow a fluid neighbour's colour (left, right, below, above).
      const n = i > 0 && Number.isFinite(values[c - 1]) ? c - 1
        : i < nx - 1 && Number.isFinite(values[c + 1]) ? c + 1
        : j > 0 && Number.isFinite(values[c - nx]) ? c - nx
        : j < ny - 1 && Number.isFinite(values[c + nx]) ? c + nx
        : -1;
      if (n >= 0) paint(n, 4 * (row + i));
    }
  }
  return out;
}
