// The brand's identity: stored rows in, the computed identity document out, and the edits in between.
import { createHash } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { Asset, Brand, BrandColor, BrandLogo, BrandTypeface } from '@db/models';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import { colorValues, parseColor } from '@/lib/color';
import { iccCmyk } from '@/lib/color/print.server';
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
import { clearSpace, minimumSize } from '@/lib/logo';
import { oneColourLogo, type OneColourVariant } from '@/lib/logo/knockout.server';
import { drawnBounds, type DrawnBounds } from '@/lib/logo/bounds.server';
import { thinnestStroke } from '@/lib/logo/stroke.server';
import type { Box } from '@/lib/logo/geometry';
import { newKey } from '@/lib/storage/storage';
import { storage } from '@/lib/storage/index.server';
import { inspectUpload } from '@/lib/uploads/inspect.server';
import { FONT_FORMATS, UPLOAD_RULES } from '@/lib/uploads/rules';
import type { IdentityForTokens } from '@/lib/tokens';
import { fontMetrics, measure, modularScale, MEASURE_RANGE, pxToRem, pxToPt, SCALE_RATIOS, type FontMetrics } from '@/lib/type';
import { shippedFont } from '@/lib/type/shipped-fonts';
import { cleanName, cleanTypefaceFamily } from '@/lib/safe/values';
import { DEFAULT_TYPE_SCALE } from './schemas';
import type {
  ColorRole,
  Identity,
  IdentityColor,
  IdentityLogo,
  IdentityTypeface,
  LightParts,
  LogoVariant,
  LogoVariantSlot,
  TypefaceRole,
  TypeScaleSettings,
  TypeScaleStep,
} from './types';

const iccCache = new Map<string, Promise<[number, number, number, number]>>();
/** ICC CMYK of a hex, memoised: the conversion is pure and each takes a sharp pipeline. */
function cachedIcc(hex: string) {
  let found = iccCache.get(hex);
  if (!found) {
    found = iccCmyk(hex);
    iccCache.set(hex, found);
    if (iccCache.size > 5000) iccCache.delete(iccCache.keys().next().value!);
  }
  return found;
}

/** A colour row with every computed value. */
export async function colorView(row: BrandColor): Promise<IdentityColor> {
  return {
    id: row.id,
    name: row.name,
    value: row.value,
    role: row.role,
    ...colorValues(row.hex),
    cmykIcc: await cachedIcc(row.hex),
    cmykOverride: row.cmykOverride,
    spot: row.spot,
    position: row.position,
  };
}

/** The hex of a typed colour, or a 400 saying what was not understood. */
function hexOf(value: string): string {
  const parsed = parseColor(value);
  if (!parsed.ok) throw new ApiError(400, 'invalid_color', parsed.error.message, { path: 'value' });
  return parsed.color.hex;
}

const brandAudit = (caller: Caller, brand: Brand, action: string, targetType: string, targetId: string, details: Record<string, unknown>) =>
  ({ actorId: caller.id, action, targetType, targetId, brandId: brand.id, studioId: brand.studioId, details });

// ---------------------------------------------------------------- colours

export async function createColor(
  caller: Caller,
  brand: Brand,
  body: { name: string; value: string; role?: ColorRole | null; cmyk?: [number, number, number, number] | null; spot?: string | null },
): Promise<IdentityColor> {
  const hex = hexOf(body.value);
  const row = await sequelize.transaction(async (t) => {
    const last = (await BrandColor.max<number, BrandColor>('position', { where: { brandId: brand.id }, transaction: t })) ?? -1;
    const color = await BrandColor.create(
      { brandId: brand.id, name: body.name, value: body.value, hex, role: body.role ?? null, cmykOverride: body.cmyk ?? null, spot: body.spot || null, position: last + 1 },
      { transaction: t },
    );
    await audit(brandAudit(caller, brand, 'color.create', 'color', color.id, { name: body.name, hex }), t);
    return color;
  });
  return colorView(row);
}

