import { displayBox, formatLength, regionPath, scaleBarLength } from './layout-geometry';

describe('layout geometry for previews', () => {
  it('boxes the added shapes and the ports in micrometres with y down', () => {
    const box = displayBox({
      shapes: [
        { op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5, angle: 0 },
        { op: 'subtract', type: 'circle', center: [5e-3, 5e-3], radius: 1e-3 },
      ],
      ports: [{ id: 'A', from: [0, 0], to: [0, 5e-5], potential: 0, pressure: 0 }],
    });
    expect(box!.minX).toBeCloseTo(0);
    expect(box!.maxX).toBeCloseTo(1000);
    expect(box!.minY).toBeCloseTo(-50);
    expect(box!.maxY).toBeCloseTo(0);
    expect(displayBox({ shapes: [], ports: [] })).toBeNull();
  });

  it('draws a rotated rectangle about its lower-left corner, counter-clockwise', () => {
    const d = regionPath({ type: 'rect', x: 0, y: 0, width: 1e-4, height: 1e-5, angle: 90 });
    // The far end of a 100 µm rectangle turned 90° points up: y = +100 µm, i.e. −100 on the display.
    expect(d).toMatch(/^M0 0 L0 -100 /);
  });

  it('sweeps a bend counter-clockwise', () => {
    const d = regionPath({ type: 'sector', center: [0, 0], innerRadius: 1e-4, outerRadius: 2e-4, startAngle: 0, endAngle: 90 });
    expect(d).toBe('M200 0 A200 200 0 0 0 0 -200 L0 -100 A100 100 0 0 1 100 0 Z');
  });

  it('picks a round scale bar', () => {
    expect(scaleBarLength(3000)).toBe(500);
    expect(scaleBarLength(900)).toBe(100);
    expect(formatLength(500)).toBe('500 µm');
    expect(formatLength(2000)).toBe('2 mm');
  });
});
