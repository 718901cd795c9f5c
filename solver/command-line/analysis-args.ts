/**
 * Arguments of the analysis commands (compare, trace, plan, edl); the USAGE text in args.ts lists them.
 * Pure parsing, no Node imports; every mistake is a UsageError whose message names it.
 */
import type { Point } from '../../shared/design';
import { UsageError } from './usage-error';

export interface CompareCommand {
  command: 'compare';
  file: string;
  port: string;
  cells?: number;
  diffusivity?: number;
  /** Particles in the band each drive is traced with (0: no band) and the seed of its random walk. */
  particles?: number;
  seed?: number;
  json: boolean;
}

/** One phase of a trace protocol: a duration (or auto for the last) and port potentials. */
export interface PhaseArg {
  duration?: number;
  potentials: Record<string, number | null>;
}

export interface TraceCommand {
  command: 'trace';
  file: string;
  species: { mobility: number; diffusivity: number };
  /** --from X1,Y1,X2,Y2 (a line) or --region X1,Y1,X2,Y2,X3,Y3,... (a polygon); absent with --pinched. */
  injection?: { kind: 'line'; from: Point; to: Point } | { kind: 'region'; polygon: Point[] };
  detector?: { from: Point; to: Point };
  pinched: boolean;
  phases: PhaseArg[];
  particles?: number;
  seed?: number;
  duration?: number;
  cells?: number;
  json: boolean;
}

export type TargetArg =
  | { kind: 'flow' | 'speed' | 'current'; port: string; value: number }
  | { kind: 'ratio'; port: string; value: number; of: string };

export interface PlanCommand {
  command: 'plan';
  file: string;
  targets: TargetArg[];
  hold: Array<{ port: string; value: number }>;
  float: string[];
  bounds: Array<{ port: string; min: number; max: number }>;
  cells?: number;
  json: boolean;
}

export interface EdlCommand {
  command: 'edl';
  /** A design to take the buffer, side-wall zeta, depth and narrowest channel from (flags override). */
  file?: string;
  ionicStrength?: number;
  zeta?: number;
  temperature?: number;
  permittivity?: number;
  viscosity?: number;
  valence?: number;
  field?: number;
  depth?: number;
  width?: number;
  json: boolean;
}

export type AnalysisCommand = CompareCommand | TraceCommand | PlanCommand | EdlCommand;
export const ANALYSIS_COMMANDS = ['compare', 'trace', 'plan', 'edl'] as const;

