import type { APIRoute } from 'astro';
import { presentationPdfResponse } from '@/lib/publishing/pdf-route.server';

/** The current version's reveal presentation as a 16:9 PDF, one slide per page. */
export const GET: APIRoute = (context) => presentationPdfResponse(context, null);
