import type { APIRoute } from 'astro';
import { filePath } from '@/lib/publishing/build/contract';
import { noteRead } from '@/lib/insights/site-read.server';
import { siteAccess } from '@/lib/publishing/site-access.server';
import { fileRefusal, sendVersionFile, textAnswer } from '@/site/built.server';

const FILE_HEADERS = {
  // A version's files never change; still private, since access is per viewer.
  'cache-control': 'private, max-age=31536000, immutable',
  'x-content-type-options': 'nosniff',
  'content-security-policy': "default-src 'none'; style-src 'unsafe-inline'; sandbox",
};

/**
 * A file of a published version (its own copy of a logo, a licensed font or a photograph, or one the build made
 * from it: a logo version ?variant=, a font weight ?weight=, a photo rendition ?w=&aspect=), as the build stored it.
 * Only what the version's pages refer to exists; any other query is a 404.
 */
export const GET: APIRoute = async (context) => {
  const access = await siteAccess(context, context.params.slug!, Number(context.params.number));
  if (access instanceof Response) return fileRefusal(access);
  const path = filePath(`files/${context.params.fileId ?? ''}`, context.url.searchParams);
  return noteRead(context, access, 'file', path, await sendVersionFile(context.request, access, path, FILE_HEADERS, () => textAnswer(404, 'Not found')));
};
