import { ChangeDetectionStrategy, Component, ElementRef, afterRenderEffect, computed, input, output, signal, viewChild } from '@angular/core';
import type { SolveFields } from '../../../../shared/result';
import { hostSize } from '../../ui/host-size';
import type { ColourRange } from '../fields/field-maps';
import type { MapPort } from '../fields/field-map';
import type { Vec } from '../fields/field-sampling';
import { drawFieldImage, fieldCanvas, prepareCanvas, ringsClip } from '../fields/map-canvas';
import { fitView, ringsBounds, toScreen, toWorld } from '../fields/map-view';

export type DrawMode = 'line' | 'region' | 'detector' | null;

const MARGIN = 20;

/**
 * The Tracer's map: the layout fitted to the box, the speed of the phase shown (the shared colour map) or the plain
 * fluid before a run, the injection (line or region) and the detector, the particles of one frame, and drawing:
 * in a draw mode a drag gives a line (injection, detector) or a rectangle (region).
 */
@Component({
  selector: 'osm-tracer-map',
  template: `
    <canvas #base aria-hidden="true"></canvas>
    <canvas #dots aria-hidden="true"></canvas>
    <svg #svg [attr.width]="size().w" [attr.height]="size().h" [class.drawing]="drawMode() !== null" role="img" [attr.aria-label]="ariaLabel()"
      (pointerdown)="onDown($event)" (pointermove)="onMove($event)" (pointerup)="onUp($event)" data-testid="tracer-map-svg">
      <path class="outline" [attr.d]="outlinePath()" data-testid="tracer-outline" />
      @for (p of portMarks(); track p.id) {
        <line class="port" [attr.x1]="p.x1" [attr.y1]="p.y1" [attr.x2]="p.x2" [attr.y2]="p.y2" />
        <text class="label" [attr.x]="p.lx" [attr.y]="p.ly" text-anchor="middle" dominant-baseline="central">{{ p.id }}</text>
      }
      @if (injectionMark(); as m) {
        @if (m.kind === 'line') {
          <line class="inject" [attr.x1]="m.x1" [attr.y1]="m.y1" [attr.x2]="m.x2" [attr.y2]="m.y2" data-testid="tracer-injection" />
        } @else {
          <polygon class="inject-region" [attr.points]="m.points" data-testid="tracer-injection" />
        }
      }
      @if (detectorMark(); as d) {
        <line class="detector-under" [attr.x1]="d.x1" [attr.y1]="d.y1" [attr.x2]="d.x2" [attr.y2]="d.y2" />
        <line class="detector" [attr.x1]="d.x1" [attr.y1]="d.y1" [attr.x2]="d.x2" [attr.y2]="d.y2" data-testid="tracer-detector" />
        <text class="label" [attr.x]="d.x2 + 6" [attr.y]="d.y2 - 6">detector</text>
      }
      @if (draftMark(); as d) {
        @if (drawMode() === 'region') {
          <rect class="draft" [attr.x]="d.x" [attr.y]="d.y" [attr.width]="d.w" [attr.height]="d.h" />
        } @else {
          <line class="draft" [attr.x1]="d.x1" [attr.y1]="d.y1" [attr.x2]="d.x2" [attr.y2]="d.y2" />
        }
      }
    </svg>
  `,
  styles: `
    :host { display: block; position: relative; overflow: hidden; min-width: 0; background: var(--mat-sys-surface-container-low);
      border: 1px solid var(--mat-sys-outline-variant); border-radius: 4px; }
    canvas, svg { position: absolute; left: 0; top: 0; }
    svg.drawing { cursor: crosshair; }
    .outline { fill: none; stroke: #262626; stroke-width: 1.25px; stroke-linejoin: round; }
    .port { stroke: var(--mat-sys-tertiary); stroke-width: 4px; }
    .label { font-size: 11px; font-weight: 600; fill: var(--mat-sys-on-surface); paint-order: stroke; stroke: var(--mat-sys-surface); stroke-width: 3px; }
    .inject { stroke: #d7301f; stroke-width: 2.5px; }
    .inject-region { fill: rgba(215, 48, 31, 0.25); stroke: #d7301f; stroke-width: 1.5px; }
    .detector-under { stroke: #fff; stroke-width: 5px; }
    .detector { stroke: #111; stroke-width: 2px; stroke-dasharray: 5 3; }
    .draft { fill: rgba(0, 0, 0, 0.08); stroke: #111; stroke-width: 1.5px; stroke-dasharray: 4 3; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TracerMap {
  readonly outline = input.required<ReadonlyArray<ReadonlyArray<Vec>>>();
  readonly ports = input<ReadonlyArray<MapPort>>([]);
  readonly fields = input<SolveFields | null>(null);
  readonly values = input<Float32Array | null>(null);
  readonly range = input<ColourRange | null>(null);
  readonly injection = input<{ kind: 'line'; from: Vec; to: Vec } | { kind: 'region'; polygon: ReadonlyArray<Vec> } | null>(null);
  readonly detector = input<{ from: Vec; to: Vec } | null>(null);
  /** x0, y0, x1, y1, ... (m); NaN for particles that left by a port. */
  readonly particles = input<Float32Array | null>(null);
  readonly drawMode = input<DrawMode>(null);
  /** Bounds [x0, y0, x1, y1] (m) to fit instead of the whole layout. */
  readonly focus = input<readonly [number, number, number, number] | null>(null);
  readonly ariaLabel = input('Tracer map');
  /** A finished drag in a draw mode: its two ends (m). */
  readonly drawn = output<{ mode: Exclude<DrawMode, null>; a: Vec; b: Vec }>();

  private readonly baseCanvas = viewChild.required<ElementRef<HTMLCanvasElement>>('base');
  private readonly dotsCanvas = viewChild.required<ElementRef<HTMLCanvasElement>>('dots');
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  protected readonly size = hostSize({ w: 600, h: 320 });
  private readonly draft = signal<[Vec, Vec] | null>(null);

  /** The focus or the layout, fitted to the box. */
  private readonly view = computed(() => {
    const { w, h } = this.size();
    return fitView(this.focus() ?? ringsBounds(this.outline()) ?? [0, 0, 1e-3, 1e-3], w, h, MARGIN);
  });

  private screen(p: Vec): [number, number] {
    return toScreen(this.view(), p);
  }

  protected readonly outlinePath = computed(() =>
    this.outline()
      .map((ring) => ring.map((p, k) => `${k ? 'L' : 'M'}${this.screen(p).map((c) => c.toFixed(1)).join(',')}`).join('') + 'Z')
      .join(''),
  );
  protected readonly portMarks = computed(() =>
    this.ports().map((p) => {
      const [x1, y1] = this.screen(p.from), [x2, y2] = this.screen(p.to);
      const len = Math.hypot(x2 - x1, y2 - y1) || 1;
      // Label beside the port, on the side of the drawing's outside (away from the box centre).
      const { w, h } = this.size();
      let nx = -(y2 - y1) / len, ny = (x2 - x1) / len;
      const mx = (x1 + x2) / 2, my = (y1 + y2) / 2;
      if ((mx - w / 2) * nx + (my - h / 2) * ny < 0) [nx, ny] = [-nx, -ny];
      return { id: p.id, x1, y1, x2, y2, lx: mx + nx * 11, ly: my + ny * 11 };
    }),
  );
  protected readonly injectionMark = computed(() => {
    const inj = this.injection();
    if (!inj) return null;
    if (inj.kind === 'line') {
      const [x1, y1] = this.screen(inj.from), [x2, y2] = this.screen(inj.to);
      return { kind: 'line' as const, x1, y1, x2, y2 };
    }
    return { kind: 'region' as const, points: inj.polygon.map((p) => this.screen(p).join(',')).join(' ') };
  });
  protected readonly detectorMark = computed(() => {
    const d = this.detector();
    if (!d) return null;
    const [x1, y1] = this.screen(d.from), [x2, y2] = this.screen(d.to);
    return { x1, y1, x2, y2 };
  });
  protected readonly draftMark = computed(() => {
    const d = this.draft();
    if (!d) return null;
    const [x1, y1] = this.screen(d[0]), [x2, y2] = this.screen(d[1]);
    return { x1, y1, x2, y2, x: Math.min(x1, x2), y: Math.min(y1, y2), w: Math.abs(x2 - x1), h: Math.abs(y2 - y1) };
  });

  private readonly image = computed(() => {
    const f = this.fields(), v = this.values(), r = this.range();
    return f && v && r ? fieldCanvas(f, v, r) : null;
  });

  constructor() {
    afterRenderEffect(() => this.drawBase());
    afterRenderEffect(() => this.drawDots());
  }

  private drawBase(): void {
    const { w, h } = this.size();
    const ctx = prepareCanvas(this.baseCanvas().nativeElement, w, h);
    const image = this.image(), f = this.fields(), v = this.view();
    if (!ctx) return;
    ctx.save();
    ctx.clip(ringsClip(this.outline(), v), 'evenodd');
    if (image && f) {
      drawFieldImage(ctx, image, f, v);
    } else {
      ctx.fillStyle = '#e4ebea';
      ctx.fillRect(0, 0, w, h);
    }
    ctx.restore();
  }

  private drawDots(): void {
    const { w, h } = this.size();
    const ctx = prepareCanvas(this.dotsCanvas().nativeElement, w, h);
    const pts = this.particles();
    if (!ctx || !pts) return;
    const { k, x: ox, y: oy } = this.view();
    ctx.fillStyle = 'rgba(255, 255, 255, 0.95)';
    ctx.strokeStyle = 'rgba(20, 20, 20, 0.7)';
    ctx.lineWidth = 0.6;
    ctx.beginPath();
    for (let i = 0; i < pts.length; i += 2) {
      const x = pts[i];
      if (x !== x) continue;
      const X = ox + k * x, Y = oy - k * pts[i + 1];
      ctx.moveTo(X + 1.7, Y);
      ctx.arc(X, Y, 1.7, 0, 2 * Math.PI);
    }
    ctx.fill();
    ctx.stroke();
  }

  private world(event: PointerEvent): Vec {
    const r = this.svg().nativeElement.getBoundingClientRect();
    return toWorld(this.view(), event.clientX - r.left, event.clientY - r.top);
  }

  protected onDown(event: PointerEvent): void {
    if (!this.drawMode() || event.button !== 0) return;
    event.preventDefault();
    this.svg().nativeElement.setPointerCapture?.(event.pointerId);
    const p = this.world(event);
    this.draft.set([p, p]);
  }

  protected onMove(event: PointerEvent): void {
    const d = this.draft();
    if (d) this.draft.set([d[0], this.world(event)]);
  }

  protected onUp(event: PointerEvent): void {
    const d = this.draft(), mode = this.drawMode();
    if (!d || !mode) return;
    this.draft.set(null);
    const b = this.world(event);
    const [X1, Y1] = this.screen(d[0]), [X2, Y2] = this.screen(b);
    if (Math.hypot(X2 - X1, Y2 - Y1) >= 4) this.drawn.emit({ mode, a: d[0], b });
  }
}
