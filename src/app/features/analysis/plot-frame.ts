import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ScaleLinear } from 'd3';
import type { Tick } from '../fields/colour-bar-ticks';

/**
 * The frame of a plot, drawn inside the plot area's group: a grid line and a label at each y tick, a tick mark
 * and a label at each x tick, the two axes, and a dashed zero line when the y range spans zero. The plot area is
 * the scales' range (x from 0, y from its first range value up to 0). Content marked `plotUnderlay` (bars) is drawn
 * over the grid and under the axes; other content over everything.
 */
@Component({
  selector: 'g[osmPlotFrame]',
  template: `
    @for (t of yTicks(); track t.value) {
      <svg:line class="grid" x1="0" [attr.x2]="innerW()" [attr.y1]="y()(t.value)" [attr.y2]="y()(t.value)" />
      <svg:text class="tick" x="-6" [attr.y]="y()(t.value)" text-anchor="end" dominant-baseline="central">{{ t.label }}</svg:text>
    }
    <ng-content select="[plotUnderlay]" />
    @for (t of xTicks(); track t.value) {
      <svg:line class="tickmark" [attr.x1]="x()(t.value)" [attr.x2]="x()(t.value)" [attr.y1]="innerH()" [attr.y2]="innerH() + 4" />
      <svg:text class="tick" [attr.x]="x()(t.value)" [attr.y]="innerH() + 15" text-anchor="middle">{{ t.label }}</svg:text>
    }
    <svg:line class="axis" x1="0" [attr.x2]="innerW()" [attr.y1]="innerH()" [attr.y2]="innerH()" />
    <svg:line class="axis" x1="0" x2="0" y1="0" [attr.y2]="innerH()" />
    @if (zeroY(); as z) {
      <svg:line class="zero" x1="0" [attr.x2]="innerW()" [attr.y1]="z" [attr.y2]="z" />
    }
    <ng-content />
  `,
  styles: `
    .grid { stroke: var(--mat-sys-outline-variant); stroke-width: 1; }
    .zero { stroke: var(--mat-sys-outline); stroke-dasharray: 3 3; }
    .axis, .tickmark { stroke: var(--mat-sys-on-surface-variant); }
    .tick { fill: var(--mat-sys-on-surface-variant); font-variant-numeric: tabular-nums; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlotFrame {
  readonly x = input.required<ScaleLinear<number, number>>();
  readonly y = input.required<ScaleLinear<number, number>>();
  readonly xTicks = input.required<ReadonlyArray<Tick>>();
  readonly yTicks = input.required<ReadonlyArray<Tick>>();

  protected readonly innerW = computed(() => this.x().range()[1]);
  protected readonly innerH = computed(() => this.y().range()[0]);
  protected readonly zeroY = computed(() => {
    const [lo, hi] = this.y().domain();
    return lo < 0 && hi > 0 ? this.y()(0) : null;
  });
}
