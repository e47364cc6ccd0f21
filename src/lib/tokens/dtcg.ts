import { rgb255 } from '@/lib/color/parse';
import { identityTokens, type Dimension, type Token } from './model';
import type { IdentityForTokens } from './types';

type Json = string | number | boolean | null | Json[] | { [key: string]: Json };
type Flavour = 'object' | 'hex';

const round4 = (v: number) => Math.round(v * 10_000) / 10_000;

/** DTCG 2025.10 colour value: sRGB components 0–1, alpha when not opaque, and the hex fallback. */
function colorValue(token: Extract<Token, { type: 'color' }>, flavour: Flavour): Json {
  const { hex, alpha } = token.value;
  if (flavour === 'hex') return alpha < 1 ? `${hex}${Math.round(alpha * 255).toString(16).padStart(2, '0')}` : hex;
  return { colorSpace: 'srgb', components: rgb255(hex).map((v) => round4(v / 255)), ...(alpha < 1 ? { alpha: round4(alpha) } : {}), hex };
}

const dimension = (d: Dimension, flavour: Flavour): Json => (flavour === 'hex' ? `${d.value}${d.unit}` : { value: d.value, unit: d.unit });

function tokenValue(token: Token, flavour: Flavour): Json {
  switch (token.type) {
    case 'color':
      return colorValue(token, flavour);
    case 'dimension':
      return dimension(token.value, flavour);
    case 'typography':
      return {
        fontFamily: token.value.fontFamily,
        fontSize: dimension(token.value.fontSize, flavour),
        fontWeight: token.value.fontWeight,
        lineHeight: token.value.lineHeight,
        letterSpacing: dimension(token.value.letterSpacing, flavour),
      };
    default:
      return token.value;
  }
}

/** Nests tokens into groups by path; every token carries its own $type. */
function build(identity: IdentityForTokens, flavour: Flavour): Record<string, Json> {
  const root: Record<string, Json> = { $description: `Design tokens for ${identity.brand?.name ?? 'the brand'}` };
  for (const token of identityTokens(identity)) {
    let group = root;
    for (const key of token.path.slice(0, -1)) group = (group[key] ??= {}) as Record<string, Json>;
    group[token.path[token.path.length - 1]] = {
      $type: token.type,
      $value: tokenValue(token, flavour),
      ...(token.description ? { $description: token.description } : {}),
    };
  }
  return root;
}

/** W3C Design Tokens Community Group format 2025.10: object colour and dimension values. */
export function toDtcg(identity: IdentityForTokens): Record<string, unknown> {
  return build(identity, 'object');
}

/** The older DTCG draft flavour many tools still read: colours as hex strings, dimensions as "1rem" strings. */
export function toDtcgHex(identity: IdentityForTokens): Record<string, unknown> {
  return build(identity, 'hex');
}
