import { decodeFieldBlob, encodeFieldBlob, FIELD_NAMES, FieldBlobError, readFieldBlob, writeFieldBlob } from './field-blob';
import type { SolveFields } from './types';

/** A small grid with NaN outside a disc, negative zeros, subnormals and extremes: every bit must come back. */
function sampleFields(nx = 37, ny = 23): SolveFields {
  const n = nx * ny;
  const make = (f: (i: number, j: number) => number) => {
    const a = new Float32Array(n);
    for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) a[i + j * nx] = f(i, j);
    return a;
  };
  const inside = (i: number, j: number) => (i - nx / 2) ** 2 + (j - ny / 2) ** 2 < (ny / 2) ** 2;
  const masked = (f: (i: number, j: number) => number) => make((i, j) => (inside(i, j) ? f(i, j) : NaN));
  return {
    nx, ny, spacing: 5e-6, x0: -1.25e-4, y0: 3.3e-5,
    fraction: make((i, j) => (inside(i, j) ? Math.min(1, ((i * 7 + j * 3) % 11) / 10) : 0)),
    potential: masked((i, j) => 400 - i * 3.7 + j * 1e-3),
    fieldX: masked((i) => (i === 18 ? -0 : 1.2e5 + i)),
    fieldY: masked((i, j) => (j === 3 ? 1e-42 : -j * 17.25)),
    velocityX: masked((i) => i * 1e-4),
    velocityY: masked((i, j) => Math.sin(i + j) * 1e-3),
    pressure: masked(() => NaN),
    vorticity: masked((i, j) => (i === 7 && j === 7 ? 3.4e38 : (i - j) * 0.5)),
    streamfunction: masked((i, j) => i * j * 1e-9),
  };
}

function sameBits(a: Float32Array, b: Float32Array): boolean {
  const x = new Uint32Array(a.buffer, a.byteOffset, a.length), y = new Uint32Array(b.buffer, b.byteOffset, b.length);
  return x.length === y.length && x.every((v, k) => v === y[k]);
}

describe('field blob', () => {
  it('round-trips every value bit for bit through gzip, and the grid header exactly', async () => {
    const fields = sampleFields();
    const stored = await writeFieldBlob(fields);
    expect([stored[0], stored[1]]).toEqual([0x1f, 0x8b]); // gzip
    const back = await readFieldBlob(stored);
    expect([back.nx, back.ny, back.spacing, back.x0, back.y0]).toEqual([fields.nx, fields.ny, fields.spacing, fields.x0, fields.y0]);
    for (const name of FIELD_NAMES) expect(sameBits(back[name], fields[name])).toBe(true);
    expect(Object.is(back.fieldX[18 + 12 * fields.nx], -0)).toBe(true);
    expect(back.extra).toEqual({});
  });

  it('compresses: NaN outside the fluid and smooth fields take far less room than raw floats', async () => {
    const fields = sampleFields(200, 120);
    const raw = encodeFieldBlob(fields);
    const stored = await writeFieldBlob(fields);
    expect(raw.length).toBeGreaterThan(FIELD_NAMES.length * 4 * 200 * 120);
    expect(stored.length).toBeLessThan(raw.length / 2);
  });

  it('reads an uncompressed blob, and a blob from a subarray of a larger buffer', async () => {
    const fields = sampleFields(9, 4);
    const raw = encodeFieldBlob(fields);
    const padded = new Uint8Array(raw.length + 16);
    padded.set(raw, 7);
    const back = await readFieldBlob(padded.subarray(7, 7 + raw.length));
    for (const name of FIELD_NAMES) expect(sameBits(back[name], fields[name])).toBe(true);
  });

  it('writes the documented header: magic, version, sizes, grid, names, aligned values', () => {
    const fields = sampleFields(3, 2);
    const raw = encodeFieldBlob(fields);
    const view = new DataView(raw.buffer);
    expect(new TextDecoder().decode(raw.subarray(0, 4))).toBe('OSMF');
    expect(view.getUint16(4, true)).toBe(1);
    expect(view.getUint16(6, true)).toBe(FIELD_NAMES.length);
    expect([view.getUint32(8, true), view.getUint32(12, true)]).toEqual([3, 2]);
    expect(view.getFloat64(16, true)).toBe(5e-6);
    const namesLength = view.getUint32(40, true);
    expect(new TextDecoder().decode(raw.subarray(44, 44 + namesLength)).split('\n')).toEqual([...FIELD_NAMES]);
    const start = (44 + namesLength + 3) & ~3;
    // Field k starts at start + 4·nx·ny·k; cell (1, 1) is index 4 (inside the fluid here).
    expect(view.getFloat32(start + 4 * 6 * FIELD_NAMES.indexOf('potential') + 4 * 4, true)).toBe(fields.potential[4]);
    expect(fields.potential[4]).not.toBeNaN();
    expect(raw.length).toBe(start + FIELD_NAMES.length * 4 * 6);
  });

  it('keeps fields it does not know and fills missing known ones with NaN', () => {
    const fields = sampleFields(4, 3);
    const raw = encodeFieldBlob(fields);
    // Rename "streamfunction" to "temperature" (same length would be simpler; rewrite the names instead).
    const view = new DataView(raw.buffer);
    const namesLength = view.getUint32(40, true);
    const names = new TextDecoder().decode(raw.subarray(44, 44 + namesLength)).replace('streamfunction', 'temperature123');
    raw.set(new TextEncoder().encode(names), 44);
    const back = decodeFieldBlob(raw);
    expect(Array.from(back.streamfunction).every(Number.isNaN)).toBe(true);
    expect(sameBits(back.extra['temperature123'], fields.streamfunction)).toBe(true);
  });

  it('refuses what is not a blob, a cut-short blob and a newer version with a FieldBlobError', async () => {
    const raw = encodeFieldBlob(sampleFields(5, 5));
    expect(() => decodeFieldBlob(new TextEncoder().encode('{"not":"a blob"} and more bytes to pass the length check'))).toThrow(FieldBlobError);
    expect(() => decodeFieldBlob(raw.subarray(0, raw.length - 4))).toThrow(/cut short/);
    const newer = raw.slice();
    new DataView(newer.buffer).setUint16(4, 2, true);
    expect(() => decodeFieldBlob(newer)).toThrow(/version 2/);
    const gz = await writeFieldBlob(sampleFields(5, 5));
    await expect(readFieldBlob(gz.subarray(0, 20))).rejects.toThrow(FieldBlobError);
  });

  it('refuses to write arrays of the wrong length', () => {
    const fields = { ...sampleFields(4, 3), pressure: new Float32Array(5) };
    expect(() => encodeFieldBlob(fields)).toThrow(/pressure has 5 values/);
  });
});
