/**
 * Draws the layout into the canvas's world group (drawing units: micrometres, y up): the fluid, wall zones, the
 * outline, shapes, ports, the selected shape and what the tool in use previews.
 */
import type * as d3 from 'd3';
import type { DesignDocument, Shape } from '../../../../shared/design';
import type { Selection, SketchPreview } from './canvas-pointer';
import { shapeBounds, unionBounds } from './shape-transform';
import { UM, ringsPath, shapePath } from './sketch-path';
import type { Vec } from './tool-geometry';

export interface WorldContent {
  doc: DesignDocument;
  selection: Selection | null;
  preview: SketchPreview | null;
  /** Outline of the fluid (rings in metres). */
  outline: ReadonlyArray<ReadonlyArray<Vec>>;
}

/** Draws into `world`, the group the canvas set up with its mask, fluid rect and layers. */
export function drawWorld(world: d3.Selection<SVGGElement, unknown, null, undefined>, { doc, selection, preview, outline }: WorldContent): void {
  // Fluid fill: shapes applied in order in a mask (add paints, subtract erases), so holes are exact.
  const bounds = unionBounds(doc.shapes.map(shapeBounds));
  const mask = world.select('mask');
  const fluid = world.select('rect.fluid');
  if (bounds) {
    const pad = Math.max(bounds[2] - bounds[0], bounds[3] - bounds[1]) * 0.05 + 1e-6;
    const box = { x: (bounds[0] - pad) * UM, y: (bounds[1] - pad) * UM, width: (bounds[2] - bounds[0] + 2 * pad) * UM, height: (bounds[3] - bounds[1] + 2 * pad) * UM };
    mask.attr('x', box.x).attr('y', box.y).attr('width', box.width).attr('height', box.height);
    fluid.attr('x', box.x).attr('y', box.y).attr('width', box.width).attr('height', box.height).attr('display', null);
  } else {
    fluid.attr('display', 'none');
  }
  mask
    .selectAll('path')
    .data(doc.shapes)
    .join('path')
    .attr('d', (s) => shapePath(s))
    .attr('fill', (s) => (s.op === 'add' ? '#fff' : '#000'));

  world
    .select('g.zones')
    .selectAll('path')
    .data(doc.wallZones)
    .join('path')
    .attr('class', 'zone')
    .attr('d', (z) => shapePath(z.region));

  world.select('path.outline').attr('d', ringsPath(outline));

  world
    .select('g.shapes')
    .selectAll<SVGPathElement, Shape>('path')
    .data(doc.shapes)
    .join('path')
    .attr('class', (s) => `shape ${s.op}`)
    .attr('data-hit', (_s, k) => `shape:${k}`)
    .attr('data-testid', (_s, k) => `shape-${k}`)
    .attr('d', (s) => shapePath(s));

  world
    .select('g.ports')
    .selectAll('line')
    .data(doc.ports)
    .join('line')
    .attr('class', (_p, k) => (selection?.kind === 'port' && selection.index === k ? 'port is-selected' : 'port'))
    .attr('data-hit', (_p, k) => `port:${k}`)
    .attr('data-testid', (p) => `port-${p.id}`)
    .attr('x1', (p) => p.from[0] * UM)
    .attr('y1', (p) => p.from[1] * UM)
    .attr('x2', (p) => p.to[0] * UM)
    .attr('y2', (p) => p.to[1] * UM);

  const chosen = selection?.kind === 'shape' ? doc.shapes[selection.index] : undefined;
  world.select('path.selected').attr('d', chosen ? shapePath(chosen) : null);

  const pv = world.select('g.preview');
  pv.selectAll('path.ghost')
    .data(preview?.shapes ?? [])
    .join('path')
    .attr('class', (s) => `ghost ${s.op}`)
    .attr('d', (s) => shapePath(s));
  const lines: Array<[Vec, Vec]> = [];
  if (preview?.rubber) lines.push(preview.rubber);
  const pts = preview?.points ?? [];
  for (let k = 1; k < pts.length; k++) lines.push([pts[k - 1], pts[k]]);
  pv.selectAll('line.rubber')
    .data(lines)
    .join('line')
    .attr('class', 'rubber')
    .attr('x1', (l) => l[0][0] * UM)
    .attr('y1', (l) => l[0][1] * UM)
    .attr('x2', (l) => l[1][0] * UM)
    .attr('y2', (l) => l[1][1] * UM);
  pv.selectAll('line.port-ghost')
    .data(preview?.segment ? [preview.segment] : [])
    .join('line')
    .attr('class', 'port-ghost')
    .attr('x1', (s) => s.from[0] * UM)
    .attr('y1', (s) => s.from[1] * UM)
    .attr('x2', (s) => s.to[0] * UM)
    .attr('y2', (s) => s.to[1] * UM);
}
