import { ARC_TOLERANCE, arcVertices, circleVertices } from './arc';
import { ringArea } from './ring';
import { sectorRings, shapeOutline } from './shape-outline';

describe('area-exact arcs', () => {
  it('a circle polygon has area π r² and stays within tolerance·r of the circle', () => {
    const r = 1.5e-5;
    const ring = circleVertices(1e-3, 2e-4, r);
    expect(ringArea(ring)).toBeCloseTo(Math.PI * r * r, 22);
    expect(Math.abs(ringArea(ring) / (Math.PI * r * r) - 1)).toBeLessThan(1e-12);
    for (let k = 0; k < ring.length; k++) {
      const a = ring[k], b = ring[(k + 1) % ring.length];
      const vertex = Math.hypot(a[0] - 1e-3, a[1] - 2e-4);
      const chordMid = Math.hypot((a[0] + b[0]) / 2 - 1e-3, (a[1] + b[1]) / 2 - 2e-4);
      expect(Math.abs(vertex - r)).toBeLessThan(ARC_TOLERANCE * r);
      expect(Math.abs(chordMid - r)).toBeLessThan(ARC_TOLERANCE * r);
    }
  });

  it('an annular sector has area (Θ/2)(r_o² − r_i²) and its end vertices exactly on the radii', () => {
    const [ri, ro] = [1e-4, 1.5e-4];
    for (const [a0, a1] of [[0, 90], [-90, 90], [30, 75], [90, 270], [0, 359]]) {
      const [ring] = sectorRings(0, 0, ri, ro, a0, a1);
      const theta = ((a1 - a0) * Math.PI) / 180;
      expect(Math.abs(ringArea(ring) / ((theta / 2) * (ro * ro - ri * ri)) - 1)).toBeLessThan(1e-12);
    }
    const arc = arcVertices(0, 0, ro, 0, 90);
    expect(arc[0]).toEqual([ro, 0]);
    expect(arc[arc.length - 1]).toEqual([0, ro]);
  });

  it('a full-turn sector is an annulus: outer ring and a clockwise hole', () => {
    const rings = shapeOutline({ type: 'sector', center: [0, 0], innerRadius: 1e-4, outerRadius: 2e-4, startAngle: 0, endAngle: 360 });
    expect(rings).toHaveLength(2);
    expect(ringArea(rings[0])).toBeGreaterThan(0);
    expect(ringArea(rings[1])).toBeLessThan(0);
    const area = ringArea(rings[0]) + ringArea(rings[1]);
    expect(Math.abs(area / (Math.PI * (4e-8 - 1e-8)) - 1)).toBeLessThan(1e-12);
  });

  it('a rect turned by a quarter turn keeps exact corners', () => {
    const [ring] = shapeOutline({ type: 'rect', x: 1e-4, y: 2e-4, width: 3e-4, height: 5e-5, angle: 90 });
    expect(ring).toEqual([[1e-4, 2e-4], [1e-4, 2e-4 + 3e-4], [1e-4 - 5e-5, 2e-4 + 3e-4], [1e-4 - 5e-5, 2e-4]]);
  });
});
