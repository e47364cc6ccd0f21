// A mock-up as a file: the template filled from an identity, every picture and font embedded as a data: address
// (Chromium fetches nothing), then drawn as PNG or printed as PDF. The draft reads the brand's own files; a published
// version reads the copies it keeps.
import type { Brand, GuidelineVersion } from '@db/models';
import { Asset } from '@db/models';
import type { AssetKind } from '@/lib/assets/kinds';
import type { Identity, IdentityLogo, IdentityTypeface } from '@/lib/identity/types';
import { loadIdentity, logoFile, typefaceFile } from '@/lib/identity/identity.server';
import { fontFaceCss } from '@/lib/guideline/identity';
import { oneColourLogo } from '@/lib/logo/knockout.server';
import { versionSnapshot, versionVariantFileId } from '@/lib/publishing/versions.server';
import { storage } from '@/lib/storage/index.server';
import { AppError } from '@/lib/errors';
import { composeMockup, requireLayout, type LogoFile } from './compose';
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

async function renderMockup(template: MockupTemplate, identity: Identity, format: MockupFormat, choice: MockupChoice, read: FileReader): Promise<File> {
  if (choice.logoId && !identity.logos.some((l) => l.id === choice.logoId)) throw new AppError('not_found', 'That logo was not found in this brand.', { status: 404 });
  const photos = (await read.photos(choice.photoIds ?? [])).map(dataUri);
  // First placed with stand-in addresses; only the logo files the layout really uses are then read.
  const layout = requireLayout(composeMockup(template, identity, { logo: (logo, file) => `logo:${logo.id}:${file}`, photos }, { logoId: choice.logoId }));
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
  const fontCss = fontFaceCss(faces);
  return format === 'pdf' ? { body: await mockupPdf(layout, fontCss), contentType: 'application/pdf' } : { body: await mockupPng(layout, fontCss), contentType: 'image/png' };
}

/** One mock-up of the brand's working identity as PNG or PDF, named after the brand and the template. */
export async function brandMockup(brand: Brand, key: string, format: MockupFormat, choice: MockupChoice = {}): Promise<File & { filename: string }> {
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
  const file = await renderMockup(template, identity, format, choice, read);
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

/** One mock-up a published version shows, drawn from the version's own identity and file copies. */
export async function versionMockup(brand: Brand, version: GuidelineVersion, key: string, format: MockupFormat): Promise<File & { filename: string }> {
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
  };
  const body = await renderMockup(template, identity, format, choice, read);
  return { ...body, filename: `${brand.slug}-v${version.number}-${template.key}.${format}` };
}
