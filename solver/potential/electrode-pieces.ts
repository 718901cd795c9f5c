/**
 * Which connected pieces of fluid have a reference potential.
 *
 * A piece whose ports are all floating (potential null) has no electrode: its potential is an
 * arbitrary constant and no current flows through it (a floating port carries zero net current,
 * so the only solution is a uniform potential). Such pieces are left out of the potential solve:
 * their field is zero and their potential undefined (NaN). Pressure can still drive flow there.
 */
import type { Port } from '../../shared/design';
import type { FluidComponents } from '../grid/components';
import type { CutCellGrid } from '../grid/cut-cell-grid';

export interface ElectrodePieces {
  /** 1 for a fluid cell in a piece with at least one electrode (a port with a potential). */
  active: Uint8Array;
  /** Whether that is every fluid cell (no piece is left out). */
  everyFluidCell: boolean;
  /** Per port: whether it lies in a piece with an electrode (false also for ports on no fluid). */
  portReferenced: boolean[];
  /** Number of fluid pieces without an electrode that touch a port. */
  floatingPieces: number;
  /** A cell of each such piece (for messages). */
  floatingSeeds: number[];
}

export function electrodePieces(grid: CutCellGrid, components: FluidComponents, ports: ReadonlyArray<Pick<Port, 'potential'>>): ElectrodePieces {
  const { label } = components;
  const hasElectrode = new Uint8Array(components.count);
  const touched = new Uint8Array(components.count);
  const seg = grid.segments;
  for (let s = 0; s < seg.count; s++) {
    const k = seg.port[s];
    const piece = label[seg.cell[s]];
    if (k < 0 || piece < 0) continue;
    touched[piece] = 1;
    if (ports[k].potential !== null) hasElectrode[piece] = 1;
  }
  const n = grid.nx * grid.ny;
  const { fraction } = grid;
  const active = new Uint8Array(n);
  let everyFluidCell = true;
  for (let c = 0; c < n; c++) {
    const piece = label[c]; // ≥ 0 on fluid cells only (components.ts)
    if (piece < 0) continue;
    if (hasElectrode[piece] !== 0 && fraction[c] > 0) active[c] = 1;
    else everyFluidCell = false;
  }
  const portReferenced = ports.map(() => false);
  for (let s = 0; s < seg.count; s++) {
    const k = seg.port[s];
    const piece = label[seg.cell[s]];
    if (k >= 0 && piece >= 0 && hasElectrode[piece]) portReferenced[k] = true;
  }
  const floatingSeeds: number[] = [];
  for (let p = 0; p < components.count; p++) if (touched[p] && !hasElectrode[p]) floatingSeeds.push(components.seed[p]);
  return { active, everyFluidCell, portReferenced, floatingPieces: floatingSeeds.length, floatingSeeds };
}
