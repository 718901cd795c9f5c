import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  ViewEncapsulation,
  afterNextRender,
  afterRenderEffect,
  computed,
  inject,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';
import * as d3 from 'd3';
import type { DesignDocument, DesignProblem, Shape } from '../../../../shared/design';
import { formatQuantity } from '../../ui/units';
import type { Segment } from './port-placement';
import { shapeBounds, shapePivot, unionBounds, type Bounds } from './shape-transform';
import { UM, insideRings, ringsPath, shapePath } from './sketch-path';
import { niceStep, scaleBarLength, snapPoint, snapStep } from './snap';
import type { Vec } from './tool-geometry';

/** What the pointer is over: a shape, a port, the rotate handle or a problem marker (empty space: null). */
export type Hit = { kind: 'shape'; index: number } | { kind: 'port'; index: number } | { kind: 'rotate' } | { kind: 'problem'; index: number };

export type Selection = { kind: 'shape' | 'port'; index: number };

export interface CanvasPointer {
  type: 'down' | 'move' | 'up' | 'click' | 'dblclick' | 'leave';
  /** Where the pointer is (m). */
  world: Vec;
  /** The same point on the snap grid (or as it is while Alt is held). */
  snapped: Vec;
  hit: Hit | null;
  event: MouseEvent;
}

/** What a tool shows while it is being used (m). */
export interface SketchPreview {
  shapes: Shape[];
  points: Vec[];
  /** A rubber-band line from the last point to the pointer. */
  rubber?: [Vec, Vec] | null;
  /** A port that a click would make. */
  segment?: Segment | null;
}

/**
 * Left-button drags: `pan-empty` pans only from empty space (Select moves shapes), `pan-anywhere` pans from
 * anywhere (click tools still get clean clicks), `draw` never pans (Chamber drags a rect). The wheel always zooms
 * and the middle button always pans.
 */
export type DragMode = 'pan-empty' | 'pan-anywhere' | 'draw';

const AXIS_BAND = 22;
const AXIS_LEFT = 52;
const MARGIN = 48;

function hitOf(target: EventTarget | null): Hit | null {
  const el = target instanceof Element ? target.closest('[data-hit]') : null;
  const code = el?.getAttribute('data-hit');
  if (!code) return null;
  const [kind, index] = code.split(':');
  if (kind === 'rotate') return { kind: 'rotate' };
  if (kind === 'shape' || kind === 'port' || kind === 'problem') return { kind, index: Number(index) };
  return null;
}

let nextCanvasId = 0;

/**
 * The drawing surface of the sketch: the layout in an SVG drawn with d3, with pan and zoom, a grid that sets
 * the snap step, axes in micrometres and a scale bar. It draws; the editor decides what pointer events mean.
 */
@Component({
  selector: 'osm-sketch-canvas',
  template: `<svg
    #svg
    class="osm-canvas-svg"
    role="application"
    [attr.aria-label]="label()"
    tabindex="0"
    (pointerdown)="onPointer('down', $event)"
    (pointermove)="onPointer('move', $event)"
    (pointerup)="onPointer('up', $event)"
    (pointerleave)="onPointer('leave', $event)"
    (click)="onPointer('click', $event)"
    (dblclick)="onPointer('dblclick', $event)"
  ></svg>`,
  styleUrl: './sketch-canvas.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'osm-sketch-canvas', '[attr.data-cursor]': 'cursor()', '[attr.data-view]': 'viewText()' },
})
export class SketchCanvas {
  readonly document = input.required<DesignDocument>();
  /** Outline of the fluid (rings in metres), drawn as the wall line. */
  readonly outline = input<ReadonlyArray<ReadonlyArray<Vec>>>([]);
  readonly selection = input<Selection | null>(null);
  readonly preview = input<SketchPreview | null>(null);
  readonly problems = input<ReadonlyArray<DesignProblem>>([]);
  readonly dragMode = input<DragMode>('pan-empty');
  /** Show the rotate handle on a selected shape. */
  readonly rotatable = input(true);
  /** CSS cursor family: select, draw. */
  readonly cursor = input<'select' | 'draw'>('select');
  readonly label = input('Layout drawing');

