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
import type { DesignDocument, DesignProblem } from '../../../../shared/design';
import { hitOf, type CanvasPointer, type DragMode, type Selection, type SketchPreview } from './canvas-pointer';
import { centredView, fitView, layoutBounds, plotCentre, toScreen as viewToScreen, toWorld as viewToWorld, type View } from './canvas-view';
import { drawFrame } from './draw-frame';
import { drawMarks } from './draw-marks';
import { drawWorld } from './draw-world';
import type { Bounds } from './shape-transform';
import { UM } from './sketch-path';
import { snapPoint, snapStep } from './snap';
import type { Vec } from './tool-geometry';

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
    return viewToScreen(this.transform(), p);
  }

  /** Screen pixels → metres. */
  toWorld(s: readonly [number, number]): Vec {
    return viewToWorld(this.transform(), s);
  }

  /** Zooms to show the whole layout (or a default 1 mm view when it is empty). */
  fit(): void {
    const doc = this.document();
    this.fittedDocument = doc;
    this.fitBounds(layoutBounds(doc) ?? [-1e-4, -1e-4, 1e-3, 6e-4]);
  }

  fitBounds(b: Bounds): void {
    this.applyTransform(fitView(b, this.size()));
  }

  /** Pans so that the point (m) is in the middle, keeping the zoom. */
  centreOn(p: readonly [number, number]): void {
    if (!this.zoom) return;
    this.applyTransform(centredView(p, this.transform().k, this.size()));
  }

  zoomBy(factor: number): void {
    if (!this.zoom) return;
    d3.select(this.svgRef().nativeElement).call(this.zoom.scaleBy, factor);
  }

  private applyTransform(view: View): void {
    const t = d3.zoomIdentity.translate(view.x, view.y).scale(view.k);
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
      const centre = this.toWorld(plotCentre(before));
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


  // ---------------------------------------------------------------- drawing

  private renderWorld(): void {
    const content = { doc: this.document(), selection: this.selection(), preview: this.preview(), outline: this.outline() };
    const world = d3.select(this.svgRef().nativeElement).select<SVGGElement>('g.world');
    if (world.empty()) return;
    drawWorld(world, content);
  }

  private renderOverlay(): void {
    const view = this.transform();
    const size = this.size();
    const content = { doc: this.document(), selection: this.selection(), problems: this.problems(), preview: this.preview(), outline: this.outline(), rotatable: this.rotatable() };
    const svg = d3.select(this.svgRef().nativeElement);
    const overlay = svg.select<SVGGElement>('g.overlay');
    if (overlay.empty()) return;
    drawFrame(svg, view, size);
    drawMarks(overlay, view, content);
  }
}
