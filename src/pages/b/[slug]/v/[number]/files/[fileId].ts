import type { APIRoute } from 'astro';
import { recolorSvg, reverseOnGround } from '../../../../../../lib/logo';
import { siteAccess } from '../../../../../../lib/publishing/site-access.server';
import { storage } from '../../../../../../lib/storage/index.server';

const VARIANTS = new Set(['black', 'white', 'reversed']);

/** A file of a published version (its own copy of a logo or a licensed font), recoloured for logo variants. */
export const GET: APIRoute = async (context) => {
  const access = await siteAccess(context, context.params.slug!, Number(context.params.number));
  if (access instanceof Response) return new Response('Not found', { status: 404 });
  // Own keys only: `__proto__`, `constructor` and the like name no file.
  const fileId = context.params.fileId ?? '';
  const file = Object.hasOwn(access.version.files, fileId) ? access.version.files[fileId] : undefined;
  if (!file) return new Response('Not found', { status: 404 });
  let body = await storage.get(file.key);
  if (!body) return new Response('Not found', { status: 404 });
  const variant = context.url.searchParams.get('variant');
  const on = context.url.searchParams.get('on');
  if (variant && VARIANTS.has(variant) && file.contentType === 'image/svg+xml') {
    const svg = body.toString('utf8');
    body = Buffer.from(variant === 'white' && on && /^#[0-9a-f]{6}$/i.test(on) ? reverseOnGround(svg, on) : recolorSvg(svg, variant as 'black' | 'white' | 'reversed'));
  }
  return new Response(new Uint8Array(body), {
    headers: {
      'content-type': file.contentType,
      // A version's files never change; still private, since access is per viewer.
      'cache-control': 'private, max-age=31536000, immutable',
      'x-content-type-options': 'nosniff',
      'content-security-policy': "default-src 'none'; style-src 'unsafe-inline'; sandbox",
    },
  });
};
