/**
 * The field blob: a solve's per-cell fields as one binary file, stored with a run (POST /api/revisions/:id/runs,
 * `fields` in base64) and read back from GET /api/runs/:id/fields. The app writes and reads it; the server keeps
 * the bytes as they are; the command line or a script can read it with the same functions.
 *
 * Layout before compression (all numbers little-endian):
 *
 *   offset  size  what
 *   0       4     magic "OSMF"
 *   4       2     format version (1)
 *   6       2     number of fields F
 *   8       4     nx
 *   12      4     ny
 *   16      8     spacing (m, float64)
 *   24      8     x0 (m, float64)
 *   32      8     y0 (m, float64)
 *   40      4     byte length L of the names
 *   44      L     the F field names, UTF-8, separated by "\n"
 *   ...     0-3   zero padding to a multiple of 4
 *   ...     4·nx·ny per field, in the order of the names: float32 values, cell (i, j) at index i + j·nx
 *
 * The whole is gzip-compressed with the platform's CompressionStream (browsers, Node 18+, workers) and read back
 * with DecompressionStream; {@link decodeFieldBlob} also reads an uncompressed blob. Unknown field names are kept in
 * `extra`; known ones missing from a blob read as NaN, so older blobs stay readable when fields are added.
 */
import type { SolveFields } from './result';

export const FIELD_BLOB_MAGIC = 'OSMF';
export const FIELD_BLOB_VERSION = 1;

/** The float arrays of SolveFields, in the order a blob stores them. */
export const FIELD_NAMES = [
  'fraction', 'potential', 'fieldX', 'fieldY', 'velocityX', 'velocityY', 'pressure', 'vorticity', 'streamfunction',
] as const;
export type FieldName = (typeof FIELD_NAMES)[number];

const HEADER_BYTES = 44;

export class FieldBlobError extends Error {
  readonly code = 'bad-field-blob';
}

/** Fields read back from a blob: the known ones, plus any the blob had that this version does not know. */
export type DecodedFields = SolveFields & { extra: Record<string, Float32Array> };

const LITTLE_ENDIAN = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;

/** The uncompressed blob of `fields` (every array must hold nx·ny values). */
export function encodeFieldBlob(fields: SolveFields): Uint8Array {
  const { nx, ny } = fields;
  const n = nx * ny;
  if (!(Number.isInteger(nx) && Number.isInteger(ny) && nx > 0 && ny > 0)) throw new FieldBlobError(`bad grid size ${nx} × ${ny}`);
  for (const name of FIELD_NAMES) {
    if (fields[name].length !== n) throw new FieldBlobError(`${name} has ${fields[name].length} values, not nx·ny = ${n}`);
  }
  const names = new TextEncoder().encode(FIELD_NAMES.join('\n'));
  const dataStart = align4(HEADER_BYTES + names.length);
  const bytes = new Uint8Array(dataStart + FIELD_NAMES.length * 4 * n);
  const view = new DataView(bytes.buffer);
  for (let k = 0; k < 4; k++) bytes[k] = FIELD_BLOB_MAGIC.charCodeAt(k);
  view.setUint16(4, FIELD_BLOB_VERSION, true);
  view.setUint16(6, FIELD_NAMES.length, true);
  view.setUint32(8, nx, true);
  view.setUint32(12, ny, true);
  view.setFloat64(16, fields.spacing, true);
  view.setFloat64(24, fields.x0, true);
  view.setFloat64(32, fields.y0, true);
  view.setUint32(40, names.length, true);
  bytes.set(names, HEADER_BYTES);
  FIELD_NAMES.forEach((name, k) => writeFloats(bytes, view, dataStart + 4 * n * k, fields[name]));
  return bytes;
}

