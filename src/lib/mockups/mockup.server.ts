// A mock-up as a file: the template filled from an identity, every picture and font embedded as a data: address
// (Chromium fetches nothing), then drawn as PNG or printed as PDF. The draft reads the brand's own files; a published
// version reads only the copies it keeps. Drawings are kept in storage under a hash of everything drawn, so the same
// inputs are never drawn twice.
import { createHash } from 'node:crypto';
import { MOCKUP_RATE_LIMIT } from 'astro:env/server';
import type { Brand } from '@db/models';
import { Asset } from '@db/models';
import type { AssetKind } from '@/lib/assets/kinds';
import type { Identity, IdentityLogo, IdentityTypeface } from '@/lib/identity/types';
import { loadIdentity, logoFile, typefaceFile } from '@/lib/identity/identity.server';
import { fontFaceCss } from '@/lib/guideline/identity';
import { oneColourLogo } from '@/lib/logo/knockout.server';
import { log } from '@/lib/log.server';
import { patternTile, type MarkFile } from '@/lib/pattern/pattern.server';
import { consumeAttempt } from '@/lib/publishing/rate-limit.server';
import { versionSnapshot, versionVariantFileId, type VersionRecord } from '@/lib/publishing/versions.server';
import { storage } from '@/lib/storage/index.server';
import { AppError } from '@/lib/errors';
import { composeMockup, requireLayout, type LogoFile, type MockupLayout } from './compose';
import { mockupPattern, type PatternFill } from './pattern';
import { mockupTemplate, type MockupTemplate } from './templates';
import { mockupPdf, mockupPng } from './render.server';
import { PHOTO_KINDS } from './photos';

export type MockupFormat = 'png' | 'pdf';
export interface MockupChoice {
  logoId?: string | null;
  photoIds?: readonly string[];
}
type File = { body: Buffer; contentType: string };

/** Where the bytes come from: the draft's files or a published version's copies. */
interface FileReader {
  logo(logo: IdentityLogo, file: LogoFile): Promise<File>;
  /** Only faces with a confirmed licence are asked for. */
  font(face: IdentityTypeface): Promise<File | null>;
  photos(ids: readonly string[]): Promise<File[]>;
  /** The mark the pattern is cut from; undefined = the working identity's own file. */
  mark?: (logo: IdentityLogo) => Promise<MarkFile | null>;
}

const dataUri = (file: File) => `data:${file.contentType};base64,${file.body.toString('base64')}`;
const SLOT: Record<LogoFile, 'original' | 'white' | 'on-dark'> = { original: 'original', white: 'white', onDark: 'on-dark' };

/** A template by key, refused as 404 when there is none and 422 when a screen piece is asked for as PDF. */
function templateFor(key: string, format: MockupFormat): MockupTemplate {
  const template = mockupTemplate(key);
  if (!template) throw new AppError('not_found', 'There is no mock-up template by that name.', { status: 404 });
  if (format === 'pdf' && template.medium !== 'print') throw new AppError('not_print', `${template.name} is a screen piece; it is offered as a PNG only.`, { status: 422 });
  return template;
}

/** The pattern the piece shows, drawn by the generator; a plain ground (logged) when the mark's file cannot be read. */
async function patternFill(template: MockupTemplate, identity: Identity, read: FileReader): Promise<PatternFill | null> {
  const pattern = mockupPattern(identity);
  if (!pattern.settings || !template.pages.some((p) => p.elements.some((e) => e.type === 'pattern'))) return null;
  const mark = read.mark;
  try {
    const tile = await patternTile(identity, pattern.settings, mark ? { readMark: (_brandId, logo) => mark(logo) } : {});
    return { kind: 'tile', href: `data:image/svg+xml;base64,${Buffer.from(tile.svg, 'utf8').toString('base64')}`, width: tile.width, height: tile.height };
  } catch (err) {
    if (!(err instanceof AppError) || err.status >= 500) throw err;
    log.warn({ brandId: identity.brand.id, code: err.code }, 'mockups: pattern drawn as a plain ground');
    return null;
  }
}

