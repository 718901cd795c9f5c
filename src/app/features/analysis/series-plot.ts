import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, afterNextRender, computed, inject, input, signal } from '@angular/core';
import * as d3 from 'd3';
import type { Dimension } from '../../ui/units';
import { rangeTicks } from '../fields/colour-bar-ticks';

import type { PlotSeries } from './plot-series';

export type { PlotSeries } from './plot-series';

const M = { left: 50, right: 14, top: 8, bottom: 36 };

/**
 * Several series over one x axis, both axes with round ticks in one display unit each (the app's unit
 * formatter), a legend, a dashed zero line when the values change sign. Used by Compare, Double layer and
 * the Tracer's band variance.
 */
@Component({
  selector: 'osm-series-plot',
  template: `
    @if (series().length > 1) {
      <div class="legend" aria-hidden="true">
        @for (p of paths(); track p.label) {
          <span class="key"><svg width="20" height="8"><line [class]="'line tone-' + p.tone" [class.dashed]="p.dashed" x1="0" x2="20" y1="4" y2="4" /></svg>{{ p.label }}</span>
        }
      </div>
    }
    <svg [attr.width]="width()" [attr.height]="svgHeight()" role="img" [attr.aria-label]="ariaLabel()">
      <g [attr.transform]="'translate(' + left() + ',' + m.top + ')'">
        @for (t of yTicks().ticks; track t.value) {
          <line class="grid" x1="0" [attr.x2]="innerW()" [attr.y1]="y()(t.value)" [attr.y2]="y()(t.value)" />
          <text class="tick" x="-6" [attr.y]="y()(t.value)" text-anchor="end" dominant-baseline="central">{{ t.label }}</text>
        }
        @for (t of xTicks().ticks; track t.value) {
          <line class="tickmark" [attr.x1]="x()(t.value)" [attr.x2]="x()(t.value)" [attr.y1]="innerH()" [attr.y2]="innerH() + 4" />
          <text class="tick" [attr.x]="x()(t.value)" [attr.y]="innerH() + 15" text-anchor="middle">{{ t.label }}</text>
        }
        <line class="axis" x1="0" [attr.x2]="innerW()" [attr.y1]="innerH()" [attr.y2]="innerH()" />
        <line class="axis" x1="0" x2="0" y1="0" [attr.y2]="innerH()" />
        @if (zeroY(); as z) {
          <line class="zero" x1="0" [attr.x2]="innerW()" [attr.y1]="z" [attr.y2]="z" />
        }
        @for (p of paths(); track p.label) {
          <path class="line" [class]="'line tone-' + p.tone" [class.dashed]="p.dashed" [attr.d]="p.d" [attr.data-series]="p.label" />
        }
        <text class="label" [attr.x]="innerW()" [attr.y]="innerH() + 31" text-anchor="end">{{ xTitle() }}{{ xTicks().unit ? ' (' + xTicks().unit + ')' : '' }}</text>
        <text class="label" [attr.transform]="'translate(' + (12 - left()) + ',' + innerH() / 2 + ') rotate(-90)'" text-anchor="middle">
          {{ yTitle() }}{{ yTicks().unit ? ' (' + yTicks().unit + ')' : '' }}
        </text>
      </g>
    </svg>
  `,
  styles: `
    :host { display: block; min-width: 0; }
    svg { display: block; font-size: 11px; }
    .grid { stroke: var(--mat-sys-outline-variant); stroke-width: 1; }
    .zero { stroke: var(--mat-sys-outline); stroke-dasharray: 3 3; }
    .axis, .tickmark { stroke: var(--mat-sys-on-surface-variant); }
    .tick { fill: var(--mat-sys-on-surface-variant); font-variant-numeric: tabular-nums; }
    .label { fill: var(--mat-sys-on-surface); }
    .line { fill: none; stroke-width: 1.75px; stroke-linejoin: round; }
    .line.dashed { stroke-dasharray: 6 3; }
    .tone-primary { stroke: var(--mat-sys-primary); }
    .tone-tertiary { stroke: var(--mat-sys-tertiary); }
    .tone-secondary { stroke: var(--mat-sys-secondary); }
    .tone-neutral { stroke: var(--mat-sys-on-surface-variant); }
    .legend { display: flex; flex-wrap: wrap; gap: 2px 14px; justify-content: flex-end; font-size: 11px; height: 18px; }
    .key { display: inline-flex; align-items: center; gap: 5px; white-space: nowrap; }
    .key svg { display: inline; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SeriesPlot {
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  readonly series = input.required<ReadonlyArray<PlotSeries>>();
  readonly xTitle = input.required<string>();
  readonly xDimension = input.required<Dimension>();
  readonly yTitle = input.required<string>();
  readonly yDimension = input.required<Dimension>();
  readonly height = input(200);
  /** Start the y axis at zero (magnitudes). */
  readonly yFromZero = input(false);

  protected readonly m = M;
  protected readonly width = signal(480);
  /** Room for the y tick labels (about 6.2 px a character) and the axis title. */
  protected readonly left = computed(() => Math.max(M.left, 30 + 6.2 * Math.max(0, ...this.yTicks().ticks.map((t) => t.label.length))));
  protected readonly innerW = computed(() => Math.max(40, this.width() - this.left() - M.right));
  /** The whole height less the legend's row above the plot. */
  protected readonly svgHeight = computed(() => this.height() - (this.series().length > 1 ? 18 : 0));
  protected readonly innerH = computed(() => Math.max(40, this.svgHeight() - M.top - M.bottom));
  protected readonly ariaLabel = computed(() => `${this.yTitle()} against ${this.xTitle()}: ${this.series().map((s) => s.label).join(', ')}`);

  private readonly extents = computed(() => {
    let x0 = Infinity, x1 = -Infinity, y0 = Infinity, y1 = -Infinity;
    for (const s of this.series()) {
      for (let k = 0; k < s.x.length; k++) {
        const x = s.x[k], y = s.y[k];
        if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
        x0 = Math.min(x0, x); x1 = Math.max(x1, x); y0 = Math.min(y0, y); y1 = Math.max(y1, y);
      }
    }
    if (!Number.isFinite(x0)) return { x: [0, 1], y: [0, 1] };
    if (this.yFromZero()) y0 = Math.min(0, y0);
    const pad = (lo: number, hi: number) => (hi > lo ? [lo, hi] : [lo - (Math.abs(lo) * 0.05 || 1e-12), hi + (Math.abs(hi) * 0.05 || 1e-12)]);
    return { x: pad(x0, x1), y: pad(y0, y1) };
  });

  protected readonly x = computed(() => d3.scaleLinear().domain(this.extents().x).range([0, this.innerW()]));
  /** The y scale's domain alone (its ticks set the left margin, which sets the x range: no cycle). */
  private readonly yDomain = computed(() => d3.scaleLinear().domain(this.extents().y).nice(5).domain());
  protected readonly y = computed(() => d3.scaleLinear().domain(this.yDomain()).range([this.innerH(), 0]));
  protected readonly xTicks = computed(() => {
    const [lo, hi] = this.x().domain();
    return rangeTicks(lo, hi, this.xDimension(), Math.max(2, Math.round(this.innerW() / 90)));
  });
  protected readonly yTicks = computed(() => {
    const [lo, hi] = this.yDomain();
    return rangeTicks(lo, hi, this.yDimension(), 4);
  });
  protected readonly zeroY = computed(() => {
    const [lo, hi] = this.y().domain();
    return lo < 0 && hi > 0 ? this.y()(0) : null;
  });
  protected readonly paths = computed(() => {
    const x = this.x(), y = this.y();
    const tones = ['primary', 'tertiary', 'secondary', 'neutral'] as const;
    return this.series().map((s, k) => {
      const pts = Array.from({ length: s.x.length }, (_, i) => [s.x[i], s.y[i]] as [number, number]);
      const d = d3
        .line<[number, number]>()
        .defined((q) => Number.isFinite(q[0]) && Number.isFinite(q[1]))
        .x((q) => x(q[0]))
        .y((q) => y(q[1]))(pts);
      return { label: s.label, tone: s.tone ?? tones[k % tones.length], dashed: !!s.dashed, d: d ?? '' };
    });
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
