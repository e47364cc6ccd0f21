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
import { keptSession, sessionFor, sessionKey } from '@/lib/auth/sessions.server';
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
import { keptReaderAccess, plainPageHtml, readerAccess, type SiteAccess } from './site-access.server';
import { keptShareGrant, SHARE_COOKIE, shareGrantFor } from './share-links.server';
import { latestNumber } from './versions.server';

/** Where serve.mjs finds the handler once the bundle has loaded it (Astro loads the middleware on the first request). */
export const FAST_PATH_KEY = Symbol.for('plumbline.fastPath');

/**
 * Answers the request and says true, or says false having touched nothing (Astro answers then); a promise of either
 * when something had to be looked up first.
 */
export type FastPathHandler = (req: IncomingMessage, res: ServerResponse) => boolean | Promise<boolean>;

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
function readOf(path: string, search: string): Asked | null {
  const m = ROUTE.exec(path);
  if (!m || !SLUG_PATTERN.test(m[1])) return null;
  const slug = m[1];
  const number = m[2] ? Number(m[2]) : null;
  const tail = m[3];
  const query = new URLSearchParams(search);
  if (!tail) return { slug, number, read: { kind: 'page' }, query };
  if (tail === 'presentation.pdf') return { slug, number, read: { kind: 'pdf', edition: 'slides' }, query };
  if (tail === 'guideline.pdf') {
    const size = (query.get('size') ?? 'a4').toLowerCase();
    // A paper size we do not print is Astro's 400.
    return size === 'a4' || size === 'letter' ? { slug, number, read: { kind: 'pdf', edition: size }, query } : null;
  }
  if (number === null) return null;
  if (tail.startsWith('files/')) return { slug, number, read: { kind: 'file', rest: tail }, query };
  return { slug, number, read: { kind: 'static', name: tail.slice('static/'.length) }, query };
}

interface Chosen {
  /** What insights count it as (a version's static copies are files). */
  kind: SiteRead['kind'];
  path: string;
  headers: Record<string, string>;
  varyCookie: boolean;
}

/**
 * The manifest path and headers for a read, or null when Astro should answer (a presentation PDF the link does not
 * include). `latest` is the brand's newest ready version number, needed for a page asked for by number.
 */
function chosenFor(access: SiteAccess, asked: Asked, latest: number | null): Chosen | null {
  const { read } = asked;
  switch (read.kind) {
    case 'page': {
      const who = access.viaShareLink ? 'link' : access.isEditor ? 'editor' : 'member';
      return { kind: 'page', path: pagePath({ latest: asked.number === null || latest === access.version.number, who, downloads: access.canDownload }), headers: PAGE_HEADERS, varyCookie: true };
    }
    case 'file':
      return { kind: 'file', path: filePath(read.rest, asked.query), headers: FILE_HEADERS, varyCookie: false };
    case 'static':
      return { kind: 'file', path: staticPath(read.name), headers: STATIC_HEADERS, varyCookie: false };
    case 'pdf': {
      if (read.edition === 'slides' && !access.canPresent) return null;
      const { brand, version } = access;
      const filename = read.edition === 'slides' ? `${brand.slug}-identity-v${version.number}.pdf` : `${brand.slug}-guidelines-v${version.number}-${read.edition}.pdf`;
      return { kind: 'pdf', path: pdfPath(read.edition), headers: { 'content-disposition': `inline; filename="${filename}"`, 'cache-control': 'private, max-age=3600' }, varyCookie: false };
    }
  }
}

/** The Headers object better-auth reads a session from (built only when a session cookie is present). */
function headersOf(req: IncomingMessage): Headers {
  const headers = new Headers();
  for (const [name, value] of Object.entries(req.headers)) if (typeof value === 'string') headers.set(name, value);
  return headers;
}

interface Asked {
  slug: string;
  number: number | null;
  read: Read;
  query: URLSearchParams;
}

/** What the fast path decided to send: the access, the manifest path and entry, and the route's headers. */
interface Decided extends Chosen {
  access: SiteAccess;
  userId: string | null;
  entry: ManifestEntry;
}

/** The manifest entry for a read of this access, or null (not ready, not built, not for this reader). */
function decided(access: SiteAccess | null, userId: string | null, chosen: Chosen | null): Decided | null {
  if (!access || access.version.state !== 'ready' || !chosen) return null;
  const entry = manifestEntry(access.version.manifest as Manifest | null, chosen.path);
  // A file too large to keep beside others (an eighth of the memory) is streamed by Astro's route instead.
  return entry && entry.size <= memory.maxBytes / 8 ? { access, userId, entry, ...chosen } : null;
}

