// The identity document: everything a brand types once (colours, logos, typefaces, type scale) with every
// computed value beside it. GET /api/brands/:id/identity returns it; blocks, the published site, the PDF
// and the token files are all rendered from it.
import type { ColorValues } from '@/lib/color/values';
import type { FontMetrics } from '@/lib/type/metrics';

export const COLOR_ROLES = ['primary', 'secondary', 'accent', 'neutral', 'background', 'text', 'support'] as const;
export type ColorRole = (typeof COLOR_ROLES)[number];

export interface IdentityColor extends ColorValues {
  id: string;
  name: string;
  /** What the designer typed, e.g. "oklch(62% 0.14 40)". */
  value: string;
  role: ColorRole | null;
  /** Press values through libvips' built-in CMYK profile, beside the plain formula in `cmyk`. */
  cmykIcc: [number, number, number, number];
  /** The designer's own CMYK for print, when they have proofed one; shown instead of the computed values. */
  cmykOverride: [number, number, number, number] | null;
  /** A spot-colour reference typed by the designer (free text, e.g. a swatch-book number). */
  spot: string | null;
  position: number;
}

export const LOGO_VARIANTS = ['primary', 'secondary', 'mark', 'wordmark', 'lockup', 'monogram'] as const;
export type LogoVariant = (typeof LOGO_VARIANTS)[number];

/** The versions of a logo a designer may supply as files of their own, each winning over the computed one. */
export const LOGO_VARIANT_SLOTS = ['black', 'white', 'reversed', 'on-dark'] as const;
export type LogoVariantSlot = (typeof LOGO_VARIANT_SLOTS)[number];
export const LOGO_VARIANT_SLOT_LABELS: Record<LogoVariantSlot, string> = {
  black: 'One colour, dark ink (for light grounds)',
  white: 'One colour, white (for dark grounds)',
  reversed: 'Reversed (for brand-colour grounds)',
  'on-dark': 'Full colour for dark grounds',
};

/**
 * How a logo's light parts (those under 3:1 against the ground it was drawn for, WCAG 2.2 SC 1.4.11) print in one
 * colour: left out as holes, so the ground shows through (a light tree cut from a dark disc), or printed in the ink
 * (a yellow lamp that would otherwise vanish). White and near-white parts stay holes either way. The designer decides.
 */
export const LIGHT_PARTS = ['holes', 'ink'] as const;
export type LightParts = (typeof LIGHT_PARTS)[number];
export const LIGHT_PARTS_LABELS: Record<LightParts, { label: string; hint: string }> = {
  holes: { label: 'Cut out', hint: 'Light parts become holes and the ground shows through them.' },
  ink: { label: 'Printed in the ink', hint: 'Light colours print in the ink like the rest; only white and near-white parts stay cut out.' },
};

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface IdentityLogo {
  id: string;
  name: string;
  variant: LogoVariant;
  format: 'svg' | 'png';
  /** The canvas in the logo's own units (the SVG viewBox, or PNG pixels). */
  canvas: Box;
  /** Drawn bounds measured from a raster: transparent margins do not count. */
  bounds: Box;
  clearSpace: {
    /** Size of one clear-space unit in logo units, and what the designer calls it (e.g. "height of the mark"). */
    unitSize: number;
    unitLabel: string;
    multiple: number;
    /** The protected area around the drawn bounds, in logo units. */
    box: Box;
  };
  minimumSize: {
    thinnestStroke: number;
    suggested: { screenPx: number; printMm: number };
    /** What the designer settled on (defaults to the suggestion). */
    screenPx: number;
    printMm: number;
  };
  /** Where to fetch the file and its recoloured variants (members only). */
  files: { original: string; black: string; white: string; reversed: string; onDark?: string };
  /** Slots for which the designer uploaded a file of their own (the computed version is used for the rest). */
  ownVariants?: LogoVariantSlot[];
  /** How its light parts print in one colour; versions published before the setting read as 'holes'. */
  lightParts?: LightParts;
  position: number;
}

export const TYPEFACE_ROLES = ['heading', 'body', 'accent'] as const;
export type TypefaceRole = (typeof TYPEFACE_ROLES)[number];

export interface IdentityTypeface {
  id: string;
  role: TypefaceRole;
  family: string;
  source: 'shipped' | 'upload';
  /** Key of an open font Plumbline ships, when source is "shipped". */
  shippedKey: string | null;
  fallback: string[];
  weights: number[];
  metrics: FontMetrics;
  licence: { confirmed: boolean; confirmedAt: string | null; note: string | null; shippedLicence: string | null };
  fileUrl: string;
}

export interface TypeScaleSettings {
  basePx: number;
  ratioName: string;
  stepsUp: number;
  stepsDown: number;
  bodyLineHeight: number;
  headingLineHeight: number;
  /** Column width the measure is computed for, in CSS px. */
  columnPx: number;
}

export interface TypeScaleStep {
  name: string;
  step: number;
  px: number;
  rem: number;
  pt: number;
  lineHeight: number;
  role: TypefaceRole;
}

/** An approved file of the asset shelf, as the downloads block lists it. */
export interface IdentityAsset {
  id: string;
  name: string;
  kind: string;
  format: string;
  /** Where readers with download rights fetch the original. */
  url: string;
  /** Photographs: pixel size, alt text, caption and focal point (absent in versions published before photographs). */
  width?: number | null;
  height?: number | null;
  alt?: string | null;
  caption?: string | null;
  focus?: { x: number; y: number } | null;
  /** In a published version: the address of the version's own copy, which answers ?w=&aspect= with a cropped rendition. */
  renditions?: string;
  /** Shelf patterns: the generator's settings the tile was drawn from (read through `patternSettingsSchema`). */
  pattern?: Record<string, unknown> | null;
}

export interface Identity {
  brand: { id: string; name: string; slug: string };
  /** Approved shelf files at the time the identity was read (absent in versions published before the shelf). */
  assets?: IdentityAsset[];
  colors: IdentityColor[];
  logos: IdentityLogo[];
  typefaces: IdentityTypeface[];
  typeScale: TypeScaleSettings & {
    ratio: number;
    steps: TypeScaleStep[];
    /** Characters per line of body text at columnPx, from the body face's own advance widths. */
    measure: { charsPerLine: number; verdict: 'too-short' | 'comfortable' | 'too-long'; range: { min: number; max: number; ideal: number } } | null;
  };
}