/** Everything Chromium is given: the placed pages with every file embedded, and the font faces. */
async function prepareMockup(template: MockupTemplate, identity: Identity, choice: MockupChoice, read: FileReader): Promise<{ layout: MockupLayout; fontCss: string }> {
  if (choice.logoId && !identity.logos.some((l) => l.id === choice.logoId)) throw new AppError('not_found', 'That logo was not found in this brand.', { status: 404 });
  const photos = (await read.photos(choice.photoIds ?? [])).map(dataUri);
  const fill = await patternFill(template, identity, read);
  // First placed with stand-in addresses; only the logo files the layout really uses are then read.
  const layout = requireLayout(composeMockup(template, identity, { logo: (logo, file) => `logo:${logo.id}:${file}`, photos, pattern: () => fill }, { logoId: choice.logoId }));
  const files = new Map<string, string>();
  for (const page of layout.pages) {
    for (const item of page.items) {
      if (item.kind !== 'logo') continue;
      if (!files.has(item.href)) files.set(item.href, dataUri(await read.logo(item.logo, item.file)));
      item.href = files.get(item.href)!;
    }
  }
  // Only faces with a confirmed licence are embedded, as on the published site.
  const faces = (
    await Promise.all(
      identity.typefaces.filter((f) => f.licence.confirmed).map(async (f) => {
        const file = await read.font(f);
        return file ? [{ ...f, fileUrl: dataUri(file) }] : [];
      }),
    )
  ).flat();
  return { layout, fontCss: fontFaceCss(faces) };
}

/** Bumped when the drawing code changes, so files kept by an older renderer are drawn again. */
const RENDERER = 'mockup-renderer-4';

/**
 * Where a drawing is kept: the SHA-256 of the renderer, the format and every input (placed pages with their embedded
 * files, font faces), its first 128 bits written in the storage's UUID-shaped key, inside the brand's folder.
 */
export function mockupCacheKey(brandId: string, format: MockupFormat, layout: MockupLayout, fontCss: string): string {
  // A placed logo's identity record carries addresses that differ between the draft and a version; what is drawn is its embedded file.
  const drawn = JSON.stringify(layout, (key, value) => (key === 'logo' && value && typeof value === 'object' ? (value as { id: string }).id : value));
  const h = createHash('sha256').update(RENDERER).update('\0').update(format).update('\0').update(drawn).update('\0').update(fontCss).digest('hex');
  return `${brandId}/mockup/${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20, 32)}.${format}`;
}

/** The drawing from storage when these inputs were drawn before; else `admit` is asked first, then it is drawn and kept. */
async function drawOnce(brandId: string, format: MockupFormat, prepared: { layout: MockupLayout; fontCss: string }, admit?: () => Promise<void>): Promise<File> {
  const contentType = format === 'pdf' ? 'application/pdf' : 'image/png';
  const key = mockupCacheKey(brandId, format, prepared.layout, prepared.fontCss);
  const kept = await storage.get(key);
  if (kept) return { body: kept, contentType };
  await admit?.();
  const body = format === 'pdf' ? await mockupPdf(prepared.layout, prepared.fontCss) : await mockupPng(prepared.layout, prepared.fontCss);
  await storage.put(key, body, contentType);
  return { body, contentType };
}

/** Seconds of the window MOCKUP_RATE_LIMIT counts in. */
const MOCKUP_RATE_WINDOW_SECONDS = 60;

/** A member may have MOCKUP_RATE_LIMIT new drawings a minute; drawings kept from before are never counted. */
async function admitDrawing(requester: string): Promise<void> {
  if (await consumeAttempt(`mockup:${requester}`, MOCKUP_RATE_LIMIT, MOCKUP_RATE_WINDOW_SECONDS)) return;
  throw new AppError(
    'rate_limited',
    `You asked for more than ${MOCKUP_RATE_LIMIT} new mock-up drawings in a minute. Pieces drawn before are still served at once; try again in a minute.`,
    { status: 429, details: { limit: MOCKUP_RATE_LIMIT, windowSeconds: MOCKUP_RATE_WINDOW_SECONDS } },
  );
}

