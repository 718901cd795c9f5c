/**
 * Choosing the grid spacing.
 *
 * `cells` (the command line's --cells N) is the number of cells along the
 * longer side of the fluid's bounding box. Without it the spacing gives about
 * 10 cells across the narrowest channel (never fewer than 8 unless capped).
 * Either way the grid (bounding box plus a one-cell margin on every side) is
 * capped at `maxCells` cells, with `capped` set so the caller can warn.
 */
import type { WidthSample } from '../geometry/channel-width';
import type { FluidRegion } from '../geometry/fluid-region';
import type { GridFrame } from './rasterise';

export interface ChooseGridOptions {
  /** Cells along the longer side of the fluid's bounding box. */
  cells?: number;
  /** The narrowest channel (from channelWidths); needed when `cells` is not given. */
  narrowest?: WidthSample | null;
  /** Cells wanted across the narrowest channel by default. */
  cellsAcross?: number;
  /** Largest grid, margins included. Default 4 million, or 16 million when `cells` is given. */
  maxCells?: number;
}

export interface GridChoice extends GridFrame {
  /** Cells along the longer side of the fluid's bounding box (may be fractional when capped). */
  cells: number;
  /** Cells across the narrowest channel at this spacing (Infinity if unknown). */
  cellsAcross: number;
  /** Whether the cap on the grid size made the spacing coarser than asked. */
  capped: boolean;
}

export const DEFAULT_MAX_CELLS = 4_000_000;
export const EXPLICIT_MAX_CELLS = 16_000_000;
export const DEFAULT_CELLS_ACROSS = 10;
/** Fewest cells along the longer side, so that tiny layouts still get a grid. */
const MIN_CELLS = 16;

/** The grid frame for spacing h over bounds, with a one-cell margin. */
export function frameFor(bounds: readonly [number, number, number, number], h: number): GridFrame {
  const [xmin, ymin, xmax, ymax] = bounds;
  const nx = Math.max(1, Math.ceil((xmax - xmin) / h - 1e-9)) + 2;
  const ny = Math.max(1, Math.ceil((ymax - ymin) / h - 1e-9)) + 2;
  return { nx, ny, spacing: h, x0: xmin - h, y0: ymin - h };
}

export function chooseGrid(region: FluidRegion, options: ChooseGridOptions = {}): GridChoice {
  const [xmin, ymin, xmax, ymax] = region.bounds;
  const lx = xmax - xmin, ly = ymax - ymin;
  const long = Math.max(lx, ly);
  if (!(long > 0)) throw new Error('the layout is empty: there is no fluid to put a grid on');
  const width = options.narrowest?.width;
  let cells: number;
  if (options.cells !== undefined) {
    if (!(Number.isInteger(options.cells) && options.cells >= 1)) throw new Error('cells must be a whole number of at least 1');
    cells = options.cells;
  } else if (width !== undefined && width > 0) {
    cells = Math.max(MIN_CELLS, Math.ceil((long / width) * (options.cellsAcross ?? DEFAULT_CELLS_ACROSS)));
  } else {
    cells = 256;
  }
  const maxCells = options.maxCells ?? (options.cells !== undefined ? EXPLICIT_MAX_CELLS : DEFAULT_MAX_CELLS);
  let h = long / cells;
  let frame = frameFor(region.bounds, h);
  let capped = false;
  if (frame.nx * frame.ny > maxCells) {
    capped = true;
    // (lx/h + 2)(ly/h + 2) ≤ maxCells: solve for 1/h, then back off until it fits.
    const a = lx * ly, b = 2 * (lx + ly), c = 4 - maxCells;
    const inv = a > 0 ? (-b + Math.sqrt(b * b - 4 * a * c)) / (2 * a) : (maxCells - 4) / b;
    h = 1 / inv;
    frame = frameFor(region.bounds, h);
    while (frame.nx * frame.ny > maxCells) {
      h *= 1.001;
      frame = frameFor(region.bounds, h);
    }
    cells = long / h;
  }
  const cellsAcross = width !== undefined && width > 0 ? width / h : Infinity;
  return { ...frame, cells, cellsAcross, capped };
}

/** --cells value that gives at least `across` cells over a channel of this width. */
export function cellsForWidth(region: FluidRegion, width: number, across = 8): number {
  const [xmin, ymin, xmax, ymax] = region.bounds;
  return Math.ceil((Math.max(xmax - xmin, ymax - ymin) / width) * across);
}
