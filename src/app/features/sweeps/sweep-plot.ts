import { ChangeDetectionStrategy, Component, ElementRef, effect, input, output, viewChild } from '@angular/core';
import * as d3 from 'd3';
import type { SweepParameterInfo } from '../../../../shared/api';
import { colourHex } from '../../../../shared/colour-maps';
import { displayUnit, type Dimension } from '../../ui/units';
import type { Series } from './sweep-series';

/** How an axis shows values of a dimension: one unit for the whole axis (°C for temperatures stored in K). */
export function axisUnits(values: number[], dimension: Dimension): { unit: string; show: (v: number) => number } {
  if (dimension === 'temperature') return { unit: '°C', show: (v) => v - 273.15 };
  const finite = values.filter(Number.isFinite);
  const { label, factor } = displayUnit(finite.length ? Math.max(...finite.map(Math.abs)) : 0, dimension);
  return { unit: label, show: (v) => v / factor };
}

export function axisTitle(name: string, unit: string): string {
  return unit ? `${name} (${unit})` : name;
}

/** Distinct line colours from the one colour-map module (viridis, evenly spaced, short of its lightest end). */
export function lineColour(k: number, n: number): string {
  return colourHex('viridis', n <= 1 ? 0.1 : (0.85 * k) / (n - 1));
}

const W = 440;
const H = 230;
const M = { top: 12, right: 14, bottom: 40, left: 64 };

/**
 * One output against the parameter (d3): a line and dots per series, the axes in display units; a click on a dot
 * picks that point. Points without a result leave a gap.
 */
@Component({
  selector: 'osm-sweep-plot',
  template: `<svg #svg class="plot" [attr.viewBox]="'0 0 ' + width + ' ' + height" role="img" [attr.aria-label]="title()"></svg>`,
  styles: `
    :host { display: block; }
    .plot { width: 100%; max-width: 440px; height: auto; font: 11px 'IBM Plex Sans', sans-serif; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepPlot {
  readonly parameter = input.required<SweepParameterInfo>();
  readonly series = input.required<Series[]>();
  readonly title = input('');
  readonly selected = input<number | null>(null);
  /** A point was clicked (its index in the sweep). */
  readonly pick = output<number>();

  protected readonly width = W;
  protected readonly height = H;
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');

  constructor() {
    effect(() => this.draw(this.parameter(), this.series(), this.selected()));
  }

  private draw(parameter: SweepParameterInfo, series: Series[], selected: number | null): void {
    const root = d3.select(this.svg().nativeElement);
    root.selectAll('*').remove();
    const xs = parameter.values;
    const x = axisUnits(xs, parameter.dimension as Dimension);
    const all = series.flatMap((s) => s.values);
    const y = axisUnits(all, series[0]?.dimension ?? 'dimensionless');
    const log = parameter.range.kind === 'log' && xs.every((v) => v > 0);
    const xDomain = d3.extent(xs.map(x.show)) as [number, number];
    const xScale = (log ? d3.scaleLog() : d3.scaleLinear()).domain(xDomain[0] === xDomain[1] ? [xDomain[0] - 1, xDomain[1] + 1] : xDomain).range([M.left, W - M.right]);
    const finite = all.filter(Number.isFinite).map(y.show);
    const yScale = d3.scaleLinear().domain(finite.length ? (d3.extent([0, ...finite]) as [number, number]) : [0, 1]).nice().range([H - M.bottom, M.top]);

    root.append('g').attr('class', 'x-axis').attr('transform', `translate(0,${H - M.bottom})`).call(d3.axisBottom(xScale).ticks(6, log ? '~g' : undefined));
    const yAxis = d3.axisLeft(yScale).ticks(5);
    // Counts (warnings) take whole-number ticks only.
    if (series[0]?.dimension === 'dimensionless') yAxis.tickValues(yScale.ticks(5).filter(Number.isInteger)).tickFormat(d3.format('d'));
    root.append('g').attr('class', 'y-axis').attr('transform', `translate(${M.left},0)`).call(yAxis);
    root.append('text').attr('x', (M.left + W - M.right) / 2).attr('y', H - 6).attr('text-anchor', 'middle').attr('fill', 'currentColor').text(axisTitle(parameter.label, x.unit));
    root.append('text').attr('transform', `translate(12,${(H - M.bottom + M.top) / 2}) rotate(-90)`).attr('text-anchor', 'middle').attr('fill', 'currentColor').text(axisTitle(series.length === 1 ? series[0].label : this.title(), y.unit));

    series.forEach((s, k) => {
      const colour = lineColour(k, series.length);
      const points = s.values.map((v, i) => ({ i, x: xScale(x.show(xs[i])), y: yScale(y.show(v)), ok: Number.isFinite(v) }));
      const line = d3.line<(typeof points)[number]>().defined((p) => p.ok).x((p) => p.x).y((p) => p.y);
      root.append('path').datum(points).attr('fill', 'none').attr('stroke', colour).attr('stroke-width', 1.6).attr('d', line);
      root
        .append('g')
        .selectAll('circle')
        .data(points.filter((p) => p.ok))
        .join('circle')
        .attr('class', 'dot')
        .attr('data-index', (p) => p.i)
        .attr('cx', (p) => p.x)
        .attr('cy', (p) => p.y)
        .attr('r', (p) => (p.i === selected ? 5 : 3))
        .attr('fill', colour)
        .attr('stroke', (p) => (p.i === selected ? 'currentColor' : 'none'))
        .style('cursor', 'pointer')
        .on('click', (_e, p) => this.pick.emit(p.i))
        .append('title')
        .text((p) => `${s.label}, point ${p.i + 1}`);
    });
    if (series.length > 1) {
      const legend = root.append('g').attr('transform', `translate(${M.left + 8},${M.top + 4})`);
      series.forEach((s, k) => {
        const row = legend.append('g').attr('transform', `translate(0,${k * 14})`);
        row.append('rect').attr('width', 10).attr('height', 3).attr('y', -4).attr('fill', lineColour(k, series.length));
        row.append('text').attr('x', 14).attr('fill', 'currentColor').text(s.label);
      });
    }
  }
}
