import type { APIRoute } from 'astro';
import { versionPageResponse } from '@/site/version-page.server';

/** One published version of a brand's guidelines. */
export const GET: APIRoute = (context) => versionPageResponse(context, Number(context.params.number));
