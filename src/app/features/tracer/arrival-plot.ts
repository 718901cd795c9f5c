import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, afterNextRender, computed, inject, input, signal } from '@angular/core';
import * as d3 from 'd3';
import { rangeTicks } from '../fields/colour-bar-ticks';
import type { Histogram } from './tracer-model';

const M = { left: 46, right: 12, top: 10, bottom: 36 };

/** The arrival-time curve at the detector: a histogram of arrivals over time, with the mean marked. */
@Component({
  selector: 'osm-arrival-plot',
  template: `
    <svg [attr.width]="width()" [attr.height]="height()" role="img" aria-label="Arrival times at the detector">
      <g [attr.transform]="'translate(' + m.left + ',' + m.top + ')'">
        @for (t of yTicks(); track t) {
          <line class="grid" x1="0" [attr.x2]="innerW()" [attr.y1]="y()(t)" [attr.y2]="y()(t)" />
          <text class="tick" x="-6" [attr.y]="y()(t)" text-anchor="end" dominant-baseline="central">{{ t }}</text>
        }
        @for (b of bars(); track $index) {
          <rect class="bar" [attr.x]="b.x" [attr.y]="b.y" [attr.width]="b.w" [attr.height]="b.h" />
        }
        @for (t of xTicks().ticks; track t.value) {
          <line class="tickmark" [attr.x1]="x()(t.value)" [attr.x2]="x()(t.value)" [attr.y1]="innerH()" [attr.y2]="innerH() + 4" />
          <text class="tick" [attr.x]="x()(t.value)" [attr.y]="innerH() + 15" text-anchor="middle">{{ t.label }}</text>
        }
        <line class="axis" x1="0" [attr.x2]="innerW()" [attr.y1]="innerH()" [attr.y2]="innerH()" />
        <line class="axis" x1="0" x2="0" y1="0" [attr.y2]="innerH()" />
        @if (meanX(); as mx) {
          <line class="mean" [attr.x1]="mx" [attr.x2]="mx" y1="0" [attr.y2]="innerH()" />
          <text class="mean-label" [attr.x]="mx + 4" y="10">mean</text>
        }
        <text class="label" [attr.x]="innerW()" [attr.y]="innerH() + 31" text-anchor="end">arrival time ({{ xTicks().unit }})</text>
        <text class="label" [attr.transform]="'translate(' + (-m.left + 11) + ',' + innerH() / 2 + ') rotate(-90)'" text-anchor="middle">particles</text>
      </g>
    </svg>
  `,
  styles: `
    :host { display: block; min-width: 0; }
    svg { display: block; font-size: 11px; }
    .grid { stroke: var(--mat-sys-outline-variant); }
    .axis, .tickmark { stroke: var(--mat-sys-on-surface-variant); }
    .tick { fill: var(--mat-sys-on-surface-variant); font-variant-numeric: tabular-nums; }
    .label { fill: var(--mat-sys-on-surface); }
    .bar { fill: var(--mat-sys-primary); opacity: 0.85; }
    .mean { stroke: var(--mat-sys-tertiary); stroke-width: 2px; stroke-dasharray: 4 3; }
    .mean-label { fill: var(--mat-sys-on-surface); font-size: 10px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ArrivalPlot {
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  readonly histogram = input.required<Histogram>();
  readonly mean = input<number | null>(null);
  readonly height = input(200);

  protected readonly m = M;
  protected readonly width = signal(420);
  protected readonly innerW = computed(() => Math.max(40, this.width() - M.left - M.right));
  protected readonly innerH = computed(() => Math.max(40, this.height() - M.top - M.bottom));
  private readonly domain = computed<[number, number]>(() => {
    const e = this.histogram().edges;
    return e.length ? [e[0], e[e.length - 1]] : [0, 1];
  });
  protected readonly x = computed(() => d3.scaleLinear().domain(this.domain()).range([0, this.innerW()]));
  protected readonly y = computed(() => d3.scaleLinear().domain([0, Math.max(1, ...this.histogram().counts)]).nice(4).range([this.innerH(), 0]));
  protected readonly xTicks = computed(() => rangeTicks(this.domain()[0], this.domain()[1], 'time', Math.max(2, Math.round(this.innerW() / 80))));
  protected readonly yTicks = computed(() => this.y().ticks(4).filter((t) => Number.isInteger(t)));
  protected readonly bars = computed(() => {
    const h = this.histogram(), x = this.x(), y = this.y();
    return h.counts.map((c, k) => {
      const x0 = x(h.edges[k]), x1 = x(h.edges[k + 1]);
      return { x: x0 + 0.5, w: Math.max(0.5, x1 - x0 - 1), y: y(c), h: this.innerH() - y(c) };
    });
  });
  protected readonly meanX = computed(() => {
    const t = this.mean();
    return t === null || !Number.isFinite(t) ? null : this.x()(t);
  });

  constructor() {
    const destroyRef = inject(DestroyRef);
    afterNextRender(() => {
      const el = this.host.nativeElement;
      const measure = () => {
        const w = Math.floor(el.getBoundingClientRect().width);
        if (w > 0) this.width.set(w);
      };
      measure();
      if (typeof ResizeObserver !== 'undefined') {
        const ro = new ResizeObserver(measure);
        ro.observe(el);
        destroyRef.onDestroy(() => ro.disconnect());
      }
    });
  }
}
