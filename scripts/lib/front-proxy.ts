// The one port of `npm run start:scaled`: each request goes to the next web process in rotation (round robin), as a
// load balancer in front of several machines would. Host, Origin and cookies pass unchanged, so better-auth's origin
// checks and SITE_URL hold; the visitor's address goes on in X-Forwarded-For (believed via TRUSTED_PROXIES).
// A process that refuses a connection leaves the rotation until its health answers again, and a request that failed
// before any byte of an answer is sent to the next process when that is safe (`mayRetry`), so a crashed process
// costs visitors nothing but the requests it had already accepted and that were not safe to repeat.
import http from 'node:http';
import type { AddressInfo } from 'node:net';

export interface FrontProxy {
  port: number;
  /** Each target port and whether it is in the rotation now. */
  rotation(): { port: number; inRotation: boolean }[];
  close(): Promise<void>;
}

export interface FrontProxyOptions {
  host: string;
  port: number;
  /** Loopback ports of the web processes. */
  targets: number[];
  /** How often a process out of the rotation is asked for its health, in ms (default 250). */
  probeEveryMs?: number;
  /** Told when a process leaves or rejoins the rotation. */
  onRotation?: (port: number, inRotation: boolean, why: string) => void;
}

/** Headers that describe one hop, not the request: never forwarded (RFC 9110 §7.6.1, common practice for proxies). */
const HOP_BY_HOP = new Set(['connection', 'keep-alive', 'proxy-connection', 'te', 'trailer', 'transfer-encoding', 'upgrade']);

/** A request body up to this size is kept while it is forwarded, so it can be sent again to another process. */
export const REPLAY_LIMIT = 1024 * 1024;

/** Where an attempt failed: `refused` (no connection, so nothing reached the process) or `reset` (cut before any answer). */
export type UpstreamFailure = 'refused' | 'reset';

/** A safe request's answer up to this size is held until it is complete before the visitor gets any of it. */
export const HOLD_LIMIT = 1024 * 1024;

/** Safe methods (RFC 9110 §9.2.1), which are idempotent (§9.2.2): asking twice changes nothing on the server. */
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS', 'TRACE']);

/**
 * May a request that failed before any byte of an answer be sent to another process? RFC 9110 §9.2.2 lets a client
 * or proxy repeat an idempotent request automatically; we repeat only the safe methods after a reset, because a save
 * (PUT with a base revision) that did reach the process would answer its own repeat with a conflict. Any method may be
 * repeated when the connection was refused, since then nothing reached the process — provided its body is still whole.
 */
export function mayRetry(method: string, failure: UpstreamFailure, bodyKept: boolean): boolean {
  if (!bodyKept) return false;
  return failure === 'refused' || SAFE_METHODS.has(method.toUpperCase());
}

/**
 * Is this answer held until complete? Only for safe methods (which may be asked again), only up to HOLD_LIMIT by its
 * declared length, and never for a stream that is meant to arrive piece by piece (server-sent events).
 */
export function holdsAnswer(method: string, contentType: string | undefined, contentLength: number): boolean {
  return SAFE_METHODS.has(method.toUpperCase()) && contentLength <= HOLD_LIMIT && !/^text\/event-stream\b/i.test(contentType ?? '');
}

