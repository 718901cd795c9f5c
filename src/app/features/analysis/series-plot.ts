import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import * as d3 from 'd3';
import type { Dimension } from '../../ui/units';
import { rangeTicks } from '../fields/colour-bar-ticks';
import { plotArea } from './plot-area';
import { PlotFrame } from './plot-frame';
import { linePath } from './plot-line';
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
  imports: [PlotFrame],
  template: `
    @if (series().length > 1) {
      <div class="legend" aria-hidden="true">
        @for (p of paths(); track p.label) {
          <span class="key"><svg width="20" height="8"><line [class]="'line tone-' + p.tone" [class.dashed]="p.dashed" x1="0" x2="20" y1="4" y2="4" /></svg>{{ p.label }}</span>
        }
      </div>
    }
    <svg [attr.width]="area.width()" [attr.height]="svgHeight()" role="img" [attr.aria-label]="ariaLabel()">
      <g [attr.transform]="'translate(' + left() + ',' + m.top + ')'" osmPlotFrame [x]="x()" [y]="y()" [xTicks]="xTicks().ticks" [yTicks]="yTicks().ticks">
        @for (p of paths(); track p.label) {
          <path class="line" [class]="'line tone-' + p.tone" [class.dashed]="p.dashed" [attr.d]="p.d" [attr.data-series]="p.label" />
        }
        <text class="label" [attr.x]="area.innerW()" [attr.y]="area.innerH() + 31" text-anchor="end">{{ xTitle() }}{{ xTicks().unit ? ' (' + xTicks().unit + ')' : '' }}</text>
        <text class="label" [attr.transform]="'translate(' + (12 - left()) + ',' + area.innerH() / 2 + ') rotate(-90)'" text-anchor="middle">
          {{ yTitle() }}{{ yTicks().unit ? ' (' + yTicks().unit + ')' : '' }}
        </text>
      </g>
    </svg>
  `,
  styleUrl: './plot.css',
  styles: `
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
  readonly series = input.required<ReadonlyArray<PlotSeries>>();
  readonly xTitle = input.required<string>();
  readonly xDimension = input.required<Dimension>();
  readonly yTitle = input.required<string>();
  readonly yDimension = input.required<Dimension>();
  readonly height = input(200);
  /** Start the y axis at zero (magnitudes). */
  readonly yFromZero = input(false);

  protected readonly m = M;
  protected readonly area = plotArea(M, 480, () => this.svgHeight(), () => this.left());
  /** Room for the y tick labels (about 6.2 px a character) and the axis title. */
  protected readonly left = computed(() => Math.max(M.left, 30 + 6.2 * Math.max(0, ...this.yTicks().ticks.map((t) => t.label.length))));
  /** The whole height less the legend's row above the plot. */
  protected readonly svgHeight = computed(() => this.height() - (this.series().length > 1 ? 18 : 0));
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

  protected readonly x = computed(() => d3.scaleLinear().domain(this.extents().x).range([0, this.area.innerW()]));
  /** The y scale's domain alone (its ticks set the left margin, which sets the x range: no cycle). */
  private readonly yDomain = computed(() => d3.scaleLinear().domain(this.extents().y).nice(5).domain());
  protected readonly y = computed(() => d3.scaleLinear().domain(this.yDomain()).range([this.area.innerH(), 0]));
  protected readonly xTicks = computed(() => {
    const [lo, hi] = this.x().domain();
    return rangeTicks(lo, hi, this.xDimension(), Math.max(2, Math.round(this.area.innerW() / 90)));
  });
  protected readonly yTicks = computed(() => {
    const [lo, hi] = this.yDomain();
    return rangeTicks(lo, hi, this.yDimension(), 4);
  });
  protected readonly paths = computed(() => {
    const x = this.x(), y = this.y();
    const tones = ['primary', 'tertiary', 'secondary', 'neutral'] as const;
    return this.series().map((s, k) => ({
      label: s.label,
      tone: s.tone ?? tones[k % tones.length],
      dashed: !!s.dashed,
      d: linePath(s.x, s.y, x, y),
    }));
  });
}