async function colorOf(brand: Brand, colorId: string): Promise<BrandColor> {
  const color = await BrandColor.findOne({ where: { id: colorId, brandId: brand.id } });
  if (!color) throw new ApiError(404, 'not_found', 'That colour was not found in this brand.');
  return color;
}

export async function updateColor(
  caller: Caller,
  brand: Brand,
  colorId: string,
  body: { name?: string; value?: string; role?: ColorRole | null; cmyk?: [number, number, number, number] | null; spot?: string | null },
): Promise<IdentityColor> {
  const color = await colorOf(brand, colorId);
  const changes: Partial<BrandColor> = {};
  if (body.name !== undefined) changes.name = body.name;
  if (body.value !== undefined) Object.assign(changes, { value: body.value, hex: hexOf(body.value) });
  if (body.role !== undefined) changes.role = body.role;
  if (body.cmyk !== undefined) changes.cmykOverride = body.cmyk;
  if (body.spot !== undefined) changes.spot = body.spot || null;
  const before = { name: color.name, hex: color.hex };
  await sequelize.transaction(async (t) => {
    await color.update(changes, { transaction: t });
    await audit(brandAudit(caller, brand, 'color.update', 'color', color.id, { before, after: { name: color.name, hex: color.hex } }), t);
  });
  return colorView(color);
}

export async function deleteColor(caller: Caller, brand: Brand, colorId: string): Promise<void> {
  const color = await colorOf(brand, colorId);
  await sequelize.transaction(async (t) => {
    await color.destroy({ transaction: t });
    await audit(brandAudit(caller, brand, 'color.delete', 'color', color.id, { name: color.name, hex: color.hex }), t);
  });
}

/** Put colours (or logos) in the order given; every id must belong to the brand, each once. */
export async function reorder(caller: Caller, brand: Brand, kind: 'color' | 'logo', ids: string[]): Promise<void> {
  const model = (kind === 'color' ? BrandColor : BrandLogo) as typeof BrandColor;
  const rows = await model.findAll({ where: { brandId: brand.id }, attributes: ['id'] });
  const known = new Set(rows.map((r) => r.id));
  if (new Set(ids).size !== ids.length || ids.length !== known.size || !ids.every((id) => known.has(id))) {
    throw new ApiError(400, 'invalid_input', `Send every ${kind} id of this brand exactly once, in the new order.`, { path: 'ids' });
  }
  await sequelize.transaction(async (t) => {
    for (const [position, id] of ids.entries()) await model.update({ position }, { where: { id, brandId: brand.id }, transaction: t });
    await audit(brandAudit(caller, brand, `${kind}.reorder`, kind, brand.id, { ids }), t);
  });
}

// ---------------------------------------------------------------- logos

export const MAX_LOGO_BYTES = UPLOAD_RULES.logo.maxBytes;

/** Read an uploaded logo through the one upload inspector: SVG (cleaned and measured) or PNG. */
async function readLogoFile(bytes: Buffer, filename: string): Promise<{ format: 'svg' | 'png'; stored: Buffer; canvas: Box; drawn: DrawnBounds | null }> {
  const logo = await inspectUpload(bytes, { as: 'logo', filename });
  const canvas = logo.viewBox ?? { x: 0, y: 0, width: logo.width!, height: logo.height! };
  return { format: logo.format as 'svg' | 'png', stored: logo.stored, canvas, drawn: logo.drawn };
}

/** What a logo draws, in its own units: the inspector measured an SVG already, a PNG is measured here. */
async function logoBounds(logo: { stored: Buffer; drawn: DrawnBounds | null }): Promise<Box> {
  try {
    return (logo.drawn ?? (await drawnBounds(logo.stored))).box;
  } catch (err) {
    throw new ApiError(400, (err as { code?: string }).code ?? 'logo_unreadable', (err as Error).message);
  }
}

/** The logo's default clear-space unit: a quarter of its drawn height (common practice starts from a letter height). */
const defaultUnit = (bounds: { height: number }) => Math.round((bounds.height / 4) * 1000) / 1000;

