// The front port of the scaled layout (scripts/lib/front-proxy.ts) against tiny loopback HTTP servers: it takes turns,
// takes a process that refuses connections out of the rotation and brings it back when its health answers, and
// repeats a request that failed before any byte of an answer on the next process only when that is safe.
// Source: RFC 9110 §9.2.1 (safe methods: GET, HEAD, OPTIONS, TRACE) and §9.2.2 (idempotent methods may be repeated
// automatically when a connection fails before the answer; a non-idempotent one must not be); taking a failed upstream
// out of rotation and probing it before sending it traffic again is common practice for load balancers.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterEach, describe, expect, test } from 'vitest';
import { HOLD_LIMIT, holdsAnswer, mayRetry, startFrontProxy, type FrontProxy } from '../../scripts/lib/front-proxy';
import { freePort } from '../../scripts/lib/postgres';

const opened: { close(): Promise<void> }[] = [];
afterEach(async () => {
  await Promise.all(opened.splice(0).map((s) => s.close()));
});

/** A process that answers every request with its name and what it received; `seen` lists what reached it. */
async function named(name: string, port = 0) {
  const seen: string[] = [];
  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      seen.push(`${req.method} ${req.url}`);
      res.writeHead(200, { 'content-type': 'application/json' });
      res.end(JSON.stringify({ name, method: req.method, body: Buffer.concat(chunks).toString() }));
    });
  });
  await new Promise<void>((r) => server.listen(port, '127.0.0.1', r));
  const handle = {
    port: (server.address() as AddressInfo).port,
    seen,
    close: () => new Promise<void>((r) => (server.closeAllConnections(), server.close(() => r()))),
  };
  opened.push(handle);
  return handle;
}

/** A process that accepts the connection, reads the request and cuts it before any byte of an answer. */
async function cutting() {
  const seen: string[] = [];
  const server = http.createServer((req) => {
    seen.push(`${req.method} ${req.url}`);
    req.socket.destroy();
  });
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  const handle = { port: (server.address() as AddressInfo).port, seen, close: () => new Promise<void>((r) => server.close(() => r())) };
  opened.push(handle);
  return handle;
}

async function front(targets: number[], changes: string[] = []): Promise<FrontProxy> {
  const proxy = await startFrontProxy({ host: '127.0.0.1', port: 0, targets, probeEveryMs: 20, onRotation: (port, inRotation) => changes.push(`${port}:${inRotation ? 'in' : 'out'}`) });
  opened.push(proxy);
  return proxy;
}

async function ask(proxy: FrontProxy, method = 'GET', body?: string) {
  const res = await fetch(`http://127.0.0.1:${proxy.port}/page`, { method, body });
  const text = await res.text();
  return { status: res.status, body: text ? JSON.parse(text) : null };
}

describe('mayRetry (RFC 9110 §9.2.1, §9.2.2)', () => {
  test.each([
    // [method, failure, body kept, retried?, why]
    ['GET', 'reset', true, true, '§9.2.1: GET is safe'],
    ['HEAD', 'reset', true, true, '§9.2.1: HEAD is safe'],
    ['OPTIONS', 'reset', true, true, '§9.2.1: OPTIONS is safe'],
    ['POST', 'reset', true, false, '§9.2.2: POST is not idempotent and may have been acted on'],
    ['PUT', 'reset', true, false, 'idempotent by §9.2.2, but our saves answer a repeat with 409: not repeated after a reset'],
    ['POST', 'refused', true, true, 'no connection: nothing reached the process'],
    ['PUT', 'refused', false, false, 'the body is no longer whole: it cannot be sent again'],
  ] as const)('%s after %s (body kept: %s) → %s (%s)', (method, failure, kept, retried, _why) => {
    expect(mayRetry(method, failure, kept)).toBe(retried);
  });
});

describe('holdsAnswer: which answers wait until complete before the visitor gets any byte', () => {
  test.each([
    ['GET', 'text/html; charset=utf-8', 80_000, true, 'a page: safe to ask again (RFC 9110 §9.2.1)'],
    ['HEAD', 'text/html', 0, true, 'safe'],
    ['GET', 'application/pdf', HOLD_LIMIT + 1, false, 'too large to hold: streamed'],
    ['POST', 'application/json', 100, false, 'not safe: it could not be asked again anyway'],
    ['GET', 'text/event-stream', 0, false, 'server-sent events arrive piece by piece (WHATWG HTML §9.2)'],
  ] as const)('%s %s of %i bytes → %s (%s)', (method, type, length, held, _why) => {
    expect(holdsAnswer(method, type, length)).toBe(held);
  });
});

/** A process that starts an answer of `declared` bytes, sends 10,000 of them and dies (its connection cut). */
async function dyingMidAnswer(declared = 20_000) {
  const seen: string[] = [];
  const server = http.createServer((req, res) => {
    seen.push(`${req.method} ${req.url}`);
    req.resume();
    res.writeHead(200, { 'content-type': 'text/html', 'content-length': String(declared) });
    res.write(Buffer.alloc(10_000, 'x'), () => setTimeout(() => req.socket.destroy(), 20));
  });
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  const handle = { port: (server.address() as AddressInfo).port, seen, close: () => new Promise<void>((r) => (server.closeAllConnections(), server.close(() => r()))) };
  opened.push(handle);
  return handle;
}

