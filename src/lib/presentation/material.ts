// What the reveal presentation is made of: the page it is set on, the grounds and inks it wears, and the pieces of a
// published version (blocks, photographs) each slide looks for. Pure: the slide registry decides with these whether
// a slide has its material or is left out.
import { contrastRatio } from '@/lib/color/contrast';
import { colorForRole, colorsInOrder, markLogo, primaryLogo } from '@/lib/guideline/identity';
import { safeAssetUrl } from '@/lib/guideline/links';
import type { GuidelineDoc, IdentityBlockNode } from '@/lib/guideline/document';
import type { Identity, IdentityAsset, IdentityLogo } from '@/lib/identity/types';
import type { ToneReport } from '@/lib/logo/tones';
import { aspectParam, CENTRE, focalCrop, objectPosition, renditionHeight, srcsetWidths, type PhotoAspect } from '@/lib/assets/photo';
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

export interface LogoFinding {
  logo: IdentityLogo;
  report: ToneReport;
}

/**
 * The logos the presentation shows (primary, then the mark) whose touching parts fall under 3:1 in grey (the tone
 * check, WCAG 2.2 SC 1.4.11), each with its report; empty when every one reads without colour.
 */
export function colourDependence(identity: Identity, tones: Record<string, ToneReport>): LogoFinding[] {
  const shown = [primaryLogo(identity), markLogo(identity)].filter((l, i, all): l is IdentityLogo => !!l && all.findIndex((o) => o?.id === l.id) === i);
  return shown.flatMap((logo) => {
    const report = Object.hasOwn(tones, logo.id) ? tones[logo.id] : undefined;
    return report?.dependsOnColour && report.collapses.length ? [{ logo, report }] : [];
  });
}

/** The first block of a type in the document, or null. */
export function firstBlock(doc: GuidelineDoc, type: string): IdentityBlockNode | null {
  return (doc.content.find((node) => node.type === type) as IdentityBlockNode | undefined) ?? null;
}

/** How many photographs the slide shows, and the aspect ratio each is cut to for its cell (see presentation.css). */
export const SLIDE_PHOTO_ASPECT: Record<number, PhotoAspect> = { 1: '16:9', 2: '4:3', 3: '4:5', 4: '4:5' };
/** Share of the slide's width one photograph takes, by how many there are (cells of .s-photos-n). */
const SLIDE_PHOTO_SHARE: Record<number, number> = { 1: 0.7, 2: 0.435, 3: 0.287, 4: 0.212 };

export interface RevealPhotograph {
  /** The version's own copy, cut around its focal point to the slide's aspect ratio. */
  src: string;
  srcSet?: string;
  sizes?: string;
  width?: number;
  height?: number;
  /** CSS object-position from the focal point, for files without renditions (older versions, plain images). */
  position: string;
  alt: string;
  caption: string;
}

interface Found {
  asset: IdentityAsset;
  alt: string;
  caption: string;
}

/** A photograph as the slide shows it: renditions of the version's copy by width (HTML srcset), cut around the focus. */
function slidePicture(found: Found, aspect: PhotoAspect, share: number): RevealPhotograph | null {
  const { asset } = found;
  const base = { alt: found.alt, caption: found.caption, position: objectPosition(asset.focus) };
  const copy = asset.kind === 'photo' && asset.width && asset.height ? safeAssetUrl(asset.renditions ?? '') : null;
  if (copy) {
    const crop = focalCrop({ width: asset.width!, height: asset.height! }, aspect, asset.focus ?? CENTRE);
    const widths = srcsetWidths(crop.width);
    const at = (w: number) => `${copy}?w=${w}&aspect=${aspectParam(aspect)}`;
    // A slide is at most 1280 CSS px wide in print; twice the cell covers sharp screens and the PDF alike.
    const wanted = Math.ceil(SLIDE_PAGE.widthPx * share * 2);
    const chosen = widths.find((w) => w >= wanted) ?? widths.at(-1)!;
    return {
      ...base,
      src: at(chosen),
      srcSet: widths.map((w) => `${at(w)} ${w}w`).join(', '),
      // The slide is as wide as the screen allows at 16:9 (min(100vw, 177.78vh)); the cell is a share of it.
      sizes: `calc(min(100vw, 177.78vh) * ${share})`,
      width: chosen,
      height: renditionHeight(chosen, aspect),
    };
  }
  const url = safeAssetUrl(asset.url);
  return url ? { ...base, src: url } : null;
}

/**
 * The photographs the guidelines recommend (imagery blocks, "do" verdicts), in document order and at most `max`: only
 * shelf photographs the version carries a copy of, never a placeholder or an address from elsewhere. Alt text and
 * caption as the imagery block shows them (its own words, else the shelf's); cut to the slide's aspect ratio around
 * each photograph's focal point.
 */
export function revealPhotographs(identity: Identity, doc: GuidelineDoc, versionBase: string, max = 4): RevealPhotograph[] {
  const seen = new Set<string>();
  const found: Found[] = [];
  for (const node of doc.content) {
    if (node.type !== 'imagery' || found.length === max) continue;
    const items = (node as IdentityBlockNode).attrs.items;
    for (const item of Array.isArray(items) ? items : []) {
      const { src, alt, caption, verdict } = (item ?? {}) as Record<string, unknown>;
      if (verdict === 'dont' || !isAssetRef(src) || seen.has(src)) continue;
      const asset = identity.assets?.find((a) => a.id === src && (a.kind === 'photo' || a.kind === 'image'));
      const url = asset && safeAssetUrl(asset.url);
      if (!asset || !url || !url.startsWith(`${versionBase}/files/`)) continue;
      seen.add(src);
      const own = (v: unknown) => (typeof v === 'string' ? v.trim() : '');
      found.push({ asset, alt: own(alt) || asset.alt?.trim() || '', caption: own(caption) || asset.caption?.trim() || '' });
      if (found.length === max) break;
    }
  }
  const aspect = SLIDE_PHOTO_ASPECT[found.length];
  return found.flatMap((f) => slidePicture(f, aspect, SLIDE_PHOTO_SHARE[found.length]) ?? []);
}
