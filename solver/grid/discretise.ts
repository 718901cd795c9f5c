/**
 * From a validated design to the cut-cell grid, with every geometry problem:
 *
 *   shapes → fluid region (boolean ops) → narrowest channel → grid spacing
 *   → cut cells, ports and wall zeta → connected pieces → checks.
 *
 * Tiny port-less pieces of fluid (below a hundredth of a cell, left by
 * shapes that nearly touch) are removed from the grid with a warning, so
 * every piece the solvers see touches a port once there are no errors.
 */
import type { DesignDocument, DesignProblem, Shape } from '../../shared/design';
import { ARC_TOLERANCE, COARSE_ARC_TOLERANCE, gridArcTolerance } from '../geometry/arc';
import { channelWidths, type ChannelWidths } from '../geometry/channel-width';
import { checkGrid, checkRegion, checkShapes } from '../geometry/checks';
import { fluidRegion, type FluidRegion } from '../geometry/fluid-region';
import { formatPoint } from '../geometry/format';
import { shapeArcRadius, shapeFeatureSize } from '../geometry/shape-outline';
import { chooseGrid, type GridChoice } from './choose-grid';
import { labelComponents, type FluidComponents } from './components';
import { allocateSegments, type CutCellGrid } from './cut-cell-grid';
import { rasterise } from './rasterise';

export interface DiscretiseOptions {
  /** Cells along the longer side of the layout (--cells). */
  cells?: number;
  maxCells?: number;
  /** Arc tolerance relative to the radius for every arc; default: as fine as the grid needs (gridRegion). */
  arcTolerance?: number;
}

export interface Discretisation {
  /** True when no problem is an error: the grid is ready to solve. */
  ok: boolean;
  problems: DesignProblem[];
  region: FluidRegion | null;
  widths: ChannelWidths | null;
  choice: GridChoice | null;
  grid: CutCellGrid | null;
  components: FluidComponents | null;
}

/** Widths below this fraction of the smallest drawn feature are slivers, not channels. */
export const SLIVER_RATIO = 1e-3;
/** Port-less pieces smaller than this (in cells) are dropped as slivers. */
const TINY_PIECE_CELLS = 0.01;

export function discretiseDesign(design: DesignDocument, options: DiscretiseOptions = {}): Discretisation {
  const problems = checkShapes(design);
  const result: Discretisation = { ok: false, problems, region: null, widths: null, choice: null, grid: null, components: null };
  if (problems.some((p) => p.code === 'empty-layout' || p.code === 'self-crossing-polygon')) return result;

  const features = design.shapes.filter((s) => s.op === 'add').map(shapeFeatureSize);
  const sliverWidth = SLIVER_RATIO * Math.min(...features);
  try {
    result.region = gridRegion(design, options, sliverWidth);
  } catch (error) {
    problems.push({
      code: 'geometry-failed',
      severity: 'error',
      message: `The shapes could not be combined (${error instanceof Error ? error.message : String(error)}); ` +
        'try moving shapes that meet at almost the same place apart or onto each other exactly.',
      field: 'shapes',
    });
    return result;
  }
  const region = result.region;
  if (region.area > 0) result.widths = channelWidths(region, sliverWidth);
  problems.push(...checkRegion(region, result.widths, sliverWidth));
  if (!(region.area > 0)) return result;

  const choice = chooseGrid(region, { cells: options.cells, maxCells: options.maxCells, narrowest: result.widths?.narrowest });
  result.choice = choice;
  const { grid, portOverlaps } = rasterise(region, choice, {
    ports: design.ports,
    sideZeta: design.zeta.side,
    wallZones: design.wallZones,
  });
  let components = labelComponents(grid);
  const tiny = tinyLoosePieces(grid, components);
  if (tiny.length > 0) {
    const removed = removeComponents(grid, components, tiny);
    result.grid = removed;
    for (const k of tiny.slice(0, 3)) {
      const c = components.seed[k];
      const i = c % grid.nx, j = (c - i) / grid.nx;
      const at: [number, number] = [grid.x0 + (i + 0.5) * grid.spacing, grid.y0 + (j + 0.5) * grid.spacing];
      problems.push({
        code: 'thin-sliver',
        severity: 'warning',
        message: `A speck of fluid near ${formatPoint(at)}, far smaller than a cell and touching no port, was left out.`,
        at,
      });
    }
    components = labelComponents(removed);
  } else {
    result.grid = grid;
  }
  result.components = components;
  problems.push(
    ...checkGrid({ design, region, grid: result.grid, choice, components, widths: result.widths, portOverlaps }),
  );
  result.ok = !problems.some((p) => p.severity === 'error');
  return result;
}

