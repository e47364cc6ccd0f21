import type { APIRoute } from 'astro';
import { tokensResponse } from '@/lib/publishing/tokens-route.server';

/** One version's design tokens (?format=dtcg|dtcg-hex|css|tailwind|scss), as built when it was published. */
export const GET: APIRoute = (context) => {
  const number = Number(context.params.number);
  if (!Number.isInteger(number) || number < 1) return new Response('Not found', { status: 404 });
  return tokensResponse(context, number);
};
