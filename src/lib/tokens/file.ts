import { toDtcg, toDtcgHex } from './dtcg';
import { TokenError } from './errors';
import { kebabName } from './names';
import { toCss, toScss, toTailwindTheme } from './text-formats';
import type { IdentityForTokens, TokenFormat } from './types';

export const TOKEN_FORMATS: readonly TokenFormat[] = ['dtcg', 'dtcg-hex', 'css', 'tailwind', 'scss'];

export interface TokenFile {
  filename: string;
  contentType: string;
  body: string;
}

const FILENAMES: Record<TokenFormat, (slug: string) => string> = {
  dtcg: (slug) => `${slug}.tokens.json`,
  'dtcg-hex': (slug) => `${slug}.legacy.tokens.json`,
  css: (slug) => `${slug}-tokens.css`,
  tailwind: (slug) => `${slug}-theme.css`,
  scss: (slug) => `_${slug}-tokens.scss`,
};

/** The download name of a token file for a brand slug (or name). */
export const tokenFilename = (format: TokenFormat, slug: string) => FILENAMES[format](kebabName(slug, 'brand'));

/** A downloadable token file for one format, named after the brand slug. */
export function tokenFile(format: TokenFormat, identity: IdentityForTokens): TokenFile {
  const slug = identity?.brand?.slug ?? identity?.brand?.name ?? '';
  const json = (value: unknown) => `${JSON.stringify(value, null, 2)}\n`;
  switch (format) {
    case 'dtcg':
      return { filename: tokenFilename(format, slug), contentType: 'application/design-tokens+json; charset=utf-8', body: json(toDtcg(identity)) };
    case 'dtcg-hex':
      return { filename: tokenFilename(format, slug), contentType: 'application/json; charset=utf-8', body: json(toDtcgHex(identity)) };
    case 'css':
      return { filename: tokenFilename(format, slug), contentType: 'text/css; charset=utf-8', body: toCss(identity) };
    case 'tailwind':
      return { filename: tokenFilename(format, slug), contentType: 'text/css; charset=utf-8', body: toTailwindTheme(identity) };
    case 'scss':
      return { filename: tokenFilename(format, slug), contentType: 'text/x-scss; charset=utf-8', body: toScss(identity) };
    default:
      throw new TokenError('unknown_format', `Unknown token format "${String(format)}"; use ${TOKEN_FORMATS.join(', ')}.`);
  }
}
