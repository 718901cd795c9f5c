/** Files (issue 8): imported drawings, the files kept with a design, run exports. */
import type { Id, Timestamp } from './common';
import type { DesignDetail } from './designs';

/** What an imported drawing gave: counts, the units used, and everything skipped with where it is (m). */
export interface ImportReport {
  format: 'svg' | 'dxf';
  metresPerUnit: number;
  unitsSource: string;
  found: { loops: number; add: number; subtract: number; circles: number; sectors: number; polygons: number; ports: number; wallZones: number };
  skipped: { entity: string; at: [number, number] | null; reason: string }[];
  bounds: [number, number, number, number];
}

/** POST /api/workspaces/:wid/designs/import with preview=1: the parsed document, nothing stored. */
export interface ImportPreview {
  document: unknown;
  report: ImportReport;
}

/** POST /api/workspaces/:wid/designs/import: the new design and what the import found. */
export interface ImportCreated {
  design: DesignDetail;
  report: ImportReport;
}

/** A file kept with a design (the original of an imported drawing). */
export interface DesignFileInfo {
  id: Id;
  designId: Id;
  kind: string;
  fileName: string;
  contentType: string;
  size: number;
  sha256: string;
  createdAt: Timestamp;
  createdBy: string | null;
}

export const RUN_EXPORT_FORMATS = ['csv', 'vtk', 'svg', 'png'] as const;
export type RunExportFormat = (typeof RUN_EXPORT_FORMATS)[number];
export const MAP_QUANTITY_NAMES = ['potential', 'fieldStrength', 'speed', 'vorticity', 'pressure', 'streamfunction'] as const;
export type MapQuantityName = (typeof MAP_QUANTITY_NAMES)[number];
