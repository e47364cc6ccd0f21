// The one port of `npm run start:scaled`: each request goes to the next web process in turn (round robin), as a load
// balancer in front of several machines would. Host, Origin and cookies pass unchanged, so better-auth's origin
// checks and SITE_URL hold; the visitor's address goes on in X-Forwarded-For (believed via TRUSTED_PROXIES).
import http from 'node:http';
import type { AddressInfo } from 'node:net';

export interface FrontProxy {
  port: number;
  close(): Promise<void>;
}

/** Headers that describe one hop, not the request: never forwarded (RFC 9110 §7.6.1, common practice for proxies). */
const HOP_BY_HOP = new Set(['connection', 'keep-alive', 'proxy-connection', 'te', 'trailer', 'transfer-encoding', 'upgrade']);

/** Listen on host:port and pass every request to `targets` (loopback ports) in turn. */
export function startFrontProxy(opts: { host: string; port: number; targets: number[] }): Promise<FrontProxy> {
  let next = 0;
  const agent = new http.Agent({ keepAlive: true });
  const server = http.createServer((req, res) => {
    const target = opts.targets[next++ % opts.targets.length];
    const headers: http.OutgoingHttpHeaders = {};
    for (const [name, value] of Object.entries(req.headers)) if (!HOP_BY_HOP.has(name) && value !== undefined) headers[name] = value;
    const from = req.socket.remoteAddress ?? '';
    headers['x-forwarded-for'] = req.headers['x-forwarded-for'] ? `${req.headers['x-forwarded-for']}, ${from}` : from;
    const upstream = http.request({ host: '127.0.0.1', port: target, method: req.method, path: req.url, headers, agent }, (answer) => {
      const out: http.OutgoingHttpHeaders = {};
      for (const [name, value] of Object.entries(answer.headers)) if (!HOP_BY_HOP.has(name) && value !== undefined) out[name] = value;
      res.writeHead(answer.statusCode ?? 502, answer.statusMessage, out);
      answer.pipe(res);
    });
    upstream.on('error', () => {
      // The process on that port is gone (nothing restarts it): say so plainly; the next request tries the next one.
      if (!res.headersSent) {
        res.writeHead(502, { 'content-type': 'application/json' });
        res.end(JSON.stringify({ error: { code: 'process_unreachable', message: 'The web process this request reached is not answering; try again.' } }));
      } else res.destroy();
    });
    req.on('aborted', () => upstream.destroy());
    req.pipe(upstream);
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port, opts.host, () => {
      resolve({
        port: (server.address() as AddressInfo).port,
        close: () =>
          new Promise<void>((done) => {
            agent.destroy();
            server.close(() => done());
            server.closeAllConnections();
          }),
      });
    });
  });
}
