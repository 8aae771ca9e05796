import { mkdirSync } from 'node:fs';
import S3rver from 's3rver';

export interface RunningFake {
  port: number;
  stop(): Promise<void>;
}

/** An S3-compatible store on loopback (s3rver), keeping objects under `directory`. */
export async function startS3Fake(options: { port: number; directory: string; bucket: string }): Promise<RunningFake> {
  mkdirSync(options.directory, { recursive: true });
  const server = new S3rver({
    port: options.port,
    address: '127.0.0.1',
    silent: true,
    directory: options.directory,
    configureBuckets: [{ name: options.bucket }],
  });
  const { port } = await server.run();
  return { port, stop: () => server.close() };
}
