// The one logger: each request's lines carry its id (the same as its X-Request-Id), one line per request, and no
// secret link ever reaches a log. Lines are read back through a pino destination stream.
import { readdirSync } from 'node:fs';
import { join, relative } from 'node:path';
import { Writable } from 'node:stream';
import { setTimeout as sleep } from 'node:timers/promises';
import { describe, expect, test } from 'vitest';
import { createLogger, currentRequestId, loggedPath, requestIdFrom, serveLogged } from '@/lib/log.server';

/** A logger at `info` whose JSON lines land in `lines`. */
function capture() {
  const lines: Record<string, unknown>[] = [];
  const destination = new Writable({
    write(chunk, _encoding, done) {
      for (const line of String(chunk).split('\n')) if (line) lines.push(JSON.parse(line));
      done();
    },
  });
  return { logger: createLogger({ level: 'info', destination }), lines };
}

describe('a request id in every line', () => {
  test('lines written anywhere while a request is served carry its id, also after awaits and in timers', async () => {
    const { logger, lines } = capture();
    const served = (id: string, path: string) =>
      serveLogged(logger, { method: 'GET', pathname: path, requestId: id }, async () => {
        logger.info('before');
        await sleep(5);
        await new Promise<void>((done) => setTimeout(() => (logger.info({ seen: currentRequestId() }, 'in a timer'), done()), 1));
        return new Response('ok', { status: 201 });
      });
    // Two requests at once: each keeps its own id.
    const [a, b] = await Promise.all([served('request-aaaa', '/app'), served('request-bbbb', '/api/brands')]);
    logger.info('outside');
    expect(a.headers.get('x-request-id')).toBe('request-aaaa');
    expect(b.headers.get('x-request-id')).toBe('request-bbbb');
    for (const id of ['request-aaaa', 'request-bbbb']) {
      const own = lines.filter((l) => l.reqId === id);
      expect(own.map((l) => l.msg)).toEqual(['before', 'in a timer', 'request']);
      expect(own[1].seen).toBe(id);
    }
    expect(lines.find((l) => l.msg === 'outside')).not.toHaveProperty('reqId');
    const line = lines.find((l) => l.reqId === 'request-bbbb' && l.msg === 'request')!;
    expect(line).toMatchObject({ level: 30, method: 'GET', path: '/api/brands', status: 201 });
    expect(typeof line.ms).toBe('number');
  });

  test('a failure that escapes is logged with the id and the request line says 500', async () => {
    const { logger, lines } = capture();
    await expect(
      serveLogged(logger, { method: 'POST', pathname: '/app/brands', requestId: 'request-cccc' }, async () => {
        throw new Error('boom');
      }),
    ).rejects.toThrow('boom');
    expect(lines.map((l) => [l.reqId, l.msg, l.status])).toEqual([
      ['request-cccc', 'unexpected failure', undefined],
      ['request-cccc', 'request', 500],
    ]);
    expect((lines[0].err as { message: string }).message).toBe('boom');
  });

  test('an answer with fixed headers (Response.redirect) still gets its id', async () => {
    const { logger } = capture();
    const response = await serveLogged(logger, { method: 'GET', pathname: '/', requestId: 'request-dddd' }, async () => Response.redirect('http://127.0.0.1/app', 303));
    expect([response.status, response.headers.get('location'), response.headers.get('x-request-id')]).toEqual([303, 'http://127.0.0.1/app', 'request-dddd']);
  });
});

describe('the incoming X-Request-Id', () => {
  test('a short plain token is kept', () => {
    expect(requestIdFrom('3f2c9a7e-5b1d-4e0f-9a8b-1c2d3e4f5a6b')).toBe('3f2c9a7e-5b1d-4e0f-9a8b-1c2d3e4f5a6b');
    expect(requestIdFrom('lb.edge_01-abcdef')).toBe('lb.edge_01-abcdef');
  });
  test.each([
    ['missing', null],
    ['a line break (forged log lines)', 'abcdefgh\n{"level":60}'],
    ['markup', '<script>alert(1)</script>'],
    ['too long', 'a'.repeat(65)],
    ['too short', 'abc'],
    ['spaces', 'abcd efgh'],
  ])('%s: replaced by a new uuid', (_name, header) => {
    const id = requestIdFrom(header);
    expect(id).not.toBe(header);
    // RFC 9562 §5.4: version 4 UUID text form.
    expect(id).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
  });
});

describe('no secret link in a log line', () => {
  /** Every route under src/pages with a [token] segment, as a path with a sample token in it. */
  function tokenRoutes(dir = 'src/pages'): string[] {
    const out: string[] = [];
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const path = join(dir, entry.name);
      if (entry.isDirectory()) out.push(...tokenRoutes(path));
      else if (path.includes('[token]')) {
        const route = '/' + relative('src/pages', path).replace(/\.(astro|ts)$/, '').replace(/\/index$/, '');
        out.push(route.replace('[token]', 'SECRETtoken_0123456789abcdefghijklmnop').replace(/\[[^\]]+\]/g, 'x'));
      }
    }
    return out;
  }

  test('every [token] route is logged as :token (a new token route fails here until redacted)', () => {
    const routes = tokenRoutes();
    expect(routes.length).toBeGreaterThanOrEqual(8);
    for (const route of routes) {
      const logged = loggedPath(route);
      expect(logged, route).not.toContain('SECRETtoken');
      expect(logged, route).toContain(':token');
    }
  });
  test('better-auth password-reset links and every query string are dropped', () => {
    expect(loggedPath('/api/auth/reset-password/SECRETtoken')).toBe('/api/auth/reset-password/:token');
    expect(loggedPath('/api/auth/verify-email?token=SECRETtoken&callbackURL=/app')).toBe('/api/auth/verify-email');
  });
  test('ordinary paths are kept as they are', () => {
    expect(loggedPath('/b/larchmere/v/3/files/6f1c1f0e-8a57-4e63-9d0c-1b5d2f4e9a10')).toBe('/b/larchmere/v/3/files/6f1c1f0e-8a57-4e63-9d0c-1b5d2f4e9a10');
    expect(loggedPath('/app/brands/6f1c1f0e-8a57-4e63-9d0c-1b5d2f4e9a10')).toBe('/app/brands/6f1c1f0e-8a57-4e63-9d0c-1b5d2f4e9a10');
    // A path that merely starts like a token route is not one.
    expect(loggedPath('/shelf/x')).toBe('/shelf/x');
  });
  test('the request line itself carries only the redacted path', async () => {
    const { logger, lines } = capture();
    await serveLogged(logger, { method: 'GET', pathname: '/s/SECRETtoken_0123456789', requestId: 'request-eeee' }, async () => new Response('ok'));
    expect(JSON.stringify(lines)).not.toContain('SECRETtoken');
    expect(lines[0].path).toBe('/s/:token');
  });
});
