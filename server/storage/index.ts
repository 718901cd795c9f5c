import type { MikroORM } from '@mikro-orm/postgresql';
import type { ServerConfig } from '../config';
import { PgBlobStore, type BlobStore } from '../services/blob-store';
import { startLocalS3 } from './local-s3';
import { S3BlobStore } from './s3-blob-store';

export interface Storage {
  blobs: BlobStore;
  /** 'postgres' (single machine) or the S3 endpoint in use, for the start-up line. */
  where: string;
  close(): Promise<void>;
}

/**
 * Where run field blobs and uploaded originals go. STORAGE=postgres keeps them in PostgreSQL (one machine);
 * otherwise objects go to S3_ENDPOINT, or to a local S3-compatible stand-in the server starts on loopback with
 * its data in .data/s3. PostgreSQL keeps the keys and metadata either way.
 */
export async function startStorage(config: ServerConfig, orm: MikroORM): Promise<Storage> {
  const s = config.storage;
  if (s.mode === 'postgres') return { blobs: new PgBlobStore(orm), where: 'PostgreSQL', close: async () => undefined };
  const local = s.endpoint ? null : await startLocalS3(s.dataDir, s.bucket);
  const endpoint = s.endpoint ?? local!.endpoint;
  // The stand-in checks signatures against its one fixed key pair.
  const keys = local ? { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' } : { accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey };
  const store = new S3BlobStore({ endpoint, bucket: s.bucket, region: s.region, ...keys });
  return {
    blobs: store,
    where: local ? `the local S3 stand-in at ${endpoint} (${s.dataDir})` : endpoint,
    async close() {
      store.close();
      await local?.close();
    },
  };
}
