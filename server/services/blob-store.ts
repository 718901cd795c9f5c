import type { MikroORM } from '@mikro-orm/postgresql';

/** Where run field blobs live. PostgreSQL for now; object storage can take its place behind the same three calls. */
export interface BlobStore {
  put(key: string, bytes: Uint8Array, contentType?: string): Promise<void>;
  /** The bytes exactly as stored, or null when there is no such key. */
  get(key: string): Promise<Buffer | null>;
  delete(key: string): Promise<void>;
}

/**
 * Blobs in the `run_blobs` table (bytea). Goes through knex with bound parameters, so the bytes travel as a
 * binary parameter rather than being escaped into the SQL text.
 */
export class PgBlobStore implements BlobStore {
  constructor(private readonly orm: MikroORM) {}

  private get knex() {
    return this.orm.em.getKnex();
  }

  async put(key: string, bytes: Uint8Array): Promise<void> {
    const buffer = Buffer.isBuffer(bytes) ? bytes : Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    await this.knex.raw(
      `insert into run_blobs (key, bytes, size, created_at) values (?, ?, ?, now())
       on conflict (key) do update set bytes = excluded.bytes, size = excluded.size, created_at = excluded.created_at`,
      [key, buffer, buffer.length],
    );
  }

  async get(key: string): Promise<Buffer | null> {
    const result = (await this.knex.raw('select bytes from run_blobs where key = ?', [key])) as { rows: { bytes: Buffer }[] };
    return result.rows[0]?.bytes ?? null;
  }

  async delete(key: string): Promise<void> {
    await this.knex.raw('delete from run_blobs where key = ?', [key]);
  }
}
