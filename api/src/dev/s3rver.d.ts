// s3rver ships no types; this is the part we use.
declare module 's3rver' {
  import type { Server } from 'node:http';
  interface S3rverOptions {
    port?: number;
    address?: string;
    silent?: boolean;
    directory: string;
    resetOnClose?: boolean;
    configureBuckets?: Array<{ name: string; configs?: unknown[] }>;
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<{ address: string; port: number }>;
    close(): Promise<void>;
    httpServer?: Server;
  }
}
