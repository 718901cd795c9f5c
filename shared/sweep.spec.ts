import { loadFixture } from '../tests/fixtures/designs';
import {
  describePointer,
  isLinearPointer,
  numericFields,
  pointerOf,
  pointerTokens,
  rangeValues,
  sweepPoints,
  sweepRequestSchema,
  valueAt,
  withValueAt,
} from './sweep';

describe('JSON pointers (RFC 6901)', () => {
  const doc = { a: [{ b: 1 }, { 'c/d': 2, 'e~f': 3 }], '': 4 };

  it('reads tokens with ~1 and ~0 escapes, and writes them back', () => {
    expect(pointerTokens('/a/1/c~1d')).toEqual(['a', '1', 'c/d']);
    expect(valueAt(doc, '/a/1/c~1d')).toBe(2);
    expect(valueAt(doc, '/a/1/e~0f')).toBe(3);
    expect(valueAt(doc, '/')).toBe(4);
    expect(pointerOf(['a', 1, 'c/d'])).toBe('/a/1/c~1d');
  });

  it('names nothing for missing keys, bad indices and inherited properties', () => {
    expect(valueAt(doc, '/a/2/b')).toBeUndefined();
    expect(valueAt(doc, '/a/01/b')).toBeUndefined();
    expect(valueAt(doc, '/a/-')).toBeUndefined();
    expect(valueAt(doc, '/a/length')).toBeUndefined();
    expect(valueAt({}, '/toString')).toBeUndefined();
  });

  it('sets a number in a copy, leaving the original as it was', () => {
    const copy = withValueAt(doc, '/a/0/b', 7);
    expect(valueAt(copy, '/a/0/b')).toBe(7);
    expect(doc.a[0].b).toBe(1);
    expect(copy.a[1]).toBe(doc.a[1]);
    expect(() => withValueAt(doc, '/a/5/b', 1)).toThrow('names nothing');
  });

  it('knows which fields the solution is linear in', () => {
    expect(isLinearPointer('/ports/0/potential')).toBe(true);
    expect(isLinearPointer('/ports/12/pressure')).toBe(true);
    expect(isLinearPointer('/ports/0/from/0')).toBe(false);
    expect(isLinearPointer('/zeta/side')).toBe(false);
  });
});

describe('ranges and points', () => {
  it('steps linearly and geometrically, ending exactly on the last value', () => {
    expect(rangeValues({ kind: 'linear', from: 0, to: 1, steps: 5 })).toEqual([0, 0.25, 0.5, 0.75, 1]);
    const log = rangeValues({ kind: 'log', from: 1e-6, to: 1e-3, steps: 4 });
    expect(log[3]).toBe(1e-3);
    log.forEach((v, k) => expect(v).toBeCloseTo(10 ** (k - 6), 15));
    expect(rangeValues({ kind: 'list', values: [3, 1, 2] })).toEqual([3, 1, 2]);
  });

  it('lays out two parameters with the first varying fastest', () => {
    expect(sweepPoints([[1, 2, 3], [10, 20]])).toEqual([[1, 10], [2, 10], [3, 10], [1, 20], [2, 20], [3, 20]]);
    expect(sweepPoints([[5, 6]])).toEqual([[5], [6]]);
  });

  it('parses a request: outputs in canonical order, default cells, refusals that name the field', () => {
    const ok = sweepRequestSchema.parse({
      revisionId: 3,
      parameters: [{ pointer: '/depth', range: { kind: 'linear', from: 1e-5, to: 3e-5, steps: 3 } }],
      outputs: ['joulePower', 'portCurrents'],
    });
    expect(ok.outputs).toEqual(['portCurrents', 'joulePower']);
    expect(ok.cells).toBe(120);
    const bad = sweepRequestSchema.safeParse({
      revisionId: 3,
      parameters: [{ pointer: '/depth', range: { kind: 'log', from: -1, to: 2, steps: 3 } }],
      outputs: ['maxField'],
    });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues[0].path).toEqual(['parameters', 0, 'range', 'to']);
    const twice = sweepRequestSchema.safeParse({
      revisionId: 3,
      parameters: [
        { pointer: '/depth', range: { kind: 'list', values: [1] } },
        { pointer: '/depth', range: { kind: 'list', values: [2] } },
      ],
      outputs: ['maxField'],
    });
    expect(twice.success).toBe(false);
    expect(sweepRequestSchema.safeParse({ revisionId: 3, parameters: [{ pointer: 'depth', range: { kind: 'list', values: [1] } }], outputs: ['maxField'] }).success).toBe(false);
  });
});

describe('numeric fields of a design', () => {
  it('lists ports, depth, zeta, buffer and shapes with readable labels, every pointer naming its number', () => {
    const design = loadFixture('cross-injector');
    const fields = numericFields(design);
    const labels = fields.map((f) => f.label);
    expect(labels.slice(0, 3)).toEqual(['Port B potential', 'Port B pressure', 'Port W potential']);
    expect(labels).toEqual(expect.arrayContaining(['Depth', 'Side-wall zeta', 'Buffer conductivity', 'Shape 2 width', 'Shape 1 corner y', 'Port S start x']));
    for (const f of fields) expect(valueAt(design, f.pointer)).toBe(f.value);
    expect(describePointer(design, '/shapes/1/width')).toEqual({ label: 'Shape 2 width', dimension: 'length' });
    expect(describePointer(design, '/zeta/lid')).toEqual({ label: 'Lid zeta', dimension: 'potential' });
  });
});
