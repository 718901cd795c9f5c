/**
 * Rasterising the fluid region onto a cut-cell grid (layout: cut-cell-grid.ts).
 *
 * Only the outline is walked: each edge is split into per-cell pieces
 * (edge-pieces.ts). Everything else follows from the pieces by the
 * divergence theorem, row by row, in one pass over the grid:
 *
 *   winding number w(x, y) ∈ {0, 1} (outer rings counter-clockwise, holes clockwise);
 *   a piece with rise dv in column i covers, within its row, the part of
 *   cell i right of it and every cell right of column i:
 *     area in cell i      += −dv · (i + 1 − ū)        (ū: mean u of the piece)
 *     cover right of i    += −dv
 *   apertureX(i, j) = cover at the face u = i (all pieces left of it),
 *   fraction(i, j)  = apertureX(i, j) + Σ_{pieces in cell} −dv (i + 1 − ū),
 *   apertureY(i, j+1) = apertureY(i, j) + Σ_{pieces in cell} du
 *     (the y-component of ∮ n ds = 0 over the fluid part of the cell).
 * This is exact for polygons (to round-off) and costs O(cells + pieces).
 * Fluid centroids of cut cells come from Green's theorem in cell-local
 * coordinates (ξ, η) ∈ [0, 1]²:
 *   A ξ̄ = ½ ∮ ξ² dη,   A η̄ = −½ ∮ η² dξ   (pieces plus open parts of the faces).
 */
import type { Point, WallZone } from '../../shared/design';
import type { FluidRegion } from '../geometry/fluid-region';
import { assignPorts, assignZeta, portCuts, type PortSegment } from './boundary-kinds';
import { allocateSegments, type BoundarySegments, type CutCellGrid } from './cut-cell-grid';
import { createPieces, splitEdge, type Pieces } from './edge-pieces';
import { rememberFluidRuns, RunList, runLength } from './fluid-runs';

/** Where the grid lies: nx × ny cells of edge `spacing` from (x0, y0). */
export interface GridFrame {
  nx: number;
  ny: number;
  spacing: number;
  x0: number;
  y0: number;
}

export interface RasteriseOptions {
  /** Port segments, indexed like design.ports. */
  ports?: ReadonlyArray<PortSegment>;
  /** zeta.side (V). */
  sideZeta?: number;
  wallZones?: ReadonlyArray<WallZone>;
}

export interface RasteriseResult {
  grid: CutCellGrid;
  /** Pairs of ports (indices) that claim the same piece of outline. */
  portOverlaps: Array<[number, number]>;
}

/** Vertex coordinates this close to a grid line (grid units) are put on it. */
const SNAP = 1e-9;
/** Running sums this close to 0 or 1 are made exact. */
const ROUND = 1e-12;
/** Least fraction of a cell that holds outline: it always holds some fluid. */
export const MIN_CUT_FRACTION = 1e-14;

function snapToLine(u: number): number {
  const r = Math.round(u);
  return Math.abs(u - r) < SNAP ? r : u;
}

function unit(v: number): number {
  if (v < ROUND) return 0;
  if (v > 1 - ROUND) return 1;
  return v;
}

/** Splits every edge of the region into per-cell pieces (grid units). */
function outlinePieces(region: FluidRegion, frame: GridFrame, ports: ReadonlyArray<PortSegment>): Pieces {
  const { nx, ny, spacing: h, x0, y0 } = frame;
  const toGrid = (p: Point): Point => [snapToLine((p[0] - x0) / h), snapToLine((p[1] - y0) / h)];
  const gridPorts = ports.map((p) => ({ from: toGrid(p.from), to: toGrid(p.to) }));
  const pieces = createPieces(4096);
  for (const polygon of region.polygons) {
    for (const ring of polygon) {
      const g = ring.map(toGrid);
      for (let k = 0, n = g.length; k < n; k++) {
        const a = g[k], b = g[(k + 1) % n];
        const cuts = gridPorts.length > 0 ? portCuts(a[0], a[1], b[0], b[1], gridPorts, 0.5) : [];
        splitEdge(pieces, nx, ny, a[0], a[1], b[0], b[1], cuts);
      }
    }
  }
  return pieces;
}

/** Piece indices ordered by cell (stable), via packed numeric keys. */
function orderByCell(pieces: Pieces): Uint32Array {
  const n = pieces.count;
  const stride = 2 ** Math.ceil(Math.log2(n + 1));
  const keys = new Float64Array(n);
  for (let s = 0; s < n; s++) keys[s] = pieces.cell[s] * stride + s;
  keys.sort();
  const order = new Uint32Array(n);
  for (let s = 0; s < n; s++) order[s] = keys[s] % stride;
  return order;
}

