/**
 * Geometry checks: problems in a valid design document that stop a solve
 * (errors) or deserve a note (warnings), with a plain message and, where the
 * problem has a place, the point to show on the drawing.
 *
 * Three stages, as the data becomes available:
 *   checkShapes  – the shapes and ports alone (empty layout, self-crossing
 *                  polygons, nothing that drives current or flow);
 *   checkRegion  – the fluid after the boolean operations (empty, slivers);
 *   checkGrid    – the cut-cell grid (ports on the outline, unconnected
 *                  fluid, resolution across the narrowest channel).
 */
import type { DesignDocument, DesignProblem } from '../../shared/design';
import type { FluidComponents } from '../grid/components';
import type { CutCellGrid } from '../grid/cut-cell-grid';
import type { GridChoice } from '../grid/choose-grid';
import type { ChannelWidths } from './channel-width';
import type { FluidRegion } from './fluid-region';
import { formatLength, formatPoint } from './format';
import { distanceToOutline, ringArea, ringPerimeter, type Vec2 } from './ring';
import { findSelfCrossing } from './self-crossing';

/** Cells wanted across the narrowest channel before we warn. */
export const MIN_CELLS_ACROSS = 8;
/** Most problems of one kind listed one by one. */
const MAX_LISTED = 5;

function midpoint(a: readonly number[], b: readonly number[]): Vec2 {
  return [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2];
}

export function checkShapes(design: DesignDocument): DesignProblem[] {
  const problems: DesignProblem[] = [];
  if (!design.shapes.some((s) => s.op === 'add')) {
    problems.push({
      code: 'empty-layout',
      severity: 'error',
      message: 'The layout is empty: add at least one shape to make the fluid.',
      field: 'shapes',
    });
  }
  design.shapes.forEach((shape, k) => {
    if (shape.type !== 'polygon') return;
    const at = findSelfCrossing(shape.points);
    if (at) {
      problems.push({
        code: 'self-crossing-polygon',
        severity: 'error',
        message: `Polygon shapes[${k}] crosses itself near ${formatPoint(at)}; list its points in order around the outline.`,
        at,
        field: `shapes[${k}].points`,
      });
    }
  });
  design.wallZones.forEach((zone, k) => {
    if (zone.region.type !== 'polygon') return;
    const at = findSelfCrossing(zone.region.points);
    if (at) {
      problems.push({
        code: 'self-crossing-polygon',
        severity: 'error',
        message: `The region of wallZones[${k}] crosses itself near ${formatPoint(at)}; list its points in order around the outline.`,
        at,
        field: `wallZones[${k}].region.points`,
      });
    }
  });
  if (!hasDrive(design)) {
    problems.push({
      code: 'no-drive',
      severity: 'error',
      message:
        design.ports.length === 0
          ? 'Nothing drives current or flow: the design has no ports. Add at least two ports with different potentials or pressures.'
          : 'Nothing drives current or flow: give two ports different potentials or different pressures (floating ports carry no current).',
      field: 'ports',
    });
  }
  return problems;
}

/** True when two ports differ in potential (floating ports aside) or in pressure. */
export function hasDrive(design: DesignDocument): boolean {
  const potentials = new Set<number>();
  const pressures = new Set<number>();
  for (const port of design.ports) {
    if (port.potential !== null) potentials.add(port.potential);
    pressures.add(port.pressure);
  }
  return potentials.size > 1 || pressures.size > 1;
}

export function checkRegion(region: FluidRegion, widths: ChannelWidths | null, sliverWidth: number): DesignProblem[] {
  if (!(region.area > 0)) {
    return [{
      code: 'empty-layout',
      severity: 'error',
      message: 'Nothing is left of the fluid after the subtracted shapes; check the order and size of the shapes.',
      field: 'shapes',
    }];
  }
  const problems: DesignProblem[] = [];
  const slivers: Array<{ width: number; at: Vec2 }> = [];
  for (const polygon of region.polygons) {
    for (const ring of polygon) {
      const thickness = (2 * Math.abs(ringArea(ring))) / ringPerimeter(ring);
      if (thickness < sliverWidth) {
        let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
        for (const [x, y] of ring) {
          x0 = Math.min(x0, x); x1 = Math.max(x1, x); y0 = Math.min(y0, y); y1 = Math.max(y1, y);
        }
        slivers.push({ width: thickness, at: [(x0 + x1) / 2, (y0 + y1) / 2] });
      }
    }
  }
  const thin = widths?.thinnest;
  if (thin && thin.width < sliverWidth && !slivers.some((s) => Math.hypot(s.at[0] - thin.at[0], s.at[1] - thin.at[1]) < sliverWidth * 100)) {
    slivers.push(thin);
  }
  for (const s of slivers.slice(0, MAX_LISTED)) {
    problems.push({
      code: 'thin-sliver',
      severity: 'warning',
      message:
        `A thin sliver (about ${formatLength(s.width)} wide) is left near ${formatPoint(s.at)} where shapes overlap or nearly touch; ` +
        'make the shapes meet exactly or overlap clearly.',
      at: s.at,
    });
  }
  if (slivers.length > MAX_LISTED) {
    problems.push({ code: 'thin-sliver', severity: 'warning', message: `${slivers.length - MAX_LISTED} more thin slivers were found.` });
  }
  return problems;
}

