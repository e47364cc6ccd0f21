import { downloadLog, downloadLogRows } from '@/lib/assets/assets.server';
import { toCsv } from '@/lib/assets/csv';
import { downloadLogQuerySchema, queryObject } from '@/lib/assets/schemas';
import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, parseWith } from '@/lib/http/api';

/** Who downloaded what and when (owners); filters kind, assetId, userId, via, from, to; ?format=csv for a spreadsheet. */
export const GET = endpoint(async ({ locals, params, url }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'audit.read');
  const { format, ...filters } = parseWith(downloadLogQuerySchema, queryObject(url), 'query');
  const entries = await downloadLog(brand, filters);
  if (format === 'json') return json({ downloads: entries });
  return new Response(toCsv(downloadLogRows(entries)), {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="${brand.slug}-downloads.csv"`,
      'cache-control': 'private, no-store',
    },
  });
});

export const ALL = methodNotAllowed;
