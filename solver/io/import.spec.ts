import { fluidRegion } from '../geometry/fluid-region';
import { IMPORT_LIMITS, ImportError, importOutline } from './index';

const svg = (body: string, root = 'width="10mm" height="5mm" viewBox="0 0 10000 5000"') =>
  `<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" ${root}>${body}</svg>`;

function refusal(name: string, text: string): ImportError {
  try {
    importOutline(name, text);
  } catch (error) {
    if (error instanceof ImportError) return error;
    throw error;
  }
  throw new Error('was not refused');
}

/** A minimal ASCII DXF with the given entity groups. */
function dxf(entities: string, units = 4): string {
  return ['0', 'SECTION', '2', 'HEADER', '9', '$INSUNITS', '70', String(units), '0', 'ENDSEC', '0', 'SECTION', '2', 'ENTITIES', entities.trim(), '0', 'ENDSEC', '0', 'EOF'].join('\n') + '\n';
}
const dxfLine = (x1: number, y1: number, x2: number, y2: number) => `0\nLINE\n8\n0\n10\n${x1}\n20\n${y1}\n30\n0\n11\n${x2}\n21\n${y2}\n31\n0`;
const dxfArc = (cx: number, cy: number, r: number, a0: number, a1: number) => `0\nARC\n8\n0\n10\n${cx}\n20\n${cy}\n30\n0\n40\n${r}\n50\n${a0}\n51\n${a1}`;

describe('SVG import', () => {
  it('scales by the document units: 10 mm over a viewBox of 10000 gives 1 um per unit; y turns up', () => {
    const r = importOutline('a.svg', svg('<rect x="0" y="0" width="2000" height="100"/>'));
    expect(r.report.metresPerUnit).toBeCloseTo(1e-6, 15);
    const s = r.design.shapes[0];
    expect(s.type).toBe('polygon');
    expect(fluidRegion(r.design.shapes).area).toBeCloseTo(2000e-6 * 100e-6, 15);
    expect(r.report.bounds[3]).toBeCloseTo(0, 15);
    expect(r.report.bounds[1]).toBeCloseTo(-100e-6, 15);
  });

  it('takes a typed scale over the document units, and px without units', () => {
    expect(importOutline('a.svg', svg('<rect width="10" height="10"/>', ''), {}).report.metresPerUnit).toBeCloseTo(0.0254 / 96, 12);
    expect(importOutline('a.svg', svg('<rect width="10" height="10"/>'), { scale: 1e-5 }).report.metresPerUnit).toBe(1e-5);
  });

  it('nests loops even-odd: a hole subtracts, an island inside it adds', () => {
    const r = importOutline('a.svg', svg(
      '<path d="M0 0H1000V1000H0Z M200 200H800V800H200Z"/><circle cx="500" cy="500" r="100"/>',
    ));
    expect(r.design.shapes.map((s) => [s.op, s.type])).toEqual([['add', 'polygon'], ['subtract', 'polygon'], ['add', 'circle']]);
    const area = fluidRegion(r.design.shapes).area;
    expect(area / 1e-12).toBeCloseTo(1000 * 1000 - 600 * 600 + Math.PI * 100 * 100, -1);
  });

  it('follows transforms, keeps circular arcs under a rotation and flattens curves and ellipses', () => {
    const r = importOutline('a.svg', svg(
      '<g transform="translate(100 100) rotate(30)"><path d="M0 0 L400 0 A200 200 0 0 1 400 400 L0 400 Z"/></g>' +
      '<path d="M2000 0 C2500 0 2500 500 2000 500 Q1800 250 2000 0Z"/><ellipse cx="4000" cy="1000" rx="300" ry="100"/>',
    ));
    expect(r.report.found.loops).toBe(3);
    expect(r.report.skipped).toEqual([]);
    const ellipse = fluidRegion([r.design.shapes[2]]).area;
    expect(ellipse / (Math.PI * 300e-6 * 100e-6)).toBeCloseTo(1, 3);
  });

  it('makes ports from a ports group and reports what it skips, with where', () => {
    const r = importOutline('a.svg', svg(
      '<rect width="1000" height="100"/><g id="ports"><line data-port="in" data-potential="5" x1="0" y1="0" x2="0" y2="100"/></g>' +
      '<path id="stray" d="M0 500 L300 500"/><text x="10" y="20">label</text>',
    ));
    expect(r.design.ports).toEqual([expect.objectContaining({ id: 'in', potential: 5, from: [0, 0], to: [0, -100e-6] })]);
    expect(r.report.skipped.map((s) => s.entity)).toEqual(['<text>', '<path id="stray">']);
    expect(r.report.skipped[1].at![1]).toBeCloseTo(-500e-6, 12);
    expect(r.report.skipped[1].reason).toMatch(/open outline/);
  });

  it.each([
    ['a script', svg('<script>alert(1)</script><rect width="10" height="10"/>'), /script/],
    ['an onload handler', svg('<rect width="10" height="10"/>', 'onload="alert(1)"'), /event handler/],
    ['an external image', svg('<image xlink:href="http://example.invalid/x.png" width="1" height="1"/><rect width="10" height="10"/>'), /outside the file/],
    ['an external use', svg('<use href="other.svg#a"/>'), /outside the file/],
    ['a javascript link', svg('<a href="javascript:alert(1)"><rect width="10" height="10"/></a>'), /outside the file|script/],
    ['an entity', `<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY x SYSTEM "file:///etc/passwd">]><svg xmlns="http://www.w3.org/2000/svg"><text>&x;</text></svg>`, /entities/],
    ['an entity bomb', `<!DOCTYPE svg [<!ENTITY a "aaaaaaaaaa"><!ENTITY b "&a;&a;&a;&a;">]><svg xmlns="http://www.w3.org/2000/svg"/>`, /entities/],
    ['a foreign object', svg('<foreignObject><div xmlns="http://www.w3.org/1999/xhtml">x</div></foreignObject>'), /foreignObject/],
    ['a style that loads', svg('<rect style="fill:url(http://example.invalid/p)" width="1" height="1"/>'), /outside the file/],
  ])('refuses an SVG with %s as hostile', (_what, text, message) => {
    const e = refusal('x.svg', text);
    expect(e.code).toBe('hostile');
    expect(e.message).toMatch(message);
  });

  it.each([
    ['truncated XML', svg('<rect width="10" height="10"/>').slice(0, 120), 'malformed'],
    ['a path with garbage', svg('<path d="M0 0 L 10 zz"/>'), 'malformed'],
    ['not XML at all', 'hello', 'malformed'],
    ['no outline', svg('<text x="1" y="1">only words</text>'), 'empty'],
    ['absurd coordinates', svg('<rect width="1e12" height="10"/>'), 'out-of-range'],
    ['a chip larger than a metre', svg('<rect width="2000000" height="10"/>'), 'out-of-range'],
    ['too many elements', svg('<g/>'.repeat(IMPORT_LIMITS.maxElements + 1)), 'too-large'],
    ['too large a file', svg(`<!-- ${'x'.repeat(IMPORT_LIMITS.maxBytes)} -->`), 'too-large'],
  ])('refuses %s', (_what, text, code) => {
    expect(refusal('x.svg', text).code).toBe(code);
  });

  it('refuses a wrong extension and a renamed file', () => {
    expect(refusal('x.png', svg('<rect width="1" height="1"/>')).code).toBe('unsupported');
    expect(refusal('x.svg', dxf(dxfLine(0, 0, 1, 1))).message).toMatch(/not XML/);
    expect(refusal('x.dxf', svg('<rect width="1" height="1"/>')).message).toMatch(/XML/);
  });
});

