/** Error codes the typography library reports. */
export type TypographyErrorCode = 'font_unreadable' | 'invalid_input';

/** A typed, plain-worded typography error that callers can map to a response. */
export class TypographyError extends Error {
  readonly code: TypographyErrorCode;
  constructor(code: TypographyErrorCode, message: string) {
    super(message);
    this.name = 'TypographyError';
    this.code = code;
  }
}

/** Throws invalid_input unless value is a finite number above zero. */
export function requirePositive(value: unknown, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new TypographyError('invalid_input', `${what} must be a number above zero, got ${String(value)}.`);
  }
  return value;
}