/** One mock-up of the brand's working identity as PNG or PDF, named after the brand and the template. */
export async function brandMockup(brand: Brand, key: string, format: MockupFormat, choice: MockupChoice = {}, requester: string | null = null): Promise<File & { filename: string }> {
  const template = templateFor(key, format);
  const identity = await loadIdentity(brand);
  const read: FileReader = {
    logo: (logo, file) => logoFile(brand, logo.id, SLOT[file]),
    font: async (face) => (face.fileUrl ? typefaceFile(brand, face.id) : null),
    async photos(ids) {
      if (!ids.length) return [];
      const rows = await Asset.findAll({ where: { brandId: brand.id, id: [...ids], state: 'approved', kind: [...PHOTO_KINDS] as string[] as AssetKind[] }, attributes: ['id', 'storageKey', 'mime'] });
      const out: File[] = [];
      for (const id of ids) {
        const row = rows.find((r) => r.id === id);
        const body = row ? await storage.get(row.storageKey) : null;
        if (row && body) out.push({ body, contentType: row.mime });
      }
      return out;
    },
  };
  const prepared = await prepareMockup(template, identity, choice, read);
  const file = await drawOnce(brand.id, format, prepared, requester ? () => admitDrawing(requester) : undefined);
  return { ...file, filename: `${brand.slug}-${template.key}.${format}` };
}

/** The blocks of a version's document that show mock-ups (top level, as the editor stores them). */
function chosenIn(doc: { content?: unknown[] }, key: string): MockupChoice | null {
  for (const node of doc.content ?? []) {
    const n = node as { type?: string; attrs?: { templates?: unknown; logoId?: unknown; photoIds?: unknown } };
    if (n.type !== 'applications' || !Array.isArray(n.attrs?.templates) || !n.attrs.templates.includes(key)) continue;
    return {
      logoId: typeof n.attrs.logoId === 'string' ? n.attrs.logoId : null,
      photoIds: Array.isArray(n.attrs.photoIds) ? n.attrs.photoIds.filter((id): id is string => typeof id === 'string') : [],
    };
  }
  return null;
}

/**
 * One mock-up a published version shows, from nothing but the version: its frozen identity and document, and the
 * file copies it keeps (logos, their own version files, photographs, licensed fonts; the pattern is cut from its logo copy).
 */
export async function versionMockupFile(version: VersionRecord, key: string, format: MockupFormat): Promise<File> {
  const template = templateFor(key, format);
  const { doc, identity } = await versionSnapshot(version);
  const choice = chosenIn(doc, key);
  if (!choice) throw new AppError('not_found', 'This version shows no such mock-up.', { status: 404 });
  const files = version.files ?? {};
  const copy = async (id: string) => {
    const entry = Object.hasOwn(files, id) ? files[id] : undefined;
    const body = entry ? await storage.get(entry.key) : null;
    return entry && body ? { body, contentType: entry.contentType } : null;
  };
  const read: FileReader = {
    async logo(logo, file) {
      const original = await copy(logo.id);
      if (!original) throw new AppError('not_found', 'The version has no copy of that logo.', { status: 404 });
      if (file === 'original') return original;
      const own = await copy(versionVariantFileId(logo.id, SLOT[file]));
      if (own) return own;
      if (file === 'onDark') return original;
      return oneColourLogo({ bytes: original.body, format: original.contentType === 'image/svg+xml' ? 'svg' : 'png', lightParts: logo.lightParts }, 'white');
    },
    font: (face) => copy(face.id),
    async photos(ids) {
      return (await Promise.all(ids.map(copy))).filter((f): f is File => f !== null && f.contentType.startsWith('image/'));
    },
    async mark(logo) {
      const original = await copy(logo.id);
      return original ? { bytes: original.body, format: original.contentType === 'image/svg+xml' ? 'svg' : 'png' } : null;
    },
  };
  return drawOnce(version.brandId, format, await prepareMockup(template, identity, choice, read));
}

/** The version's mock-up named for download after the brand, the version and the template. */
export async function versionMockup(brand: Brand, version: VersionRecord, key: string, format: MockupFormat): Promise<File & { filename: string }> {
  const file = await versionMockupFile(version, key, format);
  return { ...file, filename: `${brand.slug}-v${version.number}-${mockupTemplate(key)!.key}.${format}` };
}
