import type { APIRoute } from 'astro';
import { PRINT_WEIGHTS } from '@/lib/guideline/identity';
import { log } from '@/lib/log.server';
import { oneColourLogo, type OneColourVariant } from '@/lib/logo/knockout.server';
import { versionPhotoRendition } from '@/lib/publishing/photo-renditions.server';
import { siteAccess } from '@/lib/publishing/site-access.server';
import { versionLogoLightParts, versionVariantFileId } from '@/lib/publishing/versions.server';
import { staticInstance } from '@/lib/type/font-instance.server';
import { storage } from '@/lib/storage/index.server';

const FILE_HEADERS = {
  // A version's files never change; still private, since access is per viewer.
  'cache-control': 'private, max-age=31536000, immutable',
  'x-content-type-options': 'nosniff',
  'content-security-policy': "default-src 'none'; style-src 'unsafe-inline'; sandbox",
};
const VARIANTS = new Set(['black', 'white', 'reversed', 'on-dark']);
/** Computed versions of a version's files, which never change: the last hundred kept in memory. */
const made = new Map<string, { body: Buffer; contentType: string }>();

/** A file of a published version (its own copy of a logo or a licensed font); logo versions from the one knockout function, fonts at one static weight for print. */
export const GET: APIRoute = async (context) => {
  const access = await siteAccess(context, context.params.slug!, Number(context.params.number));
  if (access instanceof Response) return new Response('Not found', { status: 404 });
  // Own keys only: `__proto__`, `constructor` and the like name no file; "<logo>~<slot>" files come through ?variant.
  const fileId = context.params.fileId ?? '';
  let file = Object.hasOwn(access.version.files, fileId) && !fileId.includes('~') ? access.version.files[fileId] : undefined;
  if (!file) return new Response('Not found', { status: 404 });
  // A photograph asked at a width and aspect ratio: a rendition cut around its focal point (imagery block's srcset).
  if (context.url.searchParams.has('aspect')) {
    const rendition = await versionPhotoRendition(access.version, fileId, file.key, context.url.searchParams);
    if (!rendition) return new Response('Not found', { status: 404 });
    return new Response(new Uint8Array(rendition.body), { headers: { 'content-type': rendition.mime, ...FILE_HEADERS } });
  }
  let body = await storage.get(file.key);
  if (!body) return new Response('Not found', { status: 404 });
  const variant = context.url.searchParams.get('variant');
  const isLogo = file.contentType === 'image/svg+xml' || file.contentType === 'image/png';
  if (variant && VARIANTS.has(variant) && isLogo) {
    // The designer's own file for the slot wins; 'on-dark' without one is the logo as drawn.
    const ownId = versionVariantFileId(fileId, variant);
    const own = Object.hasOwn(access.version.files, ownId) ? access.version.files[ownId] : undefined;
    const ownBody = own ? await storage.get(own.key) : null;
    if (own && ownBody) {
      body = ownBody;
      file = own;
    } else if (variant !== 'on-dark') {
      // The print edition asks for a knockout painted on its known ground (?on=#rrggbb): vector all the way to the PDF.
      const on = context.url.searchParams.get('on');
      const paintOn = on && /^#[0-9a-f]{6}$/i.test(on) ? on : null;
      // Light parts as holes or ink, as the logo said when the version was published.
      const lightParts = await versionLogoLightParts(access.version, fileId);
      const memoKey = `${file.key}|${variant}|${paintOn ?? ''}|${lightParts}`;
      let version = made.get(memoKey);
      if (!version) {
        version = await oneColourLogo({ bytes: body, format: file.contentType === 'image/svg+xml' ? 'svg' : 'png', lightParts }, variant as OneColourVariant, { paintOn });
        made.set(memoKey, version);
        if (made.size > 100) made.delete(made.keys().next().value!);
      }
      body = version.body;
      file = { ...file, contentType: version.contentType };
    }
  }
  // The print edition asks for a variable font as one static weight (?weight=400|500|600|700).
  const weight = Number(context.url.searchParams.get('weight'));
  let contentType = file.contentType;
  if (file.contentType.startsWith('font/') && (PRINT_WEIGHTS as readonly number[]).includes(weight)) {
    try {
      body = await staticInstance(body, weight);
      contentType = 'font/ttf';
    } catch (err) {
      log.warn({ key: file.key, problem: (err as Error).message }, 'files: no static instance');
    }
  }
  return new Response(new Uint8Array(body), {
    headers: { 'content-type': contentType, ...FILE_HEADERS },
  });
};
