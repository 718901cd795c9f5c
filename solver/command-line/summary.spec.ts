import { makeDesign } from '../../tests/fixtures/designs';
import { solveDesign } from '../solve';
import { formatFlow, formatSI, formatSummary } from './summary';

describe('the summary units', () => {
  it('writes values with an SI prefix and 4 significant digits', () => {
    expect(formatSI(-5.698215e-5, 'A')).toBe('-56.98 µA');
    expect(formatSI(1000, 'V')).toBe('1 kV');
    expect(formatSI(0, 'V')).toBe('0 V');
    expect(formatSI(null, 'V')).toBe('—');
    expect(formatSI(NaN, 'Pa')).toBe('—');
    expect(formatSI(3.04e-9, 'm')).toBe('3.04 nm');
    expect(formatSI(999.99999, 'V')).toBe('1 kV');
  });
  it('gives flow rates per minute', () => {
    expect(formatFlow(3.351e-12)).toBe('201.1 nL/min');
  });
});

describe('the human-readable summary', () => {
  const w = 1e-4, L = 4e-4, d = 1e-4;
  const design = makeDesign({
    depth: d,
    shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: L, height: w }],
    ports: [
      { id: 'A', from: [0, 0], to: [0, w], potential: 0, pressure: 5 },
      { id: 'B', from: [L, 0], to: [L, w], potential: 0, pressure: 0 },
    ],
  });
  const result = solveDesign(design, { cells: 40 });

  it('prints each port’s mean speed, |Q| / (port width × depth), and the largest wall shear rate', () => {
    const text = formatSummary(design, result);
    const [a, b] = result.ports;
    const rowA = text.split('\n').find((l) => /^\s+A\s/.test(l))!;
    const rowB = text.split('\n').find((l) => /^\s+B\s/.test(l))!;
    expect(text).toMatch(/port\s+potential\s+current\s+flow rate\s+mean speed/);
    expect(rowA.trimEnd().endsWith(formatSI(Math.abs(a.flowRate) / (w * d), 'm/s'))).toBe(true);
    expect(rowB.trimEnd().endsWith(formatSI(Math.abs(b.flowRate) / (w * d), 'm/s'))).toBe(true);
    expect(rowA).toMatch(/ mm\/s$/);
    const shear = /largest wall shear rate\s+([\d.]+) 1\/s/.exec(text);
    expect(Number(shear?.[1])).toBeCloseTo(result.metrics.maxWallShearRate!, -1);
    expect(text).toMatch(/Reynolds number\s+[\d.]+/);
  });

  it('shows — where a result lacks the added figures', () => {
    const older = { ...result, ports: result.ports.map(({ meanSpeed: _m, ...p }) => p), metrics: { ...result.metrics, maxWallShearRate: undefined } };
    const text = formatSummary(design, older);
    expect(text.split('\n').find((l) => /^\s+A\s/.test(l))!.trimEnd()).toMatch(/—$/);
    expect(text).toMatch(/largest wall shear rate\s+—/);
  });
});
