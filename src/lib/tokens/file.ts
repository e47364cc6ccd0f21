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

/** A downloadable token file for one format, named after the brand slug. */
export function tokenFile(format: TokenFormat, identity: IdentityForTokens): TokenFile {
  const slug = kebabName(identity?.brand?.slug ?? identity?.brand?.name ?? '', 'brand');
  const json = (value: unknown) => `${JSON.stringify(value, null, 2)}\n`;
  switch (format) {
    case 'dtcg':
      return { filename: `${slug}.tokens.json`, contentType: 'application/design-tokens+json; charset=utf-8', body: json(toDtcg(identity)) };
    case 'dtcg-hex':
      return { filename: `${slug}.legacy.tokens.json`, contentType: 'application/json; charset=utf-8', body: json(toDtcgHex(identity)) };
    case 'css':
      return { filename: `${slug}-tokens.css`, contentType: 'text/css; charset=utf-8', body: toCss(identity) };
    case 'tailwind':
      return { filename: `${slug}-theme.css`, contentType: 'text/css; charset=utf-8', body: toTailwindTheme(identity) };
    case 'scss':
      return { filename: `_${slug}-tokens.scss`, contentType: 'text/x-scss; charset=utf-8', body: toScss(identity) };
    default:
      throw new TokenError('unknown_format', `Unknown token format "${String(format)}"; use ${TOKEN_FORMATS.join(', ')}.`);
  }
}
