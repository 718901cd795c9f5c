/**
 * Files in and out, shared by the command line, the server and the app: outline import (SVG, DXF), mask
 * outline export (SVG, DXF), field exports (CSV, VTK) and figures. Pure TypeScript, no Node built-ins.
 */
import { drawingToDesign, type ImportResult } from './drawing';
import { importDxf } from './dxf-import';
import { ImportError } from './limits';
import { importSvg } from './svg-import';

export { drawingToDesign, IMPORT_DEFAULTS, type ImportReport, type ImportResult, type ImportedDrawing } from './drawing';
export { importDxf } from './dxf-import';
export { IMPORT_LIMITS, ImportError, type ImportErrorCode } from './limits';
export { maskOutline } from './mask-outline';
export { designToDxf } from './outline-dxf';
export { designToSvg } from './outline-svg';
export { importSvg } from './svg-import';

export type OutlineFormat = 'svg' | 'dxf';

/** The format a file name says (by its extension), or null. */
export function formatOfName(name: string): OutlineFormat | null {
  const m = /\.([a-z0-9]+)$/i.exec(name.trim());
  const ext = m?.[1].toLowerCase();
  return ext === 'svg' ? 'svg' : ext === 'dxf' ? 'dxf' : null;
}

/** Refuses content that does not look like the format its name says (a renamed file). */
function checkContent(format: OutlineFormat, text: string): void {
  const head = text.slice(0, 1024).replace(/^\uFEFF/, '').trimStart();
  if (text.includes('\u0000')) throw new ImportError('malformed', `the file is binary, not ${format === 'svg' ? 'SVG (XML text)' : 'ASCII DXF'}`);
  if (format === 'svg' && !head.startsWith('<')) throw new ImportError('malformed', 'the file is named .svg but is not XML');
  if (format === 'dxf' && head.startsWith('<')) throw new ImportError('malformed', 'the file is named .dxf but holds XML (an SVG?)');
}

export interface ImportOptions {
  /** Metres per drawing unit, overriding the file's own units. */
  scale?: number;
  /** Name of the new design (defaults to the file name without its extension). */
  name?: string;
}

/** A drawing file (its name and text) to a design and a report; throws ImportError. */
export function importOutline(fileName: string, text: string, options: ImportOptions = {}): ImportResult {
  const format = formatOfName(fileName);
  if (!format) throw new ImportError('unsupported', `"${fileName}" is neither .svg nor .dxf; outlines are imported from SVG or DXF files`);
  if (options.scale !== undefined && !(options.scale > 0 && options.scale < 1e3 && Number.isFinite(options.scale))) {
    throw new ImportError('out-of-range', `the scale must be a positive number of metres per drawing unit, not ${String(options.scale)}`);
  }
  checkContent(format, text);
  const drawing = format === 'svg' ? importSvg(text, { scale: options.scale }) : importDxf(text, { scale: options.scale });
  const name = options.name?.trim() || fileName.replace(/^.*[\\/]/, '').replace(/\.[^.]*$/, '') || 'Imported outline';
  return drawingToDesign(drawing, name);
}
