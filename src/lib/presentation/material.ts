// What the reveal presentation is made of: the page it is set on, the grounds and inks it wears, and the pieces of a
// published version (blocks, photographs) each slide looks for. Pure: the slide registry decides with these whether
// a slide has its material or is left out.
import { contrastRatio } from '@/lib/color/contrast';
import { colorForRole, colorsInOrder } from '@/lib/guideline/identity';
import { safeAssetUrl } from '@/lib/guideline/links';
import type { GuidelineDoc, IdentityBlockNode } from '@/lib/guideline/document';
import type { Identity } from '@/lib/identity/types';
import { isAssetRef, storedHex } from '@/lib/safe/values';

/**
 * One slide as a page: 16:9, 1280 × 720 CSS px, which at CSS's 96 px to the inch (25.4 mm) is 338.67 × 190.5 mm,
 * 960 × 540 pt in the PDF.
 */
export const SLIDE_PAGE = { widthPx: 1280, heightPx: 720, widthMm: 338.67, heightMm: 190.5 } as const;

const BLACK_INK = '#000000';
const WHITE_INK = '#ffffff';

/** Black or white, whichever has the higher WCAG 2.2 contrast on `ground` (one of them always reaches 4.5:1). */
export function inkOn(ground: string): string {
  const hex = storedHex(ground, '#ffffff');
  return contrastRatio(BLACK_INK, hex) >= contrastRatio(WHITE_INK, hex) ? BLACK_INK : WHITE_INK;
}

export interface SlideGrounds {
  /** The brand's page colour (its background role, else its lightest colour). */
  light: string;
  /** Its text colour (the text role, else its darkest colour). */
  dark: string;
  /** Its primary colour. */
  brand: string;
}

/** The three grounds the slides are set on, each a checked #rrggbb. */
export function slideGrounds(identity: Identity): SlideGrounds {
  return {
    light: storedHex(colorForRole(identity, 'background')?.hex, '#ffffff'),
    dark: storedHex(colorForRole(identity, 'text')?.hex, '#1a1a1a'),
    brand: storedHex(colorForRole(identity, 'primary')?.hex, '#1a1a1a'),
  };
}

/** The palette in the designer's order, each colour with the ink its name is set in. */
export const paletteSwatches = (identity: Identity) =>
  colorsInOrder(identity).map((c) => {
    const hex = storedHex(c.hex, '#808080');
    // Press values only when the designer proofed them: a computed CMYK on a slide would read as a promise.
    return { id: c.id, name: c.name, hex, rgb: c.rgb, proofedCmyk: c.cmykOverride, role: c.role, ink: inkOn(hex) };
  });

/** The first block of a type in the document, or null. */
export function firstBlock(doc: GuidelineDoc, type: string): IdentityBlockNode | null {
  return (doc.content.find((node) => node.type === type) as IdentityBlockNode | undefined) ?? null;
}

export interface RevealPhotograph {
  url: string;
  alt: string;
  caption: string;
}

/**
 * The photographs the guidelines recommend (imagery blocks, "do" verdicts), in document order and at most `max`:
 * only shelf images the version carries a copy of, never a placeholder or an address from elsewhere.
 */
export function revealPhotographs(identity: Identity, doc: GuidelineDoc, versionBase: string, max = 4): RevealPhotograph[] {
  const seen = new Set<string>();
  const found: RevealPhotograph[] = [];
  for (const node of doc.content) {
    if (node.type !== 'imagery') continue;
    const items = (node as IdentityBlockNode).attrs.items;
    for (const item of Array.isArray(items) ? items : []) {
      const { src, alt, caption, verdict } = (item ?? {}) as Record<string, unknown>;
      if (verdict === 'dont' || !isAssetRef(src) || seen.has(src)) continue;
      const asset = identity.assets?.find((a) => a.id === src);
      const url = asset && safeAssetUrl(asset.url);
      if (!url || !url.startsWith(`${versionBase}/files/`)) continue;
      seen.add(src);
      found.push({ url, alt: typeof alt === 'string' ? alt : '', caption: typeof caption === 'string' ? caption : '' });
      if (found.length === max) return found;
    }
  }
  return found;
}
