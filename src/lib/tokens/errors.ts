import { AppError } from '@/lib/errors';

/** Error codes the token exporters report. */
export type TokenErrorCode = 'invalid_identity' | 'unknown_format';

/** A plain-worded token export error: a format we do not write (400) or an identity that cannot be written (422). */
export class TokenError extends AppError<TokenErrorCode> {
  constructor(code: TokenErrorCode, message: string) {
    super(code, message, { status: code === 'unknown_format' ? 400 : 422 });
  }
}