/**
 * The fluid region the grid is built from. Arcs are made as fine as the grid needs (gridArcTolerance in
 * geometry/arc.ts): a first outline with coarse arcs gives the grid spacing (from its narrowest channel, or
 * from `cells`), then each arc's polygon keeps within a small fraction of that spacing of its circle. Without
 * arcs, or with an explicit tolerance, one outline.
 */
function gridRegion(design: DesignDocument, options: DiscretiseOptions, sliverWidth: number): FluidRegion {
  const { shapes } = design;
  if (options.arcTolerance !== undefined || !shapes.some((s) => shapeArcRadius(s) > 0)) {
    return fluidRegion(shapes, options.arcTolerance ?? ARC_TOLERANCE);
  }
  const coarse = fluidRegion(shapes, COARSE_ARC_TOLERANCE);
  if (!(coarse.area > 0)) return coarse;
  const narrowest = channelWidths(coarse, sliverWidth).narrowest;
  const h = chooseGrid(coarse, { cells: options.cells, maxCells: options.maxCells, narrowest }).spacing;
  const tolerance = (shape: Shape) => gridArcTolerance(shapeArcRadius(shape), h);
  if (shapes.every((s) => shapeArcRadius(s) === 0 || tolerance(s) >= COARSE_ARC_TOLERANCE)) return coarse;
  return fluidRegion(shapes, tolerance);
}

function tinyLoosePieces(grid: CutCellGrid, components: FluidComponents): number[] {
  const touched = new Uint8Array(components.count);
  for (let s = 0; s < grid.segments.count; s++) {
    if (grid.segments.port[s] >= 0) touched[components.label[grid.segments.cell[s]]] = 1;
  }
  const out: number[] = [];
  for (let k = 0; k < components.count; k++) if (!touched[k] && components.size[k] < TINY_PIECE_CELLS) out.push(k);
  return out;
}

/** A copy of the grid with the cells of the given components made solid. */
export function removeComponents(grid: CutCellGrid, components: FluidComponents, drop: ReadonlyArray<number>): CutCellGrid {
  const { nx, ny } = grid;
  const gone = new Uint8Array(components.count);
  for (const k of drop) gone[k] = 1;
  const isGone = (c: number) => components.label[c] >= 0 && gone[components.label[c]] === 1;
  const fraction = grid.fraction.slice();
  const apertureX = grid.apertureX.slice();
  const apertureY = grid.apertureY.slice();
  let fluidCells = grid.fluidCells;
  for (let c = 0; c < nx * ny; c++) {
    if (!isGone(c)) continue;
    const i = c % nx, j = (c - i) / nx;
    fraction[c] = 0;
    fluidCells--;
    apertureX[i + j * (nx + 1)] = 0;
    apertureX[i + 1 + j * (nx + 1)] = 0;
    apertureY[i + j * nx] = 0;
    apertureY[i + (j + 1) * nx] = 0;
  }
  const src = grid.segments;
  const keep: number[] = [];
  for (let s = 0; s < src.count; s++) if (!isGone(src.cell[s])) keep.push(s);
  const segments = allocateSegments(keep.length);
  keep.forEach((s, t) => {
    segments.cell[t] = src.cell[s]; segments.length[t] = src.length[s];
    segments.normalX[t] = src.normalX[s]; segments.normalY[t] = src.normalY[s];
    segments.midX[t] = src.midX[s]; segments.midY[t] = src.midY[s];
    segments.port[t] = src.port[s]; segments.zeta[t] = src.zeta[s];
  });
  const cutKeep: number[] = [];
  grid.cutCells.forEach((c, k) => { if (!isGone(c)) cutKeep.push(k); });
  return {
    ...grid,
    fraction, apertureX, apertureY, segments, fluidCells,
    cutCells: Int32Array.from(cutKeep, (k) => grid.cutCells[k]),
    cutCentroidX: Float64Array.from(cutKeep, (k) => grid.cutCentroidX[k]),
    cutCentroidY: Float64Array.from(cutKeep, (k) => grid.cutCentroidY[k]),
  };
}