/** Reads an uncompressed blob (or a gzip one: see {@link readFieldBlob} for that). */
export function decodeFieldBlob(bytes: Uint8Array): DecodedFields {
  if (bytes.length < HEADER_BYTES) throw new FieldBlobError('the field blob is too short to hold a header');
  const magic = String.fromCharCode(bytes[0], bytes[1], bytes[2], bytes[3]);
  if (magic !== FIELD_BLOB_MAGIC) throw new FieldBlobError('this is not an Osmolane field blob');
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const version = view.getUint16(4, true);
  if (version !== FIELD_BLOB_VERSION) throw new FieldBlobError(`field blob version ${version} is newer than this reader (${FIELD_BLOB_VERSION})`);
  const count = view.getUint16(6, true);
  const nx = view.getUint32(8, true), ny = view.getUint32(12, true);
  const spacing = view.getFloat64(16, true), x0 = view.getFloat64(24, true), y0 = view.getFloat64(32, true);
  const namesLength = view.getUint32(40, true);
  if (HEADER_BYTES + namesLength > bytes.length) throw new FieldBlobError('the field blob is cut short in its names');
  const names = new TextDecoder().decode(bytes.subarray(HEADER_BYTES, HEADER_BYTES + namesLength)).split('\n');
  if (names.length !== count) throw new FieldBlobError(`the field blob names ${names.length} fields but says it holds ${count}`);
  const n = nx * ny;
  const dataStart = align4(HEADER_BYTES + namesLength);
  if (bytes.length < dataStart + count * 4 * n) throw new FieldBlobError('the field blob is cut short in its values');

  const read = new Map<string, Float32Array>();
  names.forEach((name, k) => read.set(name, readFloats(bytes, view, dataStart + 4 * n * k, n)));
  const take = (name: FieldName) => {
    const values = read.get(name);
    read.delete(name);
    return values ?? new Float32Array(n).fill(NaN);
  };
  const out = {
    nx, ny, spacing, x0, y0,
    fraction: take('fraction'), potential: take('potential'), fieldX: take('fieldX'), fieldY: take('fieldY'),
    velocityX: take('velocityX'), velocityY: take('velocityY'), pressure: take('pressure'),
    vorticity: take('vorticity'), streamfunction: take('streamfunction'),
  };
  return { ...out, extra: Object.fromEntries(read) };
}

/** The gzip-compressed blob of `fields`, as stored with a run. */
export async function writeFieldBlob(fields: SolveFields): Promise<Uint8Array> {
  return pipe(encodeFieldBlob(fields), new CompressionStream('gzip'));
}

/** Fields from a stored blob (gzip-compressed as {@link writeFieldBlob} writes it, or plain). */
export async function readFieldBlob(bytes: Uint8Array): Promise<DecodedFields> {
  const gzip = bytes.length >= 2 && bytes[0] === 0x1f && bytes[1] === 0x8b;
  if (!gzip) return decodeFieldBlob(bytes);
  try {
    return decodeFieldBlob(await pipe(bytes, new DecompressionStream('gzip')));
  } catch (error) {
    if (error instanceof FieldBlobError) throw error;
    throw new FieldBlobError(`the field blob could not be decompressed (${error instanceof Error ? error.message : String(error)})`);
  }
}

function align4(n: number): number {
  return (n + 3) & ~3;
}

function writeFloats(bytes: Uint8Array, view: DataView, at: number, values: Float32Array): void {
  if (LITTLE_ENDIAN) {
    bytes.set(new Uint8Array(values.buffer, values.byteOffset, values.byteLength), at);
    return;
  }
  for (let k = 0; k < values.length; k++) view.setFloat32(at + 4 * k, values[k], true);
}

function readFloats(bytes: Uint8Array, view: DataView, at: number, n: number): Float32Array {
  const out = new Float32Array(n);
  if (LITTLE_ENDIAN) {
    new Uint8Array(out.buffer).set(bytes.subarray(at, at + 4 * n));
    return out;
  }
  for (let k = 0; k < n; k++) out[k] = view.getFloat32(at + 4 * k, true);
  return out;
}

/** All bytes of `input` passed through a (de)compression stream. */
async function pipe(input: Uint8Array, transform: CompressionStream | DecompressionStream): Promise<Uint8Array> {
  const writer = transform.writable.getWriter();
  const written = writer.write(input as Uint8Array<ArrayBuffer>).then(() => writer.close());
  written.catch(() => undefined); // a broken input fails the reads below as well; that error is the one reported
  const chunks: Uint8Array[] = [];
  let total = 0;
  const reader = transform.readable.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    chunks.push(value);
    total += value.length;
  }
  await written;
  const out = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.length;
  }
  return out;
}
