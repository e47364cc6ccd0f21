// The driver a process uses, from its settings: the app reads them from astro:env (index.server.ts), the scripts
// that start it (seeding, readiness) from the environment, so both always name the same store.
import { LocalDiskStorage } from './local-disk.server';
import { S3Storage, type S3Settings } from './s3.server';
import type { FileStorage } from './storage';

export type StorageSettings = ({ driver: 'local' } & { filesDir: string }) | ({ driver: 's3' } & S3Settings);

/** The file store those settings name. */
export function openStorage(settings: StorageSettings): FileStorage {
  return settings.driver === 's3' ? new S3Storage(settings) : new LocalDiskStorage(settings.filesDir);
}

/** Storage settings under the names the app reads (STORAGE, FILES_DIR, S3_*), as environment variables for a child process. */
export function storageEnv(settings: StorageSettings): Record<string, string> {
  if (settings.driver === 'local') return { STORAGE: 'local', FILES_DIR: settings.filesDir };
  return {
    STORAGE: 's3',
    S3_BUCKET: settings.bucket,
    S3_REGION: settings.region,
    S3_FORCE_PATH_STYLE: String(settings.forcePathStyle),
    ...(settings.endpoint ? { S3_ENDPOINT: settings.endpoint } : {}),
    ...(settings.accessKeyId ? { S3_ACCESS_KEY_ID: settings.accessKeyId } : {}),
    ...(settings.secretAccessKey ? { S3_SECRET_ACCESS_KEY: settings.secretAccessKey } : {}),
  };
}
