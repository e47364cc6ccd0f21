// The one error Plumbline raises on purpose: a code that screens and scripts can test, a message for people, the HTTP
// status the API answers it with, and optional details. Pure (no server imports), so domain code and islands share it.

/** The API's one error shape: `{"error":{"code","message","details"?,"requestId"?}}`. */
export interface ErrorBody {
  error: {
    code: string;
    message: string;
    details?: unknown;
    /** Present on unexpected failures, so a person can quote it; the same id is in the server's log lines. */
    requestId?: string;
  };
}

export interface AppErrorOptions {
  /** HTTP status the API answers with (default 400: the request cannot be served as asked). */
  status?: number;
  details?: unknown;
  /** Top-level fields beside `error` in the answer (e.g. the upload route's `rejected` list). */
  extra?: Record<string, unknown>;
  cause?: unknown;
}

export class AppError<Code extends string = string> extends Error {
  readonly code: Code;
  readonly status: number;
  readonly details?: unknown;
  readonly extra?: Record<string, unknown>;

  constructor(code: Code, message: string, options: AppErrorOptions = {}) {
    super(message, options.cause === undefined ? undefined : { cause: options.cause });
    this.name = new.target.name;
    this.code = code;
    this.status = options.status ?? 400;
    if (options.details !== undefined) this.details = options.details;
    if (options.extra !== undefined) this.extra = options.extra;
  }

  /** The body the API answers with. */
  toBody(requestId?: string): ErrorBody & Record<string, unknown> {
    const error: ErrorBody['error'] = { code: this.code, message: this.message };
    if (this.details !== undefined) error.details = this.details;
    if (requestId) error.requestId = requestId;
    return { error, ...this.extra };
  }
}

/** What a client reads from an error answer: our shape, or better-auth's flat `{code, message}`, or nothing usable. */
export function readErrorBody(status: number, body: unknown): { code: string; message: string; details?: unknown; requestId?: string } {
  const b = (body && typeof body === 'object' ? body : {}) as { error?: Partial<ErrorBody['error']>; code?: unknown; message?: unknown };
  const nested = b.error && typeof b.error === 'object' ? b.error : undefined;
  const text = (v: unknown) => (typeof v === 'string' && v ? v : undefined);
  return {
    code: text(nested?.code) ?? text(b.code) ?? 'http_error',
    message: text(nested?.message) ?? text(b.message) ?? `The server answered ${status}.`,
    details: nested?.details,
    requestId: text(nested?.requestId),
  };
}
