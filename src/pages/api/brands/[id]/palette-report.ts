import { authorizeBrand } from '@/lib/auth/access.server';
import { paletteReport } from '@/lib/color';
import { endpoint, idParam, json, methodNotAllowed } from '@/lib/http/api';
import { brandPalette } from '@/lib/identity/palette.server';

/** Contrast of every ordered pair of palette colours, near-duplicates, and colour-vision previews. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  return json(paletteReport(await brandPalette(brand.id)));
});

export const ALL = methodNotAllowed;
