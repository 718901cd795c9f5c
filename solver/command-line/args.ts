/**
 * The command line's arguments (design-format.md):
 *   solve DESIGN.json [--cells N] [--probe X,Y]... [--json] [--vtk OUT.vtk]
 * Pure parsing, no Node imports; every mistake is a UsageError whose message names it.
 */
import type { Point } from '../../shared/design';

export const USAGE = 'usage: osmolane solve DESIGN.json [--cells N] [--probe X,Y]... [--json] [--vtk OUT.vtk]';

export interface SolveCommand {
  command: 'solve';
  file: string;
  cells?: number;
  probes: Point[];
  json: boolean;
  vtk?: string;
}

export type Command = SolveCommand | { command: 'help' };

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
