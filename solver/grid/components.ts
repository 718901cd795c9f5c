/**
 * Connected pieces of fluid on the grid: cells with fraction > 0 joined
 * through faces with aperture > 0 (flood fill with an explicit stack).
 */
import type { CutCellGrid } from './cut-cell-grid';
import { fluidRuns, runLength } from './fluid-runs';

export interface FluidComponents {
  /** Component of each cell (−1 for solid cells). */
  label: Int32Array;
  count: number;
  /** Fluid area of each component, in cells (Σ fraction). */
  size: Float64Array;
  /** A cell of each component with the largest fraction (a place to point at). */
  seed: Int32Array;
}

export function labelComponents(grid: CutCellGrid): FluidComponents {
  const { nx, ny, fraction, apertureX, apertureY } = grid;
  const label = new Int32Array(nx * ny).fill(-1);
  // Every fluid cell starts a fill unless an earlier one reached it: visit the runs of fluid cells.
  const { runs } = fluidRuns(grid);
  const stack = new Int32Array(Math.max(1, runLength(runs))); // a cell is pushed once, when labelled
  const sizes: number[] = [];
  const seeds: number[] = [];
  let count = 0;
  for (let k = 0; k < runs.length; k += 2) for (let start = runs[k]; start < runs[k + 1]; start++) {
    if (label[start] >= 0) continue;
    let top = 0, size = 0, seed = start;
    stack[top++] = start;
    label[start] = count;
    while (top > 0) {
      const c = stack[--top];
      size += fraction[c];
      if (fraction[c] > fraction[seed]) seed = c;
      const i = c % nx, j = (c - i) / nx;
      // Neighbours through open faces: left, right, below, above.
      const nb0 = i > 0 && apertureX[i + j * (nx + 1)] > 0 ? c - 1 : -1;
      const nb1 = i < nx - 1 && apertureX[i + 1 + j * (nx + 1)] > 0 ? c + 1 : -1;
      const nb2 = j > 0 && apertureY[i + j * nx] > 0 ? c - nx : -1;
      const nb3 = j < ny - 1 && apertureY[i + (j + 1) * nx] > 0 ? c + nx : -1;
      if (nb0 >= 0 && label[nb0] < 0) { label[nb0] = count; stack[top++] = nb0; }
      if (nb1 >= 0 && label[nb1] < 0) { label[nb1] = count; stack[top++] = nb1; }
      if (nb2 >= 0 && label[nb2] < 0) { label[nb2] = count; stack[top++] = nb2; }
      if (nb3 >= 0 && label[nb3] < 0) { label[nb3] = count; stack[top++] = nb3; }
    }
    sizes.push(size);
    seeds.push(seed);
    count++;
  }
  return { label, count, size: Float64Array.from(sizes), seed: Int32Array.from(seeds) };
}
