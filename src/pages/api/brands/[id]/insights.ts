import { authorizeBrand } from '@/lib/auth/access.server';
import { queryObject } from '@/lib/assets/schemas';
import { endpoint, idParam, json, methodNotAllowed, parseWith } from '@/lib/http/api';
import { insightsReport } from '@/lib/insights/report.server';
import { insightsQuerySchema } from '@/lib/insights/views';

/** What the brand's published site was read for, over ?range=7d|4w|12m (owners). */
export const GET = endpoint(async ({ locals, params, url }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'insights.read');
  const { range } = parseWith(insightsQuerySchema, queryObject(url), 'query');
  return json({ insights: await insightsReport(brand.id, range) }, 200, { 'cache-control': 'private, no-store' });
});

export const ALL = methodNotAllowed;
