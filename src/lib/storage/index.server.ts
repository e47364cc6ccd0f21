// The configured file store for this process: local disk (STORAGE=local, the default) or an S3-compatible store.
import { FILES_DIR, S3_ACCESS_KEY_ID, S3_BUCKET, S3_ENDPOINT, S3_FORCE_PATH_STYLE, S3_REGION, S3_SECRET_ACCESS_KEY, STORAGE } from 'astro:env/server';
import { openStorage } from './open.server';
import type { FileStorage } from './storage';

export const storage: FileStorage = openStorage(
  STORAGE === 's3'
    ? {
        driver: 's3',
        endpoint: S3_ENDPOINT || undefined,
        bucket: S3_BUCKET,
        region: S3_REGION,
        accessKeyId: S3_ACCESS_KEY_ID,
        secretAccessKey: S3_SECRET_ACCESS_KEY,
        forcePathStyle: S3_FORCE_PATH_STYLE,
      }
    : { driver: 'local', filesDir: FILES_DIR },
);

/** Which kind of store this process writes to (reported by GET /api/health). */
export const storageKind: 'local' | 's3' = STORAGE === 's3' ? 's3' : 'local';
