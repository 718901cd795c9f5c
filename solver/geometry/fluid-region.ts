/**
 * The fluid: shapes applied in order, `add` as union and `subtract` as
 * difference (polygon-clipping's sweep-line boolean operations).
 * Consecutive shapes with the same op are combined in one call, which gives
 * the same set and is much faster than one call per shape.
 */
import type { Shape } from '../../shared/design';
import { ARC_TOLERANCE } from './arc';
import { clipping, type ClipPolygon, type MultiPolygon } from './clipping';
import { openRing, orientRing, polygonsBounds, ringArea, type PolygonRings } from './ring';
import { shapeOutline } from './shape-outline';

export interface FluidRegion {
  /**
   * Connected pieces of fluid (m). Each is [outer, ...holes]; outer rings run
   * counter-clockwise and holes clockwise (fluid on the left); rings are open
   * (the first vertex is not repeated at the end). Pieces that only touch at
   * a vertex are separate.
   */
  polygons: PolygonRings[];
  /** [xmin, ymin, xmax, ymax] of the fluid (m); NaN when empty. */
  bounds: [number, number, number, number];
  /** Fluid area (m²). */
  area: number;
}

function closed(rings: PolygonRings): ClipPolygon {
  return rings.map((r) => [...r, r[0]] as [number, number][]);
}

/** Normalises polygon-clipping output: open rings, orientation, empty rings dropped. */
export function regionFromMultiPolygon(multi: MultiPolygon): FluidRegion {
  const polygons: PolygonRings[] = [];
  let area = 0;
  for (const poly of multi) {
    const rings = poly.map(openRing).filter((r) => r.length >= 3);
    if (rings.length === 0) continue;
    const outer = orientRing(rings[0], true);
    const holes = rings.slice(1).map((r) => orientRing(r, false));
    const out = [outer, ...holes];
    area += out.reduce((sum, r) => sum + ringArea(r), 0);
    polygons.push(out);
  }
  return { polygons, bounds: polygonsBounds(polygons), area };
}

/**
 * Builds the fluid region from the design's shapes, arcs to `tolerance` (relative to their radius; one value, or
 * one per shape). Throws if the clipping library gives up on a degenerate configuration (callers report it).
 */
export function fluidRegion(shapes: ReadonlyArray<Shape>, tolerance: number | ((shape: Shape) => number) = ARC_TOLERANCE): FluidRegion {
  const toleranceOf = typeof tolerance === 'number' ? () => tolerance : tolerance;
  let fluid: MultiPolygon = [];
  let k = 0;
  while (k < shapes.length) {
    const op = shapes[k].op;
    const run: ClipPolygon[] = [];
    while (k < shapes.length && shapes[k].op === op) run.push(closed(shapeOutline(shapes[k], toleranceOf(shapes[k++]))));
    if (op === 'add') {
      fluid = fluid.length > 0 ? clipping.union(fluid, ...run) : clipping.union(run[0], ...run.slice(1));
    } else if (fluid.length > 0) {
      fluid = clipping.difference(fluid, ...run);
    }
  }
  return regionFromMultiPolygon(fluid);
}
