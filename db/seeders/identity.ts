// Demo identities of our own invention: palettes, logos and typefaces for the two demo brands.
import { createHash } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { Transaction } from 'sequelize';
import { parseColor } from '@/lib/color';
import type { ColorRole, LightParts, LogoVariant, TypefaceRole } from '@/lib/identity/types';
import { sanitizeSvg } from '@/lib/logo';
import { drawnBounds } from '@/lib/logo/bounds.server';
import { thinnestStroke } from '@/lib/logo/stroke.server';
import { LocalDiskStorage } from '@/lib/storage/local-disk.server';
import { newKey, type FileStorage } from '@/lib/storage/storage';
import { fontMetrics } from '@/lib/type';
import { shippedFont } from '@/lib/type/shipped-fonts';
import { Brand, BrandColor, BrandLogo, BrandTypeface } from '@db/models';

interface DemoIdentity {
  colors: { name: string; value: string; role: ColorRole; spot?: string }[];
  logos: { file: string; name: string; variant: LogoVariant; unitLabel: string; unitOf: number; lightParts?: LightParts }[];
  typefaces: { key: string; role: TypefaceRole }[];
}

export const DEMO_IDENTITIES: Record<string, DemoIdentity> = {
  'larchmere-coffee': {
    colors: [
      { name: 'Roast', value: '#4a2c21', role: 'primary' },
      { name: 'Crema', value: '#e9d8b8', role: 'secondary' },
      { name: 'Larch green', value: '#2f5d50', role: 'accent' },
      { name: 'Ember', value: '#c8553d', role: 'accent' },
      { name: 'Steam', value: '#f6f3ee', role: 'background' },
      { name: 'Char', value: '#1b1714', role: 'text' },
    ],
    logos: [
      { file: 'larchmere-lockup.svg', name: 'Larch lockup', variant: 'primary', unitLabel: 'the height of the letter L', unitOf: 0.38 },
      { file: 'larchmere-mark.svg', name: 'Larch tree mark', variant: 'mark', unitLabel: 'a quarter of the mark’s height', unitOf: 0.25 },
    ],
    typefaces: [
      { key: 'fraunces', role: 'heading' },
      { key: 'dm-sans', role: 'body' },
    ],
  },
  'pellow-street-library': {
    colors: [
      { name: 'Library blue', value: '#1f3a5f', role: 'primary' },
      { name: 'Reading lamp', value: '#e0a526', role: 'accent' },
      { name: 'Paper', value: '#faf7f0', role: 'background' },
      { name: 'Slate', value: '#4b5563', role: 'text' },
    ],
    // The amber lamp is under 3:1 against white: cut out it would vanish in one colour, so the designer prints it in ink.
    logos: [{ file: 'pellow-mark.svg', name: 'Open book mark', variant: 'mark', unitLabel: 'the width of one page', unitOf: 0.25, lightParts: 'ink' }],
    typefaces: [
      { key: 'bricolage-grotesque', role: 'heading' },
      { key: 'source-serif-4', role: 'body' },
    ],
  },
};

const filesHere = join(import.meta.dirname, 'files');

/** Give a demo brand its identity when it has none yet (an empty palette is the sign). */
export async function seedIdentity(brand: Brand, files: FileStorage | string, t: Transaction): Promise<void> {
  const spec = DEMO_IDENTITIES[brand.slug];
  if (!spec || (await BrandColor.count({ where: { brandId: brand.id }, transaction: t })) > 0) return;
  const storage = typeof files === 'string' ? new LocalDiskStorage(files) : files;
  for (const [position, c] of spec.colors.entries()) {
    const parsed = parseColor(c.value);
    if (!parsed.ok) throw new Error(`demo colour ${c.value}: ${parsed.error.message}`);
    await BrandColor.create({ brandId: brand.id, name: c.name, value: c.value, hex: parsed.color.hex, role: c.role, cmykOverride: null, spot: c.spot ?? null, position }, { transaction: t });
  }
  for (const [position, l] of spec.logos.entries()) {
    const clean = sanitizeSvg(await readFile(join(filesHere, l.file), 'utf8'));
    if (!clean.ok) throw new Error(`demo logo ${l.file}: ${clean.error.message}`);
    const bytes = Buffer.from(clean.svg);
    const bounds = (await drawnBounds(bytes)).box;
    const key = newKey(brand.id, 'logo', 'svg');
    await storage.put(key, bytes, 'image/svg+xml');
    await BrandLogo.create(
      {
        brandId: brand.id,
        name: l.name,
        variant: l.variant,
        format: 'svg',
        storageKey: key,
        contentHash: createHash('sha256').update(bytes).digest('hex'),
        byteSize: bytes.length,
        canvas: clean.viewBox,
        bounds,
        clearSpaceUnit: Math.round(bounds.height * l.unitOf * 100) / 100,
        clearSpaceLabel: l.unitLabel,
        clearSpaceMultiple: 1,
        thinnestStroke: Math.round((await thinnestStroke(bytes, clean.viewBox, true)) * 1000) / 1000,
        minScreenPx: null,
        minPrintMm: null,
        lightParts: l.lightParts ?? 'holes',
        position,
      },
      { transaction: t },
    );
  }
  for (const f of spec.typefaces) {
    const font = shippedFont(f.key)!;
    const metrics = fontMetrics(await readFile(join(process.cwd(), font.file)));
    const weights = [100, 200, 300, 400, 500, 600, 700, 800, 900].filter((w) => w >= metrics.weight.min && w <= metrics.weight.max);
    await BrandTypeface.create(
      {
        brandId: brand.id,
        role: f.role,
        family: font.family,
        source: 'shipped',
        shippedKey: font.key,
        storageKey: null,
        format: 'woff2',
        metrics,
        fallback: font.fallback,
        weights,
        licenceConfirmedAt: new Date(),
        licenceConfirmedById: null,
        licenceNote: 'SIL Open Font License 1.1 (shipped with Plumbline)',
      },
      { transaction: t },
    );
  }
  await brand.update({ typeScale: { basePx: 17, ratioName: 'perfect-fourth', stepsUp: 5, stepsDown: 1, bodyLineHeight: 1.55, headingLineHeight: 1.1, columnPx: 540 } }, { transaction: t });
}
