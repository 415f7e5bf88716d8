import fs from 'node:fs';
import S3rver from 's3rver';

export interface FakeS3 {
  port: number;
  endpoint: string;
  close: () => Promise<void>;
}

/** s3rver on loopback with its files in `directory` and the bucket created; s3rver accepts S3RVER/S3RVER keys. */
export async function startFakeS3(options: {
  port: number;
  directory: string;
  bucket: string;
  host?: string;
}): Promise<FakeS3> {
  fs.mkdirSync(options.directory, { recursive: true });
  const server = new S3rver({
    port: options.port,
    address: options.host ?? '127.0.0.1',
    silent: true,
    directory: options.directory,
    configureBuckets: [{ name: options.bucket, configs: [] }],
  });
  const address = (await server.run()) as { port: number };
  return {
    port: address.port,
    endpoint: `http://${options.host ?? '127.0.0.1'}:${address.port}`,
    close: () => server.close(),
  };
}
