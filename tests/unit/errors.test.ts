// Every error the product raises on purpose answers through one mapping, in one shape. The statuses are HTTP's own
// meanings (RFC 9110 §15.5: 400 a request that cannot be served as asked, 404 nothing there, 413 content too large,
// 415 unsupported media type, 422 well-formed but unprocessable; §15.6: 5xx our side). The failures are raised by the
// real domain functions, not built by hand, so the test sees the codes callers get.
import { readFileSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import { inspectUpload, UploadRejection } from '@/lib/uploads/inspect.server';
import { checkRenditionSize, RenditionError, resolveRendition } from '@/lib/assets/renditions';
import { ApiClientError } from '@/lib/client/api';
import { ColorError, toColor } from '@/lib/color';
import { AppError, readErrorBody } from '@/lib/errors';
import { instantiateTemplate, TemplateError } from '@/lib/guideline/templates';
import { ApiError, errorAnswer, methodNotAllowed, parseWith, readJson } from '@/lib/http/api';
import type { Identity } from '@/lib/identity/types';
import { log } from '@/lib/log.server';
import { clearSpace, LogoError, toSanitizedSvg } from '@/lib/logo';
import { tokenFile, TokenError } from '@/lib/tokens';
import { pxToRem, TypographyError } from '@/lib/type';
import { z } from 'zod';

const identity = JSON.parse(readFileSync('tests/fixtures/identity-larchmere.json', 'utf8')) as Identity;
const context = { locals: { requestId: 'req-test-0001' } } as Parameters<typeof errorAnswer>[1];

/** What the API answers for a thrown value: status and parsed body. */
async function answer(err: unknown) {
  const response = errorAnswer(err, context);
  return { status: response.status, type: response.headers.get('content-type'), body: await response.json() };
}

/** The error a call throws (sync or async). */
async function thrown(run: () => unknown): Promise<unknown> {
  try {
    await run();
  } catch (err) {
    return err;
  }
  throw new Error('expected a throw');
}

describe('each error class answers with its status and code', () => {
  test.each<[string, () => unknown, new (...args: never[]) => Error, number, string]>([
    ['a colour that is not one', () => toColor('bogus'), ColorError, 400, 'color_unparsed'],
    ['a rem size against a zero root', () => pxToRem(16, 0), TypographyError, 400, 'invalid_input'],
    ['a token file in a format we do not write', () => tokenFile('xml' as 'css', identity as never), TokenError, 400, 'unknown_format'],
    ['clear space of a logo with no width', () => clearSpace({ bounds: { x: 0, y: 0, width: 0, height: 1 }, unitSize: 1, multiple: 1 }), LogoError, 400, 'invalid_input'],
    ['an SVG with an entity bomb', () => toSanitizedSvg(readFileSync('tests/fixtures/svg/billion-laughs.svg', 'utf8')), LogoError, 400, 'svg_entity'],
    ['an SVG rendition of a raster', () => resolveRendition({ format: 'svg' }, { kind: 'logo', format: 'png' }), RenditionError, 400, 'svg_from_raster'],
    [
      'a rendition over the side limit',
      () => checkRenditionSize({ format: 'png', width: 100_000, square: false, padding: 0, background: null, variant: 'original', color: null, colorSpace: 'rgb', sizes: null }, { format: 'png', width: 1000, height: 1000 }),
      RenditionError,
      422,
      'rendition_too_large',
    ],
    ['an empty upload', () => inspectUpload(Buffer.alloc(0), { as: 'shelf', filename: 'logo.svg' }), UploadRejection, 400, 'empty_file'],
    [
      'a starter template with an unknown placeholder',
      () => instantiateTemplate({ name: 'x', description: '', doc: { type: 'doc', content: [{ type: 'clearSpace', attrs: { logoId: '$favourite' } }] } }, identity),
      TemplateError,
      500,
      'invalid_template',
    ],
    ['a body that breaks its schema', () => parseWith(z.strictObject({ name: z.string() }), { name: 1 }), ApiError, 400, 'invalid_input'],
    ['a body that is not JSON', () => readJson(new Request('http://x/', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{' }), z.object({})), ApiError, 400, 'malformed_json'],
    ['a body that is not JSON at all', () => readJson(new Request('http://x/', { method: 'POST', headers: { 'content-type': 'text/plain' }, body: 'x' }), z.object({})), ApiError, 415, 'unsupported_media_type'],
    ['a body over its cap', () => readJson(new Request('http://x/', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '[1]' }), z.array(z.number()), 2), ApiError, 413, 'too_large'],
  ])('%s', async (_name, run, Class, status, code) => {
    const err = await thrown(run);
    expect(err).toBeInstanceOf(Class);
    expect(err).toBeInstanceOf(AppError);
    const { status: answered, type, body } = await answer(err);
    expect(answered).toBe(status);
    expect(type).toBe('application/json; charset=utf-8');
    expect(body.error.code).toBe(code);
    expect(body.error.message).toBe((err as Error).message);
    // The request id is quoted only where the failure is ours (5xx).
    expect(body.error.requestId).toBe(status >= 500 ? 'req-test-0001' : undefined);
  });

  test('a logo the renderer refuses keeps its code at the status the caller gives', async () => {
    const { status, body } = await answer(new LogoError('svg_embedded_image_too_large', 'Too big to draw.', 422));
    expect([status, body.error.code]).toEqual([422, 'svg_embedded_image_too_large']);
  });

  test('details and top-level extras stay where they were', async () => {
    const rejected = [{ filename: 'a.png', code: 'too_large', message: 'Too large.' }];
    const { body } = await answer(new ApiError(400, 'too_large', 'Too large.', { path: 'file' }, { rejected }));
    expect(body).toEqual({ error: { code: 'too_large', message: 'Too large.', details: { path: 'file' } }, rejected });
  });

  test('a method a resource does not offer: 405 method_not_allowed', async () => {
    const response = await methodNotAllowed({ request: new Request('http://x/', { method: 'PATCH' }) } as never);
    expect(response.status).toBe(405);
    expect((await response.json()).error.code).toBe('method_not_allowed');
  });

  test('anything else is a 500 that says nothing of the cause and gives the request id', async () => {
    const level = log.level;
    log.level = 'silent';
    try {
      const { status, body } = await answer(new Error('connection to 10.0.0.5 refused, password=hunter2'));
      expect(status).toBe(500);
      expect(body).toEqual({ error: { code: 'internal', message: 'Something went wrong on our side. Please try again.', requestId: 'req-test-0001' } });
    } finally {
      log.level = level;
    }
  });
});

describe('the browser reads the same shape', () => {
  test('our shape: code, message, details; a 5xx message quotes the request id', async () => {
    const ours = await answer(new ApiError(409, 'empty_draft', 'There is nothing to publish yet.', { path: 'doc' }));
    const err = ApiClientError.from(ours.status, ours.body);
    expect([err.status, err.code, err.message, err.details]).toEqual([409, 'empty_draft', 'There is nothing to publish yet.', { path: 'doc' }]);
    const failed = ApiClientError.from(500, { error: { code: 'internal', message: 'Something went wrong.', requestId: 'abc-12345' } });
    expect(failed.requestId).toBe('abc-12345');
    expect(failed.message).toBe('Something went wrong. (Reference: abc-12345)');
  });
  test('better-auth answers flat {code, message}; anything else gets a generic message', () => {
    expect(readErrorBody(401, { code: 'INVALID_EMAIL_OR_PASSWORD', message: 'Invalid email or password' })).toMatchObject({ code: 'INVALID_EMAIL_OR_PASSWORD', message: 'Invalid email or password' });
    expect(readErrorBody(502, undefined)).toMatchObject({ code: 'http_error', message: 'The server answered 502.' });
    expect(readErrorBody(502, '<html>Bad gateway</html>')).toMatchObject({ code: 'http_error', message: 'The server answered 502.' });
  });
});