export async function uploadLogo(
  caller: Caller,
  brand: Brand,
  file: File,
  fields: { name?: string; variant: LogoVariant },
): Promise<{ logo: IdentityLogo; duplicate: boolean }> {
  const read = await readLogoFile(Buffer.from(await file.arrayBuffer()), file.name);
  const { format, stored, canvas } = read;
  const contentHash = createHash('sha256').update(stored).digest('hex');
  const existing = await BrandLogo.findOne({ where: { brandId: brand.id, contentHash } });
  if (existing) return { logo: logoView(existing), duplicate: true };

  const bounds = await logoBounds(read);
  const stroke = await thinnestStroke(stored, canvas, format === 'svg');
  const key = newKey(brand.id, 'logo', format);
  await storage.put(key, stored, format === 'svg' ? 'image/svg+xml' : 'image/png');
  try {
    const row = await sequelize.transaction(async (t) => {
      const last = (await BrandLogo.max<number, BrandLogo>('position', { where: { brandId: brand.id }, transaction: t })) ?? -1;
      const logo = await BrandLogo.create(
        {
          brandId: brand.id,
          name: fields.name || cleanName(file.name.replace(/\.[a-z0-9]+$/i, ''), 'Logo', 120),
          variant: fields.variant,
          format,
          storageKey: key,
          contentHash,
          byteSize: stored.length,
          canvas,
          bounds,
          clearSpaceUnit: defaultUnit(bounds),
          clearSpaceLabel: 'a quarter of the logo’s height',
          clearSpaceMultiple: 1,
          thinnestStroke: Math.round(stroke * 1000) / 1000,
          minScreenPx: null,
          minPrintMm: null,
          position: last + 1,
        },
        { transaction: t },
      );
      await audit(brandAudit(caller, brand, 'logo.upload', 'logo', logo.id, { name: logo.name, format, bytes: stored.length }), t);
      return logo;
    });
    return { logo: logoView(row), duplicate: false };
  } catch (err) {
    await storage.delete(key); // no orphan file when the row could not be written
    throw err;
  }
}

/**
 * Where a logo's file and its versions are; the light-parts setting rides along when it is not the default, so a
 * change gives the one-colour versions new addresses and no screen keeps showing the old drawing.
 */
function oneColourUrls(base: string, lightParts: LightParts): IdentityLogo['files'] {
  const also = lightParts === 'holes' ? '' : `&lightParts=${lightParts}`;
  return { original: base, black: `${base}?variant=black${also}`, white: `${base}?variant=white${also}`, reversed: `${base}?variant=reversed${also}`, onDark: `${base}?variant=on-dark` };
}

/** A logo row with its clear space and minimum sizes computed. */
export function logoView(row: BrandLogo): IdentityLogo {
  const lightParts = row.lightParts ?? 'holes';
  const suggested = minimumSize({ logoWidthUnits: row.bounds.width, thinnestStrokeUnits: row.thinnestStroke });
  const base = `/api/brands/${row.brandId}/logos/${row.id}/file`;
  return {
    id: row.id,
    name: row.name,
    variant: row.variant,
    format: row.format,
    canvas: row.canvas,
    bounds: row.bounds,
    clearSpace: {
      unitSize: row.clearSpaceUnit,
      unitLabel: row.clearSpaceLabel,
      multiple: row.clearSpaceMultiple,
      box: clearSpace({ bounds: row.bounds, unitSize: row.clearSpaceUnit, multiple: row.clearSpaceMultiple }),
    },
    minimumSize: {
      thinnestStroke: row.thinnestStroke,
      suggested: { screenPx: suggested.screenPx, printMm: suggested.printMm },
      screenPx: row.minScreenPx ?? suggested.screenPx,
      printMm: row.minPrintMm ?? suggested.printMm,
    },
    files: oneColourUrls(base, lightParts),
    ownVariants: Object.keys(row.variantFiles ?? {}) as LogoVariantSlot[],
    lightParts,
    position: row.position,
  };
}

async function logoOf(brand: Brand, logoId: string): Promise<BrandLogo> {
  const logo = await BrandLogo.findOne({ where: { id: logoId, brandId: brand.id } });
  if (!logo) throw new ApiError(404, 'not_found', 'That logo was not found in this brand.');
  return logo;
}

