// Looking up identity data by id, and the brand's CSS custom properties the published site wears.
import { relativeLuminance } from '@/lib/color/contrast';
import type { ColorRole, Identity, IdentityColor, IdentityLogo, IdentityTypeface, TypefaceRole } from '@/lib/identity/types';
import { cssFontFamilyList, cssString, cssUrl } from '@/lib/safe/escape';
import { cleanTypefaceFamily, fallbackFamily, storedHex } from '@/lib/safe/values';

export const findColor = (identity: Identity, id: string | null | undefined): IdentityColor | undefined =>
  id ? identity.colors.find((c) => c.id === id) : undefined;

export const findLogo = (identity: Identity, id: string | null | undefined): IdentityLogo | undefined =>
  id ? identity.logos.find((l) => l.id === id) : undefined;

const byPosition = <T extends { position: number }>(list: T[]) => [...list].sort((a, b) => a.position - b.position);

export const colorsInOrder = (identity: Identity): IdentityColor[] => byPosition(identity.colors);
export const logosInOrder = (identity: Identity): IdentityLogo[] => byPosition(identity.logos);

/** The lightest and darkest colours by WCAG relative luminance. */
export function extremes(identity: Identity): { lightest?: IdentityColor; darkest?: IdentityColor } {
  const sorted = [...identity.colors].sort((a, b) => relativeLuminance(b.rgb) - relativeLuminance(a.rgb));
  return { lightest: sorted[0], darkest: sorted[sorted.length - 1] };
}

/** The first colour of a role; text and background fall back to the darkest and lightest, primary to the first. */
export function colorForRole(identity: Identity, role: ColorRole): IdentityColor | undefined {
  const ordered = colorsInOrder(identity);
  const found = ordered.find((c) => c.role === role);
  if (found) return found;
  if (role === 'text') return extremes(identity).darkest;
  if (role === 'background') return extremes(identity).lightest;
  if (role === 'primary') return ordered[0];
  return undefined;
}

/** The primary logo, else the first one. */
export function primaryLogo(identity: Identity): IdentityLogo | undefined {
  const ordered = logosInOrder(identity);
  return ordered.find((l) => l.variant === 'primary') ?? ordered[0];
}

/** The standalone mark (mark, then monogram), else the primary logo. */
export function markLogo(identity: Identity): IdentityLogo | undefined {
  const ordered = logosInOrder(identity);
  return ordered.find((l) => l.variant === 'mark') ?? ordered.find((l) => l.variant === 'monogram') ?? primaryLogo(identity);
}

export const typefaceForRole = (identity: Identity, role: TypefaceRole): IdentityTypeface | undefined =>
  identity.typefaces.find((t) => t.role === role);

/** A CSS font-family list: the family, then its fallbacks, each cleaned and escaped (an old row may predate the rules). */
export function fontStack(face: IdentityTypeface | undefined, generic = 'sans-serif'): string {
  if (!face) return generic;
  const names = [cleanTypefaceFamily(face.family), ...face.fallback.map((f) => (fallbackFamily.safeParse(f).success ? f.trim() : cleanTypefaceFamily(f, ''))).filter(Boolean)];
  return cssFontFamilyList(face.fallback.length ? names : [...names, generic]);
}

/** CSS custom properties of the brand: fonts by role and colours by role, for the published site's root. */
export function brandStyle(identity: Identity): Record<string, string> {
  const heading = typefaceForRole(identity, 'heading');
  const body = typefaceForRole(identity, 'body') ?? heading;
  const style: Record<string, string> = {
    '--brand-heading-font': fontStack(heading ?? body),
    '--brand-body-font': fontStack(body, 'serif'),
  };
  for (const role of ['primary', 'secondary', 'accent', 'text', 'background'] as const) {
    const color = colorForRole(identity, role);
    if (color) style[`--brand-${role}`] = storedHex(color.hex, role === 'text' ? '#1a1a1a' : '#ffffff');
  }
  style['--brand-text'] ??= '#1a1a1a';
  style['--brand-background'] ??= '#ffffff';
  return style;
}

/** A font weight for CSS: a number from 1 to 1000 (CSS Fonts 4 §2.2), else normal. */
const weight = (value: unknown) => (typeof value === 'number' && Number.isFinite(value) ? Math.min(1000, Math.max(1, Math.round(value))) : 400);

const fontFormat = (format: string) => (format === 'WOFF2' ? 'woff2' : format === 'WOFF' ? 'woff' : 'opentype');

/** The weights the print edition asks a variable face for, each as a static instance (see font-instance.server.ts). */
export const PRINT_WEIGHTS = [400, 500, 600, 700] as const;

/**
 * @font-face rules for the typefaces that have a file to serve (unlicensed faces have none on published pages).
 * For print, a variable face becomes one static face per weight (`?weight=`), since PDF writers embed those properly.
 */
export function fontFaceCss(typefaces: readonly IdentityTypeface[], options: { print?: boolean } = {}): string {
  return typefaces
    .filter((f) => f.fileUrl)
    .flatMap((f) => {
      const name = cssString(cleanTypefaceFamily(f.family));
      const { min, max } = f.metrics.weight;
      if (options.print && f.metrics.isVariable) {
        const weights = PRINT_WEIGHTS.filter((w) => w >= min && w <= max);
        return (weights.length ? weights : [weight(f.metrics.weight.default)]).map(
          (w) => `@font-face { font-family: ${name}; src: ${cssUrl(`${f.fileUrl}?weight=${w}`)} format("truetype"); font-weight: ${w}; }`,
        );
      }
      return [`@font-face { font-family: ${name}; src: ${cssUrl(f.fileUrl)} format("${fontFormat(f.metrics.format)}"); font-weight: ${weight(min)} ${weight(max)}; font-display: swap; }`];
    })
    .join('\n');
}
