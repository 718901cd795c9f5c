/**
 * Runs of fluid cells (fraction > 0), row by row: pairs [first, end) of cell indices, and rowRuns[j], the index
 * in `runs` of the first run of row j (rowRuns[ny] = runs.length).
 *
 * Loops over the fluid and its faces visit these instead of the whole box: a channel layout often fills a few
 * per cent of its bounding box (a cross injector with 4 mm legs, 50 µm wide). Every face with aperture > 0 joins
 * two fluid cells (cut-cell-grid.ts), so
 *   - the open vertical faces of row j are the faces c + j (the face left of cell c) for c in a run other
 *     than its first cell,
 *   - the open horizontal faces of row j are faces c (below cell c) for c in a run of row j, where ay[c] > 0.
 * Found once per grid and kept with its fraction array (a WeakMap, so the grid stays a plain object of arrays;
 * the grid's arrays are never changed once it is built).
 */
import type { CutCellGrid } from './cut-cell-grid';

export interface FluidRuns {
  runs: Int32Array;
  rowRuns: Int32Array;
}

const found = new WeakMap<Float64Array, FluidRuns>();

export function fluidRuns(grid: CutCellGrid): FluidRuns {
  let out = found.get(grid.fraction);
  if (!out) {
    out = runsOf(grid.fraction, grid.nx, grid.ny);
    found.set(grid.fraction, out);
  }
  return out;
}

/** Runs found while the grid was built (rasterise.ts), so that nobody scans the box for them. */
export function rememberFluidRuns(grid: CutCellGrid, runs: FluidRuns): void {
  found.set(grid.fraction, runs);
}

/** A growing list of run bounds. */
export class RunList {
  private list = new Int32Array(64);
  count = 0;
  push(first: number, end: number): void {
    if (this.count + 2 > this.list.length) {
      const grown = new Int32Array(2 * this.list.length);
      grown.set(this.list);
      this.list = grown;
    }
    this.list[this.count++] = first;
    this.list[this.count++] = end;
  }
  array(): Int32Array {
    return this.list.slice(0, this.count);
  }
}

/** Runs of the cells where `mask` is positive (fraction > 0, active ≠ 0), row by row. */
export function runsOf(mask: ArrayLike<number>, nx: number, ny: number): FluidRuns {
  const list = new RunList();
  const rowRuns = new Int32Array(ny + 1);
  for (let j = 0; j < ny; j++) {
    rowRuns[j] = list.count;
    const row = j * nx, end = row + nx;
    let c = row;
    while (c < end) {
      while (c < end && !(mask[c] > 0)) c++;
      if (c === end) break;
      const first = c;
      while (c < end && mask[c] > 0) c++;
      list.push(first, c);
    }
  }
  rowRuns[ny] = list.count;
  return { runs: list.array(), rowRuns };
}

/** Number of cells in the runs. */
export function runLength(runs: Int32Array): number {
  let n = 0;
  for (let k = 0; k < runs.length; k += 2) n += runs[k + 1] - runs[k];
  return n;
}
