import { AppError } from '@/lib/errors';

/** Error codes the logo library reports. */
export type LogoErrorCode =
  | 'svg_not_svg'
  | 'svg_too_large'
  | 'svg_entity'
  | 'svg_foreign_object'
  | 'svg_external_reference'
  | 'svg_embedded_image_too_large'
  | 'svg_embedded_image_unreadable'
  | 'svg_absurd_size'
  | 'svg_no_size'
  | 'logo_unreadable'
  | 'logo_empty'
  | 'invalid_input';

export interface LogoErrorInfo {
  code: LogoErrorCode;
  message: string;
}

/** A plain-worded logo error: a file or argument the logo library refuses (400 unless the caller says otherwise). */
export class LogoError extends AppError<LogoErrorCode> {
  constructor(code: LogoErrorCode, message: string, status = 400) {
    super(code, message, { status });
  }
}

/** Throws invalid_input unless value is a finite number above zero (or zero when allowed). */
export function requireSize(value: unknown, what: string, allowZero = false): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0 || (!allowZero && value === 0)) {
    throw new LogoError('invalid_input', `${what} must be a number ${allowZero ? 'of zero or more' : 'above zero'}, got ${String(value)}.`);
  }
  return value;
}
