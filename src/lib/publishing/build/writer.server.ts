// The build writer: every file a build makes goes to storage under a content-addressed key inside the version,
// and its entry is kept for the manifest. A retried build writes the same keys again, so nothing is orphaned.
import { createHash } from 'node:crypto';
import { storage } from '@/lib/storage/index.server';
import { builtKey, type BuildWriter, type ManifestEntry } from './contract';

/** File extension for a content type, kept on the key so a stored object says what it is. */
function extensionFor(type: string, path: string): string {
  const fromPath = path.split('?')[0].match(/\.([a-z0-9]{1,8})$/i)?.[1];
  if (fromPath) return fromPath;
  const known: Record<string, string> = { 'text/html': 'html', 'text/css': 'css', 'application/json': 'json', 'application/pdf': 'pdf', 'image/svg+xml': 'svg', 'image/png': 'png', 'image/jpeg': 'jpg', 'image/webp': 'webp', 'image/avif': 'avif' };
  return known[type.split(';')[0].trim()] ?? type.split('/')[1]?.replace(/[^a-z0-9]/g, '').slice(0, 8) ?? '';
}

export function createBuildWriter(brandId: string, versionId: string): BuildWriter & { entries: Record<string, ManifestEntry> } {
  const entries: Record<string, ManifestEntry> = {};
  return {
    entries,
    async write(path, bytes, type) {
      const hash = createHash('sha256').update(bytes).digest('hex');
      const key = builtKey(brandId, versionId, hash, extensionFor(type, path));
      await storage.put(key, bytes, type);
      const entry = { key, hash, size: bytes.byteLength, type };
      entries[path] = entry;
      return entry;
    },
    async read(path) {
      return Object.hasOwn(entries, path) ? storage.get(entries[path].key) : null;
    },
    paths: () => Object.keys(entries),
    entry: (path) => (Object.hasOwn(entries, path) ? entries[path] : null),
  };
}
