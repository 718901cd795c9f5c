import type { RunDetail } from '../../../../shared/api';
import { currentBalance, fromRun, runSettings, toBase64 } from './shown-solve';
import { makeFields } from './test-fields';

describe('shown solve', () => {
  it('writes base64 that decodes to the same bytes, also for blobs larger than one chunk', () => {
    const bytes = new Uint8Array(100_000).map((_, k) => (k * 7919) % 256);
    expect(Buffer.from(toBase64(bytes), 'base64').equals(Buffer.from(bytes))).toBe(true);
    expect(toBase64(new Uint8Array())).toBe('');
  });

  it('reads a stored run: ports, metrics and warnings from the summary, settings, who stored it', () => {
    const fields = makeFields(3, 2, 1e-5, {});
    const run: RunDetail = {
      id: 12, revisionId: 4, status: 'solved', createdAt: '2026-12-01T10:00:00Z', author: { id: 2, name: 'Jonas Lindqvist' },
      hasFields: true,
      settings: { cells: 600, cellsAcross: 10, narrowest: 5e-5 },
      summary: {
        ports: [{ id: 'A', potential: 1500, current: 2e-5, flowRate: -1e-12, meanSpeed: 1e-3 }, { id: 'B', potential: null, current: -2e-5, flowRate: 1e-12 }],
        metrics: { joulePower: 0.03, maxField: 3e5, reynolds: null, maxWallShearRate: 480 },
        warnings: [{ code: 'high-voltage', message: 'A port is at 1500 V.' }],
        grid: { nx: 3, ny: 2, spacing: 1e-5, fluidCells: 6 },
      },
    };
    const shown = fromRun(run, fields, null);
    expect(shown.source).toBe('run');
    expect(shown.runId).toBe(12);
    expect(shown.ports[0]).toEqual({ id: 'A', potential: 1500, current: 2e-5, flowRate: -1e-12, meanSpeed: 1e-3 });
    // B was stored without a mean speed (a run from before it): no key at all, so the table shows –.
    expect(shown.ports[1]).toStrictEqual({ id: 'B', potential: null, current: -2e-5, flowRate: 1e-12 });
    expect(shown.metrics).toEqual({ joulePower: 0.03, maxField: 3e5, maxWallShearRate: 480 });
    expect(shown.warnings[0].code).toBe('high-voltage');
    expect([shown.cells, shown.cellsAcross, shown.narrowest]).toEqual([600, 10, 5e-5]);
    expect(shown.stored?.by).toBe('Jonas Lindqvist');
    expect(runSettings(shown)).toEqual({ cells: 600, cellsAcross: 10, narrowest: 5e-5 });
  });

  it('sums port currents (Kirchhoff) and finds the largest', () => {
    const b = currentBalance([{ current: 3e-6 }, { current: -1e-6 }, { current: -2e-6 }, { current: NaN }]);
    expect(b.sum).toBeCloseTo(0, 18);
    expect(b.largest).toBe(3e-6);
  });
});
