/**
 * Draws the frame of the sketch canvas in screen pixels, from the view alone: the grid at the snap step (major
 * lines at the next round length about five steps on), axes in micrometres along the bottom and the left edge,
 * and the scale bar.
 */
import * as d3 from 'd3';
import { formatQuantity } from '../../ui/units';
import { AXIS_BAND, AXIS_LEFT, toScreen, toWorld, type Size, type View } from './canvas-view';
import { UM } from './sketch-path';
import { niceStep, scaleBarLength, snapStep } from './snap';

/** Draws into the groups the canvas set up: `g.grid`, `g.axis.x`, `g.axis.y` and `g.scale-bar`. */
export function drawFrame(svg: d3.Selection<SVGSVGElement, unknown, null, undefined>, view: View, { width, height }: Size): void {
  const step = snapStep(view.k * UM);

  // Visible world range (m).
  const [x0, yTop] = toWorld(view, [0, 0]);
  const [x1, yBottom] = toWorld(view, [width, height]);

  // Grid: minor lines at the snap step, major lines at the next round length about five steps on.
  const major = niceStep(step * 4.5);
  const lines = (from: number, to: number) => {
    const out: number[] = [];
    const first = Math.ceil(from / step);
    const last = Math.floor(to / step);
    if (last - first > 2000) return out;
    for (let k = first; k <= last; k++) out.push(k * step);
    return out;
  };
  const isMajor = (v: number) => Math.abs(v / major - Math.round(v / major)) < 1e-6;
  const grid = svg.select('g.grid');
  grid
    .selectAll('line.gx')
    .data(lines(x0, x1))
    .join('line')
    .attr('class', (v) => (isMajor(v) ? 'gx major' : 'gx'))
    .attr('x1', (v) => toScreen(view, [v, 0])[0])
    .attr('x2', (v) => toScreen(view, [v, 0])[0])
    .attr('y1', 0)
    .attr('y2', height);
  grid
    .selectAll('line.gy')
    .data(lines(yBottom, yTop))
    .join('line')
    .attr('class', (v) => (isMajor(v) ? 'gy major' : 'gy'))
    .attr('y1', (v) => toScreen(view, [0, v])[1])
    .attr('y2', (v) => toScreen(view, [0, v])[1])
    .attr('x1', 0)
    .attr('x2', width);

  // Axes in micrometres along the bottom and the left edge.
  const xs = d3.scaleLinear().domain([x0 * UM, x1 * UM]).range([0, width]);
  const ys = d3.scaleLinear().domain([yTop * UM, yBottom * UM]).range([0, height]);
  const ax = svg.select<SVGGElement>('g.axis.x').attr('transform', `translate(0,${height - AXIS_BAND})`);
  ax.selectAll('rect.band').data([0]).join('rect').attr('class', 'band').attr('width', width).attr('height', AXIS_BAND);
  ax.call(d3.axisBottom(xs).ticks(Math.max(2, Math.floor(width / 90))).tickFormat(d3.format('~g')).tickSizeOuter(0));
  ax.selectAll<SVGGElement, number>('.tick').attr('display', (v) => (xs(v) < AXIS_LEFT + 14 || xs(v) > width - 14 ? 'none' : null));
  const ay = svg.select<SVGGElement>('g.axis.y').attr('transform', `translate(${AXIS_LEFT},0)`);
  ay.selectAll('rect.band').data([0]).join('rect').attr('class', 'band').attr('x', -AXIS_LEFT).attr('width', AXIS_LEFT).attr('height', height);
  ay.call(d3.axisLeft(ys).ticks(Math.max(2, Math.floor(height / 70))).tickFormat(d3.format('~g')).tickSizeOuter(0));
  ay.selectAll<SVGGElement, number>('.tick').attr('display', (v) => (ys(v) < 8 || ys(v) > height - AXIS_BAND - 8 ? 'none' : null));
  // Both axes are in micrometres: the unit sits in the corner where they meet.
  ay.selectAll('text.unit').data([0]).join('text').attr('class', 'unit').attr('x', -AXIS_LEFT / 2).attr('y', height - AXIS_BAND / 2).attr('dy', '0.35em').text('µm');

  // Scale bar, bottom left above the axis.
  const barLength = scaleBarLength(view.k * UM, 110);
  const barPx = barLength * view.k * UM;
  const bar = svg.select('g.scale-bar').attr('transform', `translate(${AXIS_LEFT + 16},${height - AXIS_BAND - 14})`);
  bar.selectAll('path').data([0]).join('path').attr('d', `M0,-5V0H${barPx}V-5`);
  bar.selectAll('text').data([0]).join('text').attr('x', barPx / 2).attr('y', -8).text(formatQuantity(barLength, 'length', { digits: 3 }));
}
