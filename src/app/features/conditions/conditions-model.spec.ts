import { parseDesign, type DesignDocument } from '../../../../shared/design';
import { wallZeta, addZone, defaultZoneRegion, highVoltagePorts, largestPotential, mobilityOf, removeZone, withBuffer, withPort, withZeta, zetaOf } from './conditions-model';

function design(): DesignDocument {
  const r = parseDesign({
    format: 'osmolane.design/1',
    name: 'T',
    depth: 2e-5,
    buffer: { relativePermittivity: 78.4, viscosity: 8.9e-4, density: 997, conductivity: 0.14, ionicStrength: 10, temperature: 298.15 },
    zeta: { side: -0.05 },
    shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5 }],
    ports: [
      { id: 'A', from: [0, 0], to: [0, 5e-5], potential: 0 },
      { id: 'B', from: [1e-3, 0], to: [1e-3, 5e-5], potential: null },
    ],
  });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.design;
}

describe('conditions model', () => {
  it('edits without changing the old document', () => {
    const d = design();
    const e = withPort(d, 0, { potential: 1200 });
    expect(e.ports[0].potential).toBe(1200);
    expect(d.ports[0].potential).toBe(0);
    expect(withBuffer(d, { density: 1000 }).buffer).toMatchObject({ density: 1000, viscosity: 8.9e-4 });
    expect(withZeta(d, 'lid', -0.02).zeta).toEqual({ side: -0.05, floor: -0.05, lid: -0.02 });
  });

  it('relates zeta and mobility by mu_eo = -eps zeta / mu, both ways', () => {
    const d = design();
    // eps = 78.4 * 8.8541878188e-12 F/m; -eps * (-0.05 V) / 8.9e-4 Pa s = 3.9e-8 m2/(V s)
    const mu = mobilityOf(d, -0.05);
    expect(mu).toBeCloseTo((78.4 * 8.8541878188e-12 * 0.05) / 8.9e-4, 20);
    expect(mu).toBeGreaterThan(0);
    expect(zetaOf(d, mu)).toBeCloseTo(-0.05, 12);
  });

  it('finds ports above 50 V in size, floating ports aside', () => {
    let d = withPort(design(), 0, { potential: -1200 });
    expect(largestPotential(d)).toBe(1200);
    expect(highVoltagePorts(d).map((p) => p.id)).toEqual(['A']);
    d = withPort(d, 0, { potential: 50 });
    expect(highVoltagePorts(d)).toEqual([]);
  });

  it('adds and removes wall zones', () => {
    const d = design();
    const region = defaultZoneRegion([0, 0, 1e-3, 5e-5]);
    expect(region.width).toBeCloseTo(1e-4, 12);
    const e = addZone(d, region);
    expect(e.wallZones).toEqual([{ region, zeta: -0.05 }]);
    expect(removeZone(e, 0).wallZones).toEqual([]);
  });

  it('takes the zeta of a wall material, the middle of its range, or its mobility', () => {
    const z = (m: number) => -m * 1e6;
    expect(wallZeta({ zeta: -0.074, mobility: 5.8e-8 }, z)).toBe(-0.074);
    expect(wallZeta({ zetaMin: -0.11, zetaMax: -0.068 }, z)).toBeCloseTo(-0.089, 12);
    expect(wallZeta({ mobilityMin: 2e-8, mobilityMax: 8e-8 }, z)).toBeCloseTo(-0.05, 12);
    expect(wallZeta({}, z)).toBeNull();
  });
});
