import { parseDesign, type DesignDocument } from '../../../../shared/design';
import cross from '../../../../tests/fixtures/designs/cross-injector.json';
import { instantComputations } from '../../../workers/instant';
import { acrossPort, arrivalHistogram, defaultBand, phaseAt, rectangle, traceRequest, type TraceForm } from './tracer-model';

function design(): DesignDocument {
  const r = parseDesign(cross);
  if (!r.ok) throw new Error('bad fixture');
  return r.design;
}

describe('tracer model', () => {
  const doc = design();
  let rings: Awaited<ReturnType<typeof instantComputations.outline>> = [];
  beforeAll(async () => {
    rings = await instantComputations.outline(doc.shapes);
  });

  it('draws a segment across the channel at a port, inside the fluid', () => {
    // W is the right end of the horizontal channel (x = 3 mm, y 0.975 to 1.025 mm): three widths in, to the left.
    const seg = acrossPort(doc.ports[1], rings, 3, 0);
    expect(seg.from[0]).toBeCloseTo(3e-3 - 1.5e-4, 9);
    expect(seg.to[0]).toBeCloseTo(3e-3 - 1.5e-4, 9);
    expect([seg.from[1], seg.to[1]].sort()).toEqual([0.000975, 0.001025].map((v) => expect.closeTo(v, 9)));
    const band = defaultBand(doc, rings)!;
    // Highest potential W (1 kV) to the lowest, B (0 V).
    expect(band.injection.from[0]).toBeGreaterThan(2.8e-3);
    expect(band.detector.from[0]).toBeLessThan(2e-4);
    expect(defaultBand({ ...doc, ports: doc.ports.map((p) => ({ ...p, potential: null })) }, rings)).toBeNull();
  });

  it('builds the worker request, or says what is missing', () => {
    const form: TraceForm = {
      mode: 'line', mobility: -2e-8, diffusivity: 1e-10, particles: 500, seed: 4, duration: null,
      line: { from: [0, 0], to: [0, 1e-4] }, region: null, detector: null, pinched: null,
    };
    expect(traceRequest(form)).toEqual({ problem: 'Draw a detector line, or give a duration.' });
    expect(traceRequest({ ...form, duration: 0.5 })).toEqual({
      request: { species: { mobility: -2e-8, diffusivity: 1e-10 }, particles: 500, seed: 4, frames: 60, detector: undefined, injection: { kind: 'line', from: [0, 0], to: [0, 1e-4] }, phases: [{ duration: 0.5 }] },
    });
    expect(traceRequest({ ...form, mode: 'region' })).toEqual({ problem: 'Draw the injection region over a channel.' });
    const region = rectangle([0, 0], [1, 2]);
    expect(region).toEqual([[0, 0], [1, 0], [1, 2], [0, 2]]);
    expect(traceRequest({ ...form, mode: 'pinched' })).toEqual({ problem: 'Pick the four ports of the cross.' });
  });

  it('finds the phase at a time and bins arrival times', () => {
    expect([0, 0.01, 0.02, 0.5, 9].map((t) => phaseAt([0.02, 1], t))).toEqual([0, 0, 1, 1, 1]);
    const h = arrivalHistogram(Array.from({ length: 100 }, (_, k) => 1 + k / 100));
    expect(h.counts).toHaveLength(10);
    expect(h.counts.reduce((a, b) => a + b, 0)).toBe(100);
    expect(h.edges[0]).toBe(1);
    expect(h.edges[10]).toBeCloseTo(1.99, 12);
    expect(arrivalHistogram([])).toEqual({ edges: [], counts: [] });
  });
});
