import { inflateSync } from 'node:zlib';
import { loadFixture } from '../../tests/fixtures/designs';
import { fieldsToVtk } from '../result/vtk';
import { solveDesign, type SolveResult } from '../solve';
import { resultsCsv, sampleLine } from './fields-csv';
import { mapFigure, MAP_QUANTITIES, quantityValues } from './figure';
import { figureSvg } from './figure-svg';
import { crc32, encodePng } from './png';

let result: SolveResult;

beforeAll(() => {
  result = solveDesign(loadFixture('t-junction'), { cells: 120, probes: [[1e-3, 5e-5], [1, 1]] });
});

/** The numbers of one VTK data block, by its header line. */
function block(text: string, header: string, count: number): string[] {
  const lines = text.split('\n');
  const at = lines.indexOf(header);
  expect(at).toBeGreaterThan(0);
  return lines.slice(at + (header.startsWith('SCALARS') ? 2 : 1), at + (header.startsWith('SCALARS') ? 2 : 1) + count);
}

describe('VTK of a real solve', () => {
  it('has the grid of the solve in its header and the solver arrays cell by cell', () => {
    const f = result.fields;
    const text = fieldsToVtk(f, 'Osmolane: T junction');
    expect(text).toContain(`DIMENSIONS ${f.nx + 1} ${f.ny + 1} 1\n`);
    expect(text).toContain(`SPACING ${f.spacing} ${f.spacing} ${f.spacing}\n`);
    expect(text).toContain(`ORIGIN ${f.x0} ${f.y0} 0\n`);
    const n = f.nx * f.ny;
    expect(text).toContain(`CELL_DATA ${n}\n`);
    const close = (written: string, value: number) => {
      if (!Number.isFinite(value)) expect(written).toBe('nan');
      else expect(Number(written)).toBe(value); // Float32 values print exactly
    };
    const potential = block(text, 'SCALARS potential float 1', n);
    const fraction = block(text, 'SCALARS fraction float 1', n);
    const vorticity = block(text, 'SCALARS vorticity float 1', n);
    const velocity = block(text, 'VECTORS velocity float', n);
    const field = block(text, 'VECTORS field float', n);
    for (let c = 0; c < n; c += 7) {
      close(potential[c], f.potential[c]);
      close(fraction[c], f.fraction[c]);
      close(vorticity[c], f.vorticity[c]);
      const [ux, uy, uz] = velocity[c].split(' ');
      close(ux, f.velocityX[c]);
      close(uy, f.velocityY[c]);
      expect(uz).toBe('0');
      close(field[c].split(' ')[1], f.fieldY[c]);
    }
    expect(text).toContain('SCALARS pressure float 1');
  });
});

describe('CSV of a solve', () => {
  it('writes the port table, the probes and a cut line with units in the headers', () => {
    const f = result.fields;
    const y = f.y0 + (f.ny / 2) * f.spacing;
    const csv = resultsCsv({ name: 'T, "junction"', ports: result.ports, probes: result.probes, fields: f, cutLines: [{ name: 'across', from: [f.x0, y], to: [f.x0 + f.nx * f.spacing, y], samples: 11 }] });
    const lines = csv.split('\r\n');
    expect(lines[0]).toBe('# Osmolane results: T, "junction"');
    expect(lines).toContain('table,port,potential_V,current_A,flow_rate_m3_per_s,mean_speed_m_per_s');
    const ports = lines.filter((l) => l.startsWith('ports,'));
    expect(ports).toHaveLength(result.ports.length);
    expect(Number(ports[0].split(',')[3])).toBe(result.ports[0].current);
    // Port A feeds the 100 µm wide, 20 µm deep main channel: mean speed |Q| / (w d).
    const meanA = Number(ports[0].split(',')[5]);
    expect(meanA).toBe(result.ports[0].meanSpeed);
    expect(meanA / (Math.abs(result.ports[0].flowRate) / (1e-4 * 2e-5))).toBeCloseTo(1, 9);
    const probes = lines.filter((l) => l.startsWith('probes,'));
    expect(probes[1]).toBe('probes,2,1,1,false,,,,,,,');
    expect(lines.filter((l) => l.startsWith('cut_lines,across,'))).toHaveLength(11);
  });

  it('leaves the mean speed empty for a port table without it (a result from before it was computed)', () => {
    const csv = resultsCsv({ name: 'older', ports: [{ id: 'A', potential: 10, current: 1e-6, flowRate: 2e-12 }] });
    expect(csv.split('\r\n')).toContain('ports,A,10,0.000001,2e-12,');
  });

  it('samples a cut line cell by cell', () => {
    const f = result.fields;
    const c = f.nx >> 1;
    const x = f.x0 + (c + 0.5) * f.spacing;
    const s = sampleLine(f, [x, f.y0], [x, f.y0 + f.ny * f.spacing], f.ny + 1);
    const inside = s.filter((p) => p.inside);
    expect(inside.length).toBeGreaterThan(0);
    const j = Math.floor((inside[0].y - f.y0) / f.spacing);
    expect(inside[0].potential).toBe(f.potential[c + j * f.nx]);
  });
});

describe('figures', () => {
  it('renders every map with its colour range, ticks and a scale bar', () => {
    for (const q of MAP_QUANTITIES) {
      const fig = mapFigure(result.fields, q, { maxWidth: 300, maxHeight: 200 });
      expect(fig.map.rgba.length).toBe(fig.map.width * fig.map.height * 4);
      expect(fig.map.width).toBeLessThanOrEqual(300);
      expect(fig.ticks.length).toBeGreaterThan(0);
      expect(fig.scaleBar.pixels).toBeGreaterThan(0);
      expect(fig.scaleBar.label).toMatch(/(mm|µm)$/);
    }
    const v = quantityValues(result.fields, 'potential');
    const fig = mapFigure(result.fields, 'potential');
    const finite = Array.from(v).filter(Number.isFinite);
    expect(fig.range).toEqual([Math.min(...finite), Math.max(...finite)]);
    const vort = mapFigure(result.fields, 'vorticity');
    expect(vort.range[0]).toBe(-vort.range[1]);
  });

  it('encodes a PNG that zlib reads back, and an SVG with the map, the colour bar and the title', () => {
    const fig = mapFigure(result.fields, 'speed', { maxWidth: 120, maxHeight: 80, title: 'Speed <T>' });
    const png = encodePng(fig.map.rgba, fig.map.width, fig.map.height);
    expect(Array.from(png.slice(0, 8))).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
    const view = new DataView(png.buffer, png.byteOffset);
    expect(view.getUint32(16)).toBe(fig.map.width);
    expect(view.getUint32(20)).toBe(fig.map.height);
    // IHDR's CRC
    expect(view.getUint32(29)).toBe((crc32(png.subarray(12, 29)) ^ 0xffffffff) >>> 0);
    const idatLength = view.getUint32(33);
    const raw = inflateSync(png.subarray(41, 41 + idatLength));
    expect(raw.length).toBe(fig.map.height * (1 + fig.map.width * 4));
    expect(Array.from(raw.subarray(1, 1 + fig.map.width * 4))).toEqual(Array.from(fig.map.rgba.subarray(0, fig.map.width * 4)));
    const svg = figureSvg(fig);
    expect(svg).toContain('Speed &lt;T&gt;');
    expect(svg).toContain('data:image/png;base64,iVBORw0KGgo');
    expect(svg).toContain('<linearGradient id="bar"');
    expect(svg).toContain('>m/s</text>');
    expect(svg).toContain(`>${fig.scaleBar.label}</text>`);
  });
});
