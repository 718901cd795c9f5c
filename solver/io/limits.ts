/**
 * What an imported drawing may be: outline files are untrusted input, so every dimension of the work is
 * bounded before it is done. One ImportError type carries the refusal in plain words.
 */

export const IMPORT_LIMITS = {
  /** Bytes of one uploaded file. */
  maxBytes: 5 * 1024 * 1024,
  /** XML elements of an SVG. */
  maxElements: 20_000,
  /** Characters of one path's `d` or one polygon's `points`. */
  maxPathChars: 1_000_000,
  /** Segments over the whole drawing (after flattening curves). */
  maxSegments: 200_000,
  /** DXF entities. */
  maxEntities: 50_000,
  /** Largest |coordinate| in the file's own units. */
  maxRawCoordinate: 1e9,
  /** Largest |coordinate| once scaled (m): a chip is smaller than this. */
  maxCoordinateMetres: 1,
  /** Loops kept as shapes (the design allows 10000). */
  maxShapes: 10_000,
} as const;

export type ImportErrorCode = 'malformed' | 'hostile' | 'too-large' | 'unsupported' | 'out-of-range' | 'empty';

/** A refused file; `message` says why in words a user can act on. */
export class ImportError extends Error {
  constructor(
    readonly code: ImportErrorCode,
    message: string,
  ) {
    super(message);
    this.name = 'ImportError';
  }
}

/** Curves (Béziers, ellipses) become polylines within this distance of the true curve (m). */
export const CURVE_TOLERANCE = 1e-7;

export function checkRaw(v: number, what: string): void {
  if (!Number.isFinite(v) || Math.abs(v) > IMPORT_LIMITS.maxRawCoordinate) {
    throw new ImportError('out-of-range', `${what} has a coordinate of ${String(v)}, beyond ±${IMPORT_LIMITS.maxRawCoordinate} drawing units`);
  }
}
