import { makeDesign } from '../../tests/fixtures/designs';
import { channelWidths } from './channel-width';
import { fluidRegion } from './fluid-region';

const regionOf = (shapes: unknown[]) => fluidRegion(makeDesign({ shapes: shapes as never, ports: [] }).shapes);

describe('channelWidths', () => {
  it('measures a straight channel, not its length', () => {
    const w = channelWidths(regionOf([{ op: 'add', type: 'rect', x: 0, y: 0, width: 2e-3, height: 5e-5, angle: 20 }]));
    expect(w.narrowest?.width).toBeCloseTo(5e-5, 12);
  });

  it('measures a bend across its radius', () => {
    const w = channelWidths(regionOf([
      { op: 'add', type: 'sector', center: [0, 0], innerRadius: 2e-4, outerRadius: 3e-4, startAngle: 0, endAngle: 180 },
    ]));
    expect(w.narrowest!.width / 1e-4).toBeCloseTo(1, 4);
  });

  it('finds the gap between a pillar and the wall', () => {
    const w = channelWidths(regionOf([
      { op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 1e-4 },
      { op: 'subtract', type: 'circle', center: [5e-4, 6e-5], radius: 2e-5 },
    ]));
    // 100 − 60 − 20 = 20 µm above the pillar
    expect(w.narrowest!.width / 2e-5).toBeCloseTo(1, 3);
    expect(w.narrowest!.at[0]).toBeCloseTo(5e-4, 6);
  });

  it('does not take a wedge tip for a channel', () => {
    const w = channelWidths(regionOf([
      { op: 'add', type: 'polygon', points: [[0, 0], [1e-3, 0], [1e-3, 1e-4]] },
    ]));
    // A thin triangle: no two walls face each other across it.
    expect(w.narrowest === null || w.narrowest.width > 5e-5).toBe(true);
  });

  it('reports a sliver separately from the channels', () => {
    const region = regionOf([
      { op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5 },
      // A finger 10 nm wide, as left by shapes that were meant to line up.
      { op: 'add', type: 'rect', x: 5e-4, y: 4e-5, width: 1e-8, height: 5e-5 },
    ]);
    const w = channelWidths(region, 5e-8);
    expect(w.thinnest!.width).toBeLessThan(5e-8);
    expect(w.narrowest!.width / 5e-5).toBeCloseTo(1, 6);
  });
});
