/**
 * Draws the marks of the sketch canvas that stay the same size at any zoom (screen pixels): port ids on the open
 * side of each port, wall-zone labels, the points a tool has been given, the rotate handle of the selected shape
 * and the problem markers.
 */
import type * as d3 from 'd3';
import type { DesignDocument, DesignProblem, Shape } from '../../../../shared/design';
import { formatQuantity } from '../../ui/units';
import type { Selection, SketchPreview } from './canvas-pointer';
import { toScreen, toWorld, type View } from './canvas-view';
import { shapeBounds, shapePivot } from './shape-transform';
import { insideRings } from './sketch-path';
import type { Vec } from './tool-geometry';

export interface MarksContent {
  doc: DesignDocument;
  selection: Selection | null;
  problems: ReadonlyArray<DesignProblem>;
  preview: SketchPreview | null;
  /** Outline of the fluid (rings in metres). */
  outline: ReadonlyArray<ReadonlyArray<Vec>>;
  /** Show the rotate handle on a selected shape. */
  rotatable: boolean;
}

/** Draws into `overlay`, the canvas's group of screen-space marks. */
export function drawMarks(overlay: d3.Selection<SVGGElement, unknown, null, undefined>, view: View, { doc, selection, problems, preview, outline, rotatable }: MarksContent): void {
  // Port ids, on the open side of each port.
  const labels = doc.ports.map((p, k) => {
    const mid: Vec = [(p.from[0] + p.to[0]) / 2, (p.from[1] + p.to[1]) / 2];
    const a = toScreen(view, p.from), b = toScreen(view, p.to);
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]) || 1;
    let nx = -(b[1] - a[1]) / len, ny = (b[0] - a[0]) / len; // a screen normal
    const probe = toWorld(view, [toScreen(view, mid)[0] + nx * 4, toScreen(view, mid)[1] + ny * 4]);
    if (outline.length > 0 && insideRings(outline, probe)) {
      nx = -nx;
      ny = -ny;
    }
    const m = toScreen(view, mid);
    return { id: p.id, k, x: m[0] + nx * 16, y: m[1] + ny * 16 };
  });
  overlay
    .selectAll('text.port-label')
    .data(labels)
    .join('text')
    .attr('class', (l) => (selection?.kind === 'port' && selection.index === l.k ? 'port-label is-selected' : 'port-label'))
    .attr('x', (l) => l.x)
    .attr('y', (l) => l.y)
    .attr('data-hit', (l) => `port:${l.k}`)
    .text((l) => l.id);

  // Wall-zone labels.
  overlay
    .selectAll('text.zone-label')
    .data(doc.wallZones)
    .join('text')
    .attr('class', 'zone-label')
    .attr('x', (z) => {
      const b = shapeBounds(z.region);
      return toScreen(view, [(b[0] + b[2]) / 2, b[3]])[0];
    })
    .attr('y', (z) => toScreen(view, [0, shapeBounds(z.region)[3]])[1] - 4)
    .text((z, k) => `zone ${k + 1}: ζ ${formatQuantity(z.zeta, 'potential', { digits: 3 })}`);

  // Points clicked so far.
  overlay
    .selectAll('circle.vertex')
    .data(preview?.points ?? [])
    .join('circle')
    .attr('class', 'vertex')
    .attr('r', 3.5)
    .attr('cx', (p) => toScreen(view, p)[0])
    .attr('cy', (p) => toScreen(view, p)[1]);

  // Rotate handle above the selected shape.
  const chosen = selection?.kind === 'shape' && rotatable ? doc.shapes[selection.index] : undefined;
  const handle = chosen ? handleFor(view, chosen) : null;
  const h = overlay.selectAll('g.rotate').data(handle ? [handle] : []).join((enter) => {
    const g = enter.append('g').attr('class', 'rotate');
    g.append('line');
    g.append('circle').attr('class', 'pivot').attr('r', 2.5);
    g.append('circle').attr('class', 'knob').attr('r', 7).attr('data-hit', 'rotate').attr('data-testid', 'rotate-handle').append('title').text('Drag to turn (snaps to 5°, Alt for free)');
    return g;
  });
  h.select('line').attr('x1', (d) => d.top[0]).attr('y1', (d) => d.top[1]).attr('x2', (d) => d.knob[0]).attr('y2', (d) => d.knob[1]);
  h.select('circle.pivot').attr('cx', (d) => d.pivot[0]).attr('cy', (d) => d.pivot[1]);
  h.select('circle.knob').attr('cx', (d) => d.knob[0]).attr('cy', (d) => d.knob[1]);

  // Problem markers.
  const marks = problems.map((p, k) => ({ p, k })).filter((m) => m.p.at);
  const mk = overlay.selectAll<SVGGElement, { p: DesignProblem; k: number }>('g.problem').data(marks).join((enter) => {
    const g = enter.append('g');
    g.append('circle').attr('r', 9);
    g.append('text').attr('dy', '0.35em').text('!');
    g.append('title');
    return g;
  });
  mk.attr('class', (m) => `problem ${m.p.severity}`)
    .attr('data-hit', (m) => `problem:${m.k}`)
    .attr('data-testid', 'problem-marker')
    .attr('transform', (m) => {
      const s = toScreen(view, m.p.at!);
      return `translate(${s[0]},${s[1]})`;
    });
  mk.select('title').text((m) => m.p.message);
}

/** Where the rotate handle of a shape goes (px): the pivot, the top middle of its bounds and the knob above. */
function handleFor(view: View, shape: Shape): { pivot: Vec; top: Vec; knob: Vec } {
  const b = shapeBounds(shape);
  const pivot = toScreen(view, shapePivot(shape));
  const top = toScreen(view, [(b[0] + b[2]) / 2, b[3]]);
  return { pivot, top, knob: [top[0], top[1] - 28] };
}
