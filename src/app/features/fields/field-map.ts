import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  afterNextRender,
  afterRenderEffect,
  computed,
  effect,
  input,
  output,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { MatIconButton } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import * as d3 from 'd3';
import type { SolveFields } from '../../../../shared/result';
import { hostSize } from '../../ui/host-size';
import { formatLength, scaleBarLength } from '../../ui/layout-geometry';
import type { ColourRange } from './field-maps';
import { insideFluid, type Vec } from './field-sampling';
import { drawFieldImage, fieldCanvas, prepareCanvas, ringsClip } from './map-canvas';
import { fitView, ringsBounds, toScreen, toWorld, type Bounds, type MapView } from './map-view';
import { traceStreamlines } from './streamlines';

/** A port drawn on the map: its cap as a segment (m). */
export interface MapPort {
  id: string;
  from: Vec;
  to: Vec;
}

/** A numbered point on the map (a warning with a place). */
export interface MapMarker {
  at: Vec;
  label: string;
  title: string;
}

export type CutLine = readonly [Vec, Vec];

/** Room around the fitted layout for port labels (px). */
const MARGIN = 30;
/** Lines this far apart on screen (px) at the current zoom. */
const STREAMLINE_PX = 16;
const ARROW_PX = 34;
const UM = 1e6;

/**
 * One field map: the values as an image on a canvas (one pixel a cell, clipped to the fluid outline), and over
 * it in SVG the outline, ports, streamlines, arrows, the cut line, the hover mark and a scale bar. Wheel zooms,
 * dragging pans (or draws the cut line in cut mode); the buttons fit, zoom in and out from the keyboard.
 */
