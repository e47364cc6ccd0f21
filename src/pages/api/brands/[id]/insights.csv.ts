import { authorizeBrand } from '@/lib/auth/access.server';
import { toCsv } from '@/lib/assets/csv';
import { queryObject } from '@/lib/assets/schemas';
import { endpoint, idParam, methodNotAllowed, parseWith } from '@/lib/http/api';
import { reportTable } from '@/lib/insights/report';
import { insightsReport } from '@/lib/insights/report.server';
import { insightsCsvQuerySchema } from '@/lib/insights/views';

/** One table of the insights report as CSV (?range=7d|4w|12m&what=timeline|versions|sections|visitors|downloads|searches). */
export const GET = endpoint(async ({ locals, params, url }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'insights.read');
  const { range, what } = parseWith(insightsCsvQuerySchema, queryObject(url), 'query');
  const report = await insightsReport(brand.id, range);
  return new Response(toCsv(reportTable(report, what)), {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="${brand.slug}-insights-${what}-${range}.csv"`,
      'cache-control': 'private, no-store',
    },
  });
});

export const ALL = methodNotAllowed;
