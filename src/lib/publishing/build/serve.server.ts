// Serving a built version: the request has already decided access; this streams the stored bytes with the
// manifest's strong ETag, answering 304 when the visitor already holds them. Nothing is rendered or cached here.
import { Readable } from 'node:stream';
import { storage } from '@/lib/storage/index.server';
import { entryEtag, type Manifest, type ManifestEntry } from './contract';

/** A ready version's manifest entry for a path, or null (own keys only: "__proto__" names no file). */
export function manifestEntry(manifest: Manifest | null | undefined, path: string): ManifestEntry | null {
  if (!manifest || !Object.hasOwn(manifest.entries, path)) return null;
  return manifest.entries[path];
}

/** The stored bytes of one manifest entry as a response; extra headers (cache-control, disposition, CSP) are the caller's. */
export async function sendBuilt(request: Request, entry: ManifestEntry, headers: Record<string, string> = {}): Promise<Response> {
  const etag = entryEtag(entry);
  const base = { etag, 'content-type': entry.type, ...headers };
  if (request.headers.get('if-none-match')?.split(/\s*,\s*/).includes(etag)) return new Response(null, { status: 304, headers: base });
  const stored = await storage.getStream(entry.key);
  if (!stored) return new Response('Not found', { status: 404, headers: { 'content-type': 'text/plain; charset=utf-8' } });
  const body = request.method === 'HEAD' ? null : (Readable.toWeb(stored.stream) as ReadableStream<Uint8Array>);
  if (!body) stored.stream.destroy();
  return new Response(body, { headers: { ...base, 'content-length': String(stored.size) } });
}