export function rasterise(region: FluidRegion, frame: GridFrame, options: RasteriseOptions = {}): RasteriseResult {
  const { nx, ny, spacing: h, x0, y0 } = frame;
  const ports = options.ports ?? [];
  const pieces = outlinePieces(region, frame, ports);
  const order = orderByCell(pieces);
  const P = pieces.count;
  const { cell, ax, ay, bx, by } = pieces;

  const fraction = new Float64Array(nx * ny);
  const apertureX = new Float64Array((nx + 1) * ny);
  const apertureY = new Float64Array(nx * (ny + 1));
  const partial = new Float64Array(nx);
  const rise = new Float64Array(nx); // Σ −dv per cell of the row

  // Between the cells that hold pieces the cover is constant along the row, so those spans are filled, not
  // walked: the work is the pieces plus a fill per span. The runs of fluid cells (fraction > 0) come out on the way.
  const runs = new RunList();
  const rowRuns = new Int32Array(ny + 1);
  let p = 0;
  for (let j = 0; j < ny; j++) {
    rowRuns[j] = runs.count;
    const rowStart = j * nx, rowEnd = rowStart + nx, up = (j + 1) * nx;
    apertureY.copyWithin(up, rowStart, rowEnd);
    const first = p;
    for (; p < P && cell[order[p]] < rowEnd; p++) {
      const s = order[p];
      const i = cell[s] - rowStart;
      const du = bx[s] - ax[s], dv = by[s] - ay[s];
      partial[i] += -dv * (1 - (ax[s] - i + (bx[s] - i)) / 2);
      rise[i] -= dv;
      apertureY[up + i] += du;
    }
    let cover = 0, from = 0, runStart = -1;
    const faceRow = j * (nx + 1);
    for (let q = first; q < p; q++) {
      const i = cell[order[q]] - rowStart;
      if (q > first && i === cell[order[q - 1]] - rowStart) continue;
      // The span [from, i) at the current cover, then cell i with its pieces.
      if (cover !== 0) {
        fraction.fill(cover, rowStart + from, rowStart + i);
        apertureX.fill(cover, faceRow + from, faceRow + i);
        if (runStart < 0 && i > from) runStart = rowStart + from;
      } else if (runStart >= 0 && i > from) {
        runs.push(runStart, rowStart + from);
        runStart = -1;
      }
      apertureX[faceRow + i] = cover;
      fraction[rowStart + i] = Math.max(MIN_CUT_FRACTION, Math.min(1, cover + partial[i]));
      if (runStart < 0) runStart = rowStart + i;
      apertureY[up + i] = unit(apertureY[up + i]);
      cover = unit(cover + rise[i]);
      partial[i] = 0; rise[i] = 0;
      from = i + 1;
    }
    if (cover !== 0) {
      fraction.fill(cover, rowStart + from, rowEnd);
      apertureX.fill(cover, faceRow + from, faceRow + nx + 1);
      if (runStart < 0 && nx > from) runStart = rowStart + from;
      if (runStart >= 0) runs.push(runStart, rowEnd);
    } else if (runStart >= 0) {
      runs.push(runStart, rowStart + from);
    }
  }
  rowRuns[ny] = runs.count;
  const fluid = { runs: runs.array(), rowRuns };

  const cut = cutCentroids(pieces, order, frame, fraction, apertureX, apertureY);

  // Classify each piece, then join runs of like pieces within a cell into chords.
  const raw = pieceSegments(pieces, order, frame);
  const kinds = assignPorts(raw, ports, h / 2);
  assignZeta(raw, options.sideZeta ?? 0, options.wallZones ?? []);
  const segments = joinRuns(pieces, order, raw, frame);
  const portLength = new Float64Array(ports.length);
  for (let t = 0; t < segments.count; t++) if (segments.port[t] >= 0) portLength[segments.port[t]] += segments.length[t];

  const fluidCells = runLength(fluid.runs);

  const grid: CutCellGrid = {
    nx, ny, spacing: h, x0, y0, level: 0,
    fraction, apertureX, apertureY, segments,
    cutCells: cut.cells,
    cutCentroidX: cut.x,
    cutCentroidY: cut.y,
    portLength,
    fluidCells,
  };
  rememberFluidRuns(grid, fluid);
  return { grid, portOverlaps: kinds.overlaps };
}

/**
 * Centroid of the fluid in each cell that holds pieces, by Green's theorem in
 * cell-local coordinates (ξ, η) = (u − i, v − j):
 *   A ξ̄ = ½ [Σ_pieces Δη (ξa² + ξa ξb + ξb²)/3 + apertureX(i+1, j)]
 *   A η̄ = −½ [Σ_pieces Δξ (ηa² + ηa ηb + ηb²)/3 − apertureY(i, j+1)]
 * (the open parts of the right and top faces are the only faces that add).
 */