/**
 * The whole decision from memory, without waiting: undefined when something is not kept yet (the waiting path
 * looks it up and keeps it), null when Astro answers. The common read of a page costs no promise at all.
 */
function decideKept(req: IncomingMessage, asked: Asked): Decided | null | undefined {
  const cookieHeader = req.headers.cookie ?? '';
  const key = cookieHeader ? sessionKey(cookieHeader) : null;
  const session = key ? keptSession(key) : null;
  if (session === undefined) return undefined;
  const user = session?.user ?? null;
  const shareGrant = cookieHeader.includes(SHARE_COOKIE) ? keptShareGrant(parseCookies(cookieHeader)[SHARE_COOKIE]) : null;
  if (shareGrant === undefined) return undefined;
  if (!user && !shareGrant) return null;
  const access = keptReaderAccess({ user, shareGrant }, asked.slug, asked.number);
  if (access === undefined) return undefined;
  if (!access) return null;
  let latest: number | null | undefined = null;
  if (asked.read.kind === 'page' && asked.number !== null) {
    latest = siteCache.latest.get(access.brand.id);
    if (latest === undefined) return undefined;
  }
  return decided(access, user?.id ?? null, chosenFor(access, asked, latest));
}

/** The same decision, looking up (and keeping) whatever memory lacks. */
async function decideLooked(req: IncomingMessage, asked: Asked): Promise<Decided | null> {
  const cookieHeader = req.headers.cookie ?? '';
  const key = cookieHeader ? sessionKey(cookieHeader) : null;
  const user = key ? ((await sessionFor(key, headersOf(req)))?.user ?? null) : null;
  const shareGrant = cookieHeader.includes(SHARE_COOKIE) ? await shareGrantFor(parseCookies(cookieHeader)[SHARE_COOKIE]) : null;
  if (!user && !shareGrant) return null;
  const access = await readerAccess({ user, shareGrant }, asked.slug, asked.number);
  if (!access) return null;
  const latest = asked.read.kind === 'page' && asked.number !== null ? await siteCache.latest.remember(access.brand.id, () => latestNumber(access.brand.id)) : null;
  return decided(access, user?.id ?? null, chosenFor(access, asked, latest));
}

/** The stored bytes to send and their coding, from memory only (undefined when not kept yet). */
function keptBody(entry: ManifestEntry, coding: ContentCoding | 'identity'): { bytes: Buffer; sent: ContentCoding | 'identity' } | undefined {
  const bytes = memory.peek(coding === 'identity' ? entry.key : `${entry.key}\0${coding}`);
  if (!bytes) return undefined;
  if (coding === 'identity' || bytes.length < entry.size) return { bytes, sent: coding };
  // A compressed form no smaller than the file itself is not worth sending.
  const plain = memory.peek(entry.key);
  return plain ? { bytes: plain, sent: 'identity' } : undefined;
}

/** The same, reading storage and compressing once when memory lacks them; null when storage lacks the object. */
async function lookedBody(entry: ManifestEntry, coding: ContentCoding | 'identity'): Promise<{ bytes: Buffer; sent: ContentCoding | 'identity' } | null> {
  const bytes = await storedBytes(entry, coding);
  if (!bytes) return null;
  if (coding === 'identity' || bytes.length < entry.size) return { bytes, sent: coding };
  const plain = await storedBytes(entry, 'identity');
  return plain ? { bytes: plain, sent: 'identity' } : null;
}

/** chooseEncoding's answer by Accept-Encoding value: browsers send a handful of values, parsed once each. */
const codings = new Map<string, ContentCoding | 'identity'>();
function codingFor(header: string | undefined): ContentCoding | 'identity' {
  if (!header) return 'identity';
  let coding = codings.get(header);
  if (coding === undefined) {
    coding = chooseEncoding(header);
    if (codings.size >= 1000) codings.clear();
    codings.set(header, coding);
  }
  return coding;
}

