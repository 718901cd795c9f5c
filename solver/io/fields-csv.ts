/**
 * Results as CSV (RFC 4180: comma separated, CRLF line ends, fields with commas or quotes quoted): the port
 * table, the probes and cut-line profiles, one table after another, each with its own header row whose first
 * column names the table. SI units in the column names; currents and flow rates positive INTO the fluid
 * (physics.md); the mean speed (of the channel leg a port feeds) is a magnitude, empty where it was not computed.
 * Lines starting with # are comments (name, units, sign convention).
 */
import type { Point } from '../../shared/design';
import type { PortResult, ProbeResult, SolveFields } from '../result/types';

export interface CutLine {
  name: string;
  from: Point;
  to: Point;
  /** Samples along the line (default 101). */
  samples?: number;
}

export interface CsvInput {
  name: string;
  ports: ReadonlyArray<PortResult>;
  probes?: ReadonlyArray<ProbeResult>;
  fields?: SolveFields;
  cutLines?: ReadonlyArray<CutLine>;
}

function cell(v: unknown): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : '';
  if (typeof v === 'boolean') return v ? 'true' : 'false';
  const s = String(v);
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

const row = (values: unknown[]) => values.map(cell).join(',');

export interface LineSample {
  s: number;
  x: number;
  y: number;
  inside: boolean;
  potential: number;
  fieldX: number;
  fieldY: number;
  velocityX: number;
  velocityY: number;
  vorticity: number;
  pressure: number;
}

/** The fields along a segment: the value of the cell under each sample point (NaN outside the fluid). */
export function sampleLine(f: SolveFields, from: Point, to: Point, samples = 101): LineSample[] {
  const n = Math.max(2, Math.min(100000, Math.floor(samples)));
  const length = Math.hypot(to[0] - from[0], to[1] - from[1]);
  const out: LineSample[] = [];
  for (let k = 0; k < n; k++) {
    const t = k / (n - 1);
    const x = from[0] + t * (to[0] - from[0]), y = from[1] + t * (to[1] - from[1]);
    const i = Math.floor((x - f.x0) / f.spacing), j = Math.floor((y - f.y0) / f.spacing);
    const c = i >= 0 && j >= 0 && i < f.nx && j < f.ny ? i + j * f.nx : -1;
    const inside = c >= 0 && f.fraction[c] > 0;
    const at = (a: Float32Array) => (inside ? a[c] : NaN);
    out.push({
      s: t * length, x, y, inside,
      potential: at(f.potential), fieldX: at(f.fieldX), fieldY: at(f.fieldY),
      velocityX: at(f.velocityX), velocityY: at(f.velocityY), vorticity: at(f.vorticity), pressure: at(f.pressure),
    });
  }
  return out;
}

export function resultsCsv(input: CsvInput): string {
  const lines: string[] = [
    `# Osmolane results: ${input.name.replace(/[\r\n]+/g, ' ')}`,
    '# SI units; current and flow rate are positive when they enter the fluid through the port',
    row(['table', 'port', 'potential_V', 'current_A', 'flow_rate_m3_per_s', 'mean_speed_m_per_s']),
    ...input.ports.map((p) => row(['ports', p.id, p.potential, p.current, p.flowRate, p.meanSpeed])),
  ];
  if (input.probes && input.probes.length) {
    lines.push('', row(['table', 'probe', 'x_m', 'y_m', 'inside', 'potential_V', 'field_x_V_per_m', 'field_y_V_per_m', 'velocity_x_m_per_s', 'velocity_y_m_per_s', 'vorticity_1_per_s', 'pressure_Pa']));
    input.probes.forEach((p, k) => {
      lines.push(row(['probes', k + 1, p.at[0], p.at[1], p.inside, p.potential, p.field?.[0], p.field?.[1], p.velocity?.[0], p.velocity?.[1], p.vorticity, p.pressure]));
    });
  }
  if (input.fields && input.cutLines && input.cutLines.length) {
    lines.push('', row(['table', 'cut_line', 's_m', 'x_m', 'y_m', 'inside', 'potential_V', 'field_x_V_per_m', 'field_y_V_per_m', 'velocity_x_m_per_s', 'velocity_y_m_per_s', 'vorticity_1_per_s', 'pressure_Pa']));
    for (const line of input.cutLines) {
      for (const s of sampleLine(input.fields, line.from, line.to, line.samples)) {
        lines.push(row(['cut_lines', line.name, s.s, s.x, s.y, s.inside, s.potential, s.fieldX, s.fieldY, s.velocityX, s.velocityY, s.vorticity, s.pressure]));
      }
    }
  }
  return lines.join('\r\n') + '\r\n';
}
