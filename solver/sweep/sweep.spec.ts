import { loadFixture } from '../../tests/fixtures/designs';
import { solveDesign } from '../solve';
import { pointDocument, pointResult, solvePoint, superposable, superposedSweep } from '.';

const CELLS = 60;

function close(a: number, b: number, scale: number): void {
  expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-6 * scale);
}

describe('sweep points', () => {
  it('solves the point document exactly as a direct solve of it', () => {
    const design = loadFixture('cross-injector');
    const doc = pointDocument(design, ['/shapes/1/width'], [6e-5]);
    expect(doc.shapes[1]).toMatchObject({ width: 6e-5 });
    expect(design.shapes[1]).toMatchObject({ width: 5e-5 });
    expect(solvePoint(design, ['/shapes/1/width'], [6e-5], { cells: CELLS })).toEqual(pointResult(solveDesign(doc, { cells: CELLS })));
  });

  it('superposes port potentials to the direct solves, maxima and checks included', () => {
    const design = loadFixture('cross-injector');
    const pointers = ['/ports/1/potential', '/ports/2/potential'];
    expect(superposable(pointers)).toBe(true);
    expect(superposable(['/ports/1/potential', '/depth'])).toBe(false);
    const points = [[0, 0], [1000, 300], [40, 20], [-500, 900]];
    const { results, solves } = superposedSweep(design, pointers, points, { cells: CELLS });
    expect(solves).toBe(4);
    points.forEach((values, k) => {
      const direct = pointResult(solveDesign(pointDocument(design, pointers, values), { cells: CELLS }));
      const got = results[k];
      const currentScale = Math.max(...direct.ports.map((p) => Math.abs(p.current)), 1e-12);
      const flowScale = Math.max(...direct.ports.map((p) => Math.abs(p.flowRate)), 1e-24);
      direct.ports.forEach((p, j) => {
        expect(got.ports[j].id).toBe(p.id);
        close(got.ports[j].current, p.current, currentScale);
        close(got.ports[j].flowRate, p.flowRate, flowScale);
      });
      close(got.metrics.maxField, direct.metrics.maxField, direct.metrics.maxField);
      close(got.metrics.maxVorticity, direct.metrics.maxVorticity, direct.metrics.maxVorticity);
      close(got.metrics.joulePower, direct.metrics.joulePower, Math.abs(direct.metrics.joulePower) + 1e-30);
      expect(got.warnings.map((w) => w.code).sort()).toEqual(direct.warnings.map((w) => w.code).sort());
    });
  });
});
