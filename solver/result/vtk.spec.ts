import { fieldsToVtk } from './vtk';
import type { SolveFields } from './types';

describe('VTK legacy writer', () => {
  it('writes STRUCTURED_POINTS with one value per cell and nan outside the fluid', () => {
    const n = 3 * 2;
    const a = (v: number) => Float32Array.from({ length: n }, (_, k) => (k === 0 ? NaN : v + k));
    const f: SolveFields = {
      nx: 3, ny: 2, spacing: 1e-5, x0: -1e-5, y0: -1e-5,
      fraction: a(0), potential: a(10), fieldX: a(1), fieldY: a(2), velocityX: a(3), velocityY: a(4),
      pressure: a(5), vorticity: a(6), streamfunction: a(7),
    };
    const text = fieldsToVtk(f, 'Osmolane: test\nsecond line');
    const lines = text.trimEnd().split('\n');
    expect(lines.slice(0, 8)).toEqual([
      '# vtk DataFile Version 3.0',
      'Osmolane: test second line',
      'ASCII',
      'DATASET STRUCTURED_POINTS',
      'DIMENSIONS 4 3 1',
      'ORIGIN -0.00001 -0.00001 0',
      'SPACING 0.00001 0.00001 0.00001',
      'CELL_DATA 6',
    ]);
    const block = (header: string) => lines.slice(lines.indexOf(header) + (header.startsWith('SCALARS') ? 2 : 1)).slice(0, n);
    expect(block('SCALARS potential float 1')).toEqual(['nan', '11', '12', '13', '14', '15']);
    expect(block('VECTORS velocity float')[2]).toBe('5 6 0');
    for (const name of ['fraction', 'potential', 'pressure', 'vorticity', 'streamfunction']) expect(text).toContain(`SCALARS ${name} float 1`);
    expect(text).toContain('VECTORS field float');
  });
});
