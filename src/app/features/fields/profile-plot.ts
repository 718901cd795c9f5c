import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, afterNextRender, computed, inject, input, signal } from '@angular/core';
import * as d3 from 'd3';
import type { Dimension } from '../../ui/units';
import { rangeTicks } from './colour-bar-ticks';
import type { LineProfile } from './field-sampling';

const M = { left: 58, right: 12, top: 10, bottom: 34 };

/** A profile along a cut line: distance from end a on x, the quantity on y, both with units; gaps off the fluid. */
@Component({
  selector: 'osm-profile-plot',
  template: `
    <svg [attr.width]="width()" [attr.height]="height()" role="img" [attr.aria-label]="title() + ' along the cut line'">
      <g [attr.transform]="'translate(' + m.left + ',' + m.top + ')'">
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
        <path class="line" [attr.d]="path()" data-testid="profile-line" />
        <text class="label" [attr.x]="innerW()" [attr.y]="innerH() + 29" text-anchor="end">distance from a ({{ xTicks().unit }})</text>
        <text class="label" [attr.transform]="'translate(' + (-m.left + 11) + ',' + innerH() / 2 + ') rotate(-90)'" text-anchor="middle">
          {{ title() }} ({{ yTicks().unit }})
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
    .line { fill: none; stroke: var(--mat-sys-primary); stroke-width: 1.75px; stroke-linejoin: round; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProfilePlot {
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  readonly profile = input.required<LineProfile>();
  readonly title = input.required<string>();
  readonly dimension = input.required<Dimension>();
  readonly height = input(190);
  /** Start the y axis at zero (magnitudes). */
  readonly fromZero = input(false);

  protected readonly m = M;
  protected readonly width = signal(600);
  protected readonly innerW = computed(() => Math.max(40, this.width() - M.left - M.right));
  protected readonly innerH = computed(() => Math.max(40, this.height() - M.top - M.bottom));

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

  protected readonly x = computed(() => d3.scaleLinear().domain([0, this.profile().length || 1]).range([0, this.innerW()]));
  protected readonly y = computed(() => d3.scaleLinear().domain(this.extent()).nice(5).range([this.innerH(), 0]));
  protected readonly xTicks = computed(() => rangeTicks(0, this.profile().length, 'length', Math.max(2, Math.round(this.innerW() / 90))));
  protected readonly yTicks = computed(() => {
    const [lo, hi] = this.y().domain();
    return rangeTicks(lo, hi, this.dimension(), 4);
  });
  protected readonly zeroY = computed(() => {
    const [lo, hi] = this.y().domain();
    return lo < 0 && hi > 0 ? this.y()(0) : null;
  });
  protected readonly path = computed(() => {
    const p = this.profile(), x = this.x(), y = this.y();
    const pts = Array.from(p.distance, (d, k) => [d, p.values[k]] as [number, number]);
    return (
      d3
        .line<[number, number]>()
        .defined((q) => Number.isFinite(q[1]))
        .x((q) => x(q[0]))
        .y((q) => y(q[1]))(pts) ?? ''
    );
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