export async function updateLogo(caller: Caller, brand: Brand, logoId: string, changes: Partial<BrandLogo>): Promise<IdentityLogo> {
  const logo = await logoOf(brand, logoId);
  await sequelize.transaction(async (t) => {
    await logo.update(changes, { transaction: t });
    await audit(brandAudit(caller, brand, 'logo.update', 'logo', logo.id, { changes }), t);
  });
  return logoView(logo);
}

export async function deleteLogo(caller: Caller, brand: Brand, logoId: string): Promise<void> {
  const logo = await logoOf(brand, logoId);
  await sequelize.transaction(async (t) => {
    await logo.destroy({ transaction: t });
    await audit(brandAudit(caller, brand, 'logo.delete', 'logo', logo.id, { name: logo.name }), t);
  });
  await storage.delete(logo.storageKey);
  for (const own of Object.values(logo.variantFiles ?? {})) await storage.delete(own.key);
}

export type LogoFileVariant = 'original' | OneColourVariant | 'on-dark';

/**
 * The logo's bytes, or one of its versions: the designer's own file for the slot when there is one, otherwise a
 * knockout computed from the drawing (oneColourLogo) with its light parts as the logo's setting says (or as
 * `lightParts` asks, to compare before choosing); 'on-dark' falls back to the original.
 */
export async function logoFile(
  brand: Brand,
  logoId: string,
  variant: LogoFileVariant,
  ink?: string,
  lightParts?: LightParts,
): Promise<{ body: Buffer; contentType: string; filename: string }> {
  const logo = await logoOf(brand, logoId);
  const own = variant === 'original' || variant === 'one-colour' ? undefined : logo.variantFiles?.[variant];
  const ownBytes = own ? await storage.get(own.key) : null;
  const useOwn = own && ownBytes ? own : null;
  const format = useOwn?.format ?? (variant === 'original' || variant === 'on-dark' ? logo.format : logo.format === 'svg' ? 'svg' : 'png');
  const filename = `${brand.slug}-${logo.variant}${variant === 'original' ? '' : `-${variant}`}.${format}`;
  if (useOwn) return { body: ownBytes!, contentType: useOwn.format === 'svg' ? 'image/svg+xml' : 'image/png', filename };
  const bytes = await storage.get(logo.storageKey);
  if (!bytes) throw new ApiError(404, 'not_found', 'The logo file is missing from storage.');
  if (variant === 'original' || variant === 'on-dark') return { body: bytes, contentType: logo.format === 'svg' ? 'image/svg+xml' : 'image/png', filename };
  const inkHex = variant === 'one-colour' ? hexOf(ink ?? '') : undefined;
  const made = await oneColourLogo({ bytes, format: logo.format, lightParts: lightParts ?? logo.lightParts }, variant, { ink: inkHex });
  return { body: made.body, contentType: made.contentType, filename };
}

/** Store the designer's own file for one variant slot of a logo (SVG or PNG, checked like a logo upload). */
export async function uploadLogoVariant(caller: Caller, brand: Brand, logoId: string, slot: LogoVariantSlot, file: File): Promise<IdentityLogo> {
  const logo = await logoOf(brand, logoId);
  const { format, stored } = await readLogoFile(Buffer.from(await file.arrayBuffer()), file.name);
  const key = newKey(brand.id, 'logo', format);
  await storage.put(key, stored, format === 'svg' ? 'image/svg+xml' : 'image/png');
  const previous = logo.variantFiles?.[slot];
  try {
    await sequelize.transaction(async (t) => {
      await logo.update({ variantFiles: { ...logo.variantFiles, [slot]: { key, format, byteSize: stored.length } } }, { transaction: t });
      await audit(brandAudit(caller, brand, 'logo.variant.upload', 'logo', logo.id, { slot, format, bytes: stored.length }), t);
    });
  } catch (err) {
    await storage.delete(key);
    throw err;
  }
  if (previous) await storage.delete(previous.key);
  return logoView(logo);
}

