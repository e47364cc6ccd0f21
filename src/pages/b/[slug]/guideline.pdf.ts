import type { APIRoute } from 'astro';
import { pdfResponse } from '@/lib/publishing/pdf-route.server';

/** The latest version as a PDF (?size=a4|letter). */
export const GET: APIRoute = (context) => pdfResponse(context, null);
