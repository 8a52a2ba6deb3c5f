import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import S3rver from 's3rver';

export const TEST_BUCKET = 'mendstep-test-uploads';

/** A local fake S3 (s3rver) on 127.0.0.1, any free port, keeping its objects in a temporary folder. */
export async function startFakeS3() {
  const directory = await fs.mkdtemp(path.join(os.tmpdir(), 'mendstep-s3-'));
  const server = new S3rver({ address: '127.0.0.1', port: 0, silent: true, directory, configureBuckets: [{ name: TEST_BUCKET }] });
  const { port } = await server.run();
  return {
    endpoint: `http://127.0.0.1:${port}`,
    directory,
    // s3rver's default credentials.
    env: {
      STORAGE_DRIVER: 's3',
      S3_ENDPOINT: `http://127.0.0.1:${port}`,
      S3_BUCKET: TEST_BUCKET,
      S3_REGION: 'us-east-1',
      S3_ACCESS_KEY_ID: 'S3RVER',
      S3_SECRET_ACCESS_KEY: 'S3RVER',
    },
    async stop() {
      await server.close();
      await fs.rm(directory, { recursive: true, force: true });
    },
  };
}
