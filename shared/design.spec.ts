import { fixtureFiles, makeDesign } from '../tests/fixtures/designs';
import { fieldPath, parseDesign, type DesignDocument } from './design';

function base(): Record<string, unknown> {
  return JSON.parse(JSON.stringify(fixtureFiles['straight-channel'])) as Record<string, unknown>;
}

function refusals(json: unknown): Array<{ field: string; message: string }> {
  const result = parseDesign(json);
  if (result.ok) throw new Error('expected the design to be refused');
  return result.errors;
}

describe('parseDesign', () => {
  it('accepts every fixture', () => {
    for (const [name, json] of Object.entries(fixtureFiles)) {
      const result = parseDesign(json);
      expect({ name, ok: result.ok }).toEqual({ name, ok: true });
    }
  });

  it('fills in the defaults: rect angle 0, port pressure 0, floor and lid zeta from side, no wall zones', () => {
    const result = parseDesign({
      format: 'osmolane.design/1',
      name: 'defaults',
      depth: 2e-5,
      buffer: { relativePermittivity: 78.4, viscosity: 8.9e-4, density: 997, conductivity: 0.14, ionicStrength: 10, temperature: 298.15 },
      zeta: { side: -0.04, lid: -0.02 },
      shapes: [{ op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5 }],
      ports: [{ id: 'A', from: [0, 0], to: [0, 5e-5], potential: 1 }],
    });
    expect(result.ok).toBe(true);
    const design = (result as { design: DesignDocument }).design;
    expect(design.zeta).toEqual({ side: -0.04, floor: -0.04, lid: -0.02 });
    expect(design.shapes[0]).toMatchObject({ angle: 0 });
    expect(design.ports[0].pressure).toBe(0);
    expect(design.wallZones).toEqual([]);
  });

  it('reads the example of design-format.md', () => {
    const design = makeDesign({
      shapes: [
        { op: 'add', type: 'rect', x: 0, y: 0, width: 1e-3, height: 5e-5, angle: 0 },
        { op: 'add', type: 'sector', center: [0, 0], innerRadius: 1e-4, outerRadius: 1.5e-4, startAngle: 0, endAngle: 90 },
        { op: 'add', type: 'polygon', points: [[0, 0], [1e-4, 0], [1e-4, 1e-4]] },
        { op: 'add', type: 'circle', center: [5e-4, 2.5e-5], radius: 1e-5 },
        { op: 'subtract', type: 'circle', center: [5e-4, 2.5e-5], radius: 5e-6 },
      ],
      ports: [
        { id: 'S', name: 'sample', from: [0, 0], to: [0, 5e-5], potential: 0, pressure: 0 },
        { id: 'W', name: 'waste', from: [1e-3, 0], to: [1e-3, 5e-5], potential: null, pressure: 0 },
      ],
      wallZones: [{ region: { type: 'rect', x: 4e-4, y: -1e-5, width: 2e-4, height: 7e-5, angle: 0 }, zeta: -0.01 }],
    });
    expect(design.ports[1].potential).toBeNull();
    expect(design.shapes).toHaveLength(5);
  });

  it('parses JSON text too, and refuses text that is not JSON', () => {
    expect(parseDesign(JSON.stringify(base())).ok).toBe(true);
    expect(refusals('{ nope')).toEqual([{ field: '', message: 'is not valid JSON' }]);
    expect(refusals([1, 2])[0].message).toMatch(/JSON object/);
  });

  it('names the field and the reason for each refusal', () => {
    const cases: Array<[(d: any) => void, string, RegExp]> = [
      [(d) => (d.format = 'osmolane.design/2'), 'format', /must be "osmolane\.design\/1"/],
      [(d) => (d.depth = 0), 'depth', /greater than 0/],
      [(d) => (d.depth = -2e-5), 'depth', /greater than 0/],
      [(d) => delete d.name, 'name', /is required/],
      [(d) => (d.buffer.viscosity = 0), 'buffer.viscosity', /greater than 0/],
      [(d) => (d.buffer.conductivity = -1), 'buffer.conductivity', /greater than 0/],
      [(d) => (d.buffer.temperature = 'warm'), 'buffer.temperature', /must be a number, not a string/],
      [(d) => (d.zeta.side = 5), 'zeta.side', /volts/],
      [(d) => (d.shapes[0].width = 0), 'shapes[0].width', /greater than 0/],
      [(d) => (d.shapes[0].x = 50), 'shapes[0].x', /metres/],
      [(d) => (d.shapes[0].type = 'blob'), 'shapes[0].type', /"rect", "sector", "circle", "polygon"/],
      [(d) => (d.shapes[0].op = 'merge'), 'shapes[0].op', /"add" or "subtract"/],
      [(d) => (d.shapes[0] = { op: 'add', type: 'circle', center: [0, 0], radius: -1e-5 }), 'shapes[0].radius', /greater than 0/],
      [
        (d) => (d.shapes[0] = { op: 'add', type: 'sector', center: [0, 0], innerRadius: 2e-4, outerRadius: 1e-4, startAngle: 0, endAngle: 90 }),
        'shapes[0].innerRadius',
        /smaller than outerRadius/,
      ],
      [
        (d) => (d.shapes[0] = { op: 'add', type: 'sector', center: [0, 0], innerRadius: 1e-4, outerRadius: 2e-4, startAngle: 90, endAngle: 0 }),
        'shapes[0].endAngle',
        /greater than startAngle/,
      ],
      [(d) => (d.shapes[0] = { op: 'add', type: 'polygon', points: [[0, 0], [1e-4, 0]] }), 'shapes[0].points', /at least 3/],
      [(d) => delete d.ports[1].potential, 'ports[1].potential', /is required.*null for a floating port/],
      [(d) => (d.ports[1].potential = '5 V'), 'ports[1].potential', /number in volts, or null/],
      [(d) => (d.ports[0].pressure = null), 'ports[0].pressure', /must be a number/],
      [(d) => (d.ports[1].id = 'A'), 'ports[1].id', /already used by ports\[0\].*unique/],
      [(d) => (d.ports[0].to = d.ports[0].from), 'ports[0].to', /must differ/],
      [(d) => (d.wallZones = [{ region: { type: 'circle', center: [0, 0], radius: 0 }, zeta: -0.01 }]), 'wallZones[0].region.radius', /greater than 0/],
    ];
    for (const [mutate, field, message] of cases) {
      const doc = base();
      mutate(doc);
      const errors = refusals(doc);
      const hit = errors.find((e) => e.field === field);
      expect({ field, found: hit?.message ?? errors }).toEqual({ field, found: expect.stringMatching(message) });
    }
  });

  it('refuses numbers that are not finite', () => {
    const doc = base() as any;
    doc.ports[0].potential = Number.POSITIVE_INFINITY;
    doc.shapes[0].height = Number.NaN;
    const fields = refusals(doc).map((e) => e.field);
    expect(fields).toEqual(expect.arrayContaining(['ports[0].potential', 'shapes[0].height']));
  });

  it('ignores fields it does not know (later versions only add optional fields)', () => {
    const doc = base() as any;
    doc.notes = 'from a later version';
    doc.shapes[0].label = 'main channel';
    expect(parseDesign(doc).ok).toBe(true);
  });

  it('writes paths with indices in brackets', () => {
    expect(fieldPath(['ports', 1, 'potential'])).toBe('ports[1].potential');
    expect(fieldPath(['shapes', 0, 'center', 1])).toBe('shapes[0].center[1]');
    expect(fieldPath([])).toBe('');
  });
});
