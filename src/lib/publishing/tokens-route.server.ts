// The design-token files of a published version, as the build wrote them: streamed from storage with their
// manifest ETag, downloaded under the brand's name.
import type { APIContext } from 'astro';
import type { GuidelineVersion } from '@db/models';
import { heldBack } from '@/lib/handover/gate.server';
import { ApiError, errorResponse } from '@/lib/http/api';
import { tokenFilename, TOKEN_FORMATS, type TokenFormat } from '@/lib/tokens';
import { tokenPath } from './build/contract';
import { manifestEntry, sendBuilt } from './build/serve.server';
import { simplePage, siteAccess } from './site-access.server';
import { noteRead } from '@/lib/insights/site-read.server';

/** The format asked for in ?format= (dtcg when absent), or null when it names none. */
export function tokenFormat(url: URL): TokenFormat | null {
  const format = (url.searchParams.get('format') ?? 'dtcg').toLowerCase();
  return TOKEN_FORMATS.includes(format as TokenFormat) ? (format as TokenFormat) : null;
}

/** A ready version's token file in one format, or null when the version is not built (or has none). */
export function builtTokens(request: Request, version: GuidelineVersion, format: TokenFormat, slug: string): Promise<Response> | null {
  const entry = version.state === 'ready' ? manifestEntry(version.manifest, tokenPath(format)) : null;
  if (!entry) return null;
  return sendBuilt(request, entry, { 'content-disposition': `attachment; filename="${tokenFilename(format, slug)}"`, 'cache-control': 'private, max-age=3600' });
}

/** Answer GET …/tokens?format= for the version `number` (the latest ready one when null), for whoever may read it. */
export async function tokensResponse(context: APIContext, number: number | null): Promise<Response> {
  const access = await siteAccess(context, context.params.slug!, number);
  if (access instanceof Response) return access;
  const format = tokenFormat(context.url);
  if (!format) return errorResponse(new ApiError(400, 'invalid_input', `Choose a format: ${TOKEN_FORMATS.join(', ')}.`));
  // Design tokens are part of what a handover invoice can hold back until it is paid.
  const held = await heldBack(access.brand.id, tokenPath(format), access);
  if (held) return simplePage(402, held.title, held.message);
  const built = builtTokens(context.request, access.version, format, access.brand.slug);
  if (built) return noteRead(context, access, 'tokens', tokenPath(format), await built);
  if (access.version.state === 'ready') return simplePage(404, 'No token file in this format', `Version ${access.version.number} was published without its ${format} design tokens: a value in it could not be written as a token. The studio can correct it and publish again.`);
  if (access.version.state === 'failed') return simplePage(500, 'This version could not be built', 'The studio can try its build again from the publishing page.');
  return simplePage(202, 'The tokens are being prepared', `Version ${access.version.number} is still being built; its design tokens are ready in a moment.`);
}
