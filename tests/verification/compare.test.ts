import { compareDrives } from '../../solver/compare';
import { loadFixture, makeDesign } from '../fixtures/designs';

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

  it('refuses a reference diffusivity that is not a positive number, before any solve', () => {
    for (const D of [0, -1e-9, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => compareDrives(design, design.ports[0].id, { cells: 60, referenceDiffusivity: D })).toThrow(/reference diffusivity must be a positive number/);
    }
  });
});

/**
 * The band each drive gives, from the tracer (solver/compare/band.ts). A straight channel 200 µm wide and 10 µm
 * deep (w/d = 20, so the side-wall layers of the pressure drive, about d/√12 thick, hold under 3 % of the band),
 * uniform zeta, 513 V over 2 mm: about 10 mm/s, Pe = U d / D ≈ 100 for D = 1e-9 m²/s.
 *
 * Statistical tolerance: the sample variance of n arrival times has a relative standard error of √(2/(n − 1)),
 * 3.2 % for n = 2000; we allow 10 % (three standard errors). Measured with seed 1 at 100 cells: slip
 * D_app/D = 0.985, pressure D_app against the plate value 48.4 against 48.5.
 */
describe('compare: band spreading from the tracer', () => {
  const w = 2e-4, depth = 1e-5, length = 2e-3, D = 1e-9;
  const design = makeDesign({
    depth,
    zeta: { side: -0.05, floor: -0.05, lid: -0.05 },
    shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: length, height: w, angle: 0 }],
    ports: [
      { id: 'A', from: [0, 0], to: [0, w], potential: 513, pressure: 0 },
      { id: 'B', from: [length, 0], to: [length, w], potential: 0, pressure: 0 },
    ],
  });
  const cmp = compareDrives(design, 'A', { cells: 100, referenceDiffusivity: D, seed: 1 });
  const slip = cmp.slip.band!;
  const pressure = cmp.pressure.band!;

  it('releases one band across the channel for both drives and detects it a few widths on', () => {
    expect(cmp.bandProblem).toBeNull();
    expect(cmp.band).toMatchObject({ particles: 2000, seed: 1, mobility: 0, diffusivity: D });
    expect(cmp.band!.distance).toBeGreaterThanOrEqual(2 * w);
    expect(cmp.band!.width).toBeCloseTo(w, 9);
    // Flow enters through A: the release line is the nearer one.
    expect(cmp.band!.release.from[0]).toBeLessThan(cmp.band!.detector.from[0]);
    expect(slip.arrived).toBeGreaterThan(0.99 * 2000);
    expect(pressure.arrived).toBeGreaterThan(0.99 * 2000);
    expect(slip.counts.reduce((a, b) => a + b, 0)).toBe(slip.arrived);
    expect(cmp.band!.edges).toHaveLength(slip.counts.length + 1);
  });

  it('spreads the slip-driven band by molecular diffusion only: σ² = 2 D t, H = 2 D / U (Einstein 1905; reference-values.md §6, ideal plug flow)', () => {
    // First passage of a line band at distance L in plug flow: t̄ = L / U, σ_t² = 2 D L / U³, so U² σ_t² = 2 D t̄.
    const U = slip.speed;
    expect(slip.meanTime * U).toBeGreaterThan(0.97 * cmp.band!.distance);
    expect(slip.meanTime * U).toBeLessThan(1.03 * cmp.band!.distance);
    expect((U * U * slip.timeVariance) / (2 * D * slip.meanTime)).toBeGreaterThan(0.9);
    expect((U * U * slip.timeVariance) / (2 * D * slip.meanTime)).toBeLessThan(1.1);
    expect(slip.plateHeight / ((2 * D) / U)).toBeGreaterThan(0.9);
    expect(slip.plateHeight / ((2 * D) / U)).toBeLessThan(1.1);
    expect(slip.effectiveDiffusivity / D).toBeCloseTo(cmp.slip.dispersionRatio, 0);
  });

  it('spreads the pressure-driven band by Taylor–Aris, D (1 + Pe²/210) with Pe = U d / D (Aris 1956; physics.md §5; reference-values.md §6)', () => {
    const U = pressure.speed;
    expect(U / slip.speed).toBeGreaterThan(0.97);
    const Pe = (U * depth) / D;
    expect(Pe).toBeGreaterThan(80);
    const taylorAris = 1 + (Pe * Pe) / 210;
    // In-plane shear at the side walls only adds to it; at w/d = 20 and this travel it is within the statistics.
    expect(pressure.effectiveDiffusivity / D / taylorAris).toBeGreaterThan(0.9);
    expect(pressure.effectiveDiffusivity / D / taylorAris).toBeLessThan(1.1);
    expect(pressure.plateHeight).toBeGreaterThan(20 * slip.plateHeight);
  });

  it('gives the same figures again from the same seed, and other ones from another seed', () => {
    const small = { cells: 60, referenceDiffusivity: D, particles: 200 };
    const a = compareDrives(design, 'A', { ...small, seed: 7 });
    const b = compareDrives(design, 'A', { ...small, seed: 7 });
    const c = compareDrives(design, 'A', { ...small, seed: 8 });
    expect(b.pressure.band).toEqual(a.pressure.band);
    expect(b.slip.band).toEqual(a.slip.band);
    expect(c.pressure.band!.timeVariance).not.toBe(a.pressure.band!.timeVariance);
  });

  it('runs no band when asked for none', () => {
    const none = compareDrives(design, 'A', { cells: 60, particles: 0 });
    expect(none.band).toBeNull();
    expect(none.slip.band).toBeNull();
  });
});
