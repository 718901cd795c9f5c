/**
 * Sampling the fields at points (the --probe option).
 *
 * Inside: the cell's fluid fraction decides (0 outside, 1 inside); in a cut cell the exact
 * outline does. Values: bilinear interpolation between the centres of the four cells around the
 * point when all four are full, uncut fluid cells. Otherwise (near a wall, a port or a pillar):
 *   potential: the cell's linear reconstruction φ_c − E_c·(x − x_c) about its fluid centroid
 *              (exact for a linear potential);
 *   other fields: the bilinear weights renormalised over those of the four cells that are fluid
 *              and joined to the point's own cell through open faces within the 2×2 block,
 *              so values never leak across a thin wall.
 */
import type { Point } from '../../shared/design';
import { polygonsContain } from '../geometry/ring';
import type { FluidRegion } from '../geometry/fluid-region';
import { cellOf, cutIndex, fluidCentroid, type CutCellGrid } from '../grid/cut-cell-grid';
import type { ProbeResult, SolveFields } from './types';

export interface ProbeContext {
  grid: CutCellGrid;
  region: FluidRegion;
  /** φ per cell (Float64, NaN where undefined). */
  potential: Float64Array;
  fields: SolveFields;
}

interface Stencil {
  cells: number[];
  weights: number[];
  /** All four cells full and uncut: plain bilinear interpolation. */
  bilinear: boolean;
}

function finite(v: number): number | null {
  return Number.isFinite(v) ? v : null;
}

export function sampleProbes(points: ReadonlyArray<Point>, ctx: ProbeContext): ProbeResult[] {
  return points.map((at) => sampleProbe(at, ctx));
}

export function sampleProbe(at: Point, ctx: ProbeContext): ProbeResult {
  const { grid, region, fields } = ctx;
  const [x, y] = at;
  const cell = cellOf(grid, x, y);
  const f = cell >= 0 ? grid.fraction[cell] : 0;
  const inside = f >= 1 || (f > 0 && polygonsContain(region.polygons, x, y));
  if (!inside) return { at: [x, y], inside: false };

  const stencil = interpolationStencil(grid, cell, x, y);
  const value = (array: Float32Array) => {
    let sum = 0;
    for (let k = 0; k < stencil.cells.length; k++) sum += stencil.weights[k] * array[stencil.cells[k]];
    return sum;
  };
  let potential: number;
  if (stencil.bilinear) {
    potential = 0;
    stencil.cells.forEach((c, k) => { potential += stencil.weights[k] * ctx.potential[c]; });
  } else {
    const [cx, cy] = fluidCentroid(grid, cell);
    potential = ctx.potential[cell] - fields.fieldX[cell] * (x - cx) - fields.fieldY[cell] * (y - cy);
  }
  return {
    at: [x, y],
    inside: true,
    potential: finite(potential),
    field: [value(fields.fieldX), value(fields.fieldY)],
    velocity: [value(fields.velocityX), value(fields.velocityY)],
    vorticity: finite(value(fields.vorticity)),
    pressure: finite(value(fields.pressure)),
  };
}

function isFullUncut(grid: CutCellGrid, c: number): boolean {
  return grid.fraction[c] >= 1 && cutIndex(grid, c) < 0;
}

/** The four cells whose centres surround (x, y), with bilinear weights, reduced as described above. */
function interpolationStencil(grid: CutCellGrid, cell: number, x: number, y: number): Stencil {
  const { nx, ny, spacing: h, x0, y0 } = grid;
  const fi = (x - x0) / h - 0.5, fj = (y - y0) / h - 0.5;
  const i0 = Math.floor(fi), j0 = Math.floor(fj);
  const tx = fi - i0, ty = fj - j0;
  const block: Array<[number, number, number]> = [
    [i0, j0, (1 - tx) * (1 - ty)],
    [i0 + 1, j0, tx * (1 - ty)],
    [i0, j0 + 1, (1 - tx) * ty],
    [i0 + 1, j0 + 1, tx * ty],
  ];
  const inGrid = block.filter(([i, j]) => i >= 0 && i < nx && j >= 0 && j < ny);
  const full = inGrid.length === 4 && inGrid.every(([i, j]) => isFullUncut(grid, i + j * nx));
  if (full) return { cells: block.map(([i, j]) => i + j * nx), weights: block.map((b) => b[2]), bilinear: true };

  // Cells of the block joined to `cell` through open faces inside the block.
  const members = new Set(inGrid.map(([i, j]) => i + j * nx).filter((c) => grid.fraction[c] > 0));
  const joined = new Set<number>([cell]);
  const open = (a: number, b: number) => {
    const ia = a % nx, ja = (a - ia) / nx;
    if (b === a + 1) return grid.apertureX[ia + 1 + ja * (nx + 1)] > 0;
    if (b === a - 1) return grid.apertureX[ia + ja * (nx + 1)] > 0;
    if (b === a + nx) return grid.apertureY[a + nx] > 0;
    if (b === a - nx) return grid.apertureY[a] > 0;
    return false;
  };
  for (let pass = 0; pass < 3; pass++) {
    for (const c of members) {
      if (joined.has(c)) continue;
      for (const d of joined) if (open(c, d)) { joined.add(c); break; }
    }
  }
  const cells: number[] = [], weights: number[] = [];
  let total = 0;
  for (const [i, j, w] of inGrid) {
    const c = i + j * nx;
    if (!joined.has(c)) continue;
    cells.push(c);
    weights.push(w);
    total += w;
  }
  if (!(total > 0)) return { cells: [cell], weights: [1], bilinear: false };
  return { cells, weights: weights.map((w) => w / total), bilinear: false };
}
