// Looking up identity data by id, and the brand's CSS custom properties the published site wears.
import { relativeLuminance } from '../color/contrast';
import type { ColorRole, Identity, IdentityColor, IdentityLogo, IdentityTypeface, TypefaceRole } from '../identity/types';

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

/** A CSS font-family list: the family quoted, then its fallbacks. */
export function fontStack(face: IdentityTypeface | undefined, generic = 'sans-serif'): string {
  if (!face) return generic;
  const quote = (name: string) => (/^[A-Za-z-]+$/.test(name) ? name : `"${name.replace(/["\\]/g, '')}"`);
  return [face.family, ...face.fallback].map(quote).concat(face.fallback.length ? [] : [generic]).join(', ');
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
    if (color) style[`--brand-${role}`] = color.hex;
  }
  style['--brand-text'] ??= '#1a1a1a';
  style['--brand-background'] ??= '#ffffff';
  return style;
}

const fontFormat = (format: string) => (format === 'WOFF2' ? 'woff2' : format === 'WOFF' ? 'woff' : 'opentype');

/** The weights the print edition asks a variable face for, each as a static instance (see font-instance.server.ts). */
export const PRINT_WEIGHTS = [400, 500, 600, 700] as const;

/**
 * @font-face rules for the typefaces that have a file to serve (unlicensed faces have none on published pages).
 * For print, a variable face becomes one static face per weight (`?weight=`), since PDF writers embed those properly.
 */
export function fontFaceCss(typefaces: readonly IdentityTypeface[], options: { print?: boolean } = {}): string {
  const family = (f: IdentityTypeface) => f.family.replace(/["\\<>]/g, '');
  return typefaces
    .filter((f) => f.fileUrl)
    .flatMap((f) => {
      const { min, max } = f.metrics.weight;
      if (options.print && f.metrics.isVariable) {
        const weights = PRINT_WEIGHTS.filter((w) => w >= min && w <= max);
        return (weights.length ? weights : [Math.round(f.metrics.weight.default)]).map(
          (w) => `@font-face { font-family: "${family(f)}"; src: url("${f.fileUrl}?weight=${w}") format("truetype"); font-weight: ${w}; }`,
        );
      }
      return [`@font-face { font-family: "${family(f)}"; src: url("${f.fileUrl}") format("${fontFormat(f.metrics.format)}"); font-weight: ${min} ${max}; font-display: swap; }`];
    })
    .join('\n');
}
