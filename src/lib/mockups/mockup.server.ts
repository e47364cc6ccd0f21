// A brand's mock-up as a file: the identity read, the template filled, every picture and font embedded as a data:
// address (Chromium fetches nothing), then drawn as PNG or printed as PDF.
import type { Brand } from '@db/models';
import { Asset } from '@db/models/assets';
import type { AssetKind } from '@/lib/assets/kinds';
import { loadIdentity, logoFile, typefaceFile } from '@/lib/identity/identity.server';
import { fontFaceCss } from '@/lib/guideline/identity';
import { storage } from '@/lib/storage/index.server';
import { AppError } from '@/lib/errors';
import { composeMockup, requireLayout, type LogoFile } from './compose';
import { mockupTemplate } from './templates';
import { mockupPdf, mockupPng } from './render.server';
import { PHOTO_KINDS } from './photos';

export type MockupFormat = 'png' | 'pdf';

const dataUri = (bytes: Buffer, type: string) => `data:${type};base64,${bytes.toString('base64')}`;
const SLOT: Record<LogoFile, 'original' | 'white' | 'on-dark'> = { original: 'original', white: 'white', onDark: 'on-dark' };

/** The brand's approved photographs among the chosen ids, in the chosen order, as data: addresses. */
async function photoSources(brand: Brand, photoIds: readonly string[]): Promise<string[]> {
  if (!photoIds.length) return [];
  const rows = await Asset.findAll({ where: { brandId: brand.id, id: [...photoIds], state: 'approved', kind: [...PHOTO_KINDS] as string[] as AssetKind[] }, attributes: ['id', 'storageKey', 'mime'] });
  const out: string[] = [];
  for (const id of photoIds) {
    const row = rows.find((r) => r.id === id);
    const bytes = row ? await storage.get(row.storageKey) : null;
    if (row && bytes) out.push(dataUri(bytes, row.mime));
  }
  return out;
}

/** One mock-up of the brand as PNG or PDF, named after the brand and the template. */
export async function brandMockup(brand: Brand, key: string, format: MockupFormat, options: { logoId?: string | null; photoIds?: readonly string[] } = {}): Promise<{ body: Buffer; contentType: string; filename: string }> {
  const template = mockupTemplate(key);
  if (!template) throw new AppError('not_found', 'There is no mock-up template by that name.', { status: 404 });
  if (format === 'pdf' && template.medium !== 'print') throw new AppError('not_print', `${template.name} is a screen piece; it is offered as a PNG only.`, { status: 422 });
  const identity = await loadIdentity(brand);
  if (options.logoId && !identity.logos.some((l) => l.id === options.logoId)) throw new AppError('not_found', 'That logo was not found in this brand.', { status: 404 });
  const photos = await photoSources(brand, options.photoIds ?? []);
  // First placed with stand-in addresses; only the logo files the layout really uses are then read.
  const layout = requireLayout(composeMockup(template, identity, { logo: (logo, file) => `logo:${logo.id}:${file}`, photos }, { logoId: options.logoId }));
  const files = new Map<string, string>();
  for (const page of layout.pages) {
    for (const item of page.items) {
      if (item.kind !== 'logo') continue;
      if (!files.has(item.href)) {
        const file = await logoFile(brand, item.logo.id, SLOT[item.file]);
        files.set(item.href, dataUri(file.body, file.contentType));
      }
      item.href = files.get(item.href)!;
    }
  }
  // Only faces with a confirmed licence have a file to serve (fileUrl), as on the published site.
  const faces = await Promise.all(
    identity.typefaces.filter((f) => f.fileUrl).map(async (f) => {
      const file = await typefaceFile(brand, f.id);
      return { ...f, fileUrl: dataUri(file.body, file.contentType) };
    }),
  );
  const fontCss = fontFaceCss(faces);
  const body = format === 'pdf' ? await mockupPdf(layout, fontCss) : await mockupPng(layout, fontCss);
  return { body, contentType: format === 'pdf' ? 'application/pdf' : 'image/png', filename: `${brand.slug}-${template.key}.${format}` };
}