/** Drop the designer's own file for a slot: the computed version is used again. */
export async function deleteLogoVariant(caller: Caller, brand: Brand, logoId: string, slot: LogoVariantSlot): Promise<IdentityLogo> {
  const logo = await logoOf(brand, logoId);
  const previous = logo.variantFiles?.[slot];
  if (!previous) throw new ApiError(404, 'not_found', 'This logo has no file of its own for that version.');
  const { [slot]: _gone, ...rest } = logo.variantFiles;
  await sequelize.transaction(async (t) => {
    await logo.update({ variantFiles: rest }, { transaction: t });
    await audit(brandAudit(caller, brand, 'logo.variant.delete', 'logo', logo.id, { slot }), t);
  });
  await storage.delete(previous.key);
  return logoView(logo);
}

// ---------------------------------------------------------------- typefaces

export const MAX_FONT_BYTES = UPLOAD_RULES.typeface.maxBytes;

/** Standard weights (100–900) inside a font's weight range. */
const weightsIn = (m: FontMetrics) => {
  const list = [100, 200, 300, 400, 500, 600, 700, 800, 900].filter((w) => w >= m.weight.min && w <= m.weight.max);
  return list.length ? list : [m.weight.default];
};

async function typefaceBytes(face: BrandTypeface): Promise<Buffer | null> {
  if (face.source === 'shipped') {
    const font = shippedFont(face.shippedKey ?? '');
    return font ? readFile(join(process.cwd(), font.file)) : null;
  }
  return face.storageKey ? storage.get(face.storageKey) : null;
}

export async function addShippedTypeface(caller: Caller, brand: Brand, key: string, role: TypefaceRole, fallback?: string[]): Promise<IdentityTypeface> {
  const font = shippedFont(key)!;
  const metrics = fontMetrics(await readFile(join(process.cwd(), font.file)));
  const row = await sequelize.transaction(async (t) => {
    const face = await BrandTypeface.create(
      {
        brandId: brand.id,
        role,
        family: font.family,
        source: 'shipped',
        shippedKey: font.key,
        storageKey: null,
        format: 'woff2',
        metrics,
        fallback: fallback ?? font.fallback,
        weights: weightsIn(metrics),
        // Open fonts shipped with Plumbline are licensed for web embedding (SIL OFL 1.1).
        licenceConfirmedAt: new Date(),
        licenceConfirmedById: caller.id,
        licenceNote: 'SIL Open Font License 1.1 (shipped with Plumbline)',
      },
      { transaction: t },
    );
    await audit(brandAudit(caller, brand, 'typeface.add', 'typeface', face.id, { family: font.family, role, source: 'shipped' }), t);
    return face;
  });
  return typefaceView(row);
}

export async function uploadTypeface(caller: Caller, brand: Brand, file: File, role: TypefaceRole, family?: string): Promise<IdentityTypeface> {
  const bytes = Buffer.from(await file.arrayBuffer());
  const font = await inspectUpload(bytes, { as: 'typeface', filename: file.name });
  const format = font.format as (typeof FONT_FORMATS)[number];
  const metrics = font.font!;
  const key = newKey(brand.id, 'font', format);
  await storage.put(key, bytes, `font/${format}`);
  try {
    const row = await sequelize.transaction(async (t) => {
      const face = await BrandTypeface.create(
        {
          brandId: brand.id,
          role,
          family: family || cleanTypefaceFamily(metrics.family),
          source: 'upload',
          shippedKey: null,
          storageKey: key,
          format,
          metrics,
          fallback: ['system-ui', 'sans-serif'],
          weights: weightsIn(metrics),
          licenceConfirmedAt: null,
          licenceConfirmedById: null,
          licenceNote: null,
        },
        { transaction: t },
      );
      await audit(brandAudit(caller, brand, 'typeface.upload', 'typeface', face.id, { family: face.family, role, format }), t);
      return face;
    });
    return typefaceView(row);
  } catch (err) {
    await storage.delete(key);
    throw err;
  }
}

