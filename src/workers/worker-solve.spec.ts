import straight from '../../tests/fixtures/designs/straight-channel.json';
import { defaultCells, measureLayout, resultBuffers, solveOutcome, throttledProgress } from './worker-solve';

describe('the worker’s solve', () => {
  it('measures the narrowest channel and the bounds the grid is chosen from', () => {
    const m = measureLayout(straight);
    expect(m.narrowest).toBeCloseTo(5e-5, 12);
    expect(m.bounds).toEqual([0, 0, 0.002, 5e-5]);
    // About 10 cells across 50 um over 2 mm: 400 along the longer side.
    expect(defaultCells(m)).toBe(400);
    expect(measureLayout({ nonsense: true }).problem).toBeTruthy();
  });

  it('solves into an outcome with cells across the narrowest channel, reporting progress by stage', () => {
    const stages: string[] = [];
    const outcome = solveOutcome(straight, { cells: 80 }, (p) => stages.push(p.stage));
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    expect(outcome.cells).toBe(80);
    expect(outcome.cellsAcross).toBeCloseTo(2, 6); // 2 mm / 80 = 25 um cells, 50 um channel
    expect(outcome.result.ports.map((p) => p.id)).toEqual(['A', 'B']);
    expect(new Set(stages)).toEqual(new Set(['geometry', 'potential', 'flow', 'fields']));
    // Every field array's buffer listed once, ready to transfer.
    const buffers = resultBuffers(outcome.result);
    expect(new Set(buffers).size).toBe(buffers.length);
    expect(buffers).toContain(outcome.result.fields.potential.buffer);
  });

  it('turns a refusal into data (comlink would lose the SolveError’s code)', () => {
    const outcome = solveOutcome({ ...straight, ports: [] }, {});
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(typeof outcome.error.code).toBe('string');
    expect(outcome.error.message.length).toBeGreaterThan(0);
    const stopped = solveOutcome(straight, { cells: 80 }, undefined, undefined, () => true);
    expect(stopped.ok === false && stopped.error.code).toBe('cancelled');
  });

  it('reports progress on a new stage, at the end of a stage, and otherwise at most every interval', () => {
    let t = 0;
    const seen: string[] = [];
    const report = throttledProgress((p) => seen.push(`${p.stage}:${p.fraction}`), 100, () => t);
    report({ stage: 'potential', fraction: 0 });
    t = 50;
    report({ stage: 'potential', fraction: 0.3 });
    t = 120;
    report({ stage: 'potential', fraction: 0.6 });
    t = 130;
    report({ stage: 'potential', fraction: 1 });
    report({ stage: 'flow', fraction: 0 });
    expect(seen).toEqual(['potential:0', 'potential:0.6', 'potential:1', 'flow:0']);
  });
});
