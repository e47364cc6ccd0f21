import type { APIRoute } from 'astro';
import { presentationResponse } from '@/site/presentation.server';

/** The reveal presentation of one version (the PDF step prints its ?print form). */
export const GET: APIRoute = (context) => presentationResponse(context, Number(context.params.number));
