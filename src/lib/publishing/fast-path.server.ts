// The fast path for published reads: scripts/serve.mjs asks it first about every GET or HEAD under /b/. It answers
// what it can decide from memory alone — a member's or a share-link holder's page, file, stylesheet or PDF of a
// ready version — with the built bytes kept in memory (brotli and gzip made once), and hands everything else
// (sign-in redirects, former slugs, versions not ready, print passes, refusals, every other route) to Astro
// unchanged. Access is readerAccess(), the same decision siteAccess() starts with; no database round trip in the
// common case, since sessions, share grants, brands, roles and versions are kept current by change notices.
import type { IncomingMessage, ServerResponse } from 'node:http';
import { promisify } from 'node:util';
import { brotliCompress, constants as zlib, gzip } from 'node:zlib';
import { parse as parseCookies } from 'cookie';
import { SITE_MEMORY_MB, TRUSTED_PROXIES } from 'astro:env/server';
import { sessionFor, sessionKey } from '@/lib/auth/sessions.server';
import { SLUG_PATTERN } from '@/lib/brands/slug';
import { heldBack } from '@/lib/handover/gate.server';
import { clientAddress, trustedProxies } from '@/lib/http/client-address';
import { asksNotToTrack, type SiteRead } from '@/lib/insights/contract';
import { recordRead } from '@/lib/insights/record.server';
import { log, requestIdFrom } from '@/lib/log.server';
import { storage } from '@/lib/storage/index.server';
import { entryEtag, filePath, pagePath, pdfPath, staticPath, type Manifest, type ManifestEntry } from './build/contract';
import { manifestEntry } from './build/serve.server';
import { ByteMemory } from './byte-memory';
import { chooseEncoding, etagMatches, isCompressible, type ContentCoding } from './encoding';
import { siteCache } from './site-cache';
import { plainPageHtml, readerAccess, type SiteAccess } from './site-access.server';
import { SHARE_COOKIE, shareGrantFor } from './share-links.server';
import { latestNumber } from './versions.server';

/** Where serve.mjs finds the handler once the bundle has loaded it (Astro loads the middleware on the first request). */
export const FAST_PATH_KEY = Symbol.for('plumbline.fastPath');

/** Answers the request and resolves true, or resolves false having touched nothing (Astro answers then). */
export type FastPathHandler = (req: IncomingMessage, res: ServerResponse) => Promise<boolean>;

// The same headers the Astro routes send for each kind of read (src/pages/b/…).
const PAGE_HEADERS = { 'cache-control': 'private, no-cache' };
const FILE_HEADERS = {
  'cache-control': 'private, max-age=31536000, immutable',
  'x-content-type-options': 'nosniff',
  'content-security-policy': "default-src 'none'; style-src 'unsafe-inline'; sandbox",
};
const STATIC_HEADERS = { 'cache-control': 'private, max-age=31536000, immutable', 'x-content-type-options': 'nosniff' };

/**
 * /b/:slug[/v/:n] and, under a version, files/:id and static/:name; guideline.pdf and presentation.pdf with or
 * without one. Raw (still percent-encoded) segments: anything encoded, or a number Astro would refuse, falls through.
 */
const ROUTE = /^\/b\/([a-z0-9-]{1,80})(?:\/v\/([1-9]\d{0,8}))?(?:\/(guideline\.pdf|presentation\.pdf|files\/[A-Za-z0-9._~-]{1,200}|static\/[A-Za-z0-9._-]{1,200}))?$/;

type Read = { kind: 'page' } | { kind: 'file'; rest: string } | { kind: 'static'; name: string } | { kind: 'pdf'; edition: 'a4' | 'letter' | 'slides' };

const trust = trustedProxies(TRUSTED_PROXIES);
const memory = new ByteMemory(Math.max(0, SITE_MEMORY_MB) * 1024 * 1024);
const compress = { br: promisify(brotliCompress), gzip: promisify(gzip) };

