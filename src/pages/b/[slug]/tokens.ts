import type { APIRoute } from 'astro';
import { tokensResponse } from '@/lib/publishing/tokens-route.server';

/** The latest version's design tokens (?format=dtcg|dtcg-hex|css|tailwind|scss). */
export const GET: APIRoute = (context) => tokensResponse(context, null);
