import { ChangeDetectionStrategy, Component, ElementRef, computed, effect, input, output, viewChild } from '@angular/core';
import * as d3 from 'd3';
import type { SweepParameterInfo } from '../../../../shared/api';
import { colourHex } from '../../../../shared/colour-maps';
import type { Dimension } from '../../ui/units';
import { ColourBar } from '../fields/colour-bar';
import type { ColourRange } from '../fields/field-maps';
import { axisTitle, axisUnits } from './sweep-plot';
import type { Series } from './sweep-series';

const W = 480;
const H = 300;
const M = { top: 12, right: 10, bottom: 40, left: 70 };

/** The colour range of a series: cividis from its least to its largest value, or cool-warm symmetric about zero. */
export function seriesRange(series: Series): ColourRange {
  const finite = series.values.filter(Number.isFinite);
  let min = finite.length ? Math.min(...finite) : 0;
  let max = finite.length ? Math.max(...finite) : 1;
  if (series.signed) {
    max = Math.max(Math.abs(min), Math.abs(max)) || 1;
    min = -max;
  }
  if (min === max) max = min + 1;
  return { min, max, belowMin: false, aboveMax: false, colourMap: series.signed ? 'cool-warm' : 'cividis', empty: finite.length === 0 };
}

/**
 * One output over two parameters (d3): a cell per point coloured from the one colour-map module (cividis for
 * magnitudes, cool-warm centred on zero for signed values such as currents), with the Fields tab's colour bar.
 * Cells sit at their parameters' step positions (labelled with the values), so log and listed ranges read plainly.
 * A click on a cell picks its point; points without a result stay empty.
 */
@Component({
  selector: 'osm-sweep-map',
  imports: [ColourBar],
  template: `
    <svg #svg class="map" [attr.viewBox]="'0 0 ' + width + ' ' + height" role="img" [attr.aria-label]="series().label + ' over two parameters'"></svg>
    <osm-colour-bar class="bar" [range]="range()" [title]="series().label" [dimension]="series().dimension" [height]="height" />
  `,
  styles: `
    :host { display: flex; gap: 12px; align-items: flex-start; }
    .map { width: 100%; max-width: 480px; height: auto; font: 11px 'IBM Plex Sans', sans-serif; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepMap {
  readonly parameters = input.required<SweepParameterInfo[]>();
  readonly series = input.required<Series>();
  readonly selected = input<number | null>(null);
  readonly pick = output<number>();

  protected readonly width = W;
  protected readonly height = H;
  protected readonly range = computed(() => seriesRange(this.series()));
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');

  constructor() {
    effect(() => this.draw(this.parameters(), this.series(), this.range(), this.selected()));
  }

  private draw([p1, p2]: SweepParameterInfo[], series: Series, range: ColourRange, selected: number | null): void {
    const root = d3.select(this.svg().nativeElement);
    root.selectAll('*').remove();
    if (!p1 || !p2) return;
    const n1 = p1.values.length;
    const n2 = p2.values.length;
    const xUnits = axisUnits(p1.values, p1.dimension as Dimension);
    const yUnits = axisUnits(p2.values, p2.dimension as Dimension);
    const x = d3.scaleBand<number>().domain(d3.range(n1)).range([M.left, W - M.right]).padding(0.04);
    const y = d3.scaleBand<number>().domain(d3.range(n2)).range([H - M.bottom, M.top]).padding(0.04);

    const t = (v: number) => (v - range.min) / (range.max - range.min);

    root
      .append('g')
      .selectAll('rect')
      .data(series.values.map((v, index) => ({ v, index, i: index % n1, j: Math.floor(index / n1) })))
      .join('rect')
      .attr('class', 'cell')
      .attr('data-index', (d) => d.index)
      .attr('x', (d) => x(d.i)!)
      .attr('y', (d) => y(d.j)!)
      .attr('width', x.bandwidth())
      .attr('height', y.bandwidth())
      .attr('fill', (d) => (Number.isFinite(d.v) ? colourHex(range.colourMap, t(d.v)) : 'none'))
      .attr('stroke', (d) => (d.index === selected ? 'currentColor' : Number.isFinite(d.v) ? 'none' : 'var(--mat-sys-outline-variant)'))
      .attr('stroke-width', (d) => (d.index === selected ? 2 : 1))
      .style('cursor', 'pointer')
      .on('click', (_e, d) => this.pick.emit(d.index))
      .append('title')
      .text((d) => `point ${d.index + 1}`);

    const every = (n: number) => Math.max(1, Math.ceil(n / 8));
    const fmt = d3.format('~g');
    root.append('g').attr('transform', `translate(0,${H - M.bottom})`)
      .call(d3.axisBottom(x).tickValues(d3.range(0, n1, every(n1))).tickFormat((i) => fmt(Number(xUnits.show(p1.values[i]).toPrecision(4)))));
    root.append('g').attr('transform', `translate(${M.left},0)`)
      .call(d3.axisLeft(y).tickValues(d3.range(0, n2, every(n2))).tickFormat((j) => fmt(Number(yUnits.show(p2.values[j]).toPrecision(4)))));
    root.append('text').attr('x', (M.left + W - M.right) / 2).attr('y', H - 6).attr('text-anchor', 'middle').attr('fill', 'currentColor').text(axisTitle(p1.label, xUnits.unit));
    root.append('text').attr('transform', `translate(12,${(H - M.bottom + M.top) / 2}) rotate(-90)`).attr('text-anchor', 'middle').attr('fill', 'currentColor').text(axisTitle(p2.label, yUnits.unit));
  }
}
