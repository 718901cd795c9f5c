import { makeDesign } from '../../tests/fixtures/designs';
import { pdfText } from '../../tests/integration/pdf-text';
import { solveDesign, type SolveResult } from '../../solver/solve';
import { runReportPdf, type ReportInput } from './run-report';

/** A pressure-driven channel, 100 µm wide and deep, 400 µm long: each port feeds a 100 µm × 100 µm leg. */
const w = 1e-4, L = 4e-4, d = 1e-4;
const design = makeDesign({
  name: 'Report channel',
  depth: d,
  shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: L, height: w }],
  ports: [
    { id: 'A', from: [0, 0], to: [0, w], potential: 0, pressure: 5 },
    { id: 'B', from: [L, 0], to: [L, w], potential: 0, pressure: 0 },
  ],
});

function input(result: SolveResult): ReportInput {
  return {
    design,
    designName: 'Report channel',
    workspace: 'Tidewater Assay Lab',
    revision: { number: 3, note: '', createdAt: '2026-12-01T09:00:00Z' },
    run: { id: 17, createdAt: '2026-12-01T10:00:00Z', author: 'Jonas Lindqvist' },
    review: { state: 'draft', approvedBy: null, approvedAt: null },
    result,
    version: 'test',
  };
}

const sig4 = (v: number) => String(Number(v.toPrecision(4)));

describe('run report', () => {
  const result = solveDesign(design, { cells: 40 });

  it('gives each port the mean speed of its leg, |Q| / (width × depth) in mm/s, and the largest wall shear rate', async () => {
    const text = pdfText(await runReportPdf(input(result)));
    expect(text).toContain('Mean speed (mm/s)');
    const [a, b] = result.ports;
    const meanA = (Math.abs(a.flowRate) / (w * d)) * 1e3, meanB = (Math.abs(b.flowRate) / (w * d)) * 1e3;
    // 5 Pa over 400 µm: about 5.5 mm/s, so the value is printed with its digits in mm/s, not rounded to 0.
    expect(meanA).toBeGreaterThan(1);
    expect(meanA).toBeLessThan(100);
    expect(text).toContain(`A 0 0 ${sig4(a.flowRate * 6e13)} ${sig4(meanA)}`);
    expect(text).toContain(`B 0 0 ${sig4(b.flowRate * 6e13)} ${sig4(meanB)}`);
    expect(text).toMatch(new RegExp(`largest wall shear rate\\s+${sig4(result.metrics.maxWallShearRate!)}\\s+1/s`));
  });

  it('writes - for figures a result does not have', async () => {
    const older: SolveResult = {
      ...result,
      ports: result.ports.map(({ meanSpeed: _m, ...p }) => p),
      metrics: { ...result.metrics, maxWallShearRate: undefined },
    };
    const text = pdfText(await runReportPdf(input(older)));
    expect(text).toContain(`A 0 0 ${sig4(result.ports[0].flowRate * 6e13)} -`);
    expect(text).toMatch(/largest wall shear rate\s+-\s+1\/s/);
  });
});
