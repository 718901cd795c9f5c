/**
 * The command line's arguments (design-format.md):
 *   solve DESIGN.json [--cells N] [--probe X,Y]... [--json] [--vtk OUT.vtk] [--csv OUT.csv]
 *   export DESIGN.json --format svg|dxf --out FILE
 *   import FILE [--scale METRES_PER_UNIT] --out DESIGN.json
 *   compare, trace, plan, edl (analysis-args.ts)
 * Pure parsing, no Node imports; every mistake is a UsageError whose message names it.
 */
import type { Point } from '../../shared/design';
import { ANALYSIS_COMMANDS, parseAnalysisArgs, type AnalysisCommand } from './analysis-args';
import { UsageError } from './usage-error';

export { UsageError } from './usage-error';
export type { AnalysisCommand, CompareCommand, EdlCommand, PlanCommand, TraceCommand } from './analysis-args';

export const USAGE = [
  'usage: osmolane solve DESIGN.json [--cells N] [--probe X,Y]... [--json] [--vtk OUT.vtk] [--csv OUT.csv]',
  '       osmolane export DESIGN.json --format svg|dxf --out FILE',
  '       osmolane import FILE.svg|FILE.dxf [--scale METRES_PER_UNIT] --out DESIGN.json',
  '       osmolane compare DESIGN.json --port ID [--cells N] [--diffusivity D] [--particles N] [--seed S] [--json]',
  '       osmolane trace DESIGN.json --species MOBILITY,DIFFUSIVITY (--from X1,Y1,X2,Y2 | --region X1,Y1,X2,Y2,X3,Y3,... | --pinched)',
  '                [--detector X1,Y1,X2,Y2] [--phase DURATION|auto:PORT=V,...]... [--duration T] [--particles N] [--seed S] [--cells N] [--json]',
  '       osmolane plan DESIGN.json --target KIND:PORT:VALUE[:OF]... [--hold PORT=V]... [--float PORT]... [--bounds PORT=MIN:MAX]... [--cells N] [--json]',
  '       osmolane edl [DESIGN.json] --ionic-strength MOL_PER_M3 --zeta V --temperature K [--depth M] [--width M]',
  '                [--permittivity R] [--viscosity PA_S] [--valence Z] [--field V_PER_M] [--json]',
  '',
  'SI units throughout (m, V, s, Pa). compare: the same layout by slip and by pressure at the flow rate of --port,',
  '  with the band spreading of each from a tracer run of the reference species (--particles 0 skips it).',
  'trace: a band of a species (mobility m²/Vs, diffusivity m²/s) from a line or region to a detector line; --pinched',
  '  sets up a pinched plug at a cross (ports S, SW, B, W): loading, then dispensing, overridden by --phase.',
  'plan: reservoir potentials for targets; KIND is flow (m³/s), speed (m/s) or current (A) into the fluid through',
  '  PORT, or ratio (Q_PORT = VALUE x Q_OF); --hold fixes a potential, --float leaves a port without an electrode.',
  'edl: the double layer for a buffer and wall; a DESIGN.json gives the buffer, side zeta, depth and narrowest width.',
].join('\n');

export interface SolveCommand {
  command: 'solve';
  file: string;
  cells?: number;
  probes: Point[];
  json: boolean;
  vtk?: string;
  csv?: string;
}

export interface ExportCommand {
  command: 'export';
  file: string;
  format: 'svg' | 'dxf';
  out: string;
}

export interface ImportCommand {
  command: 'import';
  file: string;
  scale?: number;
  out: string;
}

export type Command = SolveCommand | ExportCommand | ImportCommand | AnalysisCommand | { command: 'help' };

