// The files a published version serves, made from its own copies: a logo as drawn or in one of its one-colour
// versions (the designer's own file for the slot first), a licensed font (one static weight for print), a
// photograph's rendition around its focal point. The build makes each one its pages refer to, once.
import type { VersionFile } from '@db/models';
import { PRINT_WEIGHTS } from '@/lib/guideline/identity';
import { log } from '@/lib/log.server';
import { oneColourLogo, type OneColourVariant } from '@/lib/logo/knockout.server';
import { storage } from '@/lib/storage/index.server';
import { staticInstance } from '@/lib/type/font-instance.server';
import { versionPhotoRendition } from './photo-renditions.server';
import { versionLogoLightParts, versionVariantFileId, type VersionRecord } from './versions.server';

const VARIANTS = new Set(['black', 'white', 'reversed', 'on-dark']);

export interface MadeFile {
  body: Buffer;
  contentType: string;
}

/**
 * The file `fileId` of a version as `query` asks for it (?variant=, ?on=, ?weight=, ?w=&aspect=), or null when the
 * version has no such file or the query asks for something it does not offer. Logo version files ("<logo>~<slot>")
 * are reached through ?variant only.
 */
export async function versionFile(version: VersionRecord, fileId: string, query: URLSearchParams): Promise<MadeFile | null> {
  const files: Record<string, VersionFile> = version.files ?? {};
  // Own keys only: `__proto__`, `constructor` and the like name no file.
  let file = Object.hasOwn(files, fileId) && !fileId.includes('~') ? files[fileId] : undefined;
  if (!file) return null;
  // A photograph asked at a width and aspect ratio: a rendition cut around its focal point (imagery block's srcset).
  if (query.has('aspect')) {
    const rendition = await versionPhotoRendition(version, fileId, file.key, query);
    return rendition ? { body: rendition.body, contentType: rendition.mime } : null;
  }
  let body = await storage.get(file.key);
  if (!body) return null;
  const variant = query.get('variant');
  const isLogo = file.contentType === 'image/svg+xml' || file.contentType === 'image/png';
  if (variant && VARIANTS.has(variant) && isLogo) {
    // The designer's own file for the slot wins; 'on-dark' without one is the logo as drawn.
    const ownId = versionVariantFileId(fileId, variant);
    const own = Object.hasOwn(files, ownId) ? files[ownId] : undefined;
    const ownBody = own ? await storage.get(own.key) : null;
    if (own && ownBody) {
      body = ownBody;
      file = own;
    } else if (variant !== 'on-dark') {
      // The print edition asks for a knockout painted on its known ground (?on=#rrggbb): vector all the way to the PDF.
      const on = query.get('on');
      const paintOn = on && /^#[0-9a-f]{6}$/i.test(on) ? on : null;
      // Light parts as holes or ink, as the logo said when the version was published.
      const lightParts = await versionLogoLightParts(version, fileId);
      const made = await oneColourLogo({ bytes: body, format: file.contentType === 'image/svg+xml' ? 'svg' : 'png', lightParts }, variant as OneColourVariant, { paintOn });
      body = made.body;
      file = { ...file, contentType: made.contentType };
    }
  }
  // The print edition asks for a variable font as one static weight (?weight=400|500|600|700).
  const weight = Number(query.get('weight'));
  if (file.contentType.startsWith('font/') && (PRINT_WEIGHTS as readonly number[]).includes(weight)) {
    try {
      return { body: await staticInstance(body, weight), contentType: 'font/ttf' };
    } catch (err) {
      log.warn({ key: file.key, problem: (err as Error).message }, 'files: no static instance');
    }
  }
  return { body, contentType: file.contentType };
}
