import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import * as d3 from 'd3';
import type { Dimension } from '../../ui/units';
import { plotArea } from '../analysis/plot-area';
import { PlotFrame } from '../analysis/plot-frame';
import { linePath } from '../analysis/plot-line';
import { rangeTicks } from './colour-bar-ticks';
import type { LineProfile } from './field-sampling';

const M = { left: 58, right: 12, top: 10, bottom: 34 };

/** A profile along a cut line: distance from end a on x, the quantity on y, both with units; gaps off the fluid. */
@Component({
  selector: 'osm-profile-plot',
  imports: [PlotFrame],
  template: `
    <svg [attr.width]="area.width()" [attr.height]="height()" role="img" [attr.aria-label]="title() + ' along the cut line'">
      <g [attr.transform]="'translate(' + m.left + ',' + m.top + ')'" osmPlotFrame [x]="x()" [y]="y()" [xTicks]="xTicks().ticks" [yTicks]="yTicks().ticks">
        <path class="line" [attr.d]="path()" data-testid="profile-line" />
        <text class="label" [attr.x]="area.innerW()" [attr.y]="area.innerH() + 29" text-anchor="end">distance from a ({{ xTicks().unit }})</text>
        <text class="label" [attr.transform]="'translate(' + (-m.left + 11) + ',' + area.innerH() / 2 + ') rotate(-90)'" text-anchor="middle">
          {{ title() }} ({{ yTicks().unit }})
        </text>
      </g>
    </svg>
  `,
  styleUrl: '../analysis/plot.css',
  styles: `
    .line { fill: none; stroke: var(--mat-sys-primary); stroke-width: 1.75px; stroke-linejoin: round; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProfilePlot {
  readonly profile = input.required<LineProfile>();
  readonly title = input.required<string>();
  readonly dimension = input.required<Dimension>();
  readonly height = input(190);
  /** Start the y axis at zero (magnitudes). */
  readonly fromZero = input(false);

  protected readonly m = M;
  protected readonly area = plotArea(M, 600, () => this.height());

  /**
   * The y range: from zero for magnitudes (a plug profile then reads as flat, as it is); otherwise the values'
   * range, widened to at least a thousandth of their size so rounding noise is not blown up into a shape.
   */
  private readonly extent = computed<[number, number]>(() => {
    let lo = Infinity, hi = -Infinity;
    for (const v of this.profile().values) if (Number.isFinite(v)) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
    if (!Number.isFinite(lo)) return [0, 1];
    if (this.fromZero()) {
      lo = Math.min(0, lo);
      hi = Math.max(0, hi);
    }
    const least = Math.max(Math.abs(lo), Math.abs(hi)) * 1e-3 || 1e-12;
    if (hi - lo < least) {
      const mid = (hi + lo) / 2;
      return [mid - least / 2, mid + least / 2];
    }
    return [lo, hi];
  });

  protected readonly x = computed(() => d3.scaleLinear().domain([0, this.profile().length || 1]).range([0, this.area.innerW()]));
  protected readonly y = computed(() => d3.scaleLinear().domain(this.extent()).nice(5).range([this.area.innerH(), 0]));
  protected readonly xTicks = computed(() => rangeTicks(0, this.profile().length, 'length', Math.max(2, Math.round(this.area.innerW() / 90))));
  protected readonly yTicks = computed(() => {
    const [lo, hi] = this.y().domain();
    return rangeTicks(lo, hi, this.dimension(), 4);
  });
  protected readonly path = computed(() => linePath(this.profile().distance, this.profile().values, this.x(), this.y()));
}
