// One-colour versions of logos, the one place every route, page, print edition, shelf and bundle asks for them.
// They are drawn by the one rendition function (assets/render.server.ts), which decides the colour treatment once.
import { renderRendition } from '@/lib/assets/render.server';
import type { LightParts } from '@/lib/identity/types';
import type { OneColourVariant } from './recolour.server';

export { knockoutRaster, variantInk, type OneColourVariant } from './recolour.server';

/** A logo file the designer uploaded for one variant; it wins over anything computed. */
export interface VariantOverride {
  bytes: Buffer;
  format: 'svg' | 'png';
}

/**
 * The one function behind every one-colour logo: the designer's own file for the slot when there is one, otherwise
 * the knockout computed from the logo as stored (SVG stays SVG, rasters become a PNG), its light parts as holes or ink
 * as the logo's own setting says.
 */
export async function oneColourLogo(
  logo: { bytes: Buffer; format: 'svg' | 'png' | 'webp' | 'jpeg'; lightParts?: LightParts },
  variant: OneColourVariant,
  options: { ink?: string | null; override?: VariantOverride | null; paintOn?: string | null } = {},
): Promise<{ body: Buffer; format: 'svg' | 'png'; contentType: string }> {
  const { override } = options;
  if (override) return { body: override.bytes, format: override.format, contentType: override.format === 'svg' ? 'image/svg+xml' : 'image/png' };
  const made = await renderRendition(
    { bytes: logo.bytes, format: logo.format, drawnBounds: null },
    { format: 'original', width: null, square: false, padding: 0, background: null, variant, color: options.ink ?? null, paintOn: options.paintOn ?? null, lightParts: logo.lightParts, colorSpace: 'rgb', sizes: null },
  );
  return { body: made.body, format: made.ext === 'svg' ? 'svg' : 'png', contentType: made.mime };
}
