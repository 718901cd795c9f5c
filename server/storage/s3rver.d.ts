/** The local S3 stand-in ships no types; the part we use. */
declare module 's3rver' {
  interface S3rverOptions {
    address?: string;
    port?: number;
    directory: string;
    silent?: boolean;
    configureBuckets?: Array<{ name: string }>;
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<{ address: string; port: number; family: string }>;
    close(): Promise<void>;
  }
}