/** A finite decimal number written in full ("1e-3", "-2.5"); Number() alone would accept "" and " ". */
export function parseNumber(text: string): number | null {
  if (!/^\s*[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?\s*$/i.test(text)) return null;
  const v = Number(text);
  return Number.isFinite(v) ? v : null;
}

/** Walks the options: `--flag value`, `--flag=value` and bare flags; positional arguments are collected. */
function walk(rest: ReadonlyArray<string>, handle: (flag: string, value: () => string, hasInline: boolean) => boolean): string[] {
  const positional: string[] = [];
  for (let k = 0; k < rest.length; k++) {
    const arg = rest[k];
    const eq = arg.startsWith('--') ? arg.indexOf('=') : -1;
    const flag = eq > 0 ? arg.slice(0, eq) : arg;
    const value = (): string => {
      if (eq > 0) return arg.slice(eq + 1);
      if (k + 1 >= rest.length) throw new UsageError(`${flag} needs a value`);
      return rest[++k];
    };
    if (arg.startsWith('-') && arg !== '-' && parseNumber(arg) === null) {
      if (!handle(flag, value, eq > 0)) throw new UsageError(`unknown option "${flag}"`);
    } else {
      positional.push(arg);
    }
  }
  return positional;
}

function numbers(flag: string, text: string, count: number | 'pairs', example: string): number[] {
  const parts = text.split(',');
  const values = parts.map(parseNumber);
  const okCount = count === 'pairs' ? parts.length >= 6 && parts.length % 2 === 0 : parts.length === count;
  if (!okCount || values.some((v) => v === null)) throw new UsageError(`${flag} must be ${example}, not "${text}"`);
  return values as number[];
}

function whole(flag: string, text: string, min: number): number {
  const v = Number(text);
  if (!/^\s*-?\d+\s*$/.test(text) || !Number.isSafeInteger(v) || v < min) throw new UsageError(`${flag} must be a whole number${min > 0 ? ` of at least ${min}` : ''}, not "${text}"`);
  return v;
}

function positive(flag: string, text: string, what: string): number {
  const v = parseNumber(text);
  if (v === null || !(v > 0)) throw new UsageError(`${flag} must be a positive number (${what}), not "${text}"`);
  return v;
}

function number(flag: string, text: string, what: string): number {
  const v = parseNumber(text);
  if (v === null) throw new UsageError(`${flag} must be a number (${what}), not "${text}"`);
  return v;
}

function oneFile(positional: string[], command: string): string {
  if (positional.length === 0) throw new UsageError(`no design file given for ${command}`);
  if (positional.length > 1) throw new UsageError(`one design file at a time, got ${positional.length}: ${positional.join(', ')}`);
  return positional[0];
}

/** Options every analysis command shares: --cells N and --json. */
function common(out: { cells?: number; json: boolean }, flag: string, value: () => string, inline: boolean): boolean {
  if (flag === '--cells') out.cells = whole('--cells', value(), 1);
  else if (flag === '--json') {
    if (inline) throw new UsageError('--json takes no value');
    out.json = true;
  } else return false;
  return true;
}

export function parseAnalysisArgs(command: AnalysisCommand['command'], rest: ReadonlyArray<string>): AnalysisCommand {
  switch (command) {
    case 'compare':
      return parseCompare(rest);
    case 'trace':
      return parseTrace(rest);
    case 'plan':
      return parsePlan(rest);
    case 'edl':
      return parseEdl(rest);
  }
}

function parseCompare(rest: ReadonlyArray<string>): CompareCommand {
  const out: CompareCommand = { command: 'compare', file: '', port: '', json: false };
  const positional = walk(rest, (flag, value, inline) => {
    if (flag === '--port') out.port = value();
    else if (flag === '--diffusivity') out.diffusivity = positive('--diffusivity', value(), 'm²/s of the reference species');
    else if (flag === '--particles') out.particles = whole('--particles', value(), 0);
    else if (flag === '--seed') out.seed = whole('--seed', value(), 0);
    else return common(out, flag, value, inline);
    return true;
  });
  out.file = oneFile(positional, 'compare');
  if (!out.port) throw new UsageError('compare needs --port ID (the port whose flow rate the two drives match)');
  return out;
}

/** `--phase T:ID=V,ID=V` (T in seconds, or "auto" for the last phase; V in volts or "float"). */
function parsePhase(text: string): PhaseArg {
  const example = 'DURATION:PORT=V[,PORT=V...] (e.g. 0.05:S=400,SW=0 or auto:B=600,W=0)';
  const colon = text.indexOf(':');
  if (colon <= 0) throw new UsageError(`--phase must be ${example}, not "${text}"`);
  const head = text.slice(0, colon).trim();
  const phase: PhaseArg = { potentials: {} };
  if (head !== 'auto') phase.duration = positive('--phase', head, 'seconds, or auto');
  for (const part of text.slice(colon + 1).split(',').filter((p) => p.trim() !== '')) {
    const [id, v] = part.split('=');
    if (!id?.trim() || v === undefined) throw new UsageError(`--phase must be ${example}, not "${text}"`);
    phase.potentials[id.trim()] = v.trim() === 'float' ? null : number('--phase', v, `volts for port ${id.trim()}`);
  }
  return phase;
}

function parseTrace(rest: ReadonlyArray<string>): TraceCommand {
  const out: TraceCommand = { command: 'trace', file: '', species: { mobility: NaN, diffusivity: NaN }, pinched: false, phases: [], json: false };
  const positional = walk(rest, (flag, value, inline) => {
    switch (flag) {
      case '--species': {
        const [mobility, diffusivity] = numbers('--species', value(), 2, 'MOBILITY,DIFFUSIVITY in m²/Vs and m²/s (e.g. -2e-8,1e-10)');
        if (!(diffusivity >= 0)) throw new UsageError('--species: the diffusivity must not be negative');
        out.species = { mobility, diffusivity };
        break;
      }
      case '--from': {
        const [x1, y1, x2, y2] = numbers('--from', value(), 4, 'X1,Y1,X2,Y2 in metres (the injection line)');
        out.injection = { kind: 'line', from: [x1, y1], to: [x2, y2] };
        break;
      }
      case '--region': {
        const v = numbers('--region', value(), 'pairs', 'X1,Y1,X2,Y2,X3,Y3[,...] in metres (the injection polygon)');
        out.injection = { kind: 'region', polygon: Array.from({ length: v.length / 2 }, (_, k) => [v[2 * k], v[2 * k + 1]] as Point) };
        break;
      }
      case '--detector': {
        const [x1, y1, x2, y2] = numbers('--detector', value(), 4, 'X1,Y1,X2,Y2 in metres (the detector line)');
        out.detector = { from: [x1, y1], to: [x2, y2] };
        break;
      }
      case '--pinched':
        if (inline) throw new UsageError('--pinched takes no value');
        out.pinched = true;
        break;
      case '--phase':
        out.phases.push(parsePhase(value()));
        break;
      case '--particles':
        out.particles = whole('--particles', value(), 10);
        break;
      case '--seed':
        out.seed = whole('--seed', value(), 0);
        break;
      case '--duration':
        out.duration = positive('--duration', value(), 'seconds');
        break;
      default:
        return common(out, flag, value, inline);
    }
    return true;
  });
  out.file = oneFile(positional, 'trace');
  if (Number.isNaN(out.species.mobility)) throw new UsageError('trace needs --species MOBILITY,DIFFUSIVITY (m²/Vs, m²/s)');
  if (!out.pinched && !out.injection) throw new UsageError('trace needs --from X1,Y1,X2,Y2 or --region X1,Y1,...; or --pinched at a cross');
  if (!out.pinched && !out.detector && out.duration === undefined) throw new UsageError('trace needs --detector X1,Y1,X2,Y2, or a --duration');
  if (out.phases.slice(0, -1).some((p) => p.duration === undefined)) throw new UsageError('--phase: only the last phase may run for "auto"');
  return out;
}

const TARGET_KINDS = ['flow', 'speed', 'current', 'ratio'] as const;

/** `KIND:PORT:VALUE[:OF]`: flow (m³/s), speed (m/s), current (A) into the fluid through PORT; ratio: Q_PORT = VALUE·Q_OF. */
function parseTarget(text: string): TargetArg {
  const example = 'KIND:PORT:VALUE[:OF] with KIND flow, speed, current or ratio (e.g. speed:W:-1e-3 or ratio:SW:0:W)';
  const [kind, port, valueText, of, ...more] = text.split(':');
  const value = valueText === undefined ? null : parseNumber(valueText);
  if (!(TARGET_KINDS as readonly string[]).includes(kind) || !port || value === null || more.length > 0) throw new UsageError(`--target must be ${example}, not "${text}"`);
  if (kind === 'ratio') {
    if (!of) throw new UsageError(`--target ratio needs the port it is a ratio OF: ratio:PORT:VALUE:OF, not "${text}"`);
    return { kind, port, value, of };
  }
  if (of !== undefined) throw new UsageError(`--target ${kind} takes KIND:PORT:VALUE, not "${text}"`);
  return { kind: kind as 'flow' | 'speed' | 'current', port, value };
}

function parsePlan(rest: ReadonlyArray<string>): PlanCommand {
  const out: PlanCommand = { command: 'plan', file: '', targets: [], hold: [], float: [], bounds: [], json: false };
  const positional = walk(rest, (flag, value, inline) => {
    if (flag === '--target') out.targets.push(parseTarget(value()));
    else if (flag === '--hold') {
      const text = value();
      const [port, v] = text.split('=');
      const volts = v === undefined ? null : parseNumber(v);
      if (!port || volts === null) throw new UsageError(`--hold must be PORT=VOLTS (e.g. B=0), not "${text}"`);
      out.hold.push({ port, value: volts });
    } else if (flag === '--float') {
      const port = value();
      if (!port) throw new UsageError('--float needs a port id');
      out.float.push(port);
    } else if (flag === '--bounds') {
      const text = value();
      const m = /^([^=]+)=([^:]*):([^:]*)$/.exec(text);
      const lo = m ? (m[2] === '' ? -Infinity : parseNumber(m[2])) : null;
      const hi = m ? (m[3] === '' ? Infinity : parseNumber(m[3])) : null;
      if (!m || lo === null || hi === null) throw new UsageError(`--bounds must be PORT=MIN:MAX in volts (e.g. S=0:1500), not "${text}"`);
      if (lo > hi) throw new UsageError(`--bounds ${text}: the minimum is above the maximum`);
      out.bounds.push({ port: m[1], min: lo, max: hi });
    } else return common(out, flag, value, inline);
    return true;
  });
  out.file = oneFile(positional, 'plan');
  if (out.targets.length === 0) throw new UsageError('plan needs at least one --target KIND:PORT:VALUE[:OF]');
  return out;
}

function parseEdl(rest: ReadonlyArray<string>): EdlCommand {
  const out: EdlCommand = { command: 'edl', json: false };
  const positional = walk(rest, (flag, value, inline) => {
    switch (flag) {
      case '--ionic-strength':
        out.ionicStrength = positive(flag, value(), 'mol/m³; 10 mM is 10');
        break;
      case '--zeta':
        out.zeta = number(flag, value(), 'volts, e.g. -0.05');
        break;
      case '--temperature':
        out.temperature = positive(flag, value(), 'kelvin');
        break;
      case '--permittivity':
        out.permittivity = positive(flag, value(), 'relative permittivity');
        break;
      case '--viscosity':
        out.viscosity = positive(flag, value(), 'Pa s');
        break;
      case '--valence':
        out.valence = whole(flag, value(), 1);
        break;
      case '--field':
        out.field = positive(flag, value(), 'V/m');
        break;
      case '--depth':
        out.depth = positive(flag, value(), 'metres');
        break;
      case '--width':
        out.width = positive(flag, value(), 'metres');
        break;
      case '--json':
        if (inline) throw new UsageError('--json takes no value');
        out.json = true;
        break;
      default:
        return false;
    }
    return true;
  });
  if (positional.length > 1) throw new UsageError(`one design file at a time, got ${positional.length}: ${positional.join(', ')}`);
  out.file = positional[0];
  if (!out.file) {
    const missing = [['--ionic-strength', out.ionicStrength], ['--zeta', out.zeta], ['--temperature', out.temperature]].filter(([, v]) => v === undefined).map(([f]) => f);
    if (missing.length) throw new UsageError(`edl needs ${missing.join(', ')} (or a DESIGN.json to take them from)`);
  }
  return out;
}
