import type { NumericField } from '../../../../shared/sweep';
import { buildRequest, defaultParameter } from './sweep-request';
import { seriesGroups, sweepCsv, sweepSeries } from './sweep-series';
import { applySweepEvent, isFinished } from './sweep-state';
import { sampleSweep } from './testing';

describe('sweep series, CSV and events', () => {
  it('makes one series per port and metric asked for, grouped by plot', () => {
    const series = sweepSeries(sampleSweep());
    expect(series.map((s) => s.label)).toEqual(['Current at A', 'Current at B', 'Largest field strength', 'Warnings']);
    expect(series[1].values).toEqual([-1e-6, -2e-6, -3e-6]);
    expect(series[3].values).toEqual([0, 0, 1]);
    expect(seriesGroups(series).map((g) => [g.group, g.series.length])).toEqual([['Port currents', 2], ['Largest field strength', 1], ['Warnings', 1]]);
  });

  it('writes CSV with SI units in the header and full precision', () => {
    const lines = sweepCsv(sampleSweep()).trim().split('\n');
    expect(lines[0]).toBe('point,Shape 2 width (m),state,Current at A (A),Current at B (A),Largest field strength (V/m),Warnings,warning codes');
    expect(lines[1]).toBe('1,0.00005,solved,0.000001,-0.000001,10000,0,');
    expect(lines[3].endsWith(',1,high-voltage')).toBe(true);
  });

  it('folds the event stream into the sweep', () => {
    const start = sampleSweep({ status: 'solving', done: 0 });
    let s = applySweepEvent(null, { type: 'snapshot', sweep: start });
    const point = { ...start.points[1], status: 'failed' as const, error: 'overlap' };
    s = applySweepEvent(s, { type: 'point', point });
    expect(s!.points[1].error).toBe('overlap');
    const { points: _points, ...summary } = sampleSweep();
    s = applySweepEvent(s, { type: 'status', sweep: summary });
    expect(s!.status).toBe('solved');
    expect(s!.points[1].status).toBe('failed');
    expect(isFinished(s!.status)).toBe(true);
  });
});

describe('the sweep form', () => {
  const fields: NumericField[] = [
    { pointer: '/ports/0/potential', label: 'Port S potential', dimension: 'potential', value: 400 },
    { pointer: '/shapes/1/width', label: 'Shape 2 width', dimension: 'length', value: 5e-5 },
  ];

  it('starts from a range around the present value', () => {
    expect(defaultParameter(fields[0])).toMatchObject({ kind: 'linear', from: '0 V', to: '800 V', steps: 11 });
    expect(defaultParameter(fields[1])).toMatchObject({ from: '25 µm', to: '75 µm' });
  });

  it('reads quantities with units into a request and says whether it superposes', () => {
    const built = buildRequest(11, [{ ...defaultParameter(fields[1]), from: '40 um', to: '0.06 mm', steps: 3 }], ['maxField'], 80, fields);
    expect(built).toMatchObject({ ok: true, points: 3, superposed: false });
    if (!built.ok) throw new Error(built.message);
    expect(built.request.parameters[0].range).toEqual({ kind: 'linear', from: 4e-5, to: 6e-5, steps: 3 });
    const linear = buildRequest(11, [{ ...defaultParameter(fields[0]), kind: 'list', list: '100, 1.2 kV' }], ['portCurrents'], 80, fields);
    expect(linear).toMatchObject({ ok: true, superposed: true, request: { parameters: [{ range: { kind: 'list', values: [100, 1200] } }] } });
  });

  it('names what is wrong: units, too many points, no output', () => {
    expect(buildRequest(1, [{ ...defaultParameter(fields[1]), from: '40 V' }], ['maxField'], 80, fields)).toMatchObject({ ok: false, message: expect.stringContaining('Parameter 1, from') });
    const big = buildRequest(1, [{ ...defaultParameter(fields[0]), steps: 30 }, { ...defaultParameter(fields[1]), steps: 20 }], ['maxField'], 80, fields);
    expect(big).toMatchObject({ ok: false, points: 600, message: expect.stringContaining('at most 400') });
    expect(buildRequest(1, [defaultParameter(fields[1])], [], 80, fields)).toMatchObject({ ok: false, message: 'Choose at least one output' });
  });
});
