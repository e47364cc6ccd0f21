// A local S3-compatible server for `npm start` with STORAGE=s3 and for the tests: s3rver (pure Node, from npm),
// keeping its objects under a folder of ours. It checks request signatures with its own fixed key pair.
import S3rver from 's3rver';
import type { S3Settings } from './s3.server';

export interface FakeS3 {
  /** The settings that reach it, with its bucket already made. */
  settings: S3Settings & { endpoint: string };
  close(): Promise<void>;
}

/** s3rver's own credentials: the only pair it accepts. */
const FAKE_KEY = 'S3RVER';

/** Start the fake on 127.0.0.1 (port 0 picks a free one) with `bucket` made; its objects stay in `dir` across restarts. */
export async function startFakeS3(opts: { dir: string; bucket: string; port?: number; host?: string }): Promise<FakeS3> {
  const host = opts.host ?? '127.0.0.1';
  const server = new S3rver({
    address: host,
    port: opts.port ?? 0,
    directory: opts.dir,
    silent: true,
    // Buckets in the path only: a virtual-host bucket would need a name server for <bucket>.127.0.0.1.
    vhostBuckets: false,
    configureBuckets: [{ name: opts.bucket, configs: [] }],
  });
  const { port } = await server.run();
  return {
    settings: { endpoint: `http://${host}:${port}`, bucket: opts.bucket, region: 'us-east-1', accessKeyId: FAKE_KEY, secretAccessKey: FAKE_KEY, forcePathStyle: true },
    close: () => server.close(),
  };
}
