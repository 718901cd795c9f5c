import { parseDesign, type DesignDocument } from '../../shared/design';
import cross from '../../tests/fixtures/designs/cross-injector.json';
import { instantComputations as instant } from './instant';

function design(): DesignDocument {
  const r = parseDesign(cross);
  if (!r.ok) throw new Error('bad fixture');
  return r.design;
}

describe('the instant worker', () => {
  const doc = design();

  it('outlines the fluid as rings in metres: one ring for the cross, with its exact area', async () => {
    const rings = await instant.outline(doc.shapes);
    expect(rings).toHaveLength(1);
    // Shoelace area of the ring against the union of the cross's two rectangles (their overlap counted once).
    const ring = rings[0];
    let twice = 0;
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) twice += ring[j][0] * ring[i][1] - ring[i][0] * ring[j][1];
    const rects = doc.shapes.filter((s) => s.type === 'rect') as Array<{ width: number; height: number }>;
    const overlap = Math.min(...rects.map((r) => r.width)) * Math.min(...rects.map((r) => r.height));
    const union = rects.reduce((a, r) => a + r.width * r.height, 0) - overlap;
    expect(Math.abs(twice / 2)).toBeCloseTo(union, 15);
    expect(await instant.outline([])).toEqual([]);
  });

  it('gives the pinched-plug preset for the cross, or says which port is missing', async () => {
    const roles = { sample: 'S', sampleWaste: 'SW', buffer: 'B', waste: 'W' };
    const preset = await instant.pinchedPlug(doc, roles, 0);
    if (!preset.ok) throw new Error(preset.message);
    expect(preset.preset.phases).toHaveLength(2);
    const refused = await instant.pinchedPlug(doc, { ...roles, waste: 'X' }, 0);
    expect(refused).toEqual({ ok: false, message: expect.stringContaining('"X"') });
  });

  it('checks the geometry without notes about resolution, and reads the double layer', async () => {
    expect(await instant.checkGeometry(doc)).toEqual([]);
    const noDrive = await instant.checkGeometry({ ...doc, ports: doc.ports.map((p) => ({ ...p, potential: null, pressure: 0 })) });
    expect(noDrive.map((p) => p.severity)).toContain('error');
    const view = await instant.doubleLayer(
      { ionicStrength: 10, zeta: -0.05, temperature: 298.15, field: 1e4, relativePermittivity: 78.3, viscosity: 8.9e-4, depth: 2e-5, width: 5e-5 },
      'nm',
    );
    // Debye length of a 10 mM 1:1 buffer at 25 °C: 3.04 nm (reference-values.md §2).
    expect(view.report.debyeLength).toBeCloseTo(3.04e-9, 11);
  });
});
