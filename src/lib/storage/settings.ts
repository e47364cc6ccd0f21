// Which store a process uses, as plain settings: what the scripts pass to the server they start. No driver code here,
// so a script (or the tests' global set-up) can name a store without loading the object-store SDK.
import type { S3Settings } from './s3.server';

export type StorageSettings = { driver: 'local'; filesDir: string } | ({ driver: 's3' } & S3Settings);

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
