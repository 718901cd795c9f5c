/**
 * The cut-cell grid: the one data structure the potential and flow solvers
 * read. A plain object of numbers and typed arrays (no methods), so it can be
 * posted to and from a Web Worker as transferable buffers.
 *
 * LAYOUT (all lengths in metres)
 *
 *   Square cells of edge h = `spacing`. Cell (i, j), 0 ≤ i < nx, 0 ≤ j < ny,
 *   covers [x0 + i h, x0 + (i+1) h] × [y0 + j h, y0 + (j+1) h];
 *   its index is c = i + j * nx (row-major, x fastest).
 *   The grid covers the fluid's bounding box plus at least one empty cell on
 *   every side, so cells on the grid's border have fraction 0.
 *
 *   fraction[c]          nx * ny        fluid area of the cell / h², in [0, 1].
 *   apertureX[i + j*(nx+1)]  (nx+1) * ny  open fraction of the vertical face at
 *                                        x = x0 + i h, between y0 + j h and y0 + (j+1) h;
 *                                        it separates cell (i−1, j) from cell (i, j).
 *   apertureY[i + j*nx]  nx * (ny+1)    open fraction of the horizontal face at
 *                                        y = y0 + j h, between x0 + i h and x0 + (i+1) h;
 *                                        it separates cell (i, j−1) from cell (i, j).
 *
 *   A face's aperture is the length of the face lying inside the fluid
 *   (interior, open set) divided by h. A wall that lies exactly on a face
 *   closes it (aperture 0) and its boundary segment belongs to the fluid-side
 *   cell. Apertures of a grid-aligned rectangle are exactly 0 or 1.
 *
 *   segments: the fluid outline clipped to the cells, sorted by cell
 *   (ascending), as a struct of arrays of length `segments.count`. Within a
 *   cell, a run of outline of one kind that turns less than 10° is one
 *   straight chord (from where it enters to where it leaves), so a cut cell
 *   usually holds one segment, two at a corner or where a port meets a wall:
 *     cell[s]            the cell that holds the piece;
 *     length[s]          its length (m);
 *     normalX/normalY[s] its unit normal pointing OUT of the fluid;
 *     midX/midY[s]       its midpoint (m); its ends are
 *                        mid ± (length/2)·(−normalY, normalX);
 *     port[s]            −1 for a side wall, else the index k of the port in
 *                        design.ports whose segment covers the piece;
 *     zeta[s]            side-wall zeta (V) at the piece: zeta.side, or the
 *                        last wall zone whose region holds the midpoint
 *                        (also filled for port pieces: the wall it would be).
 *
 *   DISCRETE DIVERGENCE THEOREM (exact to round-off, for every cell c = (i, j)):
 *     h·[apertureX(i+1, j) − apertureX(i, j)] + Σ_{s in c} length[s]·normalX[s] = 0
 *     h·[apertureY(i, j+1) − apertureY(i, j)] + Σ_{s in c} length[s]·normalY[s] = 0
 *   so aperture-weighted fluxes with zero-flux walls conserve exactly, and a
 *   uniform field has zero discrete divergence in every cut cell.
 *
 *   cutCells: ascending indices of the cells that hold outline pieces (all
 *   cells with 0 < fraction < 1, and full cells with a wall on a face);
 *   cutCentroidX/Y[k]: centroid (m) of the fluid part of cell cutCells[k].
 *   Every other fluid cell has its centroid at the cell centre.
 *
 *   portLength[k]: total outline length (m) assigned to port k; 0 means the
 *   port is not on the outline at this resolution (the checks report it).
 *
 * CONVENTIONS FOR SOLVERS
 *   - A cell is fluid iff fraction > 0. Every cell that holds a segment is
 *     fluid (its fraction is at least 1e-14, MIN_CUT_FRACTION in rasterise.ts),
 *     and a face with aperture > 0 always joins two fluid cells.
 *   - Fractions and apertures of cut cells can be tiny (a wall just grazing
 *     a cell); use them as weights and don't divide by them. A cut cell's
 *     face apertures can exceed its fraction (thin fluid along a face).
 *   - Fractions of uncut cells are exactly 0 or 1; apertures of faces no
 *     outline crosses are exactly 0 or 1.
 *   - Outer outline runs counter-clockwise and holes clockwise, so the fluid
 *     is on the left of each segment's direction (−normalY, normalX).
 *   - coarsen() builds the next multigrid level (spacing 2h) with fractions =
 *     mean of the 4 children, apertures = mean of the 2 fine faces covered,
 *     and the same segments re-assigned to the parent cells, so the discrete
 *     divergence theorem holds on every level.
 */