describe('the front port', () => {
  test('a page cut half-way by a dying process is asked again from the next one: the visitor gets the whole page', async () => {
    const dying = await dyingMidAnswer();
    const a = await named('a');
    const proxy = await front([dying.port, a.port]);
    const r = await ask(proxy);
    expect(r.status).toBe(200);
    expect(r.body.name).toBe('a');
    expect(dying.seen).toEqual(['GET /page']);
  });

  test('an answer too large to hold, cut after the visitor got part of it: the visitor sees the cut rather than waiting', async () => {
    const dying = await dyingMidAnswer(HOLD_LIMIT + 1);
    const a = await named('a');
    const proxy = await front([dying.port, a.port]);
    await expect(ask(proxy)).rejects.toThrow();
    expect(a.seen).toEqual([]);
  });

  test('a POST answer cut half-way is not asked again: the visitor sees the cut', async () => {
    const dying = await dyingMidAnswer();
    const a = await named('a');
    const proxy = await front([dying.port, a.port]);
    await expect(ask(proxy, 'POST', '{}')).rejects.toThrow();
    expect(a.seen).toEqual([]);
  });

  test('takes turns between the processes (round robin)', async () => {
    const a = await named('a');
    const b = await named('b');
    const proxy = await front([a.port, b.port]);
    const names = [];
    for (let i = 0; i < 4; i++) names.push((await ask(proxy)).body.name);
    expect(names).toEqual(['a', 'b', 'a', 'b']);
  });

  test('a process that refuses connections leaves the rotation, its requests go to the next one, and it comes back once its health answers', async () => {
    const a = await named('a');
    const gone = await freePort(); // nothing listens here: connections are refused
    const changes: string[] = [];
    const proxy = await front([gone, a.port], changes);
    const answers = await Promise.all(Array.from({ length: 10 }, () => ask(proxy)));
    expect(answers.map((r) => r.status)).toEqual(Array(10).fill(200));
    expect(answers.every((r) => r.body.name === 'a')).toBe(true);
    expect(proxy.rotation()).toEqual([
      { port: gone, inRotation: false },
      { port: a.port, inRotation: true },
    ]);
    expect(changes).toEqual([`${gone}:out`]);

    // The process starts again on its port: the health probe (GET /api/health → 200) brings it back.
    const back = await named('b', gone);
    for (let i = 0; i < 200 && !proxy.rotation()[0].inRotation; i++) await new Promise((r) => setTimeout(r, 10));
    expect(changes).toEqual([`${gone}:out`, `${gone}:in`]);
    expect(back.seen).toContain('GET /api/health');
    const names = new Set<string>();
    for (let i = 0; i < 4; i++) names.add((await ask(proxy)).body.name);
    expect(names).toEqual(new Set(['a', 'b']));
  });

  test('a POST whose connection was refused is sent, body and all, to the next process', async () => {
    const a = await named('a');
    const proxy = await front([await freePort(), a.port]);
    const r = await ask(proxy, 'POST', '{"note":"sent once, arrives whole"}');
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ name: 'a', method: 'POST', body: '{"note":"sent once, arrives whole"}' });
    expect(a.seen).toEqual(['POST /page']);
  });

  test('a GET cut before any byte of its answer is repeated on the next process', async () => {
    const cut = await cutting();
    const a = await named('a');
    const proxy = await front([cut.port, a.port]);
    const r = await ask(proxy);
    expect(r.status).toBe(200);
    expect(r.body.name).toBe('a');
    expect(cut.seen).toEqual(['GET /page']);
  });

  test('a POST cut before its answer is not repeated (it may have been acted on): a clear 502 error', async () => {
    const cut = await cutting();
    const a = await named('a');
    const proxy = await front([cut.port, a.port]);
    const r = await ask(proxy, 'POST', '{"n":1}');
    expect(r.status).toBe(502);
    expect(r.body.error.code).toBe('process_unreachable');
    expect(r.body.error.message).toMatch(/try again/);
    expect(cut.seen).toEqual(['POST /page']);
    expect(a.seen).toEqual([]);
  });

  test('a visitor who leaves before the answer does not take the process out of the rotation', async () => {
    const slow = http.createServer((_req, res) => setTimeout(() => res.end('late'), 300));
    await new Promise<void>((r) => slow.listen(0, '127.0.0.1', r));
    opened.push({ close: () => new Promise<void>((r) => (slow.closeAllConnections(), slow.close(() => r()))) });
    const port = (slow.address() as AddressInfo).port;
    const changes: string[] = [];
    const proxy = await front([port], changes);
    await expect(fetch(`http://127.0.0.1:${proxy.port}/page`, { signal: AbortSignal.timeout(50) })).rejects.toThrow();
    await new Promise((r) => setTimeout(r, 100));
    expect(proxy.rotation()).toEqual([{ port, inRotation: true }]);
    expect(changes).toEqual([]);
  });

  test('when no process answers at all, a clear 502 error', async () => {
    const proxy = await front([await freePort(), await freePort()]);
    const r = await ask(proxy);
    expect(r.status).toBe(502);
    expect(r.body.error.code).toBe('process_unreachable');
  });
});
