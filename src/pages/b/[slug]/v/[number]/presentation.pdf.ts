import type { APIRoute } from 'astro';
import { presentationPdfResponse } from '@/lib/publishing/pdf-route.server';

/** One version's reveal presentation as a 16:9 PDF, one slide per page. */
export const GET: APIRoute = (context) => {
  const number = Number(context.params.number);
  if (!Number.isInteger(number) || number < 1) return new Response('Not found', { status: 404 });
  return presentationPdfResponse(context, number);
};
