// Colours as mock-ups use them: only a parsed #rrggbb ever reaches SVG or CSS.
import type { ColorRole, Identity } from '@/lib/identity/types';
import { colorForRole } from '@/lib/guideline/identity';
import { contrastRatio } from '@/lib/color/contrast';

const HEX = /^#[0-9a-f]{6}$/i;

/** The stored hex when it is a plain #rrggbb, else the fallback. */
export const storedHexOr = (hex: string | undefined, fallback: string): string => (hex && HEX.test(hex) ? hex.toLowerCase() : fallback);

const FALLBACK: Record<ColorRole, string> = {
  primary: '#333333',
  secondary: '#8a8a8a',
  accent: '#555555',
  neutral: '#999999',
  background: '#ffffff',
  text: '#1a1a1a',
  support: '#777777',
};

/** The hex of a palette role, with a quiet fallback when the brand has no colour for it. */
export function roleHex(identity: Identity, role: ColorRole): string {
  return storedHexOr(colorForRole(identity, role)?.hex, FALLBACK[role]);
}

/** WCAG 2.2 SC 1.4.3: body text needs 4.5:1 against its ground. */
export const TEXT_CONTRAST = 4.5;

/** The wanted text colour when it reads on the ground (4.5:1), else the brand's text or background colour that does, else black or white. */
export function readableOn(identity: Identity, wanted: string, ground: string): string {
  if (contrastRatio(wanted, ground) >= TEXT_CONTRAST) return wanted;
  const brand = [roleHex(identity, 'text'), roleHex(identity, 'background')].find((c) => contrastRatio(c, ground) >= TEXT_CONTRAST);
  if (brand) return brand;
  return contrastRatio('#ffffff', ground) >= contrastRatio('#000000', ground) ? '#ffffff' : '#000000';
}

/** A ground is dark when white stands on it at 3:1 or more (WCAG 2.2 SC 1.4.11, graphics). */
export const isDarkGround = (ground: string): boolean => contrastRatio('#ffffff', ground) >= 3;

/** A colour laid over a ground at some strength (plain sRGB mixing, common practice for a flat tint). */
export function tint(hex: string, ground: string, strength: number): string {
  const ch = (h: string, i: number) => parseInt(h.slice(1 + 2 * i, 3 + 2 * i), 16);
  return `#${[0, 1, 2].map((i) => Math.round(ch(hex, i) * strength + ch(ground, i) * (1 - strength)).toString(16).padStart(2, '0')).join('')}`;
}