export interface GridCheckInput {
  design: DesignDocument;
  region: FluidRegion;
  grid: CutCellGrid;
  choice: GridChoice;
  components: FluidComponents;
  widths: ChannelWidths | null;
  portOverlaps: ReadonlyArray<[number, number]>;
}

export function checkGrid(input: GridCheckInput): DesignProblem[] {
  const { design, region, grid, choice, components, widths, portOverlaps } = input;
  const problems: DesignProblem[] = [];
  const half = grid.spacing / 2;

  design.ports.forEach((port, k) => {
    const length = Math.hypot(port.to[0] - port.from[0], port.to[1] - port.from[1]);
    const covered = grid.portLength[k] / length;
    const at = midpoint(port.from, port.to);
    if (covered < 0.5) {
      const gap = distanceToOutline(region.polygons, at[0], at[1]);
      problems.push({
        code: 'port-off-outline',
        severity: 'error',
        message:
          `Port "${port.id}" is not on the outline of the fluid: its middle is ${formatLength(gap)} from the nearest wall. ` +
          `A port must lie along the fluid's edge (within half a cell, ${formatLength(half)}).`,
        at,
        field: `ports[${k}]`,
      });
    } else if (covered < 0.98) {
      problems.push({
        code: 'port-partly-off-outline',
        severity: 'warning',
        message: `Only ${Math.round(covered * 100)}% of port "${port.id}" lies on the outline of the fluid; the rest is ignored.`,
        at,
        field: `ports[${k}]`,
      });
    }
  });

  for (const [a, b] of portOverlaps) {
    const pa = design.ports[a], pb = design.ports[b];
    problems.push({
      code: 'ports-overlap',
      severity: 'error',
      message: `Ports "${pa.id}" and "${pb.id}" overlap on the outline; each piece of the outline can belong to one port only.`,
      at: midpoint(pb.from, pb.to),
      field: `ports[${b}]`,
    });
  }

  // Components that no port touches.
  const touched = new Uint8Array(components.count);
  for (let s = 0; s < grid.segments.count; s++) {
    if (grid.segments.port[s] >= 0) {
      const label = components.label[grid.segments.cell[s]];
      if (label >= 0) touched[label] = 1;
    }
  }
  const loose: number[] = [];
  for (let k = 0; k < components.count; k++) if (!touched[k]) loose.push(k);
  for (const k of loose.slice(0, MAX_LISTED)) {
    const c = components.seed[k];
    const i = c % grid.nx, j = (c - i) / grid.nx;
    const at: Vec2 = [grid.x0 + (i + 0.5) * grid.spacing, grid.y0 + (j + 0.5) * grid.spacing];
    const area = components.size[k] * grid.spacing * grid.spacing;
    problems.push({
      code: 'unconnected-fluid',
      severity: 'error',
      message:
        `A piece of fluid near ${formatPoint(at)} (about ${formatLength(Math.sqrt(area))} across) touches no port, ` +
        'so its potential and flow are undefined: connect it to a channel with a port or remove it.',
      at,
    });
  }
  if (loose.length > MAX_LISTED) {
    problems.push({
      code: 'unconnected-fluid',
      severity: 'error',
      message: `${loose.length - MAX_LISTED} more pieces of fluid touch no port.`,
    });
  }

  const narrowest = widths?.narrowest;
  if (choice.capped) {
    problems.push({
      code: 'grid-capped',
      severity: 'warning',
      message:
        `The grid was limited to ${(choice.nx * choice.ny).toLocaleString('en-US')} cells (${choice.nx} × ${choice.ny}, ` +
        `cells of ${formatLength(choice.spacing)}) to keep the solve within memory.`,
    });
  }
  if (narrowest && choice.cellsAcross < MIN_CELLS_ACROSS) {
    const [xmin, ymin, xmax, ymax] = region.bounds;
    const needed = Math.ceil((Math.max(xmax - xmin, ymax - ymin) / narrowest.width) * MIN_CELLS_ACROSS);
    problems.push({
      code: 'under-resolved',
      severity: 'warning',
      message:
        `The narrowest channel (${formatLength(narrowest.width)} near ${formatPoint(narrowest.at)}) is only ` +
        `${choice.cellsAcross.toFixed(1)} cells across at this resolution; use --cells ${needed} or more for ` +
        `${MIN_CELLS_ACROSS} cells across.`,
      at: narrowest.at,
    });
  }
  return problems;
}
