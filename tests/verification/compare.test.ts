import { compareDrives } from '../../solver/compare';
import { loadFixture } from '../fixtures/designs';

/**
 * Compare: slip-driven against pressure-driven operation at a matched flow rate (product.md, capability 5).
 * With uniform zeta and equal heads the slip flow is irrotational (Cummings, Griffiths, Nilson & Paul,
 * Anal. Chem. 72, 2526 (2000)); the pressure-driven flow through the same port carries wall vorticity.
 */
describe('compare slip against pressure', () => {
  const design = loadFixture('bend-90');
  const port = design.ports[design.ports.length - 1].id;
  const cmp = compareDrives(design, port, { cells: 160 });

  it('matches the flow rate through the chosen port', () => {
    expect(cmp.pressure.flowRate / cmp.slip.flowRate).toBeCloseTo(1, 8);
    expect(Math.abs(cmp.slip.flowRate)).toBeGreaterThan(0);
  });

  it('finds the slip-driven flow nearly free of vorticity and the pressure-driven flow full of it', () => {
    expect(cmp.slip.meanVorticity).toBeLessThan(0.05 * cmp.pressure.meanVorticity);
    expect(cmp.pressure.wallShear).toBeGreaterThan(cmp.slip.wallShear);
  });

  it('gives more depth-wise Taylor–Aris dispersion under pressure than under slip (physics.md §5)', () => {
    expect(cmp.slip.dispersionRatio).toBeCloseTo(1, 2);
    expect(cmp.pressure.dispersionRatio).toBeGreaterThan(1.01);
  });

  it('drives the pressure case with heads in the pattern of the port potentials and no field', () => {
    const f = cmp.pressure.result.fields;
    let maxField = 0;
    for (let c = 0; c < f.fieldX.length; c++) if (f.fraction[c] > 0) maxField = Math.max(maxField, Math.hypot(f.fieldX[c], f.fieldY[c]));
    expect(maxField).toBe(0);
    for (const p of design.ports) {
      if (p.potential !== null) expect(cmp.pressures[p.id]).toBeCloseTo(cmp.pressurePerVolt * p.potential, 6);
    }
  });

  it('refuses a port that does not exist, naming it', () => {
    expect(() => compareDrives(design, 'NOPE', { cells: 60 })).toThrow('no port "NOPE"');
  });
});