@Component({
  selector: 'osm-field-map',
  imports: [MatIconModule, MatIconButton, MatTooltipModule],
  template: `
    <canvas #canvas aria-hidden="true"></canvas>
    <svg
      #svg
      [attr.width]="size().w"
      [attr.height]="size().h"
      [class.cutting]="cutMode()"
      role="img"
      [attr.aria-label]="ariaLabel()"
      data-testid="field-map-svg"
      (pointermove)="onMove($event)"
      (pointerleave)="onLeave()"
      (pointerdown)="onDown($event)"
      (pointerup)="onUp($event)"
    >
      <g [attr.transform]="worldTransform()">
        @if (streamlines()) {
          <path class="stream-under" [attr.d]="streamlinePath()" />
          <path class="stream" [attr.d]="streamlinePath()" data-testid="streamlines" />
        }
        <path class="outline" [attr.d]="outlinePath()" data-testid="map-outline" />
      </g>
      @if (arrows()) {
        <path class="arrows-under" [attr.d]="arrowPath()" />
        <path class="arrows" [attr.d]="arrowPath()" data-testid="arrows" />
      }
      @for (p of portMarks(); track p.id) {
        <line class="port" [attr.x1]="p.x1" [attr.y1]="p.y1" [attr.x2]="p.x2" [attr.y2]="p.y2" />
        <text class="port-label" [attr.x]="p.lx" [attr.y]="p.ly" text-anchor="middle" dominant-baseline="central">{{ p.id }}</text>
      }
      @for (m of markerMarks(); track $index) {
        <g class="marker" [attr.transform]="'translate(' + m.x + ',' + m.y + ')'">
          <title>{{ m.title }}</title>
          <circle r="8" />
          <text text-anchor="middle" dominant-baseline="central">{{ m.label }}</text>
        </g>
      }
      @if (cutMark(); as c) {
        <line class="cut-under" [attr.x1]="c.x1" [attr.y1]="c.y1" [attr.x2]="c.x2" [attr.y2]="c.y2" />
        <line class="cut" [attr.x1]="c.x1" [attr.y1]="c.y1" [attr.x2]="c.x2" [attr.y2]="c.y2" data-testid="cut-line" />
        <circle class="cut-end" [attr.cx]="c.x1" [attr.cy]="c.y1" r="3.5" />
        <text class="cut-label" [attr.x]="c.x1 - 8" [attr.y]="c.y1 - 8" text-anchor="middle">a</text>
        <circle class="cut-end" [attr.cx]="c.x2" [attr.cy]="c.y2" r="3.5" />
        <text class="cut-label" [attr.x]="c.x2 + 8" [attr.y]="c.y2 - 8" text-anchor="middle">b</text>
      }
      @if (probeMark(); as p) {
        <g class="probe" [attr.transform]="'translate(' + p.x + ',' + p.y + ')'">
          <circle r="5" />
          <line x1="-9" x2="-5" /><line x1="5" x2="9" /><line y1="-9" y2="-5" /><line y1="5" y2="9" />
        </g>
      }
      @if (scaleBar(); as s) {
        <g class="scale" [attr.transform]="'translate(' + 12 + ',' + (size().h - 14) + ')'">
          <rect x="-4" y="-17" [attr.width]="s.px + 8" height="24" rx="3" />
          <line x1="0" [attr.x2]="s.px" y1="0" y2="0" />
          <line x1="0" x2="0" y1="-4" y2="4" /><line [attr.x1]="s.px" [attr.x2]="s.px" y1="-4" y2="4" />
          <text [attr.x]="s.px / 2" y="-6" text-anchor="middle">{{ s.label }}</text>
        </g>
      }
    </svg>
    <div class="zoom">
      <button matIconButton type="button" (click)="zoomBy(1.6)" aria-label="Zoom in" matTooltip="Zoom in (or the wheel)"><mat-icon>add</mat-icon></button>
      <button matIconButton type="button" (click)="zoomBy(1 / 1.6)" aria-label="Zoom out" matTooltip="Zoom out"><mat-icon>remove</mat-icon></button>
      <button matIconButton type="button" (click)="fit()" aria-label="Fit the layout" matTooltip="Fit the layout"><mat-icon>fit_screen</mat-icon></button>
    </div>
  `,
  styleUrl: './field-map.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FieldMap {
  readonly fields = input.required<SolveFields>();
  readonly values = input.required<Float32Array>();
  readonly range = input.required<ColourRange>();
  /** The fluid outline as rings (m); masks the image and is drawn on top. */
  readonly outline = input<ReadonlyArray<ReadonlyArray<Vec>>>([]);
  readonly ports = input<ReadonlyArray<MapPort>>([]);
  readonly markers = input<ReadonlyArray<MapMarker>>([]);
  readonly streamlines = input(false);
  readonly arrows = input(false);
  /** Dragging draws the cut line instead of panning. */
  readonly cutMode = input(false);
  readonly cut = input<CutLine | null>(null);
  /** The point the readout describes (m). */
  readonly probe = input<Vec | null>(null);
  readonly ariaLabel = input('Field map');

  /** The pointer's place on the layout (m), or null when it leaves the map. */
  readonly hover = output<Vec | null>();
  readonly cutChange = output<CutLine>();

  private readonly canvas = viewChild.required<ElementRef<HTMLCanvasElement>>('canvas');
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');

  protected readonly size = hostSize({ w: 600, h: 360 });
  private readonly zoomT = signal<d3.ZoomTransform>(d3.zoomIdentity);
  /** The zoom at which the streamlines were traced (they are traced again when it changes a lot). */
  private readonly streamZoom = signal(1);
  private readonly draft = signal<CutLine | null>(null);
  private drawing: Vec | null = null;
  private zoom: d3.ZoomBehavior<SVGSVGElement, unknown> | null = null;

  /** Layout bounds (m): the outline's, or the grid's less its one-cell margin. */
  private readonly bounds = computed<Bounds>(
    () => {
      const f = this.fields();
      return ringsBounds(this.outline()) ?? [f.x0 + f.spacing, f.y0 + f.spacing, f.x0 + (f.nx - 1) * f.spacing, f.y0 + (f.ny - 1) * f.spacing];
    },
    // The same numbers again (a new outline of the same layout) keep the engineer's zoom.
    { equal: (a, b) => a.every((v, k) => v === b[k]) },
  );

  /** The view that fits the layout (zoom 1). */
  private readonly base = computed<MapView>(() => {
    const { w, h } = this.size();
    return fitView(this.bounds(), w, h, MARGIN);
  });

  protected readonly view = computed<MapView>(() => {
    const b = this.base(), t = this.zoomT();
    return { k: b.k * t.k, x: t.x + t.k * b.x, y: t.y + t.k * b.y };
  });

  protected readonly worldTransform = computed(() => {
    const v = this.view();
    return `translate(${v.x},${v.y}) scale(${v.k / UM},${-v.k / UM})`;
  });

  protected readonly outlinePath = computed(() => ringsPathUm(this.outline()));

  private readonly traced = computed(() => {
    if (!this.streamlines()) return [];
    const f = this.fields();
    const k = this.base().k * this.streamZoom();
    return traceStreamlines(f, { separation: Math.max(STREAMLINE_PX / k, 1.5 * f.spacing) });
  });

  protected readonly streamlinePath = computed(() => {
    let d = '';
    for (const line of this.traced()) {
      for (let k = 0; k < line.length; k += 2) d += `${k === 0 ? 'M' : 'L'}${(line[k] * UM).toFixed(2)},${(line[k + 1] * UM).toFixed(2)}`;
    }
    return d;
  });

  /** A robust top speed for arrow lengths (the few fastest cells do not shrink all the others). */
  private readonly arrowSpeed = computed(() => {
    const f = this.fields();
    const speeds: number[] = [];
    for (let c = 0; c < f.velocityX.length; c++) {
      const s = Math.hypot(f.velocityX[c], f.velocityY[c]);
      if (Number.isFinite(s)) speeds.push(s);
    }
    if (speeds.length === 0) return 0;
    speeds.sort((a, b) => a - b);
    return speeds[Math.floor(0.99 * (speeds.length - 1))];
  });

  protected readonly arrowPath = computed(() => {
    if (!this.arrows()) return '';
    const f = this.fields(), v = this.view(), { w, h } = this.size();
    const top = this.arrowSpeed();
    if (!(top > 0)) return '';
    const path = d3.path();
    // One arrow per ARROW_PX square of the screen, at the fluid cell nearest the square's centre, so that channels
    // narrower than the squares still get theirs.
    const cols = Math.ceil(w / ARROW_PX), rows = Math.ceil(h / ARROW_PX);
    const best = new Int32Array(cols * rows).fill(-1);
    const dist = new Float64Array(cols * rows).fill(Infinity);
    const cellPx = f.spacing * v.k;
    // When cells are larger than the squares, every visible cell centre is a candidate anyway.
    const i0 = Math.max(0, Math.floor((-v.x / v.k - f.x0) / f.spacing)), i1 = Math.min(f.nx - 1, Math.ceil(((w - v.x) / v.k - f.x0) / f.spacing));
    const j0 = Math.max(0, Math.floor(((v.y - h) / v.k - f.y0) / f.spacing)), j1 = Math.min(f.ny - 1, Math.ceil((v.y / v.k - f.y0) / f.spacing));
    for (let j = j0; j <= j1; j++) {
      for (let i = i0; i <= i1; i++) {
        const c = i + j * f.nx;
        if (!(f.fraction[c] >= 0.5)) continue;
        const X = v.x + v.k * (f.x0 + (i + 0.5) * f.spacing), Y = v.y - v.k * (f.y0 + (j + 0.5) * f.spacing);
        if (X < 0 || Y < 0 || X >= w || Y >= h) continue;
        const col = Math.floor(X / ARROW_PX), row = Math.floor(Y / ARROW_PX), b = col + row * cols;
        const d = (X - (col + 0.5) * ARROW_PX) ** 2 + (Y - (row + 0.5) * ARROW_PX) ** 2;
        if (d < dist[b]) {
          dist[b] = d;
          best[b] = c;
        }
      }
    }
    const room = Math.max(ARROW_PX - 8, Math.min(cellPx, 2 * ARROW_PX));
    for (const c of best) {
      if (c < 0) continue;
      const i = c % f.nx, j = (c - i) / f.nx;
      const u = f.velocityX[c], vy = f.velocityY[c];
      const speed = Math.hypot(u, vy);
      if (!(speed > top * 0.02)) continue;
      const X = v.x + v.k * (f.x0 + (i + 0.5) * f.spacing), Y = v.y - v.k * (f.y0 + (j + 0.5) * f.spacing);
      // Length grows with speed; never so short that the head hides the direction.
      const len = Math.max(9, Math.min(1, speed / top) * room);
      const dx = (u / speed) * len, dy = (-vy / speed) * len;
      const hx = X + dx / 2, hy = Y + dy / 2;
      path.moveTo(X - dx / 2, Y - dy / 2);
      path.lineTo(hx, hy);
      const head = Math.min(5, 0.45 * len), ux = dx / len, uy = dy / len;
      path.moveTo(hx - head * (ux + 0.55 * uy), hy - head * (uy - 0.55 * ux));
      path.lineTo(hx, hy);
      path.lineTo(hx - head * (ux - 0.55 * uy), hy - head * (uy + 0.55 * ux));
    }
    return path.toString();
  });

  protected readonly portMarks = computed(() => {
    const v = this.view(), f = this.fields(), rings = this.outline();
    return this.ports().map((p) => {
      const [x1, y1] = toScreen(v, p.from), [x2, y2] = toScreen(v, p.to);
      const mx = (p.from[0] + p.to[0]) / 2, my = (p.from[1] + p.to[1]) / 2;
      const len = Math.hypot(p.to[0] - p.from[0], p.to[1] - p.from[1]) || 1;
      let nx = -(p.to[1] - p.from[1]) / len, ny = (p.to[0] - p.from[0]) / len;
      // Label on the side away from the fluid.
      const probe = 0.25 * len;
      if (insideFluid(f, [mx + nx * probe, my + ny * probe], rings)) {
        nx = -nx;
        ny = -ny;
      }
      return { id: p.id, x1, y1, x2, y2, lx: (x1 + x2) / 2 + nx * 12, ly: (y1 + y2) / 2 - ny * 12 };
    });
  });

  protected readonly markerMarks = computed(() => {
    const v = this.view();
    return this.markers().map((m) => {
      const [x, y] = toScreen(v, m.at);
      return { x, y, label: m.label, title: m.title };
    });
  });

  protected readonly cutMark = computed(() => {
    const c = this.draft() ?? this.cut();
    if (!c) return null;
    const v = this.view();
    const [x1, y1] = toScreen(v, c[0]), [x2, y2] = toScreen(v, c[1]);
    return { x1, y1, x2, y2 };
  });

  protected readonly probeMark = computed(() => {
    const p = this.probe();
    if (!p) return null;
    const [x, y] = toScreen(this.view(), p);
    return { x, y };
  });

  protected readonly scaleBar = computed(() => {
    const v = this.view(), { w } = this.size();
    const spanUm = (w / v.k) * UM;
    const len = scaleBarLength(spanUm);
    return { px: (len / UM) * v.k, label: formatLength(len) };
  });

  private readonly image = computed(() => fieldCanvas(this.fields(), this.values(), this.range()));

  constructor() {
    afterNextRender(() => {
      const zoom = d3
        .zoom<SVGSVGElement, unknown>()
        .scaleExtent([0.5, 400])
        // The drawing's own size (the SVG's width and height): no layout query of the element.
        .extent(() => {
          const { w, h } = this.size();
          return [[0, 0], [w, h]];
        })
        .filter((event: Event & { button?: number; ctrlKey?: boolean }) => (event.type === 'wheel' || !this.cutMode()) && !event.button)
        .on('zoom', (event: d3.D3ZoomEvent<SVGSVGElement, unknown>) => this.zoomT.set(event.transform))
        .on('end', (event: d3.D3ZoomEvent<SVGSVGElement, unknown>) => {
          const ratio = event.transform.k / this.streamZoom();
          if (ratio > 1.4 || ratio < 1 / 1.4) this.streamZoom.set(event.transform.k);
        });
      d3.select(this.svg().nativeElement).call(zoom).on('dblclick.zoom', null);
      this.zoom = zoom;
    });

    // A new layout (another solve or run) starts fitted.
    effect(() => {
      this.bounds();
      untracked(() => this.fit());
    });

    afterRenderEffect(() => this.draw());
  }

  protected fit(): void {
    this.streamZoom.set(1);
    if (this.zoom) d3.select(this.svg().nativeElement).call(this.zoom.transform, d3.zoomIdentity);
    else this.zoomT.set(d3.zoomIdentity);
  }

  protected zoomBy(factor: number): void {
    if (!this.zoom) return;
    const { w, h } = this.size();
    d3.select(this.svg().nativeElement).call(this.zoom.scaleBy, factor, [w / 2, h / 2]);
    const ratio = this.zoomT().k / this.streamZoom();
    if (ratio > 1.4 || ratio < 1 / 1.4) this.streamZoom.set(this.zoomT().k);
  }

  private draw(): void {
    const { w, h } = this.size();
    const image = this.image();
    const v = this.view(), f = this.fields(), rings = this.outline();
    const ctx = prepareCanvas(this.canvas().nativeElement, w, h);
    if (!ctx || !image) return;
    ctx.save();
    if (rings.length > 0) ctx.clip(ringsClip(rings, v), 'evenodd');
    drawFieldImage(ctx, image, f, v);
    ctx.restore();
  }

  // ---- pointer

  private world(event: MouseEvent): Vec {
    const r = this.svg().nativeElement.getBoundingClientRect();
    return toWorld(this.view(), event.clientX - r.left, event.clientY - r.top);
  }

  protected onMove(event: PointerEvent): void {
    const p = this.world(event);
    if (this.drawing) this.draft.set([this.drawing, p]);
    this.hover.emit(p);
  }

  protected onLeave(): void {
    if (!this.drawing) this.hover.emit(null);
  }

  protected onDown(event: PointerEvent): void {
    if (!this.cutMode() || event.button !== 0) return;
    event.preventDefault();
    this.svg().nativeElement.setPointerCapture?.(event.pointerId);
    this.drawing = this.world(event);
    this.draft.set([this.drawing, this.drawing]);
  }

  protected onUp(event: PointerEvent): void {
    if (!this.drawing) return;
    const line: CutLine = [this.drawing, this.world(event)];
    this.drawing = null;
    this.draft.set(null);
    const v = this.view();
    if (Math.hypot(line[1][0] - line[0][0], line[1][1] - line[0][1]) * v.k >= 4) this.cutChange.emit(line);
  }
}

/** Path data of rings (m) in micrometres. */
function ringsPathUm(rings: ReadonlyArray<ReadonlyArray<Vec>>): string {
  return rings
    .map((ring) => ring.map((p, k) => `${k === 0 ? 'M' : 'L'}${+(p[0] * UM).toFixed(3)},${+(p[1] * UM).toFixed(3)}`).join('') + 'Z')
    .join('');
}