import type { Vec2 } from '../geometry/ring';

export interface BoundarySegments {
  count: number;
  cell: Int32Array;
  length: Float64Array;
  normalX: Float64Array;
  normalY: Float64Array;
  midX: Float64Array;
  midY: Float64Array;
  /** −1: wall; k ≥ 0: port index in design.ports. */
  port: Int32Array;
  zeta: Float64Array;
}

export interface CutCellGrid {
  nx: number;
  ny: number;
  /** Cell edge h (m). */
  spacing: number;
  /** Lower-left corner of cell (0, 0) (m). */
  x0: number;
  y0: number;
  /** 0 for the grid built from the shapes; n for the n-th coarsening. */
  level: number;
  fraction: Float64Array;
  apertureX: Float64Array;
  apertureY: Float64Array;
  segments: BoundarySegments;
  cutCells: Int32Array;
  cutCentroidX: Float64Array;
  cutCentroidY: Float64Array;
  /** Outline length assigned to each port (m), indexed like design.ports. */
  portLength: Float64Array;
  /** Number of cells with fraction > 0. */
  fluidCells: number;
}

export const WALL = -1;

/** Index of the vertical face left of cell (i, j). */
export function faceXIndex(grid: CutCellGrid, i: number, j: number): number {
  return i + j * (grid.nx + 1);
}

/** Index of the horizontal face below cell (i, j). */
export function faceYIndex(grid: CutCellGrid, i: number, j: number): number {
  return i + j * grid.nx;
}

/** The cell that contains (x, y), or −1 outside the grid. Points on a face go to the upper/right cell. */
export function cellOf(grid: CutCellGrid, x: number, y: number): number {
  const i = Math.floor((x - grid.x0) / grid.spacing);
  const j = Math.floor((y - grid.y0) / grid.spacing);
  if (!(i >= 0 && i < grid.nx && j >= 0 && j < grid.ny)) return -1;
  return i + j * grid.nx;
}

export function cellCentre(grid: CutCellGrid, cell: number): Vec2 {
  const i = cell % grid.nx, j = (cell - i) / grid.nx;
  return [grid.x0 + (i + 0.5) * grid.spacing, grid.y0 + (j + 0.5) * grid.spacing];
}

/** Position of `cell` in cutCells, or −1 if the cell is not cut (binary search). */
export function cutIndex(grid: CutCellGrid, cell: number): number {
  let lo = 0, hi = grid.cutCells.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const v = grid.cutCells[mid];
    if (v === cell) return mid;
    if (v < cell) lo = mid + 1;
    else hi = mid - 1;
  }
  return -1;
}

/** Centroid of the fluid part of a cell (the cell centre for uncut cells). */
export function fluidCentroid(grid: CutCellGrid, cell: number): Vec2 {
  const k = cutIndex(grid, cell);
  return k >= 0 ? [grid.cutCentroidX[k], grid.cutCentroidY[k]] : cellCentre(grid, cell);
}

/** Segments of `cell` are those with index in [start, end). */
export function segmentRange(grid: CutCellGrid, cell: number): [number, number] {
  const cells = grid.segments.cell;
  const lowerBound = (value: number) => {
    let lo = 0, hi = grid.segments.count;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (cells[mid] < value) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  };
  return [lowerBound(cell), lowerBound(cell + 1)];
}

/** An empty segment table of the given size. */
export function allocateSegments(count: number): BoundarySegments {
  return {
    count,
    cell: new Int32Array(count),
    length: new Float64Array(count),
    normalX: new Float64Array(count),
    normalY: new Float64Array(count),
    midX: new Float64Array(count),
    midY: new Float64Array(count),
    port: new Int32Array(count),
    zeta: new Float64Array(count),
  };
}