/** Write the answer: 304 when the visitor holds this representation, else 200 with the bytes (none for HEAD). */
function send(req: IncomingMessage, res: ServerResponse, d: Decided, body: { bytes: Buffer; sent: ContentCoding | 'identity' }, compressible: boolean): void {
  const { entry } = d;
  const etag = body.sent === 'identity' ? entryEtag(entry) : `"${entry.hash.slice(0, 32)}-${body.sent === 'br' ? 'br' : 'gz'}"`;
  const headers: Record<string, string | number> = { etag, 'content-type': entry.type, ...d.headers, 'x-request-id': requestIdFrom(req.headers['x-request-id'] as string | undefined) };
  if (d.varyCookie || compressible) headers.vary = d.varyCookie ? (compressible ? 'Cookie, Accept-Encoding' : 'Cookie') : 'Accept-Encoding';
  if (etagMatches(req.headers['if-none-match'], etag)) {
    res.writeHead(304, headers).end();
    return;
  }
  if (body.sent !== 'identity') headers['content-encoding'] = body.sent;
  headers['content-length'] = body.bytes.length;
  res.writeHead(200, headers);
  res.end(req.method === 'HEAD' ? undefined : body.bytes);
  // The answer is out: nothing about noting it may reach the visitor or the process. A HEAD is not a read, and the
  // version's own stylesheets and scripts are the page's furniture, not something anyone reads or downloads.
  if (req.method !== 'GET' || d.path.startsWith('static/')) return;
  try {
    recordRead(siteRead(req, d.access, d.kind, d.path, d.userId));
  } catch (err) {
    log.warn({ err }, 'a published read could not be noted');
  }
}

/** The answer when something had to be looked up: the handover gate for files and PDFs, then the bytes. */
async function answerLooked(req: IncomingMessage, res: ServerResponse, d: Decided | null, kind: Read['kind']): Promise<boolean> {
  if (!d) return false;
  if (kind !== 'page') {
    const held = await heldBack(d.access.brand.id, d.path, d.access);
    if (held) {
      const body = Buffer.from(plainPageHtml(held.title, held.message));
      const requestId = requestIdFrom(req.headers['x-request-id'] as string | undefined);
      res.writeHead(402, { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store', 'content-length': body.length, 'x-request-id': requestId });
      res.end(req.method === 'HEAD' ? undefined : body);
      return true;
    }
  }
  const compressible = isCompressible(d.entry.type);
  const body = await lookedBody(d.entry, compressible ? codingFor(req.headers['accept-encoding']) : 'identity');
  if (!body) return false;
  send(req, res, d, body, compressible);
  return true;
}

const fastPath: FastPathHandler = (req, res) => {
  const url = req.url ?? '/';
  const q = url.indexOf('?');
  const asked = readOf(q === -1 ? url : url.slice(0, q), q === -1 ? '' : url.slice(q + 1));
  if (!asked) return false;
  try {
    // A page whose every lookup and bytes are in memory is answered here and now (no handover gate for pages).
    const kept = asked.read.kind === 'page' ? decideKept(req, asked) : undefined;
    if (kept === null) return false;
    if (kept) {
      const compressible = isCompressible(kept.entry.type);
      const body = keptBody(kept.entry, compressible ? codingFor(req.headers['accept-encoding']) : 'identity');
      if (body) {
        send(req, res, kept, body, compressible);
        return true;
      }
    }
  } catch (err) {
    if (res.headersSent) throw err;
    log.warn({ err, path: url.slice(0, q === -1 ? undefined : q) }, 'published read fell back to the full route');
    return false;
  }
  return decideLooked(req, asked)
    .then((d) => answerLooked(req, res, d, asked.read.kind))
    .catch((err: unknown) => {
      if (res.headersSent) throw err;
      // Storage or the database had a moment: Astro's route answers this one as it always did.
      log.warn({ err, path: url.slice(0, q === -1 ? undefined : q) }, 'published read fell back to the full route');
      return false;
    });
};

function siteRead(req: IncomingMessage, access: SiteAccess, kind: SiteRead['kind'], path: string, userId: string | null): SiteRead {
  const header = (name: string) => req.headers[name] as string | undefined;
  const socket = req.socket.remoteAddress ?? '';
  // Only a trusted proxy's X-Forwarded-For is read, as for the limiters (src/lib/http/client-address.ts).
  const forwarded = header('x-forwarded-for');
  const ip = socket && trust(socket) ? clientAddress({ headers: { get: (name: string) => (name === 'x-forwarded-for' ? (forwarded ?? null) : null) } } as unknown as Request, socket, trust) : socket;
  return {
    brandId: access.brand.id,
    versionNumber: access.version.number,
    kind,
    path,
    shareLinkId: access.viaShareLink,
    userId,
    ip,
    userAgent: header('user-agent') ?? '',
    doNotTrack: asksNotToTrack(header),
    fetchedAs: header('sec-fetch-dest') ?? null,
  };
}

/** Make the fast path available to scripts/serve.mjs (once per process; the middleware calls it when it loads). */
export function installFastPath(): void {
  (globalThis as Record<symbol, unknown>)[FAST_PATH_KEY] = fastPath;
}
