import { fluidRegion } from '../geometry/fluid-region';
import { ringPerimeter } from '../geometry/ring';
import { loadFixture, type FixtureName } from '../../tests/fixtures/designs';
import { designToDxf, designToSvg, importOutline } from './index';

function measure(shapes: Parameters<typeof fluidRegion>[0]) {
  const region = fluidRegion(shapes);
  const perimeter = region.polygons.flat().reduce((sum, ring) => sum + ringPerimeter(ring), 0);
  return { area: region.area, perimeter, pieces: region.polygons.length, holes: region.polygons.reduce((n, p) => n + p.length - 1, 0) };
}

const FIXTURES: FixtureName[] = ['straight-channel', 'cross-injector', 'bend-90', 'serpentine', 'expansion-chamber', 't-junction'];

describe('outline round trip: export, import back, same fluid', () => {
  it.each(FIXTURES.flatMap((f) => [[f, 'svg'], [f, 'dxf']] as const))('%s through %s keeps area and perimeter within 0.1 %%', (name, format) => {
    const design = loadFixture(name);
    const text = format === 'svg' ? designToSvg(design) : designToDxf(design);
    const back = importOutline(`${name}.${format}`, text);
    const before = measure(design.shapes);
    const after = measure(back.design.shapes);
    expect(Math.abs(after.area / before.area - 1)).toBeLessThan(1e-3);
    expect(Math.abs(after.perimeter / before.perimeter - 1)).toBeLessThan(1e-3);
    expect(after.pieces).toBe(before.pieces);
    expect(after.holes).toBe(before.holes);
    expect(back.report.skipped).toEqual([]);
    // Ports come back where they were; through SVG with their conditions too.
    expect(back.design.ports.map((p) => p.id)).toEqual(design.ports.map((p) => p.id));
    back.design.ports.forEach((p, k) => {
      expect(p.from[0]).toBeCloseTo(design.ports[k].from[0], 12);
      expect(p.to[1]).toBeCloseTo(design.ports[k].to[1], 12);
      if (format === 'svg') expect(p.potential).toBe(design.ports[k].potential);
    });
  });

  it('keeps arcs as arcs: the bend comes back with its arcs, pillars as circles', () => {
    const bend = importOutline('bend.dxf', designToDxf(loadFixture('bend-90')));
    const svg = designToSvg(loadFixture('bend-90'));
    expect(svg).toMatch(/A300 300 0 0 0/); // the outer radius, 300 um, counter-clockwise on the chip
    expect(designToDxf(loadFixture('bend-90'))).toMatch(/\n42\n/);
    expect(bend.report.found.polygons).toBe(1);
    const chamber = loadFixture('expansion-chamber');
    const pillars = chamber.shapes.filter((s) => s.op === 'subtract' && s.type === 'circle').length;
    const back = importOutline('chamber.svg', designToSvg(chamber));
    expect(back.report.found.circles).toBe(pillars);
    expect(back.report.found.subtract).toBe(pillars);
  });

  it('states the units in the files', () => {
    const design = loadFixture('cross-injector');
    const svg = designToSvg(design);
    expect(svg).toMatch(/width="[\d.]+mm" height="[\d.]+mm" viewBox="[-\d.]+ [-\d.]+ [\d.]+ [\d.]+"/);
    const dxf = designToDxf(design);
    expect(dxf).toMatch(/\$INSUNITS\n70\n13\n/);
    expect(dxf).toContain('\nLAYER\n2\nports\n');
  });
});
