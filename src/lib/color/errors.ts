import { AppError } from '@/lib/errors';

/** Error codes the colour library reports. */
export type ColorErrorCode = 'color_unparsed' | 'invalid_input';

/** A plain-worded colour error: a value that is not a colour, or arguments out of range (400). */
export class ColorError extends AppError<ColorErrorCode> {
  constructor(code: ColorErrorCode, message: string) {
    super(code, message, { status: 400 });
  }
}