export function typefaceView(row: BrandTypeface): IdentityTypeface {
  return {
    id: row.id,
    role: row.role,
    // Cleaned on the way out as well: a row stored before the family-name rule must not carry CSS.
    family: cleanTypefaceFamily(row.family),
    source: row.source,
    shippedKey: row.shippedKey,
    fallback: row.fallback,
    weights: row.weights,
    metrics: row.metrics,
    licence: {
      confirmed: row.licenceConfirmedAt !== null,
      confirmedAt: row.licenceConfirmedAt?.toISOString() ?? null,
      note: row.licenceNote,
      shippedLicence: row.source === 'shipped' ? 'OFL-1.1' : null,
    },
    fileUrl: `/api/brands/${row.brandId}/typefaces/${row.id}/file`,
  };
}

async function typefaceOf(brand: Brand, id: string): Promise<BrandTypeface> {
  const face = await BrandTypeface.findOne({ where: { id, brandId: brand.id } });
  if (!face) throw new ApiError(404, 'not_found', 'That typeface was not found in this brand.');
  return face;
}

export async function updateTypeface(
  caller: Caller,
  brand: Brand,
  id: string,
  body: { role?: TypefaceRole; fallback?: string[]; weights?: number[]; licenceConfirmed?: boolean; licenceNote?: string | null },
): Promise<IdentityTypeface> {
  const face = await typefaceOf(brand, id);
  const changes: Partial<BrandTypeface> = {};
  if (body.role) changes.role = body.role;
  if (body.fallback) changes.fallback = body.fallback;
  if (body.weights) changes.weights = body.weights;
  if (body.licenceNote !== undefined) changes.licenceNote = body.licenceNote;
  if (body.licenceConfirmed === true && !face.licenceConfirmedAt) Object.assign(changes, { licenceConfirmedAt: new Date(), licenceConfirmedById: caller.id });
  if (body.licenceConfirmed === false) Object.assign(changes, { licenceConfirmedAt: null, licenceConfirmedById: null });
  await sequelize.transaction(async (t) => {
    await face.update(changes, { transaction: t });
    await audit(brandAudit(caller, brand, body.licenceConfirmed !== undefined ? 'typeface.licence' : 'typeface.update', 'typeface', face.id, { family: face.family, ...body }), t);
  });
  return typefaceView(face);
}

export async function deleteTypeface(caller: Caller, brand: Brand, id: string): Promise<void> {
  const face = await typefaceOf(brand, id);
  await sequelize.transaction(async (t) => {
    await face.destroy({ transaction: t });
    await audit(brandAudit(caller, brand, 'typeface.delete', 'typeface', face.id, { family: face.family }), t);
  });
  if (face.storageKey) await storage.delete(face.storageKey);
}

export async function typefaceFile(brand: Brand, id: string): Promise<{ body: Buffer; contentType: string }> {
  const face = await typefaceOf(brand, id);
  const bytes = await typefaceBytes(face);
  if (!bytes) throw new ApiError(404, 'not_found', 'The font file is missing.');
  return { body: bytes, contentType: `font/${face.format}` };
}

// ---------------------------------------------------------------- type scale

/** Names for scale steps: headings from the top down, body at the base, small sizes below. */
function stepName(step: number, stepsUp: number): string {
  if (step === 0) return 'body';
  if (step < 0) return step === -1 ? 'small' : step === -2 ? 'caption' : `small-${-step}`;
  const level = stepsUp - step + 1;
  return level <= 6 ? `h${level}` : `display-${level - 6}`;
}

export function typeScaleSteps(settings: TypeScaleSettings): TypeScaleStep[] {
  return modularScale({ base: settings.basePx, ratio: settings.ratioName as keyof typeof SCALE_RATIOS, stepsUp: settings.stepsUp, stepsDown: settings.stepsDown })
    .reverse()
    .map(({ step, px }) => ({
      name: stepName(step, settings.stepsUp),
      step,
      px: Math.round(px * 100) / 100,
      rem: Math.round(pxToRem(px) * 1000) / 1000,
      pt: Math.round(pxToPt(px) * 100) / 100,
      lineHeight: step > 0 ? settings.headingLineHeight : settings.bodyLineHeight,
      role: step > 0 ? 'heading' : 'body',
    }));
}