describe('DXF import', () => {
  it('joins LINE and ARC entities end to end into a loop and keeps the arc as a sector', () => {
    // A 90° bend, inner radius 1 mm, outer 2 mm, drawn as two lines and two arcs in any order and direction.
    const text = dxf([dxfArc(0, 0, 2, 0, 90), dxfLine(1, 0, 2, 0), dxfArc(0, 0, 1, 0, 90), dxfLine(0, 2, 0, 1)].join('\n'));
    const r = importOutline('bend.dxf', text);
    expect(r.report.unitsSource).toMatch(/millimetres/);
    expect(r.design.shapes).toEqual([
      expect.objectContaining({ op: 'add', type: 'sector', innerRadius: 1e-3, outerRadius: 2e-3, startAngle: 0, endAngle: 90 }),
    ]);
  });

  it('reads LWPOLYLINE bulges as arcs (a stadium of two half circles)', () => {
    const poly = '0\nLWPOLYLINE\n8\n0\n90\n4\n70\n1\n10\n0\n20\n0\n10\n4\n20\n0\n42\n1\n10\n4\n20\n2\n10\n0\n20\n2\n42\n1';
    const r = importOutline('s.dxf', dxf(poly, 13));
    const area = fluidRegion(r.design.shapes).area;
    expect(area / ((4 * 2 + Math.PI) * 1e-12)).toBeCloseTo(1, 5);
  });

  it('reports open and unsupported entities by name and position', () => {
    const text = dxf([dxfLine(0, 0, 1, 0), dxfLine(1, 0, 1, 1), dxfLine(1, 1, 0, 0), dxfLine(5, 5, 6, 6), '0\nPOINT\n8\n0\n10\n3\n20\n4\n30\n0'].join('\n'));
    const r = importOutline('t.dxf', text);
    expect(r.report.found.polygons).toBe(1);
    expect(r.report.skipped).toEqual([
      expect.objectContaining({ entity: expect.stringMatching(/^POINT/), at: [3e-3, 4e-3] }),
      expect.objectContaining({ entity: expect.stringMatching(/^LINE/), at: [5e-3, 5e-3], reason: expect.stringMatching(/open/) }),
    ]);
  });

  it.each([
    ['absurd coordinates', dxf(dxfLine(0, 0, 1e300, 0) + '\n' + dxfLine(1e300, 0, 0, 0)), 'out-of-range'],
    ['coordinates past a metre once scaled', dxf([dxfLine(0, 0, 5000, 0), dxfLine(5000, 0, 0, 5), dxfLine(0, 5, 0, 0)].join('\n')), 'out-of-range'],
    ['a truncated file', dxf(dxfLine(0, 0, 1, 0)).slice(0, 60), 'malformed'],
    ['a file that is not DXF', 'this is not a drawing\n', 'malformed'],
    ['a binary DXF', 'AutoCAD Binary DXF\r\n\u001a\u0000', 'malformed'],
    ['no closed outline', dxf(dxfLine(0, 0, 1, 0)), 'empty'],
  ])('refuses %s', (_what, text, code) => {
    expect(refusal('x.dxf', text).code).toBe(code);
  });
});
