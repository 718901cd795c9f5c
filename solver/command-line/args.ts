/**
 * The command line's arguments (design-format.md):
 *   solve DESIGN.json [--cells N] [--probe X,Y]... [--json] [--vtk OUT.vtk] [--csv OUT.csv]
 *   export DESIGN.json --format svg|dxf --out FILE
 *   import FILE [--scale METRES_PER_UNIT] --out DESIGN.json
 * Pure parsing, no Node imports; every mistake is a UsageError whose message names it.
 */
import type { Point } from '../../shared/design';

export const USAGE = [
  'usage: osmolane solve DESIGN.json [--cells N] [--probe X,Y]... [--json] [--vtk OUT.vtk] [--csv OUT.csv]',
  '       osmolane export DESIGN.json --format svg|dxf --out FILE',
  '       osmolane import FILE.svg|FILE.dxf [--scale METRES_PER_UNIT] --out DESIGN.json',
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

export type Command = SolveCommand | ExportCommand | ImportCommand | { command: 'help' };

export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}

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
