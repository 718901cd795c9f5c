/** The human-readable result of `osmolane solve` (without --json): ports with the mean speed of their legs, probes, metrics, warnings. */
import type { DesignDocument } from '../../shared/design';
import type { SolveResult } from '../result/types';

const PREFIXES: Array<[number, string]> = [[1e9, 'G'], [1e6, 'M'], [1e3, 'k'], [1, ''], [1e-3, 'm'], [1e-6, 'µ'], [1e-9, 'n'], [1e-12, 'p'], [1e-15, 'f']];

/** 4 significant digits with an SI prefix: formatSI(-5.698e-5, 'A') → "-56.98 µA". */
export function formatSI(value: number | null | undefined, unit: string): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  if (value === 0) return `0 ${unit}`;
  const a = Math.abs(value);
  const [scale, prefix] = PREFIXES.find(([s]) => a >= s * 0.99995) ?? PREFIXES[PREFIXES.length - 1];
  return `${Number((value / scale).toPrecision(4))} ${prefix}${unit}`;
}

/** m³/s in litres per minute with a prefix (nL/min, µL/min), as chip engineers read flow rates. */
export function formatFlow(q: number): string {
  return formatSI(q * 6e4, 'L/min');
}

function table(rows: string[][]): string[] {
  const widths = rows[0].map((_, col) => Math.max(...rows.map((r) => r[col].length)));
  return rows.map((r) => r.map((cell, col) => cell.padEnd(widths[col])).join('   ').trimEnd());
}

export function formatSummary(design: DesignDocument, result: SolveResult): string {
  const out: string[] = [];
  const { grid, metrics, solver } = result;
  out.push(`${design.name}`);
  out.push(`grid ${grid.nx} × ${grid.ny} cells of ${formatSI(grid.spacing, 'm')} (${grid.fluidCells.toLocaleString('en-US')} with fluid)`);
  out.push('');
  out.push('ports (current and flow rate positive into the chip; mean speed in the channel leg the port feeds):');
  const portRows = [['port', 'potential', 'current', 'flow rate', 'mean speed']];
  for (const p of result.ports) {
    const floating = design.ports.find((q) => q.id === p.id)?.potential === null;
    portRows.push([p.id, `${formatSI(p.potential, 'V')}${floating ? ' (floating)' : ''}`, formatSI(p.current, 'A'), formatFlow(p.flowRate), formatSI(p.meanSpeed, 'm/s')]);
  }
  out.push(...table(portRows).map((l) => `  ${l}`));
  if (result.probes.length > 0) {
    out.push('');
    out.push('probes:');
    const rows = [['at (x, y)', 'potential', 'field (Ex, Ey)', 'velocity (u, v)', 'pressure']];
    for (const p of result.probes) {
      const at = `${formatSI(p.at[0], 'm')}, ${formatSI(p.at[1], 'm')}`;
      if (!p.inside) {
        rows.push([at, 'outside the fluid', '', '', '']);
        continue;
      }
      rows.push([
        at,
        formatSI(p.potential, 'V'),
        p.field ? `${formatSI(p.field[0], 'V/m')}, ${formatSI(p.field[1], 'V/m')}` : '—',
        p.velocity ? `${formatSI(p.velocity[0], 'm/s')}, ${formatSI(p.velocity[1], 'm/s')}` : '—',
        formatSI(p.pressure, 'Pa'),
      ]);
    }
    out.push(...table(rows).map((l) => `  ${l}`));
  }
  out.push('');
  out.push('metrics:');
  out.push(...table([
    ['Joule power', formatSI(metrics.joulePower, 'W')],
    ['largest field', formatSI(metrics.maxField, 'V/m')],
    ['largest speed', formatSI(metrics.maxSpeed, 'm/s')],
    ['largest wall shear rate', metrics.maxWallShearRate === undefined ? '—' : `${Number(metrics.maxWallShearRate.toPrecision(4))} 1/s`],
    ['Debye length', formatSI(metrics.debyeLength, 'm')],
    ['Reynolds number', Number(metrics.reynolds.toPrecision(3)).toString()],
  ]).map((l) => `  ${l}`));
  out.push('');
  out.push(
    `solver: potential ${solver.potentialIterations} iterations in ${solver.potentialSeconds.toFixed(2)} s, ` +
      `flow ${solver.flowIterations} iterations in ${solver.flowSeconds.toFixed(2)} s, ` +
      `residual ${solver.residual.toExponential(1)}, ${solver.seconds.toFixed(2)} s in all`,
  );
  if (result.warnings.length > 0) {
    out.push('');
    out.push('warnings:');
    for (const w of result.warnings) out.push(`  [${w.code}] ${w.message}`);
  }
  return out.join('\n') + '\n';
}
