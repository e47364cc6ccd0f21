import type { APIRoute } from 'astro';
import { versionPageResponse } from '@/site/version-page.server';

/** The current version of a brand's guidelines. */
export const GET: APIRoute = (context) => versionPageResponse(context, null);
