// The token exporters: DTCG 2025.10 JSON, the older hex-string flavour, CSS custom properties, Tailwind 4 theme, SCSS.
export { TokenError, type TokenErrorCode } from './errors';
export type { IdentityForTokens, TokenFormat, TypefaceRole } from './types';
export { identityTokens, ROOT_PX, type Token, type Dimension, type Typography } from './model';
export { kebabName } from './names';
export { toDtcg, toDtcgHex } from './dtcg';
export { toCss, toScss, toTailwindTheme, cssValue } from './text-formats';
export { tokenFile, tokenFilename, TOKEN_FORMATS, type TokenFile } from './file';