/** The bytes of one stored object (and its compressed forms), from memory or storage; null when storage lacks it. */
function storedBytes(entry: ManifestEntry, coding: ContentCoding | 'identity'): Promise<Buffer | null> {
  return memory.remember(coding === 'identity' ? entry.key : `${entry.key}\0${coding}`, async () => {
    if (coding === 'identity') return storage.get(entry.key);
    const plain = await storedBytes(entry, 'identity');
    if (!plain) return null;
    return coding === 'br'
      ? compress.br(plain, { params: { [zlib.BROTLI_PARAM_QUALITY]: 11, [zlib.BROTLI_PARAM_SIZE_HINT]: plain.length } })
      : compress.gzip(plain, { level: 9 });
  });
}

/** What the request asks for, or null when it is not a read the fast path serves. */
function readOf(path: string, query: URLSearchParams): { slug: string; number: number | null; read: Read } | null {
  const m = ROUTE.exec(path);
  if (!m || !SLUG_PATTERN.test(m[1])) return null;
  const number = m[2] ? Number(m[2]) : null;
  const tail = m[3];
  if (!tail) return { slug: m[1], number, read: { kind: 'page' } };
  if (tail === 'presentation.pdf') return { slug: m[1], number, read: { kind: 'pdf', edition: 'slides' } };
  if (tail === 'guideline.pdf') {
    const size = (query.get('size') ?? 'a4').toLowerCase();
    // A paper size we do not print is Astro's 400.
    return size === 'a4' || size === 'letter' ? { slug: m[1], number, read: { kind: 'pdf', edition: size } } : null;
  }
  if (number === null) return null;
  if (tail.startsWith('files/')) return { slug: m[1], number, read: { kind: 'file', rest: tail } };
  return { slug: m[1], number, read: { kind: 'static', name: tail.slice('static/'.length) } };
}

/** The manifest path and headers for a read, or null when Astro should answer (a refusal, a path not built). */
async function resolve(access: SiteAccess, number: number | null, read: Read, query: URLSearchParams) {
  switch (read.kind) {
    case 'page': {
      const latest = number === null || (await siteCache.latest.remember(access.brand.id, () => latestNumber(access.brand.id))) === access.version.number;
      const who = access.viaShareLink ? 'link' : access.isEditor ? 'editor' : 'member';
      return { path: pagePath({ latest, who, downloads: access.canDownload }), headers: PAGE_HEADERS, varyCookie: true };
    }
    case 'file':
      return { path: filePath(read.rest, query), headers: FILE_HEADERS, varyCookie: false };
    case 'static':
      return { path: staticPath(read.name), headers: STATIC_HEADERS, varyCookie: false };
    case 'pdf': {
      if (read.edition === 'slides' && !access.canPresent) return null;
      const { brand, version } = access;
      const filename = read.edition === 'slides' ? `${brand.slug}-identity-v${version.number}.pdf` : `${brand.slug}-guidelines-v${version.number}-${read.edition}.pdf`;
      const headers = { 'content-disposition': `inline; filename="${filename}"`, 'cache-control': 'private, max-age=3600' };
      return { path: pdfPath(read.edition), headers, varyCookie: false };
    }
  }
}

/** The Headers object better-auth reads a session from (built only when a session cookie is present). */
function headersOf(req: IncomingMessage): Headers {
  const headers = new Headers();
  for (const [name, value] of Object.entries(req.headers)) if (typeof value === 'string') headers.set(name, value);
  return headers;
}