  readonly pointer = output<CanvasPointer>();

  private readonly svgRef = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly id = `osm-sketch-${++nextCanvasId}`;
  private readonly size = signal({ width: 800, height: 520 });
  private readonly transform = signal<d3.ZoomTransform>(d3.zoomIdentity);
  private readonly destroyRef = inject(DestroyRef);
  private zoom?: d3.ZoomBehavior<SVGSVGElement, unknown>;
  /** Set once the engineer pans or zooms; until then the view follows the size of the drawing. */
  private userMoved = false;
  /** The document the view was last fitted to. */
  private fittedDocument: DesignDocument | null = null;

  /** Screen pixels per metre at the current zoom. */
  readonly pixelsPerMetre = computed(() => this.transform().k * UM);
  /** The view as "tx ty k" (screen px = t + k · µm, y flipped), for tests that click at layout points. */
  protected readonly viewText = computed(() => {
    const t = this.transform();
    return `${t.x} ${t.y} ${t.k}`;
  });
  /** The snap step (m) for the current zoom; the grid is drawn at this step. */
  readonly snapStep = computed(() => snapStep(this.pixelsPerMetre()));

  constructor() {
    afterNextRender(() => this.setUp());
    afterRenderEffect(() => this.renderWorld());
    afterRenderEffect(() => this.renderOverlay());
    afterRenderEffect(() => {
      const t = this.transform();
      d3.select(this.svgRef().nativeElement).select('g.world').attr('transform', `translate(${t.x},${t.y}) scale(${t.k},${-t.k})`);
    });
  }

  // ---------------------------------------------------------------- coordinates

  /** Metres → screen pixels. */
  toScreen(p: readonly [number, number]): Vec {
    const t = this.transform();
    return [t.x + t.k * p[0] * UM, t.y - t.k * p[1] * UM];
  }

  /** Screen pixels → metres. */
  toWorld(s: readonly [number, number]): Vec {
    const t = this.transform();
    return [(s[0] - t.x) / t.k / UM, (t.y - s[1]) / t.k / UM];
  }

  /** Zooms to show the whole layout (or a default 1 mm view when it is empty). */
  fit(): void {
    const doc = this.document();
    this.fittedDocument = doc;
    const all: Bounds[] = doc.shapes.map(shapeBounds);
    for (const p of doc.ports) all.push([Math.min(p.from[0], p.to[0]), Math.min(p.from[1], p.to[1]), Math.max(p.from[0], p.to[0]), Math.max(p.from[1], p.to[1])]);
    this.fitBounds(unionBounds(all) ?? [-1e-4, -1e-4, 1e-3, 6e-4]);
  }

  fitBounds(b: Bounds): void {
    const { width, height } = this.size();
    const bw = Math.max(b[2] - b[0], 1e-6) * UM, bh = Math.max(b[3] - b[1], 1e-6) * UM;
    const k = Math.min((width - AXIS_LEFT - 2 * MARGIN) / bw, (height - AXIS_BAND - 2 * MARGIN) / bh);
    const cx = ((b[0] + b[2]) / 2) * UM, cy = ((b[1] + b[3]) / 2) * UM;
    const sx = AXIS_LEFT + (width - AXIS_LEFT) / 2, sy = (height - AXIS_BAND) / 2;
    this.applyTransform(d3.zoomIdentity.translate(sx - k * cx, sy + k * cy).scale(k));
  }