export async function setTypeScale(caller: Caller, brand: Brand, settings: TypeScaleSettings): Promise<void> {
  await sequelize.transaction(async (t) => {
    await brand.update({ typeScale: settings }, { transaction: t });
    await audit(brandAudit(caller, brand, 'typescale.update', 'brand', brand.id, { ...settings }), t);
  });
}

// ---------------------------------------------------------------- the whole identity

export async function loadIdentity(brand: Brand): Promise<Identity> {
  const [colors, logos, faces, approved] = await Promise.all([
    BrandColor.findAll({ where: { brandId: brand.id }, order: [['position', 'ASC'], ['createdAt', 'ASC']] }),
    BrandLogo.findAll({ where: { brandId: brand.id }, order: [['position', 'ASC'], ['createdAt', 'ASC']] }),
    BrandTypeface.findAll({ where: { brandId: brand.id }, order: [['createdAt', 'ASC']] }),
    Asset.findAll({ where: { brandId: brand.id, state: 'approved' }, order: [['name', 'ASC']], attributes: ['id', 'name', 'kind', 'format', 'width', 'height', 'altText', 'caption', 'focusX', 'focusY', 'patternSettings'] }),
  ]);
  const settings: TypeScaleSettings = { ...DEFAULT_TYPE_SCALE, ...(brand.typeScale ?? {}) };
  const body = faces.find((f) => f.role === 'body') ?? faces[0];
  let measured: Identity['typeScale']['measure'] = null;
  if (body) {
    const bytes = await typefaceBytes(body);
    if (bytes) {
      const m = measure(bytes, { sizePx: settings.basePx, columnWidthPx: settings.columnPx });
      measured = { charsPerLine: Math.round(m.charsPerLine), verdict: m.verdict, range: { ...MEASURE_RANGE } };
    }
  }
  return {
    brand: { id: brand.id, name: brand.name, slug: brand.slug },
    assets: approved.map((a) => ({
      id: a.id,
      name: a.name,
      kind: a.kind,
      format: a.format,
      url: `/api/assets/${a.id}/file?format=original`,
      // Photographs carry what the imagery block draws with; other files stay as they were.
      ...(a.kind === 'photo'
        ? { width: a.width, height: a.height, alt: a.altText, caption: a.caption, focus: a.focusX != null && a.focusY != null ? { x: a.focusX, y: a.focusY } : null }
        : {}),
      // Patterns carry the settings they were drawn from, so the pattern block and the mock-ups draw the same tile again.
      ...(a.kind === 'pattern' ? { pattern: a.patternSettings ?? null } : {}),
    })),
    colors: await Promise.all(colors.map(colorView)),
    logos: logos.map(logoView),
    typefaces: faces.map(typefaceView),
    typeScale: { ...settings, ratio: SCALE_RATIOS[settings.ratioName as keyof typeof SCALE_RATIOS].ratio, steps: typeScaleSteps(settings), measure: measured },
  };
}

/** What the token exporters need, from the identity document. */
export function tokensInput(identity: Identity): IdentityForTokens {
  const faceFor = (role: TypefaceRole) => identity.typefaces.find((f) => f.role === role);
  return {
    brand: { name: identity.brand.name, slug: identity.brand.slug },
    colors: identity.colors.map((c) => ({ name: c.name, hex: c.hex, role: c.role ?? undefined })),
    typefaces: identity.typefaces.map((f) => ({ role: f.role, family: f.family, fallback: f.fallback, weights: f.weights })),
    typeScale: {
      basePx: identity.typeScale.basePx,
      ratioName: identity.typeScale.ratioName,
      ratio: identity.typeScale.ratio,
      steps: identity.typeScale.steps.map((s) => ({
        name: s.name,
        px: s.px,
        lineHeight: s.lineHeight,
        role: faceFor(s.role) ? s.role : undefined,
        weight: s.role === 'heading' ? (faceFor('heading')?.weights.includes(700) ? 700 : undefined) : undefined,
      })),
    },
  };
}
