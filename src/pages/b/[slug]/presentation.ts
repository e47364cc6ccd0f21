import type { APIRoute } from 'astro';
import { presentationResponse } from '@/site/presentation.server';

/** The reveal presentation of the current version: members, and share links that include it. */
export const GET: APIRoute = (context) => presentationResponse(context, null);