  /** Pans so that the point (m) is in the middle, keeping the zoom. */
  centreOn(p: readonly [number, number]): void {
    const { width, height } = this.size();
    if (!this.zoom) return;
    const t = this.transform();
    this.applyTransform(d3.zoomIdentity.translate(AXIS_LEFT + (width - AXIS_LEFT) / 2 - t.k * p[0] * UM, (height - AXIS_BAND) / 2 + t.k * p[1] * UM).scale(t.k));
  }

  zoomBy(factor: number): void {
    if (!this.zoom) return;
    d3.select(this.svgRef().nativeElement).call(this.zoom.scaleBy, factor);
  }

  private applyTransform(t: d3.ZoomTransform): void {
    if (this.zoom) d3.select(this.svgRef().nativeElement).call(this.zoom.transform, t);
    else this.transform.set(t);
  }

  // ---------------------------------------------------------------- set-up

  private setUp(): void {
    const svgEl = this.svgRef().nativeElement;
    const svg = d3.select(svgEl);
    svg.append('rect').attr('class', 'bg').attr('width', '100%').attr('height', '100%');
    svg.append('g').attr('class', 'grid');
    const world = svg.append('g').attr('class', 'world');
    world.append('defs').append('mask').attr('id', `${this.id}-fluid`).attr('maskUnits', 'userSpaceOnUse');
    world.append('rect').attr('class', 'fluid').attr('mask', `url(#${this.id}-fluid)`);
    world.append('g').attr('class', 'zones');
    world.append('path').attr('class', 'outline');
    world.append('g').attr('class', 'shapes');
    world.append('path').attr('class', 'selected');
    world.append('g').attr('class', 'ports');
    world.append('g').attr('class', 'preview');
    svg.append('g').attr('class', 'overlay');
    svg.append('g').attr('class', 'axis x');
    svg.append('g').attr('class', 'axis y');
    svg.append('g').attr('class', 'scale-bar');

    const measure = () => {
      const r = svgEl.getBoundingClientRect();
      const before = this.size();
      if (!(r.width > 0 && r.height > 0) || (r.width === before.width && r.height === before.height)) return;
      const centre = this.toWorld([AXIS_LEFT + (before.width - AXIS_LEFT) / 2, (before.height - AXIS_BAND) / 2]);
      this.size.set({ width: r.width, height: r.height });
      // Until the engineer pans, zooms or edits, the whole layout stays in view as the drawing finds its size;
      // after that a resize keeps the middle of the view where it was.
      if (!this.userMoved && this.document() === this.fittedDocument) this.fit();
      else this.centreOn(centre);
    };
    if (typeof ResizeObserver !== 'undefined') {
      const observer = new ResizeObserver(measure);
      observer.observe(svgEl);
      this.destroyRef.onDestroy(() => observer.disconnect());
    }

    this.zoom = d3
      .zoom<SVGSVGElement, unknown>()
      .scaleExtent([0.002, 5000])
      .extent(() => {
        const { width, height } = this.size();
        return [[0, 0], [width, height]];
      })
      .clickDistance(4)
      .filter((event: MouseEvent & { type: string }) => {
        if (event.type === 'wheel') return true;
        if (event.type === 'dblclick') return false;
        if (event.type.startsWith('touch')) return true;
        if (event.button === 1) return true;
        if (event.button !== 0 || event.ctrlKey) return false;
        const hit = hitOf(event.target);
        if (hit && (hit.kind === 'rotate' || hit.kind === 'problem')) return false;
        const mode = this.dragMode();
        if (mode === 'draw') return false;
        if (mode === 'pan-empty') return hit === null;
        return true;
      })
      .on('zoom', (event: d3.D3ZoomEvent<SVGSVGElement, unknown>) => {
        if (event.sourceEvent) this.userMoved = true;
        this.transform.set(event.transform);
      });
    svg.call(this.zoom).on('dblclick.zoom', null);
    measure();
    this.fit();
  }

  // ---------------------------------------------------------------- events