/** A finite decimal number written in full ("1e-3", "-2.5"); Number() alone would accept "" and " ". */
function parseNumber(text: string): number | null {
  if (!/^\s*[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?\s*$/i.test(text)) return null;
  const v = Number(text);
  return Number.isFinite(v) ? v : null;
}

export function parseArgs(argv: ReadonlyArray<string>): Command {
  if (argv.length === 0) throw new UsageError(`no command given; ${USAGE}`);
  if (argv.includes('--help') || argv.includes('-h')) return { command: 'help' };
  const [command, ...rest] = argv;
  if (command === 'export' || command === 'import') return parseFilesCommand(command, rest);
  if ((ANALYSIS_COMMANDS as readonly string[]).includes(command)) {
    try {
      return parseAnalysisArgs(command as AnalysisCommand['command'], rest);
    } catch (error) {
      if (error instanceof UsageError && /^unknown option|^no design file/.test(error.message)) throw new UsageError(`${error.message}; ${USAGE.split('\n').find((l) => l.includes(`osmolane ${command} `))?.trim()}`);
      throw error;
    }
  }
  if (command !== 'solve') throw new UsageError(`unknown command "${command}"; ${USAGE}`);
  const out: SolveCommand = { command: 'solve', file: '', probes: [], json: false };
  const files: string[] = [];
  for (let k = 0; k < rest.length; k++) {
    const arg = rest[k];
    const eq = arg.startsWith('--') ? arg.indexOf('=') : -1;
    const flag = eq > 0 ? arg.slice(0, eq) : arg;
    const value = (): string => {
      if (eq > 0) return arg.slice(eq + 1);
      if (k + 1 >= rest.length) throw new UsageError(`${flag} needs a value`);
      return rest[++k];
    };
    switch (flag) {
      case '--cells': {
        const text = value();
        if (!/^\s*\d+\s*$/.test(text) || !(Number(text) >= 1) || !Number.isSafeInteger(Number(text))) {
          throw new UsageError(`--cells must be a positive whole number, not "${text}"`);
        }
        out.cells = Number(text);
        break;
      }
      case '--probe': {
        const text = value();
        const parts = text.split(',');
        const xy = parts.map(parseNumber);
        if (parts.length !== 2 || xy[0] === null || xy[1] === null) {
          throw new UsageError(`--probe must be two numbers X,Y in metres (e.g. --probe 5e-4,2.5e-5), not "${text}"`);
        }
        out.probes.push([xy[0], xy[1]]);
        break;
      }
      case '--json':
        if (eq > 0) throw new UsageError('--json takes no value');
        out.json = true;
        break;
      case '--vtk': {
        const text = value();
        if (text === '') throw new UsageError('--vtk needs a file name');
        out.vtk = text;
        break;
      }
      case '--csv': {
        const text = value();
        if (text === '') throw new UsageError('--csv needs a file name');
        out.csv = text;
        break;
      }
      default:
        if (arg.startsWith('-') && arg !== '-') throw new UsageError(`unknown option "${flag}"; ${USAGE}`);
        files.push(arg);
    }
  }
  if (files.length === 0) throw new UsageError(`no design file given; ${USAGE}`);
  if (files.length > 1) throw new UsageError(`one design file at a time, got ${files.length}: ${files.join(', ')}`);
  out.file = files[0];
  return out;
}

/** export DESIGN.json --format svg|dxf --out FILE; import FILE [--scale S] --out DESIGN.json */
function parseFilesCommand(command: 'export' | 'import', rest: ReadonlyArray<string>): ExportCommand | ImportCommand {
  const files: string[] = [];
  let format: string | undefined, out: string | undefined, scale: number | undefined;
  for (let k = 0; k < rest.length; k++) {
    const arg = rest[k];
    const eq = arg.startsWith('--') ? arg.indexOf('=') : -1;
    const flag = eq > 0 ? arg.slice(0, eq) : arg;
    const value = (): string => {
      if (eq > 0) return arg.slice(eq + 1);
      if (k + 1 >= rest.length) throw new UsageError(`${flag} needs a value`);
      return rest[++k];
    };
    if (flag === '--out') {
      out = value();
      if (out === '') throw new UsageError('--out needs a file name');
    } else if (flag === '--format' && command === 'export') {
      format = value().toLowerCase();
      if (format !== 'svg' && format !== 'dxf') throw new UsageError(`--format must be svg or dxf, not "${format}"`);
    } else if (flag === '--scale' && command === 'import') {
      const text = value();
      const v = parseNumber(text);
      if (v === null || !(v > 0)) throw new UsageError(`--scale must be a positive number of metres per drawing unit (e.g. 1e-6), not "${text}"`);
      scale = v;
    } else if (arg.startsWith('-') && arg !== '-') {
      throw new UsageError(`unknown option "${flag}" for ${command}; ${USAGE}`);
    } else {
      files.push(arg);
    }
  }
  const what = command === 'export' ? 'design file' : 'drawing file (.svg or .dxf)';
  if (files.length === 0) throw new UsageError(`no ${what} given; ${USAGE}`);
  if (files.length > 1) throw new UsageError(`one ${what} at a time, got ${files.length}: ${files.join(', ')}`);
  if (out === undefined) throw new UsageError(`${command} needs --out FILE`);
  if (command === 'export') {
    if (format === undefined) throw new UsageError('export needs --format svg or --format dxf');
    return { command, file: files[0], format: format as 'svg' | 'dxf', out };
  }
  return { command, file: files[0], out, ...(scale !== undefined ? { scale } : {}) };
}
