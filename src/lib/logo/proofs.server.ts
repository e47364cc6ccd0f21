// One-colour proofs of a logo, the design-phase check: black on white and white on black through the one-colour
// knockout (inner shapes stay visible), and greyscale by WCAG 2.2 relative luminance, with the tone analysis beside.
// Every drawing goes through the one rendition function; the grey is computed here on its pixels (tones.ts).
import sharp from 'sharp';
import { renderRendition, type RenditionSpec } from '@/lib/assets/render.server';
import type { LightParts } from '@/lib/identity/types';
import { escapeXml } from '@/lib/safe/escape';
import { oneColourLogo, type VariantOverride } from './knockout.server';
import { greyscalePixels, toneReport, type ToneReport } from './tones';

/** The longer side of the drawn logo in a proof, px. */
export const PROOF_SIZE = 640;
/** Ground left around the logo on each side of a proof, as a share of PROOF_SIZE. */
export const PROOF_MARGIN = 0.1;

/** A logo as the proofs draw it; `lightParts` is its own choice for light parts in one colour (holes when left out). */
export type LogoSource = { bytes: Buffer; format: 'svg' | 'png' | 'webp' | 'jpeg'; canvas: { width: number; height: number }; lightParts?: LightParts };
export type OneColourProof = 'black-on-white' | 'white-on-black';

const PROOF_GROUND = { 'black-on-white': { variant: 'black', ground: '#ffffff' }, 'white-on-black': { variant: 'white', ground: '#000000' } } as const;

const plainSpec = (width: number, background: string | null): RenditionSpec => ({
  format: 'png', width, square: false, padding: 0, background, variant: 'original', color: null, colorSpace: 'rgb', sizes: null,
});

/** The width that puts the logo's longer side at PROOF_SIZE. */
function drawWidth(canvas: LogoSource['canvas']): number {
  const aspect = canvas.width / Math.max(canvas.height, 1e-9);
  return Math.max(1, Math.round(aspect >= 1 ? PROOF_SIZE : PROOF_SIZE * aspect));
}

/**
 * The logo drawn as it is (transparent ground), as raw RGBA pixels. For the analysis (`native`) a raster is never
 * enlarged: resampling would widen its edges into seams of mixed colour wider than the touching test allows.
 */
async function drawnPixels(logo: LogoSource, native = false) {
  const width = native && logo.format !== 'svg' ? Math.min(drawWidth(logo.canvas), Math.round(logo.canvas.width)) : drawWidth(logo.canvas);
  const drawn = await renderRendition({ bytes: logo.bytes, format: logo.format, drawnBounds: null }, plainSpec(width, null));
  const { data, info } = await sharp(drawn.body).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  return { data, width: info.width, height: info.height, channels: info.channels };
}

const margin = () => Math.round(PROOF_SIZE * PROOF_MARGIN);
const onGround = (img: sharp.Sharp, ground: string) => {
  const m = margin();
  return img.flatten({ background: ground }).extend({ top: m, bottom: m, left: m, right: m, background: ground }).png().toBuffer();
};

/** Black on white or white on black: the one-colour knockout (the designer's own file when there is one) on its ground. */
export async function oneColourProof(logo: LogoSource, kind: OneColourProof, override?: VariantOverride | null): Promise<Buffer> {
  const { variant, ground } = PROOF_GROUND[kind];
  const made = await oneColourLogo(logo, variant, { override });
  const drawn = await renderRendition({ bytes: made.body, format: made.format, drawnBounds: null }, plainSpec(drawWidth(logo.canvas), null));
  return onGround(sharp(drawn.body), ground);
}

/** The logo in grey by WCAG 2.2 relative luminance, on white. */
export async function greyscaleProof(logo: LogoSource): Promise<Buffer> {
  const raster = await drawnPixels(logo);
  const grey = greyscalePixels(raster);
  return onGround(sharp(grey, { raw: { width: raster.width, height: raster.height, channels: 4 } }), '#ffffff');
}

/** Which colours the logo is drawn in, and which touching ones turn into greys too close to tell apart. */
export async function logoTones(logo: LogoSource): Promise<ToneReport> {
  return toneReport(await drawnPixels(logo, true));
}

const SHEET_TILE = 360;
const SHEET_GAP = 24;
const SHEET_LABEL = 40;

/** One PNG with the three proofs side by side, labelled, and the verdict underneath. */
export async function proofSheet(logo: LogoSource, overrides: { black?: VariantOverride | null; white?: VariantOverride | null }): Promise<Buffer> {
  const [black, white, grey, tones] = await Promise.all([
    oneColourProof(logo, 'black-on-white', overrides.black),
    oneColourProof(logo, 'white-on-black', overrides.white),
    greyscaleProof(logo),
    logoTones(logo),
  ]);
  const tiles = [
    { png: black, ground: '#ffffff', label: 'Black on white' },
    { png: white, ground: '#000000', label: 'White on black' },
    { png: grey, ground: '#ffffff', label: 'Greyscale (relative luminance)' },
  ];
  const width = SHEET_GAP + tiles.length * (SHEET_TILE + SHEET_GAP);
  const height = SHEET_GAP + SHEET_TILE + SHEET_LABEL + 56;
  const verdict = tones.dependsOnColour
    ? `Depends on colour: ${tones.collapses.map((c) => `${c.a.hex} and ${c.b.hex} touch at ${(Math.floor(c.contrast * 100) / 100).toFixed(2)}:1`).slice(0, 3).join('; ')} (under 3:1, WCAG 2.2 SC 1.4.11).`
    : 'Reads without colour: touching parts keep at least 3:1 in grey (WCAG 2.2 SC 1.4.11).';
  const text = (x: number, y: number, s: string, size: number, weight = 400) =>
    `<text x="${x}" y="${y}" font-family="DejaVu Sans, sans-serif" font-size="${size}" font-weight="${weight}" fill="#1c1a17">${escapeXml(s)}</text>`;
  const frames = tiles.map((_t, i) => `<rect x="${SHEET_GAP + i * (SHEET_TILE + SHEET_GAP) - 0.5}" y="${SHEET_GAP - 0.5}" width="${SHEET_TILE + 1}" height="${SHEET_TILE + 1}" fill="none" stroke="#cfc8bc"/>`).join('');
  const labels = tiles.map((t, i) => text(SHEET_GAP + i * (SHEET_TILE + SHEET_GAP), SHEET_GAP + SHEET_TILE + 26, t.label, 16, 600)).join('');
  const words = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}">${frames}${labels}${text(SHEET_GAP, height - 24, verdict, 14)}</svg>`;
  const composites = await Promise.all(
    tiles.map(async (t, i) => ({
      input: await sharp(t.png).resize({ width: SHEET_TILE, height: SHEET_TILE, fit: 'contain', background: t.ground }).png().toBuffer(),
      left: SHEET_GAP + i * (SHEET_TILE + SHEET_GAP),
      top: SHEET_GAP,
    })),
  );
  return sharp({ create: { width, height, channels: 4, background: '#ffffff' } })
    .composite([...composites, { input: Buffer.from(words), left: 0, top: 0 }])
    .png()
    .toBuffer();
}
