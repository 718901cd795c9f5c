import { ChangeDetectionStrategy, Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { scaleLinear } from 'd3';
import { PlotFrame } from './plot-frame';

@Component({
  imports: [PlotFrame],
  template: `
    <svg>
      <g osmPlotFrame [x]="x" [y]="y()" [xTicks]="xTicks" [yTicks]="yTicks">
        <g plotUnderlay><rect class="bar" /></g>
        <path class="line" />
      </g>
    </svg>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class Host {
  readonly x = scaleLinear().domain([0, 10]).range([0, 200]);
  readonly y = signal(scaleLinear().domain([-1, 1]).range([100, 0]));
  readonly xTicks = [0, 5, 10].map((v) => ({ value: v, label: String(v) }));
  readonly yTicks = [-1, 0, 1].map((v) => ({ value: v, label: v < 0 ? `\u2212${-v}` : String(v) }));
}

async function render() {
  await TestBed.configureTestingModule({ imports: [Host] }).compileComponents();
  const fixture = TestBed.createComponent(Host);
  fixture.detectChanges();
  await fixture.whenStable();
  return fixture;
}

describe('PlotFrame', () => {
  it('draws the grid under projected bars, the axes over them, and the rest of the content on top', async () => {
    const fixture = await render();
    const frame = (fixture.nativeElement as HTMLElement).querySelector('g[osmPlotFrame]')!;
    const order = Array.from(frame.querySelectorAll('line, rect, path')).map((e) => e.getAttribute('class'));
    expect(order).toEqual(['grid', 'grid', 'grid', 'bar', 'tickmark', 'tickmark', 'tickmark', 'axis', 'axis', 'zero', 'line']);
    const labels = Array.from(frame.querySelectorAll('text.tick')).map((t) => t.textContent?.trim());
    expect(labels).toEqual(['\u22121', '0', '1', '0', '5', '10']);
  });

  it('puts the ticks on the scales and the axes along the plot area', async () => {
    const fixture = await render();
    const frame = (fixture.nativeElement as HTMLElement).querySelector('g[osmPlotFrame]')!;
    const grid = frame.querySelectorAll('line.grid');
    expect(grid[0].getAttribute('y1')).toBe('100');
    expect(grid[0].getAttribute('x2')).toBe('200');
    expect(frame.querySelectorAll('line.tickmark')[1].getAttribute('x1')).toBe('100');
    const [xAxis, yAxis] = Array.from(frame.querySelectorAll('line.axis'));
    expect([xAxis.getAttribute('y1'), xAxis.getAttribute('x2')]).toEqual(['100', '200']);
    expect(yAxis.getAttribute('y2')).toBe('100');
    expect(frame.querySelector('line.zero')?.getAttribute('y1')).toBe('50');
  });

  it('draws no zero line when the y range does not span zero', async () => {
    const fixture = await render();
    fixture.componentInstance.y.set(scaleLinear().domain([0, 1]).range([100, 0]));
    fixture.detectChanges();
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelector('line.zero')).toBeNull();
  });
});
