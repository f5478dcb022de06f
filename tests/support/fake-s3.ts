import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import S3rver from 's3rver';

export type FakeS3 = {
  endpoint: string;
  bucket: string;
  /** The environment that points createTestApp at this fake (STORAGE=s3, path-style). */
  env: Record<string, string>;
  close: () => Promise<void>;
};

/**
 * A local S3-compatible server (s3rver from npm) on a free loopback port, with one bucket,
 * files in a temporary folder that close() removes. s3rver accepts the key pair S3RVER/S3RVER.
 */
export async function startFakeS3(bucket = 'rindwise-test'): Promise<FakeS3> {
  const directory = await mkdtemp(path.join(os.tmpdir(), 'rindwise-s3-'));
  const server = new S3rver({
    address: '127.0.0.1',
    port: 0,
    silent: true,
    directory,
    configureBuckets: [{ name: bucket }],
  });
  const { port } = await server.run();
  const endpoint = `http://127.0.0.1:${port}`;
  return {
    endpoint,
    bucket,
    env: {
      STORAGE: 's3',
      S3_ENDPOINT: endpoint,
      S3_BUCKET: bucket,
      S3_REGION: 'us-east-1',
      S3_ACCESS_KEY_ID: 'S3RVER',
      S3_SECRET_ACCESS_KEY: 'S3RVER',
      S3_FORCE_PATH_STYLE: 'true',
    },
    close: async () => {
      await server.close();
      await rm(directory, { recursive: true, force: true });
    },
  };
}
