import { AppError } from '@/lib/errors';

/** Error codes the typography library reports. */
export type TypographyErrorCode = 'font_unreadable' | 'invalid_input';

/** A plain-worded typography error: a font that cannot be read, or arguments out of range (400). */
export class TypographyError extends AppError<TypographyErrorCode> {
  constructor(code: TypographyErrorCode, message: string) {
    super(code, message, { status: 400 });
  }
}

/** Throws invalid_input unless value is a finite number above zero. */
export function requirePositive(value: unknown, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new TypographyError('invalid_input', `${what} must be a number above zero, got ${String(value)}.`);
  }
  return value;
}
