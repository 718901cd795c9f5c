import bend from '../../tests/fixtures/designs/bend-90.json';
import cross from '../../tests/fixtures/designs/cross-injector.json';
import straight from '../../tests/fixtures/designs/straight-channel.json';
import type { AnalysisProgress } from './solver-api';
import { compareOutcome, comparisonBuffers, responsesOutcome, traceBuffers, traceOutcome } from './worker-analysis';

describe('the worker’s analyses', () => {
  it('compares slip and pressure into an outcome, with progress over its three solves and two bands, and distinct buffers', () => {
    const seen: AnalysisProgress[] = [];
    const port = bend.ports[bend.ports.length - 1].id;
    const out = compareOutcome(bend, { port, cells: 60 }, (p) => seen.push(p));
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.comparison.pressure.flowRate / out.comparison.slip.flowRate).toBeCloseTo(1, 6);
    expect(new Set(seen.map((p) => p.label))).toEqual(new Set(['slip-driven solve', 'unit-head solve', 'pressure-driven solve', 'slip-driven band', 'pressure-driven band']));
    const fractions = seen.map((p) => p.fraction);
    expect(fractions.every((f, k) => k === 0 || f >= fractions[k - 1] - 1e-12)).toBe(true);
    expect(fractions[fractions.length - 1]).toBeGreaterThan(0.87);
    expect(fractions[fractions.length - 1]).toBeLessThanOrEqual(1);
    expect(out.comparison.slip.band).not.toBeNull();
    expect(out.comparison.pressure.band!.plateHeight).toBeGreaterThan(out.comparison.slip.band!.plateHeight);
    const buffers = comparisonBuffers(out.comparison);
    expect(new Set(buffers).size).toBe(buffers.length);
    expect(buffers.length).toBeGreaterThanOrEqual(18);
  });

  it('refuses a port that does not exist as data', () => {
    const out = compareOutcome(bend, { port: 'NOPE', cells: 40 });
    expect(out).toEqual({ ok: false, error: expect.objectContaining({ code: 'invalid-option', message: expect.stringContaining('no port "NOPE"') }) });
  });

  it('computes a unit response per electrode', () => {
    const labels = new Set<string>();
    const out = responsesOutcome(cross, { cells: 60 }, (p) => labels.add(p.label));
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.responses.drives.map((d) => d.port)).toEqual(['B', 'W', 'S', 'SW']);
    expect(labels).toEqual(new Set(['unit response of B', 'unit response of W', 'unit response of S', 'unit response of SW']));
  });

  it('traces a band to a detector, frames and arrivals ready to transfer', () => {
    const out = traceOutcome(straight, {
      species: { mobility: 0, diffusivity: 1e-10 },
      injection: { kind: 'line', from: [2e-4, 0], to: [2e-4, 5e-5] },
      detector: { from: [1.5e-3, 0], to: [1.5e-3, 5e-5] },
      particles: 100,
      cells: 80,
      frames: 6,
    });
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.run.trace.frames).toHaveLength(6);
    expect(out.run.trace.detector?.arrived).toBe(100);
    const buffers = traceBuffers(out.run);
    expect(buffers).toContain(out.run.trace.frames[0].positions.buffer);
    expect(new Set(buffers).size).toBe(buffers.length);
  });
});
