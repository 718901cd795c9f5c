/**
 * The per-cell fields as a VTK legacy ASCII file (STRUCTURED_POINTS, CELL_DATA), for ParaView or
 * VisIt: points are the cell corners (nx+1) × (ny+1) × 1, so each value belongs to one cell.
 * Undefined values (outside the fluid) are written as nan. Format: "VTK File Formats", Kitware,
 * VTK User's Guide, legacy format section.
 */
import type { SolveFields } from './types';

function values(a: Float32Array): string {
  const parts: string[] = new Array(a.length);
  for (let k = 0; k < a.length; k++) parts[k] = Number.isFinite(a[k]) ? String(a[k]) : 'nan';
  return parts.join('\n');
}

function vectors(x: Float32Array, y: Float32Array): string {
  const parts: string[] = new Array(x.length);
  for (let k = 0; k < x.length; k++) {
    const u = Number.isFinite(x[k]) ? String(x[k]) : 'nan';
    const v = Number.isFinite(y[k]) ? String(y[k]) : 'nan';
    parts[k] = `${u} ${v} 0`;
  }
  return parts.join('\n');
}

export function fieldsToVtk(f: SolveFields, title: string): string {
  const scalar = (name: string, a: Float32Array) => `SCALARS ${name} float 1\nLOOKUP_TABLE default\n${values(a)}\n`;
  const vector = (name: string, x: Float32Array, y: Float32Array) => `VECTORS ${name} float\n${vectors(x, y)}\n`;
  return (
    '# vtk DataFile Version 3.0\n' +
    `${title.replace(/[\r\n]+/g, ' ').slice(0, 250)}\n` +
    'ASCII\n' +
    'DATASET STRUCTURED_POINTS\n' +
    `DIMENSIONS ${f.nx + 1} ${f.ny + 1} 1\n` +
    `ORIGIN ${f.x0} ${f.y0} 0\n` +
    `SPACING ${f.spacing} ${f.spacing} ${f.spacing}\n` +
    `CELL_DATA ${f.nx * f.ny}\n` +
    scalar('fraction', f.fraction) +
    scalar('potential', f.potential) +
    vector('field', f.fieldX, f.fieldY) +
    vector('velocity', f.velocityX, f.velocityY) +
    scalar('pressure', f.pressure) +
    scalar('vorticity', f.vorticity) +
    scalar('streamfunction', f.streamfunction)
  );
}
