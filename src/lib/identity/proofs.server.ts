// One-colour proofs of the brand's logos for the identity workspace: the tone analysis and the proof images, each
// from the logo as stored (and the designer's own black or white file where there is one, as everywhere else).
import { Brand, BrandLogo } from '@db/models';
import { ApiError } from '@/lib/http/api';
import { drawnGround, paintRoleFor } from '@/lib/logo/knockout';
import type { VariantOverride } from '@/lib/logo/knockout.server';
import { greyscaleProof, logoTones, oneColourProof, proofSheet, type LogoSource } from '@/lib/logo/proofs.server';
import type { LogoProofs, ProofKind } from '@/lib/logo/tones';
import type { LightParts } from '@/lib/identity/types';
import { storage } from '@/lib/storage/index.server';

/** The logo as the proofs draw it: its own light-parts choice, or `lightParts` to compare the other before choosing. */
async function proofSource(brand: Brand, logoId: string, lightParts?: LightParts): Promise<{ logo: BrandLogo; source: LogoSource }> {
  const logo = await BrandLogo.findOne({ where: { id: logoId, brandId: brand.id } });
  if (!logo) throw new ApiError(404, 'not_found', 'That logo was not found in this brand.');
  const bytes = await storage.get(logo.storageKey);
  if (!bytes) throw new ApiError(404, 'not_found', 'The logo file is missing from storage.');
  return { logo, source: { bytes, format: logo.format, canvas: logo.canvas, lightParts: lightParts ?? logo.lightParts } };
}

/** The designer's own file for a one-colour slot, when they uploaded one and it is still in storage. */
async function ownFile(logo: BrandLogo, slot: 'black' | 'white'): Promise<VariantOverride | null> {
  const own = logo.variantFiles?.[slot];
  if (!own) return null;
  const bytes = await storage.get(own.key);
  return bytes ? { bytes, format: own.format } : null;
}

/**
 * The tone analysis of one logo and where its proofs are. The addresses carry the light-parts choice they are drawn
 * with, so changing it gives new images, and `compare` shows the one-colour proofs with the other choice.
 */
export async function logoProofs(brand: Brand, logoId: string): Promise<LogoProofs> {
  const { logo, source } = await proofSource(brand, logoId);
  const base = `/api/brands/${brand.id}/logos/${logo.id}/proofs`;
  const lightParts = logo.lightParts ?? 'holes';
  const drawnWith = (choice: LightParts) => `?lightParts=${choice}`;
  const other: LightParts = lightParts === 'holes' ? 'ink' : 'holes';
  const tones = await logoTones(source);
  const ground = logo.format === 'svg' ? drawnGround(source.bytes.toString('utf8')) : 'light';
  return {
    tones,
    lightParts,
    lightColours: tones.parts.filter((p) => paintRoleFor(p.hex, ground, 'holes') !== paintRoleFor(p.hex, ground, 'ink')).map((p) => p.hex),
    files: {
      blackOnWhite: `${base}/black-on-white${drawnWith(lightParts)}`,
      whiteOnBlack: `${base}/white-on-black${drawnWith(lightParts)}`,
      greyscale: `${base}/greyscale`,
      sheet: `${base}/sheet${drawnWith(lightParts)}`,
    },
    compare: { lightParts: other, blackOnWhite: `${base}/black-on-white${drawnWith(other)}`, whiteOnBlack: `${base}/white-on-black${drawnWith(other)}` },
  };
}

/** One proof image (PNG) of one logo, with a file name for downloads; `lightParts` overrides the logo's own choice. */
export async function logoProofImage(brand: Brand, logoId: string, kind: ProofKind, lightParts?: LightParts): Promise<{ body: Buffer; filename: string }> {
  const { logo, source } = await proofSource(brand, logoId, lightParts);
  const filename = `${brand.slug}-${logo.variant}-proof-${kind}.png`;
  switch (kind) {
    case 'black-on-white':
      return { body: await oneColourProof(source, kind, await ownFile(logo, 'black')), filename };
    case 'white-on-black':
      return { body: await oneColourProof(source, kind, await ownFile(logo, 'white')), filename };
    case 'greyscale':
      return { body: await greyscaleProof(source), filename };
    case 'sheet':
      return { body: await proofSheet(source, { black: await ownFile(logo, 'black'), white: await ownFile(logo, 'white') }), filename };
  }
}
