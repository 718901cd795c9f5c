import type { Port } from '../../../../shared/design';
import { AXIS_BAND, AXIS_LEFT, MARGIN, centredView, fitView, layoutBounds, plotCentre, toScreen, toWorld } from './canvas-view';

describe('canvas view', () => {
  const size = { width: 800, height: 520 };

  it('maps metres to pixels and back, with y up on the layout and down on the screen', () => {
    const view = { x: 100, y: 400, k: 0.5 };
    // 1 µm is half a pixel at k = 0.5.
    expect(toScreen(view, [1e-4, 2e-4])).toEqual([150, 300]);
    const back = toWorld(view, toScreen(view, [3e-5, -7e-5]));
    expect(back[0]).toBeCloseTo(3e-5, 15);
    expect(back[1]).toBeCloseTo(-7e-5, 15);
  });

  it('fits bounds into the plot area: centred, the tighter side filling it less the margins', () => {
    const b: [number, number, number, number] = [0, 0, 1e-3, 1e-4];
    const view = fitView(b, size);
    // 1000 µm wide in 800 - 52 - 96 px; 100 µm tall in 520 - 22 - 96 px: the width decides.
    expect(view.k).toBeCloseTo((size.width - AXIS_LEFT - 2 * MARGIN) / 1000, 12);
    const [cx, cy] = toScreen(view, [5e-4, 5e-5]);
    expect(cx).toBeCloseTo(AXIS_LEFT + (size.width - AXIS_LEFT) / 2, 9);
    expect(cy).toBeCloseTo((size.height - AXIS_BAND) / 2, 9);
    expect(toScreen(view, [0, 0])[0]).toBeCloseTo(AXIS_LEFT + MARGIN, 9);
  });

  it('centres a point keeping the zoom', () => {
    const view = centredView([2e-4, -1e-4], 3, size);
    expect(view.k).toBe(3);
    const s = toScreen(view, [2e-4, -1e-4]);
    const c = plotCentre(size);
    expect(s[0]).toBeCloseTo(c[0], 9);
    expect(s[1]).toBeCloseTo(c[1], 9);
  });

  it('bounds a layout by its shapes and ports, or not at all when empty', () => {
    const port: Port = { id: 'A', from: [-1e-4, 2e-4], to: [-1e-4, 3e-4], potential: 0, pressure: 0 };
    expect(layoutBounds({ shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5, angle: 0 }], ports: [port] })).toEqual([-1e-4, 0, 1e-3, 3e-4]);
    expect(layoutBounds({ shapes: [], ports: [] })).toBeNull();
  });
});
