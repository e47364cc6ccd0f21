/** Error codes the colour library reports. */
export type ColorErrorCode = 'color_unparsed' | 'invalid_input';

/** A typed, plain-worded colour error that callers can map to a response. */
export class ColorError extends Error {
  readonly code: ColorErrorCode;
  constructor(code: ColorErrorCode, message: string) {
    super(message);
    this.name = 'ColorError';
    this.code = code;
  }
}
