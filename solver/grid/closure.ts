/**
 * The discrete divergence theorem on a cut-cell grid, as a check: for every
 * cell, h·Δaperture along x plus Σ length·n_x of its segments is zero (and
 * likewise along y). Returns the largest defect relative to h, and where.
 * Solvers and tests use it to confirm that a grid (or a coarsened level) is
 * closed, so aperture-weighted fluxes conserve exactly.
 */
import type { CutCellGrid } from './cut-cell-grid';

export interface ClosureDefect {
  /** max over cells of |h Δa_x + Σ l n_x| / h, and of the y counterpart. */
  x: number;
  y: number;
  /** Cell with the largest defect (−1 when all are zero). */
  cell: number;
}

export function closureDefect(grid: CutCellGrid): ClosureDefect {
  const { nx, ny, spacing: h, apertureX, apertureY, segments } = grid;
  const sx = new Float64Array(nx * ny);
  const sy = new Float64Array(nx * ny);
  for (let s = 0; s < segments.count; s++) {
    sx[segments.cell[s]] += segments.length[s] * segments.normalX[s];
    sy[segments.cell[s]] += segments.length[s] * segments.normalY[s];
  }
  let worstX = 0, worstY = 0, cell = -1;
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const c = i + j * nx;
      const dx = Math.abs(apertureX[i + 1 + j * (nx + 1)] - apertureX[i + j * (nx + 1)] + sx[c] / h);
      const dy = Math.abs(apertureY[i + (j + 1) * nx] - apertureY[i + j * nx] + sy[c] / h);
      if (dx > worstX || dy > worstY) cell = c;
      worstX = Math.max(worstX, dx);
      worstY = Math.max(worstY, dy);
    }
  }
  return { x: worstX, y: worstY, cell };
}
