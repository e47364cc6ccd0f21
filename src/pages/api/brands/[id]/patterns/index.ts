import { z } from 'zod';
import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, fileResponse, idParam, json, methodNotAllowed, parseWith, readJson } from '@/lib/http/api';
import { loadIdentity } from '@/lib/identity/identity.server';
import { patternSettingsSchema, settingsFromQuery } from '@/lib/pattern/layout';
import { patternPng, patternTile, PATTERN_PIXEL_RATIOS } from '@/lib/pattern/pattern.server';
import { savePattern } from '@/lib/pattern/shelf.server';

/** What the export adds to the pattern's own settings: the file format, the PNG density, a download. */
const exportQuery = z.object({
  format: z.enum(['svg', 'png'], { error: 'format must be svg or png.' }).default('svg'),
  ratio: z.coerce.number().refine((n) => (PATTERN_PIXEL_RATIOS as readonly number[]).includes(n), { error: `ratio must be one of ${PATTERN_PIXEL_RATIOS.join(', ')}.` }).default(2),
  download: z.enum(['1']).optional(),
});

const saveBody = z.strictObject({
  settings: patternSettingsSchema,
  name: z.string().trim().min(1).max(160).optional(),
});

/** One seamless tile of the pattern, as SVG or PNG: ?logoId=&layout=&scale=&spacing=&rotation=&seed=&groundColorId=&inkColorId=&opacity=&format=&ratio= */
export const GET = endpoint(async ({ locals, params, url }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  const { format, ratio, download, ...rest } = Object.fromEntries(url.searchParams);
  const wanted = parseWith(exportQuery, { format, ratio, download }, 'query');
  const settings = parseWith(patternSettingsSchema, settingsFromQuery(rest), 'query');
  const tile = await patternTile(await loadIdentity(brand), settings);
  const filename = `${brand.slug}-pattern-${settings.layout}.${wanted.format}`;
  const body = wanted.format === 'svg' ? Buffer.from(tile.svg, 'utf8') : await patternPng(tile, wanted.ratio);
  const response = fileResponse(body, wanted.format === 'svg' ? 'image/svg+xml' : 'image/png', filename, { inline: wanted.download !== '1' });
  response.headers.set('x-pattern-tile', `${tile.width}x${tile.height}`);
  return response;
});

/** Put the tile on the asset shelf as a draft pattern, with its settings: { settings, name? }. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'asset.upload');
  const body = await readJson(request, saveBody);
  const saved = await savePattern(caller, brand, await loadIdentity(brand), body.settings, body.name);
  return json(saved, saved.duplicate ? 200 : 201);
});

export const ALL = methodNotAllowed;