const fastPath: FastPathHandler = async (req, res) => {
  const url = req.url ?? '/';
  const q = url.indexOf('?');
  const path = q === -1 ? url : url.slice(0, q);
  const query = new URLSearchParams(q === -1 ? '' : url.slice(q + 1));
  const asked = readOf(path, query);
  if (!asked) return false;
  try {
    const cookieHeader = req.headers.cookie ?? '';
    const key = cookieHeader ? sessionKey(cookieHeader) : null;
    const user = key ? ((await sessionFor(key, headersOf(req)))?.user ?? null) : null;
    const shareGrant = cookieHeader.includes(SHARE_COOKIE) ? await shareGrantFor(parseCookies(cookieHeader)[SHARE_COOKIE]) : null;
    if (!user && !shareGrant) return false;
    const access = await readerAccess({ user, shareGrant }, asked.slug, asked.number);
    if (!access || access.version.state !== 'ready') return false;
    const chosen = await resolve(access, asked.number, asked.read, query);
    if (!chosen) return false;
    const entry = manifestEntry(access.version.manifest as Manifest | null, chosen.path);
    if (!entry) return false;
    const requestId = requestIdFrom(req.headers['x-request-id'] as string | undefined);

    if (asked.read.kind !== 'page') {
      const held = await heldBack(access.brand.id, chosen.path, access);
      if (held) {
        const body = Buffer.from(plainPageHtml(held.title, held.message));
        res.writeHead(402, { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store', 'content-length': body.length, 'x-request-id': requestId });
        res.end(req.method === 'HEAD' ? undefined : body);
        return true;
      }
    }

    const compressible = isCompressible(entry.type);
    const coding = compressible ? chooseEncoding(req.headers['accept-encoding']) : 'identity';
    let bytes = await storedBytes(entry, coding);
    let sent: ContentCoding | 'identity' = coding;
    // A compressed form no smaller than the file itself is not worth sending.
    if (coding !== 'identity' && bytes && bytes.length >= entry.size) {
      bytes = await storedBytes(entry, 'identity');
      sent = 'identity';
    }
    if (!bytes) return false;
    const etag = sent === 'identity' ? entryEtag(entry) : `"${entry.hash.slice(0, 32)}-${sent === 'br' ? 'br' : 'gz'}"`;
    const vary = [...(chosen.varyCookie ? ['Cookie'] : []), ...(compressible ? ['Accept-Encoding'] : [])].join(', ');
    const headers: Record<string, string | number> = { etag, 'content-type': entry.type, ...chosen.headers, 'x-request-id': requestId };
    if (vary) headers.vary = vary;
    if (etagMatches(req.headers['if-none-match'], etag)) {
      res.writeHead(304, headers).end();
      return true;
    }
    if (sent !== 'identity') headers['content-encoding'] = sent;
    headers['content-length'] = bytes.length;
    res.writeHead(200, headers);
    res.end(req.method === 'HEAD' ? undefined : bytes);
    recordRead(siteRead(req, access, asked.read.kind === 'static' ? 'file' : asked.read.kind, chosen.path, user?.id ?? null));
    return true;
  } catch (err) {
    if (res.headersSent) throw err;
    // Storage or the database had a moment: Astro's route answers this one as it always did.
    log.warn({ err, path: path.replace(/\?.*/, '') }, 'published read fell back to the full route');
    return false;
  }
};

function siteRead(req: IncomingMessage, access: SiteAccess, kind: SiteRead['kind'], path: string, userId: string | null): SiteRead {
  const header = (name: string) => req.headers[name] as string | undefined;
  const forwarded = header('x-forwarded-for');
  const asRequest = { headers: { get: (name: string) => (name === 'x-forwarded-for' ? (forwarded ?? null) : null) } } as unknown as Request;
  return {
    brandId: access.brand.id,
    versionNumber: access.version.number,
    kind,
    path,
    shareLinkId: access.viaShareLink,
    userId,
    ip: clientAddress(asRequest, req.socket.remoteAddress ?? '', trust),
    userAgent: header('user-agent') ?? '',
    doNotTrack: asksNotToTrack(header),
  };
}

/** Make the fast path available to scripts/serve.mjs (once per process; the middleware calls it when it loads). */
export function installFastPath(): void {
  (globalThis as Record<symbol, unknown>)[FAST_PATH_KEY] = fastPath;
}
