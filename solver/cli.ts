/**
 * Osmolane on the command line (design-format.md):
 *
 *   npm run -s osmolane -- solve DESIGN.json [--cells N] [--probe X,Y]... [--json] [--vtk OUT.vtk] [--csv OUT.csv]
 *   npm run -s osmolane -- export DESIGN.json --format svg|dxf --out FILE
 *   npm run -s osmolane -- import FILE.svg|FILE.dxf [--scale METRES_PER_UNIT] --out DESIGN.json
 *   npm run -s osmolane -- compare|trace|plan|edl ... (see USAGE in command-line/args.ts)
 *
 * Exit 0 on success; 2 with one `error:` line on stderr for an invalid design or argument;
 * 1 with one `error:` line for an internal failure. Never a stack trace.
 * The only solver file with Node imports.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { parseArgs, UsageError, USAGE } from './command-line/args';
import { formatSummary } from './command-line/summary';
import { runCompare, runEdl, runPlan, runTraceCommand, type AnalysisOutput } from './command-line/analysis';
import type { AnalysisCommand } from './command-line/analysis-args';
import { PlanError } from './planner';
import { parseDesign, type DesignDocument } from '../shared/design';
import { asSolveError, invalidDesign } from './result/errors';
import { resultJson } from './result/types';
import { fieldsToVtk } from './result/vtk';
import { designToDxf, designToSvg, ImportError, importOutline } from './io';
import { resultsCsv } from './io/fields-csv';
import { solveDesign } from './solve';

class Exit extends Error {
  constructor(readonly code: number, message: string) {
    super(message);
  }
}

function oneLine(text: string): string {
  return text.replace(/\s*[\r\n]+\s*/g, ' ').trim();
}

function main(argv: string[]): void {
  let command;
  try {
    command = parseArgs(argv);
  } catch (error) {
    if (error instanceof UsageError) throw new Exit(2, error.message);
    throw error;
  }
  if (command.command === 'help') {
    process.stdout.write(`${USAGE}\n`);
    return;
  }
  if (command.command === 'edl' && command.file === undefined) {
    analysis(command, null);
    return;
  }
  const text = read(command.file!);
  if (command.command === 'import') {
    let imported;
    try {
      imported = importOutline(command.file, text, { scale: command.scale });
    } catch (error) {
      if (error instanceof ImportError) throw new Exit(2, `${command.file}: ${error.message}`);
      throw error;
    }
    write(command.out, `${JSON.stringify(imported.design, null, 2)}\n`);
    const { found, skipped } = imported.report;
    process.stdout.write(
      `${command.file}: ${found.add} add and ${found.subtract} subtract shapes (${found.circles} circles, ${found.sectors} sectors, ${found.polygons} polygons), ${found.ports} ports, ${found.wallZones} wall zones; ${imported.report.unitsSource}\n` +
        skipped.map((s) => `skipped ${s.entity}${s.at ? ` at (${s.at.map((v) => v.toPrecision(4)).join(', ')}) m` : ''}: ${s.reason}\n`).join('') +
        `wrote ${command.out}\n`,
    );
    return;
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    throw new Exit(2, `${command.file} is not valid JSON (${(error as Error).message})`);
  }
  const parsed = parseDesign(json);
  if (!parsed.ok) throw new Exit(2, `${command.file}: ${invalidDesign(parsed.errors).message}`);
  if (command.command === 'export') {
    write(command.out, command.format === 'svg' ? designToSvg(parsed.design) : designToDxf(parsed.design));
    process.stdout.write(`wrote ${command.out} (${command.format === 'svg' ? 'SVG, 1 unit = 1 um' : 'DXF, $INSUNITS micrometres'})\n`);
    return;
  }
  if (command.command !== 'solve') {
    analysis(command, parsed.design);
    return;
  }

  let result;
  try {
    result = solveDesign(parsed.design, { cells: command.cells, probes: command.probes });
  } catch (error) {
    const e = asSolveError(error);
    throw new Exit(e.kind === 'internal' ? 1 : 2, e.kind === 'internal' ? e.message : `${command.file}: ${e.message}`);
  }
  if (command.vtk !== undefined) {
    try {
      writeFileSync(command.vtk, fieldsToVtk(result.fields, `Osmolane: ${parsed.design.name}`));
    } catch (error) {
      throw new Exit(2, `cannot write ${command.vtk}: ${(error as Error).message}`);
    }
  }
  if (command.csv !== undefined) write(command.csv, resultsCsv({ name: parsed.design.name, ports: result.ports, probes: result.probes }));
  process.stdout.write(command.json ? `${JSON.stringify(resultJson(result), null, 2)}\n` : formatSummary(parsed.design, result));
}

/** compare, trace, plan, edl: JSON or text on stdout; refusals exit 2, naming the design file. */
function analysis(command: AnalysisCommand, design: DesignDocument | null): void {
  let output: AnalysisOutput;
  try {
    if (command.command === 'edl') output = runEdl(design, command);
    else if (!design) throw new Exit(2, 'no design file given');
    else if (command.command === 'compare') output = runCompare(design, command);
    else if (command.command === 'trace') output = runTraceCommand(design, command);
    else output = runPlan(design, command);
  } catch (error) {
    if (error instanceof Exit) throw error;
    const where = command.file ? `${command.file}: ` : '';
    if (error instanceof PlanError) throw new Exit(2, `${where}${error.message}`);
    const e = asSolveError(error);
    throw new Exit(e.kind === 'internal' ? 1 : 2, e.kind === 'internal' ? e.message : `${where}${e.message}`);
  }
  process.stdout.write(command.json ? `${JSON.stringify(output.json, null, 2)}\n` : output.text);
}

function read(file: string): string {
  try {
    return readFileSync(file, 'utf8');
  } catch (error) {
    const reason = (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (error as Error).message;
    throw new Exit(2, `cannot read ${file}: ${reason}`);
  }
}

function write(file: string, text: string): void {
  try {
    writeFileSync(file, text);
  } catch (error) {
    throw new Exit(2, `cannot write ${file}: ${(error as Error).message}`);
  }
}

try {
  main(process.argv.slice(2));
} catch (error) {
  const code = error instanceof Exit ? error.code : 1;
  const message = error instanceof Exit ? error.message : `internal failure: ${error instanceof Error ? error.message : String(error)}`;
  process.stderr.write(`error: ${oneLine(message)}\n`);
  process.exitCode = code;
}