/** Listen on host:port and pass every request to the web processes in `targets` (loopback ports) in turn. */
export function startFrontProxy(opts: FrontProxyOptions): Promise<FrontProxy> {
  const probeEveryMs = opts.probeEveryMs ?? 250;
  const targets = opts.targets.map((port) => ({ port, inRotation: true, probe: null as NodeJS.Timeout | null }));
  let next = 0;
  let closed = false;
  const agent = new http.Agent({ keepAlive: true });

  /** The next process in the rotation not yet tried for this request; when none is in the rotation, any not tried. */
  function pick(tried: Set<number>) {
    for (const wanted of [true, false]) {
      for (let i = 0; i < targets.length; i++) {
        const t = targets[(next + i) % targets.length];
        if (t.inRotation === wanted && !tried.has(t.port)) {
          next = (next + i + 1) % targets.length;
          return t;
        }
      }
    }
    return null;
  }

  function takeOut(target: (typeof targets)[number], why: string) {
    if (!target.inRotation || closed) return;
    target.inRotation = false;
    opts.onRotation?.(target.port, false, why);
    const ask = () => {
      const probe = http.get({ host: '127.0.0.1', port: target.port, path: '/api/health', agent: false, timeout: 2000 }, (answer) => {
        answer.resume();
        if (closed) return;
        if (answer.statusCode === 200) {
          target.inRotation = true;
          opts.onRotation?.(target.port, true, 'its health answers again');
        } else target.probe = setTimeout(ask, probeEveryMs);
      });
      probe.on('timeout', () => probe.destroy());
      probe.on('error', () => {
        if (!closed) target.probe = setTimeout(ask, probeEveryMs);
      });
    };
    target.probe = setTimeout(ask, probeEveryMs);
  }

  const server = http.createServer((req, res) => {
    const headers: http.OutgoingHttpHeaders = {};
    for (const [name, value] of Object.entries(req.headers)) if (!HOP_BY_HOP.has(name) && value !== undefined) headers[name] = value;
    const from = req.socket.remoteAddress ?? '';
    headers['x-forwarded-for'] = req.headers['x-forwarded-for'] ? `${req.headers['x-forwarded-for']}, ${from}` : from;
    const method = req.method ?? 'GET';

    // The body as it passed through, kept while it is small enough to be sent again.
    let kept: Buffer[] | null = [];
    let keptBytes = 0;
    let bodyDone = false;
    let current: http.ClientRequest | null = null;
    let answered = false;
    const tried = new Set<number>();

    req.on('data', (chunk: Buffer) => {
      if (kept) {
        keptBytes += chunk.length;
        if (keptBytes <= REPLAY_LIMIT) kept.push(chunk);
        else kept = null;
      }
      if (current && !current.write(chunk)) {
        req.pause();
        current.once('drain', () => req.resume());
      }
    });
    req.on('end', () => {
      bodyDone = true;
      current?.end();
    });
    // The visitor left before the answer was done: drop the attempt (its error is ours, not the process's).
    let abandoned = false;
    res.on('close', () => {
      if (res.writableFinished) return;
      abandoned = true;
      current?.destroy();
    });

    const attempt = () => {
      const target = pick(tried);
      if (!target) {
        res.writeHead(502, { 'content-type': 'application/json' });
        res.end(JSON.stringify({ error: { code: 'process_unreachable', message: 'No web process is answering just now; try again in a moment.' } }));
        return;
      }
      tried.add(target.port);
      const upstream = http.request({ host: '127.0.0.1', port: target.port, method, path: req.url, headers, agent }, (answer) => {
        const out: http.OutgoingHttpHeaders = {};
        for (const [name, value] of Object.entries(answer.headers)) if (!HOP_BY_HOP.has(name) && value !== undefined) out[name] = value;
        const commit = () => {
          answered = true;
          res.writeHead(answer.statusCode ?? 502, answer.statusMessage, out);
        };
        const length = Number(answer.headers['content-length'] ?? 0);
        if (!holdsAnswer(method, answer.headers['content-type'], length)) {
          commit();
          answer.pipe(res);
          // Cut short after the visitor got part of it: the visitor must see the cut, not wait for the rest.
          answer.on('error', () => res.destroy());
          answer.on('close', () => answer.complete || res.destroy());
          return;
        }
        // Held until complete: an answer cut by a dying process has reached nobody yet, so it may be asked again.
        let held: Buffer[] | null = [];
        let heldBytes = 0;
        answer.on('data', (chunk: Buffer) => {
          if (held) {
            heldBytes += chunk.length;
            held.push(chunk);
            if (heldBytes <= HOLD_LIMIT) return;
            commit();
            for (const c of held) res.write(c);
            held = null;
            answer.pipe(res);
          }
        });
        answer.on('end', () => {
          if (!held) return;
          commit();
          res.end(Buffer.concat(held));
        });
        answer.on('error', (err) => (answered ? res.destroy() : failed(err)));
        answer.on('close', () => {
          if (answer.complete) return;
          if (answered) res.destroy();
          else failed(Object.assign(new Error('answer cut short'), { code: 'ECONNRESET' }));
        });
      });
      current = upstream;
      // One verdict per attempt, however many of the request's and the answer's events report the same failure.
      let settled = false;
      const failed = (err: NodeJS.ErrnoException) => {
        if (abandoned || settled) return;
        settled = true;
        if (answered || res.headersSent) {
          res.destroy();
          return;
        }
        const failure: UpstreamFailure = err.code === 'ECONNREFUSED' ? 'refused' : 'reset';
        // A reset on a kept-alive connection may only mean the process closed an idle one: not a reason to take it out.
        if (failure === 'refused' || !upstream.reusedSocket) takeOut(target, `${err.code ?? err.message} on ${method}`);
        if (mayRetry(method, failure, kept !== null) && !res.destroyed) {
          req.pause();
          attempt();
          return;
        }
        res.writeHead(502, { 'content-type': 'application/json' });
        res.end(JSON.stringify({ error: { code: 'process_unreachable', message: 'The web process this request reached stopped answering; try again.' } }));
      };
      upstream.on('error', failed);
      // A new attempt starts with everything the body has sent so far, then follows it.
      for (const chunk of kept ?? []) upstream.write(chunk);
      if (bodyDone) upstream.end();
      else req.resume();
    };
    attempt();
  });
  // Many visitors keep their connections open between requests; a slow one must not hold a process's socket.
  server.keepAliveTimeout = 5000;

  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port, opts.host, () => {
      resolve({
        port: (server.address() as AddressInfo).port,
        rotation: () => targets.map((t) => ({ port: t.port, inRotation: t.inRotation })),
        close: () =>
          new Promise<void>((done) => {
            closed = true;
            for (const t of targets) if (t.probe) clearTimeout(t.probe);
            agent.destroy();
            server.close(() => done());
            server.closeAllConnections();
          }),
      });
    });
  });
}
