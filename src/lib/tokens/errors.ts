/** Error codes the token exporters report. */
export type TokenErrorCode = 'invalid_identity' | 'unknown_format';

/** A typed, plain-worded token export error. */
export class TokenError extends Error {
  readonly code: TokenErrorCode;
  constructor(code: TokenErrorCode, message: string) {
    super(message);
    this.name = 'TokenError';
    this.code = code;
  }
}
