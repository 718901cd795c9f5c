import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import * as d3 from 'd3';
import { plotArea } from '../analysis/plot-area';
import { PlotFrame } from '../analysis/plot-frame';
import { rangeTicks } from '../fields/colour-bar-ticks';
import type { Histogram } from './tracer-model';

const M = { left: 46, right: 12, top: 10, bottom: 36 };

/** The arrival-time curve at the detector: a histogram of arrivals over time, with the mean marked. */
@Component({
  selector: 'osm-arrival-plot',
  imports: [PlotFrame],
  template: `
    <svg [attr.width]="area.width()" [attr.height]="height()" role="img" aria-label="Arrival times at the detector">
      <g [attr.transform]="'translate(' + m.left + ',' + m.top + ')'" osmPlotFrame [x]="x()" [y]="y()" [xTicks]="xTicks().ticks" [yTicks]="yTicks()">
        <g plotUnderlay>
          @for (b of bars(); track $index) {
            <rect class="bar" [attr.x]="b.x" [attr.y]="b.y" [attr.width]="b.w" [attr.height]="b.h" />
          }
        </g>
        @if (meanX(); as mx) {
          <line class="mean" [attr.x1]="mx" [attr.x2]="mx" y1="0" [attr.y2]="area.innerH()" />
          <text class="mean-label" [attr.x]="mx + 4" y="10">mean</text>
        }
        <text class="label" [attr.x]="area.innerW()" [attr.y]="area.innerH() + 31" text-anchor="end">arrival time ({{ xTicks().unit }})</text>
        <text class="label" [attr.transform]="'translate(' + (-m.left + 11) + ',' + area.innerH() / 2 + ') rotate(-90)'" text-anchor="middle">particles</text>
      </g>
    </svg>
  `,
  styleUrl: '../analysis/plot.css',
  styles: `
    .bar { fill: var(--mat-sys-primary); opacity: 0.85; }
    .mean { stroke: var(--mat-sys-tertiary); stroke-width: 2px; stroke-dasharray: 4 3; }
    .mean-label { fill: var(--mat-sys-on-surface); font-size: 10px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ArrivalPlot {
  readonly histogram = input.required<Histogram>();
  readonly mean = input<number | null>(null);
  readonly height = input(200);

  protected readonly m = M;
  protected readonly area = plotArea(M, 420, () => this.height());
  private readonly domain = computed<[number, number]>(() => {
    const e = this.histogram().edges;
    return e.length ? [e[0], e[e.length - 1]] : [0, 1];
  });
  protected readonly x = computed(() => d3.scaleLinear().domain(this.domain()).range([0, this.area.innerW()]));
  protected readonly y = computed(() => d3.scaleLinear().domain([0, Math.max(1, ...this.histogram().counts)]).nice(4).range([this.area.innerH(), 0]));
  protected readonly xTicks = computed(() => rangeTicks(this.domain()[0], this.domain()[1], 'time', Math.max(2, Math.round(this.area.innerW() / 80))));
  /** Whole numbers of particles. */
  protected readonly yTicks = computed(() =>
    this.y()
      .ticks(4)
      .filter((t) => Number.isInteger(t))
      .map((t) => ({ value: t, label: String(t) })),
  );
  protected readonly bars = computed(() => {
    const h = this.histogram(), x = this.x(), y = this.y();
    return h.counts.map((c, k) => {
      const x0 = x(h.edges[k]), x1 = x(h.edges[k + 1]);
      return { x: x0 + 0.5, w: Math.max(0.5, x1 - x0 - 1), y: y(c), h: this.area.innerH() - y(c) };
    });
  });
  protected readonly meanX = computed(() => {
    const t = this.mean();
    return t === null || !Number.isFinite(t) ? null : this.x()(t);
  });
}
