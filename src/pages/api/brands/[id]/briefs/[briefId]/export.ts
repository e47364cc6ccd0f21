import { authorizeBrand } from '@/lib/auth/access.server';
import { briefOf } from '@/lib/briefs/briefs.server';
import { answersCsv, answersMarkdown } from '@/lib/briefs/questionnaire';
import { ApiError, endpoint, idParam, methodNotAllowed } from '@/lib/http/api';
import { slugify } from '@/lib/brands/slug';

/** The answers as a download: ?format=md (Markdown) or ?format=csv (RFC 4180). */
export const GET = endpoint(async ({ locals, params, url }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  const brief = await briefOf(brand, idParam(params.briefId, 'That brief'));
  const format = url.searchParams.get('format') ?? 'md';
  if (format !== 'md' && format !== 'csv') throw new ApiError(400, 'invalid_input', 'Choose format=md (Markdown) or format=csv.', { path: 'format' });
  const name = `${slugify(brand.name)}-brief.${format}`;
  const body =
    format === 'md'
      ? answersMarkdown({ brandName: brand.name, title: brief.title, contactName: brief.contactName, submittedAt: brief.submittedAt?.toISOString() ?? null }, brief.questions, brief.answers)
      : answersCsv(brief.questions, brief.answers);
  return new Response(body, {
    headers: {
      'content-type': format === 'md' ? 'text/markdown; charset=utf-8' : 'text/csv; charset=utf-8; header=present',
      'content-disposition': `attachment; filename="${name}"`,
      'cache-control': 'no-store',
    },
  });
});

export const ALL = methodNotAllowed;
