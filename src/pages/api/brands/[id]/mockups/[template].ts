import { z } from 'zod';
import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, methodNotAllowed, parseWith } from '@/lib/http/api';
import { brandMockup } from '@/lib/mockups/mockup.server';

const query = z.strictObject({
  format: z.enum(['png', 'pdf'], { error: 'Choose a format: png or pdf.' }).default('png'),
  logoId: z.uuid({ error: 'Expected a logo id.' }).optional(),
  /** Shelf photographs by id, comma-separated, in the order the template uses them. */
  photos: z
    .string()
    .max(400)
    .optional()
    .transform((v) => (v ? v.split(',').filter(Boolean) : []))
    .pipe(z.array(z.uuid({ error: 'Expected photograph ids.' })).max(6, { error: 'At most 6 photographs.' })),
});

/** One mock-up of the brand's identity as a PNG (screen) or a PDF with bleed and crop marks (print pieces); new drawings count against the member's rate. */
export const GET = endpoint(async ({ locals, params, url }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  const { format, logoId, photos } = parseWith(query, Object.fromEntries(url.searchParams), 'query');
  const file = await brandMockup(brand, String(params.template ?? ''), format, { logoId, photoIds: photos }, caller.id);
  return new Response(new Uint8Array(file.body), {
    headers: { 'content-type': file.contentType, 'content-disposition': `attachment; filename="${file.filename}"`, 'cache-control': 'no-store' },
  });
});

export const ALL = methodNotAllowed;
