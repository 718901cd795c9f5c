import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client, type S3ClientConfig } from '@aws-sdk/client-s3';
import type { BlobStore } from '../services/blob-store';

export interface S3Settings {
  endpoint: string;
  bucket: string;
  region: string;
  accessKeyId: string;
  secretAccessKey: string;
}

/**
 * Blobs as objects in an S3-compatible store (the AWS SDK v3). Path-style addressing, so a local stand-in on
 * loopback works as well as a real endpoint; checksums only where the operation requires them, which local
 * stand-ins understand.
 */
export class S3BlobStore implements BlobStore {
  readonly client: S3Client;

  constructor(readonly settings: S3Settings) {
    const config: S3ClientConfig = {
      endpoint: settings.endpoint,
      region: settings.region,
      forcePathStyle: true,
      credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey },
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
    };
    this.client = new S3Client(config);
  }

  async put(key: string, bytes: Uint8Array, contentType = 'application/octet-stream'): Promise<void> {
    await this.client.send(new PutObjectCommand({ Bucket: this.settings.bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.byteLength }));
  }

  async get(key: string): Promise<Buffer | null> {
    try {
      const r = await this.client.send(new GetObjectCommand({ Bucket: this.settings.bucket, Key: key }));
      return Buffer.from(await r.Body!.transformToByteArray());
    } catch (error) {
      const e = error as { name?: string; $metadata?: { httpStatusCode?: number } };
      if (e.name === 'NoSuchKey' || e.$metadata?.httpStatusCode === 404) return null;
      throw error;
    }
  }

  async delete(key: string): Promise<void> {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.settings.bucket, Key: key }));
  }

  close(): void {
    this.client.destroy();
  }
}