function cutCentroids(
  pieces: Pieces, order: Uint32Array, frame: GridFrame,
  fraction: Float64Array, apertureX: Float64Array, apertureY: Float64Array,
): { cells: Int32Array; x: Float64Array; y: Float64Array } {
  const { nx, spacing: h, x0, y0 } = frame;
  const { cell, ax, ay, bx, by } = pieces;
  const P = pieces.count;
  const cells: number[] = [], xs: number[] = [], ys: number[] = [];
  let q0 = 0;
  while (q0 < P) {
    const c = cell[order[q0]];
    const i = c % nx, j = (c - i) / nx;
    let q1 = q0, sumX = 0, sumY = 0, midU = 0, midV = 0;
    for (; q1 < P && cell[order[q1]] === c; q1++) {
      const s = order[q1];
      const xa = ax[s] - i, ya = ay[s] - j, xb = bx[s] - i, yb = by[s] - j;
      sumX += ((yb - ya) * (xa * xa + xa * xb + xb * xb)) / 3;
      sumY += ((xb - xa) * (ya * ya + ya * yb + yb * yb)) / 3;
      midU += (xa + xb) / 2;
      midV += (ya + yb) / 2;
    }
    const area = fraction[c];
    let xi = (0.5 * (sumX + apertureX[i + 1 + j * (nx + 1)])) / area;
    let eta = (-0.5 * (sumY - apertureY[i + (j + 1) * nx])) / area;
    if (!(area > 1e-9)) {
      xi = midU / (q1 - q0);
      eta = midV / (q1 - q0);
    }
    cells.push(c);
    xs.push(x0 + (i + Math.min(1, Math.max(0, xi))) * h);
    ys.push(y0 + (j + Math.min(1, Math.max(0, eta))) * h);
    q0 = q1;
  }
  return { cells: Int32Array.from(cells), x: Float64Array.from(xs), y: Float64Array.from(ys) };
}

/** One segment (m) per piece, in cell order, for classification. */
function pieceSegments(pieces: Pieces, order: Uint32Array, frame: GridFrame): BoundarySegments {
  const { spacing: h, x0, y0 } = frame;
  const out = allocateSegments(pieces.count);
  for (let q = 0; q < pieces.count; q++) {
    const s = order[q];
    const du = pieces.bx[s] - pieces.ax[s], dv = pieces.by[s] - pieces.ay[s];
    const len = Math.hypot(du, dv);
    out.cell[q] = pieces.cell[s];
    out.length[q] = len * h;
    // Fluid on the left of travel: outward normal (dv, −du)/len.
    out.normalX[q] = dv / len;
    out.normalY[q] = -du / len;
    out.midX[q] = x0 + ((pieces.ax[s] + pieces.bx[s]) / 2) * h;
    out.midY[q] = y0 + ((pieces.ay[s] + pieces.by[s]) / 2) * h;
  }
  return out;
}

/** Pieces turning less than this from the first piece of a run join it (cos 10°). */
const JOIN_COS = Math.cos((10 * Math.PI) / 180);

/**
 * Joins consecutive pieces of one cell that continue each other, are of the
 * same kind (port, zeta) and turn less than 10° into one chord. Σ length·n is
 * unchanged (a closed chain), so the discrete divergence theorem still holds;
 * fractions and apertures were already taken from the exact pieces.
 */
function joinRuns(pieces: Pieces, order: Uint32Array, raw: BoundarySegments, frame: GridFrame): BoundarySegments {
  const { spacing: h, x0, y0 } = frame;
  const { ax, ay, bx, by } = pieces;
  const P = pieces.count;
  const ends = new Int32Array(P); // last piece (sorted position) of the run starting at each kept position
  const starts: number[] = [];
  let q = 0;
  while (q < P) {
    const first = q;
    while (
      q + 1 < P &&
      raw.cell[q + 1] === raw.cell[first] &&
      raw.port[q + 1] === raw.port[first] &&
      raw.zeta[q + 1] === raw.zeta[first] &&
      bx[order[q]] === ax[order[q + 1]] && by[order[q]] === ay[order[q + 1]] &&
      raw.normalX[q + 1] * raw.normalX[first] + raw.normalY[q + 1] * raw.normalY[first] > JOIN_COS
    ) q++;
    ends[starts.length] = q;
    starts.push(first);
    q++;
  }
  const out = allocateSegments(starts.length);
  starts.forEach((first, t) => {
    const a = order[first], b = order[ends[t]];
    const du = bx[b] - ax[a], dv = by[b] - ay[a];
    const len = Math.hypot(du, dv);
    out.cell[t] = raw.cell[first];
    out.length[t] = len * h;
    out.normalX[t] = dv / len;
    out.normalY[t] = -du / len;
    out.midX[t] = x0 + ((ax[a] + bx[b]) / 2) * h;
    out.midY[t] = y0 + ((ay[a] + by[b]) / 2) * h;
    out.port[t] = raw.port[first];
    out.zeta[t] = raw.zeta[first];
  });
  return out;
}
