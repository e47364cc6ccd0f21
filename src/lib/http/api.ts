// The API's conventions: JSON in and out, one error shape, zod at the boundary.
import type { APIContext, APIRoute } from 'astro';
import busboy from 'busboy';
import { Readable } from 'node:stream';
import { z } from 'zod';
import { AppError } from '@/lib/errors';
import { log } from '@/lib/log.server';

/** The one error class written status first, as routes think of it: `new ApiError(404, 'not_found', '…')`. */
export class ApiError extends AppError {
  constructor(status: number, code: string, message: string, details?: unknown, extra?: Record<string, unknown>) {
    super(code, message, { status, details, extra });
  }
}

export const notFound = (what = 'That brand') => new ApiError(404, 'not_found', `${what} was not found.`);

/** A JSON response with our defaults (no caching of personal data). */
export function json(body: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers },
  });
}

/** The error shape as a response; failures on our side (5xx) carry the request id, so a person can quote it. */
export function errorResponse(err: AppError, requestId?: string): Response {
  return json(err.toBody(err.status >= 500 ? requestId : undefined), err.status);
}

/** Any thrown value as our error shape: an AppError answers as itself; anything else is logged and answers 500. */
export function errorAnswer(err: unknown, context: Pick<APIContext, 'locals'>): Response {
  const requestId = context.locals.requestId;
  if (err instanceof AppError) {
    if (err.status >= 500) log.error({ err, code: err.code }, 'request failed');
    return errorResponse(err, requestId);
  }
  log.error({ err }, 'unexpected failure');
  return errorResponse(new AppError('internal', 'Something went wrong on our side. Please try again.', { status: 500 }), requestId);
}

/** Readable details for a zod failure: each problem with its path. */
export function zodDetails(error: z.ZodError): { path: string; message: string }[] {
  return error.issues.map((i) => {
    const at = i.path.join('.');
    if (i.code === 'unrecognized_keys') {
      const keys = i.keys.map((k) => (at ? `${at}.${k}` : k));
      return { path: keys.join(', '), message: `unknown field${keys.length > 1 ? 's' : ''}, not accepted here` };
    }
    return { path: at || '(body)', message: i.message };
  });
}

/** Parse a value through a schema or raise a 400 naming the first bad path. */
export function parseWith<T extends z.ZodType>(schema: T, value: unknown, where = 'body'): z.infer<T> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  const details = zodDetails(result.error);
  const first = details[0];
  throw new ApiError(400, 'invalid_input', `The ${where} is not valid: ${first.path}: ${first.message}`, details);
}

const MAX_JSON_BYTES = 1_000_000;

const size = (bytes: number) => (bytes >= 1024 * 1024 ? `${Math.round(bytes / 1024 / 1024)} MB` : `${Math.ceil(bytes / 1024)} kB`);
const tooLarge = (maxBytes: number) => new ApiError(413, 'too_large', `The request body is too large: at most ${size(maxBytes)} is accepted here.`);

/** The request body's chunks, stopping with a 413 as soon as more than `maxBytes` arrive (chunked bodies too). */
export async function* cappedBody(request: Request, maxBytes: number): AsyncGenerator<Uint8Array> {
  const declared = Number(request.headers.get('content-length') ?? 0);
  if (declared > maxBytes) throw tooLarge(maxBytes);
  if (!request.body) return;
  const reader = request.body.getReader();
  let total = 0;
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) return;
      total += value.byteLength;
      // Stop pulling, without cancelling: cancelling would reset the connection before the 413 is sent.
      if (total > maxBytes) throw tooLarge(maxBytes);
      yield value;
    }
  } finally {
    reader.releaseLock();
  }
}

/** The whole request body as bytes, or a 413 the moment it passes `maxBytes`. */
export async function readBody(request: Request, maxBytes: number): Promise<Buffer> {
  const chunks: Uint8Array[] = [];
  for await (const chunk of cappedBody(request, maxBytes)) chunks.push(chunk);
  return Buffer.concat(chunks);
}

/** Read a JSON request body through a schema: malformed JSON, wrong type or unknown fields → 400; over the cap → 413. */
export async function readJson<T extends z.ZodType>(request: Request, schema: T, maxBytes = MAX_JSON_BYTES): Promise<z.infer<T>> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.includes('application/json')) {
    throw new ApiError(415, 'unsupported_media_type', 'Send the request body as JSON (Content-Type: application/json).');
  }
  const text = (await readBody(request, maxBytes)).toString('utf8');
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    throw new ApiError(400, 'malformed_json', 'The request body is not valid JSON.');
  }
  return parseWith(schema, value);
}

type Handler = (context: APIContext) => Promise<Response> | Response;

/** Wrap an endpoint so thrown AppErrors and unexpected failures both answer in our error shape. */
export function endpoint(handler: Handler): APIRoute {
  return async (context) => {
    try {
      return await handler(context);
    } catch (err) {
      return errorAnswer(err, context);
    }
  };
}