  protected onPointer(type: CanvasPointer['type'], event: MouseEvent): void {
    const svgEl = this.svgRef().nativeElement;
    const [sx, sy] = d3.pointer(event, svgEl);
    const world = this.toWorld([sx, sy]);
    const snapped = event.altKey ? world : snapPoint(world, this.snapStep());
    if (type === 'down') svgEl.focus({ preventScroll: true });
    this.pointer.emit({ type, world, snapped, hit: hitOf(event.target), event });
  }

  /** Keeps pointer moves coming to the drawing while a drag runs outside it. */
  capture(event: MouseEvent): void {
    const e = event as PointerEvent;
    const svgEl = this.svgRef().nativeElement;
    if (typeof e.pointerId === 'number' && typeof svgEl.setPointerCapture === 'function') {
      try {
        svgEl.setPointerCapture(e.pointerId);
      } catch {
        // the pointer is gone already
      }
    }
  }

  // ---------------------------------------------------------------- drawing (world units: micrometres, y up)

  private renderWorld(): void {
    const doc = this.document();
    const selection = this.selection();
    const preview = this.preview();
    const outline = this.outline();
    const svg = d3.select(this.svgRef().nativeElement);
    const world = svg.select<SVGGElement>('g.world');
    if (world.empty()) return;

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

  // ---------------------------------------------------------------- overlay (screen pixels)

  private renderOverlay(): void {
    const t = this.transform();
    const { width, height } = this.size();
    const doc = this.document();
    const selection = this.selection();
    const problems = this.problems();
    const preview = this.preview();
    const outline = this.outline();
    const rotatable = this.rotatable();
    const svg = d3.select(this.svgRef().nativeElement);
    if (svg.select('g.overlay').empty()) return;
    const step = snapStep(t.k * UM);

    // Visible world range (m).
    const [x0, yTop] = this.toWorld([0, 0]);
    const [x1, yBottom] = this.toWorld([width, height]);

    // Grid: minor lines at the snap step, major lines at the next round length about five steps on.
    const major = niceStep(step * 4.5);
    const lines = (from: number, to: number) => {
      const out: number[] = [];
      const first = Math.ceil(from / step);
      const last = Math.floor(to / step);
      if (last - first > 2000) return out;
      for (let k = first; k <= last; k++) out.push(k * step);
      return out;
    };
    const isMajor = (v: number) => Math.abs(v / major - Math.round(v / major)) < 1e-6;
    const grid = svg.select('g.grid');
    grid
      .selectAll('line.gx')
      .data(lines(x0, x1))
      .join('line')
      .attr('class', (v) => (isMajor(v) ? 'gx major' : 'gx'))
      .attr('x1', (v) => this.toScreen([v, 0])[0])
      .attr('x2', (v) => this.toScreen([v, 0])[0])
      .attr('y1', 0)
      .attr('y2', height);
    grid
      .selectAll('line.gy')
      .data(lines(yBottom, yTop))
      .join('line')
      .attr('class', (v) => (isMajor(v) ? 'gy major' : 'gy'))
      .attr('y1', (v) => this.toScreen([0, v])[1])
      .attr('y2', (v) => this.toScreen([0, v])[1])
      .attr('x1', 0)
      .attr('x2', width);

    const overlay = svg.select('g.overlay');

    // Port ids, on the open side of each port.
    const labels = doc.ports.map((p, k) => {
      const mid: Vec = [(p.from[0] + p.to[0]) / 2, (p.from[1] + p.to[1]) / 2];
      const a = this.toScreen(p.from), b = this.toScreen(p.to);
      const len = Math.hypot(b[0] - a[0], b[1] - a[1]) || 1;
      let nx = -(b[1] - a[1]) / len, ny = (b[0] - a[0]) / len; // a screen normal
      const probe = this.toWorld([this.toScreen(mid)[0] + nx * 4, this.toScreen(mid)[1] + ny * 4]);
      if (outline.length > 0 && insideRings(outline, probe)) {
        nx = -nx;
        ny = -ny;
      }
      const m = this.toScreen(mid);
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
        return this.toScreen([(b[0] + b[2]) / 2, b[3]])[0];
      })
      .attr('y', (z) => this.toScreen([0, shapeBounds(z.region)[3]])[1] - 4)
      .text((z, k) => `zone ${k + 1}: ζ ${formatQuantity(z.zeta, 'potential', { digits: 3 })}`);

    // Points clicked so far.
    overlay
      .selectAll('circle.vertex')
      .data(preview?.points ?? [])
      .join('circle')
      .attr('class', 'vertex')
      .attr('r', 3.5)
      .attr('cx', (p) => this.toScreen(p)[0])
      .attr('cy', (p) => this.toScreen(p)[1]);

    // Rotate handle above the selected shape.
    const chosen = selection?.kind === 'shape' && rotatable ? doc.shapes[selection.index] : undefined;
    const handle = chosen ? this.handleFor(chosen) : null;
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
        const s = this.toScreen(m.p.at!);
        return `translate(${s[0]},${s[1]})`;
      });
    mk.select('title').text((m) => m.p.message);

