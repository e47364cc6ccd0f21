// The configured file store for this process.
import { FILES_DIR } from 'astro:env/server';
import { LocalDiskStorage } from './local-disk.server';
import type { FileStorage } from './storage';

export const storage: FileStorage = new LocalDiskStorage(FILES_DIR);

/** Which kind of store this process writes to (reported by GET /api/health). */
export const storageKind: 'local' | 's3' = 'local';
