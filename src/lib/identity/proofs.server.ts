// One-colour proofs of the brand's logos for the identity workspace: the tone analysis and the proof images, each
// from the logo as stored (and the designer's own black or white file where there is one, as everywhere else).
import { Brand, BrandLogo } from '@db/models';
import { ApiError } from '@/lib/http/api';
import type { VariantOverride } from '@/lib/logo/knockout.server';
import { greyscaleProof, logoTones, oneColourProof, proofSheet, type LogoSource } from '@/lib/logo/proofs.server';
import type { LogoProofs, ProofKind } from '@/lib/logo/tones';
import { storage } from '@/lib/storage/index.server';

async function proofSource(brand: Brand, logoId: string): Promise<{ logo: BrandLogo; source: LogoSource }> {
  const logo = await BrandLogo.findOne({ where: { id: logoId, brandId: brand.id } });
  if (!logo) throw new ApiError(404, 'not_found', 'That logo was not found in this brand.');
  const bytes = await storage.get(logo.storageKey);
  if (!bytes) throw new ApiError(404, 'not_found', 'The logo file is missing from storage.');
  return { logo, source: { bytes, format: logo.format, canvas: logo.canvas } };
}

/** The designer's own file for a one-colour slot, when they uploaded one and it is still in storage. */
async function ownFile(logo: BrandLogo, slot: 'black' | 'white'): Promise<VariantOverride | null> {
  const own = logo.variantFiles?.[slot];
  if (!own) return null;
  const bytes = await storage.get(own.key);
  return bytes ? { bytes, format: own.format } : null;
}

/** The tone analysis of one logo and where its proofs are. */
export async function logoProofs(brand: Brand, logoId: string): Promise<LogoProofs> {
  const { logo, source } = await proofSource(brand, logoId);
  const base = `/api/brands/${brand.id}/logos/${logo.id}/proofs`;
  return {
    tones: await logoTones(source),
    files: { blackOnWhite: `${base}/black-on-white`, whiteOnBlack: `${base}/white-on-black`, greyscale: `${base}/greyscale`, sheet: `${base}/sheet` },
  };
}

/** One proof image (PNG) of one logo, with a file name for downloads. */
export async function logoProofImage(brand: Brand, logoId: string, kind: ProofKind): Promise<{ body: Buffer; filename: string }> {
  const { logo, source } = await proofSource(brand, logoId);
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
