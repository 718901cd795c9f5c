/**
 * Osmolane on the command line (design-format.md):
 *
 *   npm run -s osmolane -- solve DESIGN.json [--cells N] [--probe X,Y]... [--json] [--vtk OUT.vtk]
 *
 * Exit 0 on success; 2 with one `error:` line on stderr for an invalid design or argument;
 * 1 with one `error:` line for an internal failure. Never a stack trace.
 * The only solver file with Node imports.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { parseArgs, UsageError, USAGE } from './command-line/args';
import { formatSummary } from './command-line/summary';
import { parseDesign } from '../shared/design';
import { asSolveError, invalidDesign } from './result/errors';
import { resultJson } from './result/types';
import { fieldsToVtk } from './result/vtk';
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
  let text: string;
  try {
    text = readFileSync(command.file, 'utf8');
  } catch (error) {
    const reason = (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (error as Error).message;
    throw new Exit(2, `cannot read ${command.file}: ${reason}`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    throw new Exit(2, `${command.file} is not valid JSON (${(error as Error).message})`);
  }
  const parsed = parseDesign(json);
  if (!parsed.ok) throw new Exit(2, `${command.file}: ${invalidDesign(parsed.errors).message}`);

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
  process.stdout.write(command.json ? `${JSON.stringify(resultJson(result), null, 2)}\n` : formatSummary(parsed.design, result));
}

try {
  main(process.argv.slice(2));
} catch (error) {
  const code = error instanceof Exit ? error.code : 1;
  const message = error instanceof Exit ? error.message : `internal failure: ${error instanceof Error ? error.message : String(error)}`;
  process.stderr.write(`error: ${oneLine(message)}\n`);
  process.exitCode = code;
}
