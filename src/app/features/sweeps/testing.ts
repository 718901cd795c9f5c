import type { SweepDetail, SweepPoint, SweepPointResult } from '../../../../shared/api';

/** A small finished sweep for specs: width of shape 2 at three values, ports A and B. */
export function sampleSweep(over: Partial<SweepDetail> = {}): SweepDetail {
  const result = (k: number): SweepPointResult => ({
    ports: [
      { id: 'A', potential: 100, current: 1e-6 * (k + 1), flowRate: 2e-12 * (k + 1) },
      { id: 'B', potential: 0, current: -1e-6 * (k + 1), flowRate: -2e-12 * (k + 1) },
    ],
    metrics: { joulePower: 1e-4 * (k + 1), maxField: 1e4 * (k + 1), maxVorticity: 50 * (k + 1), maxSpeed: 1e-3 },
    warnings: k === 2 ? [{ code: 'high-voltage', message: 'A port is at 100 V.' }] : [],
  });
  const points: SweepPoint[] = [5e-5, 6e-5, 7e-5].map((v, k) => ({
    index: k, values: [v], status: 'solved', result: result(k), error: null, attempts: 1, seconds: 0.1, runId: null,
  }));
  return {
    id: 7, designId: 3, revisionId: 11, revisionNumber: 2, status: 'solved', method: 'jobs',
    parameters: [{ pointer: '/shapes/1/width', label: 'Shape 2 width', dimension: 'length', range: { kind: 'list', values: [5e-5, 6e-5, 7e-5] }, values: [5e-5, 6e-5, 7e-5] }],
    outputs: ['portCurrents', 'maxField', 'warnings'], cells: 80, total: 3, done: 3, failed: 0, message: null,
    createdAt: '2026-12-02T00:00:00.000Z', finishedAt: '2026-12-02T00:00:05.000Z', author: { id: 1, name: 'Jonas Lindqvist' },
    points, ...over,
  };
}