    // Axes in micrometres along the bottom and the left edge.
    const xs = d3.scaleLinear().domain([x0 * UM, x1 * UM]).range([0, width]);
    const ys = d3.scaleLinear().domain([yTop * UM, yBottom * UM]).range([0, height]);
    const ax = svg.select<SVGGElement>('g.axis.x').attr('transform', `translate(0,${height - AXIS_BAND})`);
    ax.selectAll('rect.band').data([0]).join('rect').attr('class', 'band').attr('width', width).attr('height', AXIS_BAND);
    ax.call(d3.axisBottom(xs).ticks(Math.max(2, Math.floor(width / 90))).tickFormat(d3.format('~g')).tickSizeOuter(0));
    ax.selectAll<SVGGElement, number>('.tick').attr('display', (v) => (xs(v) < AXIS_LEFT + 14 || xs(v) > width - 14 ? 'none' : null));
    const ay = svg.select<SVGGElement>('g.axis.y').attr('transform', `translate(${AXIS_LEFT},0)`);
    ay.selectAll('rect.band').data([0]).join('rect').attr('class', 'band').attr('x', -AXIS_LEFT).attr('width', AXIS_LEFT).attr('height', height);
    ay.call(d3.axisLeft(ys).ticks(Math.max(2, Math.floor(height / 70))).tickFormat(d3.format('~g')).tickSizeOuter(0));
    ay.selectAll<SVGGElement, number>('.tick').attr('display', (v) => (ys(v) < 8 || ys(v) > height - AXIS_BAND - 8 ? 'none' : null));
    // Both axes are in micrometres: the unit sits in the corner where they meet.
    ay.selectAll('text.unit').data([0]).join('text').attr('class', 'unit').attr('x', -AXIS_LEFT / 2).attr('y', height - AXIS_BAND / 2).attr('dy', '0.35em').text('µm');

    // Scale bar, bottom left above the axis.
    const barLength = scaleBarLength(t.k * UM, 110);
    const barPx = barLength * t.k * UM;
    const bar = svg.select('g.scale-bar').attr('transform', `translate(${AXIS_LEFT + 16},${height - AXIS_BAND - 14})`);
    bar.selectAll('path').data([0]).join('path').attr('d', `M0,-5V0H${barPx}V-5`);
    bar.selectAll('text').data([0]).join('text').attr('x', barPx / 2).attr('y', -8).text(formatQuantity(barLength, 'length', { digits: 3 }));
  }

  private handleFor(shape: Shape): { pivot: Vec; top: Vec; knob: Vec } {
    const b = shapeBounds(shape);
    const pivot = this.toScreen(shapePivot(shape));
    const top = this.toScreen([(b[0] + b[2]) / 2, b[3]]);
    return { pivot, top, knob: [top[0], top[1] - 28] };
  }
}
