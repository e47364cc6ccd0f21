import type { APIRoute } from 'astro';
import { pdfResponse } from '@/lib/publishing/pdf-route.server';

/** One version as a PDF (?size=a4|letter). */
export const GET: APIRoute = (context) => {
  const number = Number(context.params.number);
  if (!Number.isInteger(number) || number < 1) return new Response('Not found', { status: 404 });
  return pdfResponse(context, number);
};
