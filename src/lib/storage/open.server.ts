// The driver a process uses, from its settings: the app reads them from astro:env (index.server.ts), the scripts
// that start it (seeding, readiness) from the environment, so both always name the same store.
import { LocalDiskStorage } from './local-disk.server';
import { S3Storage } from './s3.server';
import type { StorageSettings } from './settings';
import type { FileStorage } from './storage';

/** The file store those settings name. */
export function openStorage(settings: StorageSettings): FileStorage {
  return settings.driver === 's3' ? new S3Storage(settings) : new LocalDiskStorage(settings.filesDir);
}
