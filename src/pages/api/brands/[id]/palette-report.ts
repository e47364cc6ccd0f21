import { authorizeBrand } from '@/lib/auth/access.server';
import { paletteReport } from '@/lib/color';
import { endpoint, idParam, json, methodNotAllowed } from '@/lib/http/api';
import { BrandColor } from '@db/models';

/** Contrast of every ordered pair of palette colours, near-duplicates, and colour-vision previews. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  const colors = await BrandColor.findAll({ where: { brandId: brand.id }, order: [['position', 'ASC']], attributes: ['id', 'name', 'hex'] });
  return json(paletteReport(colors.map((c) => ({ id: c.id, name: c.name, hex: c.hex }))));
});

export const ALL = methodNotAllowed;
