/**
 * What a sweep's plots, table and CSV show: one series per number asked for (a port's current or flow rate, the
 * largest field, vorticity, Joule power, the count of warnings), grouped as the plots draw them.
 */
import type { SweepDetail, SweepOutput, SweepPointResult } from '../../../../shared/api';
import type { Dimension } from '../../ui/units';

export interface Series {
  key: string;
  label: string;
  /** The plot the series is drawn in. */
  group: string;
  dimension: Dimension;
  /** True for quantities with a sign (currents, flow rates): maps use a diverging colour map. */
  signed: boolean;
  /** One value per point (NaN where the point has no result). */
  values: number[];
}

type Picker = (r: SweepPointResult) => number;

function series(sweep: SweepDetail, key: string, label: string, group: string, dimension: Dimension, signed: boolean, pick: Picker): Series {
  return { key, label, group, dimension, signed, values: sweep.points.map((p) => (p.result ? pick(p.result) : NaN)) };
}

/** The outputs in words: the form's check boxes and the plots' headings. */
export const OUTPUT_LABELS: Record<SweepOutput, string> = {
  portCurrents: 'Port currents',
  portFlowRates: 'Port flow rates',
  maxField: 'Largest field strength',
  maxVorticity: 'Largest vorticity',
  joulePower: 'Joule power',
  warnings: 'Warnings',
};

/** Port ids from the first point with a result, in the design's order. */
function portIds(sweep: SweepDetail): string[] {
  return sweep.points.find((p) => p.result)?.result!.ports.map((p) => p.id) ?? [];
}

export function sweepSeries(sweep: SweepDetail): Series[] {
  const out: Series[] = [];
  const ports = portIds(sweep);
  const port = (r: SweepPointResult, id: string) => r.ports.find((p) => p.id === id);
  for (const output of sweep.outputs) {
    const group = OUTPUT_LABELS[output];
    switch (output) {
      case 'portCurrents':
        for (const id of ports) out.push(series(sweep, `current:${id}`, `Current at ${id}`, group, 'current', true, (r) => port(r, id)?.current ?? NaN));
        break;
      case 'portFlowRates':
        for (const id of ports) out.push(series(sweep, `flow:${id}`, `Flow rate at ${id}`, group, 'flowRate', true, (r) => port(r, id)?.flowRate ?? NaN));
        break;
      case 'maxField':
        out.push(series(sweep, 'maxField', 'Largest field strength', group, 'fieldStrength', false, (r) => r.metrics.maxField));
        break;
      case 'maxVorticity':
        out.push(series(sweep, 'maxVorticity', 'Largest vorticity', group, 'vorticity', false, (r) => r.metrics.maxVorticity));
        break;
      case 'joulePower':
        out.push(series(sweep, 'joulePower', 'Joule power', group, 'power', false, (r) => r.metrics.joulePower));
        break;
      case 'warnings':
        out.push(series(sweep, 'warnings', 'Warnings', group, 'dimensionless', false, (r) => r.warnings.length));
        break;
    }
  }
  return out;
}

/** Series by plot, in order. */
export function seriesGroups(all: Series[]): Array<{ group: string; series: Series[] }> {
  const groups: Array<{ group: string; series: Series[] }> = [];
  for (const s of all) {
    const g = groups.find((x) => x.group === s.group);
    if (g) g.series.push(s);
    else groups.push({ group: s.group, series: [s] });
  }
  return groups;
}

const SI_UNITS: Partial<Record<Dimension, string>> = {
  length: 'm', potential: 'V', pressure: 'Pa', angle: 'deg', viscosity: 'Pa s', density: 'kg/m3', conductivity: 'S/m',
  concentration: 'mol/m3', temperature: 'K', current: 'A', flowRate: 'm3/s', fieldStrength: 'V/m', vorticity: '1/s', power: 'W',
};

function csvCell(text: string): string {
  return /[",\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The sweep as CSV: one row per point, SI units in the header, full precision, warning codes joined by "; ". */
export function sweepCsv(sweep: SweepDetail, all: Series[] = sweepSeries(sweep)): string {
  const unit = (d: string) => (SI_UNITS[d as Dimension] ? ` (${SI_UNITS[d as Dimension]})` : '');
  const head = ['point', ...sweep.parameters.map((p) => `${p.label}${unit(p.dimension)}`), 'state', ...all.map((s) => `${s.label}${unit(s.dimension)}`)];
  if (sweep.outputs.includes('warnings')) head.push('warning codes');
  const rows = sweep.points.map((p) => {
    const cells = [String(p.index + 1), ...p.values.map(String), p.status, ...all.map((s) => (Number.isFinite(s.values[p.index]) ? String(s.values[p.index]) : ''))];
    if (sweep.outputs.includes('warnings')) cells.push((p.result?.warnings ?? []).map((w) => w.code).join('; '));
    return cells;
  });
  return [head, ...rows].map((r) => r.map(csvCell).join(',')).join('\n') + '\n';
}
