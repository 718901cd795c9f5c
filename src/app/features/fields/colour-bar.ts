import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { colourHex } from '../../../../shared/colour-maps';
import type { Dimension } from '../../ui/units';
import { labelIn, rangeTicks } from './colour-bar-ticks';
import type { ColourRange } from './field-maps';

let nextId = 0;

/** A vertical colour bar: the map's colours over its range, round ticks in one unit, the unit in the heading. */
@Component({
  selector: 'osm-colour-bar',
  template: `
    <svg [attr.width]="width" [attr.height]="height()" role="img" [attr.aria-label]="description()">
      <defs>
        <linearGradient [attr.id]="gradientId" x1="0" y1="1" x2="0" y2="0">
          @for (s of stops(); track $index) {
            <stop [attr.offset]="s.offset" [attr.stop-color]="s.colour" />
          }
        </linearGradient>
      </defs>
      <text class="title" x="0" y="12">{{ title() }}</text>
      <text class="unit" x="0" y="27">{{ ticks().unit || '–' }}</text>
      <g [attr.transform]="'translate(0,' + top + ')'">
        <rect x="0.5" y="0.5" [attr.width]="barWidth" [attr.height]="barHeight()" [attr.fill]="'url(#' + gradientId + ')'" class="bar" />
        @if (range().aboveMax) {
          <path [attr.d]="'M0.5,0 L' + (barWidth / 2 + 0.5) + ',-8 L' + (barWidth + 0.5) + ',0Z'" [attr.fill]="stops()[stops().length - 1].colour" class="cap">
            <title>Some values lie above {{ endLabel(range().max) }} {{ ticks().unit }} (shown in the end colour)</title>
          </path>
        }
        @if (range().belowMin) {
          <path [attr.d]="'M0.5,' + (barHeight() + 1) + ' L' + (barWidth / 2 + 0.5) + ',' + (barHeight() + 9) + ' L' + (barWidth + 0.5) + ',' + (barHeight() + 1) + 'Z'" [attr.fill]="stops()[0].colour" class="cap">
            <title>Some values lie below {{ endLabel(range().min) }} {{ ticks().unit }} (shown in the end colour)</title>
          </path>
        }
        @for (t of ticks().ticks; track t.value) {
          <g class="tick" [attr.transform]="'translate(0,' + y(t.value) + ')'">
            <line [attr.x1]="barWidth" [attr.x2]="barWidth + 4" y1="0.5" y2="0.5" />
            <text [attr.x]="barWidth + 6" y="4">{{ t.label }}</text>
          </g>
        }
      </g>
    </svg>
  `,
  styles: `
    :host { display: block; }
    svg { display: block; overflow: visible; font-size: 11px; fill: var(--mat-sys-on-surface); }
    .title { font-weight: 600; font-size: 11.5px; }
    .unit { fill: var(--mat-sys-on-surface-variant); }
    .bar { stroke: var(--mat-sys-outline); stroke-width: 1; }
    .cap { stroke: var(--mat-sys-outline); stroke-width: 1; }
    .tick line { stroke: var(--mat-sys-on-surface-variant); }
    .tick text { font-variant-numeric: tabular-nums; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ColourBar {
  readonly range = input.required<ColourRange>();
  /** Short name of the quantity, e.g. "Potential φ". */
  readonly title = input.required<string>();
  readonly dimension = input.required<Dimension>();
  /** Height of the whole bar, headings included (px). */
  readonly height = input(300);

  protected readonly width = 84;
  protected readonly barWidth = 16;
  protected readonly top = 44;
  protected readonly gradientId = `osm-colour-bar-${nextId++}`;

  protected readonly barHeight = computed(() => Math.max(60, this.height() - this.top - 14));
  protected readonly ticks = computed(() => {
    const r = this.range();
    return rangeTicks(r.min, r.max, this.dimension(), Math.max(3, Math.round(this.barHeight() / 45)));
  });
  protected readonly stops = computed(() => {
    const name = this.range().colourMap;
    return Array.from({ length: 33 }, (_, k) => ({ offset: k / 32, colour: colourHex(name, k / 32) }));
  });
  protected readonly description = computed(() => {
    const r = this.range(), t = this.ticks();
    return `Colour bar of ${this.title()} from ${this.endLabel(r.min)} to ${this.endLabel(r.max)} ${t.unit}`;
  });

  protected y(value: number): number {
    const r = this.range();
    return Math.round((1 - (value - r.min) / (r.max - r.min)) * this.barHeight());
  }

  protected endLabel(value: number): string {
    return labelIn(this.ticks(), value);
  }
}
