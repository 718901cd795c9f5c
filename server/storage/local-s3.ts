import { mkdirSync } from 'node:fs';
import S3rver from 's3rver';

export interface LocalS3 {
  endpoint: string;
  close(): Promise<void>;
}

/**
 * A local S3-compatible stand-in (s3rver) on loopback with its objects under `directory`, for when no S3
 * endpoint is configured, like the local SMTP stand-in for mail. It signs with the fixed key pair S3RVER/S3RVER.
 */
export async function startLocalS3(directory: string, bucket: string): Promise<LocalS3> {
  mkdirSync(directory, { recursive: true });
  const server = new S3rver({ address: '127.0.0.1', port: 0, directory, silent: true, configureBuckets: [{ name: bucket }] });
  const info = (await server.run()) as { address: string; port: number };
  return {
    endpoint: `http://127.0.0.1:${info.port}`,
    close: () => server.close(),
  };
}