/** A uuid path parameter, or 404 (a malformed id names nothing). */
export function idParam(value: string | undefined, what = 'That brand'): string {
  if (!value || !z.uuid().safeParse(value).success) throw notFound(what);
  return value;
}

/** Answer for a method a resource does not offer. */
export const methodNotAllowed: APIRoute = ({ request }) =>
  errorResponse(new ApiError(405, 'method_not_allowed', `${request.method} is not offered here.`));

export interface FormLimits {
  /** The most one file may hold; the default is the whole request's cap. */
  maxFileBytes?: number;
  /** The error for a file over maxFileBytes (default: 413 too_large), raised as soon as it is passed. */
  fileTooLarge?: (filename: string) => AppError;
}

/**
 * Read a multipart form as it streams in: 413 once the request passes `maxBytes`, and an error as soon as one
 * file passes `maxFileBytes`, so no oversized body is ever held whole. A file within its cap is kept whole: every
 * upload is inspected whole before it is stored (inspect.server.ts), so none could go to storage as a stream.
 */
export async function readForm(request: Request, maxBytes: number, limits: FormLimits = {}): Promise<FormData> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.includes('multipart/form-data')) {
    throw new ApiError(415, 'unsupported_media_type', 'Send files as multipart/form-data, in a field named "file".');
  }
  const maxFileBytes = limits.maxFileBytes ?? maxBytes;
  const fileTooLarge = limits.fileTooLarge ?? (() => new ApiError(413, 'too_large', `The file is too large: at most ${size(maxFileBytes)} is accepted here.`));
  const malformed = () => new ApiError(400, 'malformed_form', 'The upload could not be read as a form.');
  let parser: busboy.Busboy;
  try {
    parser = busboy({ headers: { 'content-type': type }, limits: { fileSize: maxFileBytes, fields: 100, fieldSize: 64 * 1024, parts: 200 } });
  } catch {
    throw malformed();
  }
  const form = new FormData();
  const pending: Promise<void>[] = [];
  let oversized: string | null = null;
  parser.on('field', (name, value) => form.append(name, value));
  parser.on('file', (name, stream, info) => {
    const chunks: Uint8Array<ArrayBuffer>[] = [];
    stream.on('data', (chunk: Buffer) => chunks.push(new Uint8Array(chunk)));
    stream.on('limit', () => (oversized ??= info.filename ?? 'upload'));
    // A refused upload destroys the parser, which errors its open file: handled here, or the process would stop.
    stream.on('error', () => {});
    pending.push(new Promise((done) => stream.once('close', () => {
      form.append(name, new File(chunks, info.filename ?? 'upload', { type: info.mimeType }));
      done();
    })));
  });
  const finished = new Promise<void>((resolve, reject) => {
    parser.on('close', resolve);
    parser.on('error', reject);
  });
  finished.catch(() => {});
  try {
    for await (const chunk of cappedBody(request, maxBytes)) {
      if (!parser.write(chunk)) await Promise.race([new Promise((r) => parser.once('drain', r)), finished]);
      if (oversized) throw fileTooLarge(oversized);
    }
    parser.end();
    await finished;
    await Promise.all(pending);
    if (oversized) throw fileTooLarge(oversized);
  } catch (err) {
    parser.destroy();
    if (err instanceof AppError) throw err;
    throw malformed();
  }
  return form;
}

/** The single file in a form's "file" field, or a 400 saying it is missing. */
export function formFile(form: FormData, field = 'file'): File {
  const file = form.get(field);
  if (!(file instanceof File)) throw new ApiError(400, 'missing_file', `Attach a file in the "${field}" field.`);
  return file;
}

/** The form's text fields (the file field aside) as a plain object, for a zod schema. */
export function formFields(form: FormData, skip = 'file'): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of form.entries()) if (k !== skip && typeof v === 'string') out[k] = v;
  return out;
}

/**
 * A file download response; `inline` shows it in the browser, otherwise it downloads with the name given.
 * A stream (with its size) is sent as it is read, never held whole.
 */
export function fileResponse(body: Buffer | { stream: Readable; size: number }, contentType: string, filename: string, opts: { inline?: boolean } = {}): Response {
  const safe = filename.replace(/[^\w.-]+/g, '-');
  const streamed = !Buffer.isBuffer(body);
  return new Response(streamed ? (Readable.toWeb(body.stream) as ReadableStream<Uint8Array>) : new Uint8Array(body), {
    headers: {
      'content-type': contentType,
      'content-length': String(streamed ? body.size : body.length),
      'content-disposition': `${opts.inline ? 'inline' : 'attachment'}; filename="${safe}"`,
      'cache-control': 'private, no-cache',
      'x-content-type-options': 'nosniff',
      // An SVG opened directly must not run anything, whatever slipped through.
      'content-security-policy': "default-src 'none'; style-src 'unsafe-inline'; sandbox",
    },
  });
}
