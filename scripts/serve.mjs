// The production server: published reads through the app's fast path when it decides them
// (src/lib/publishing/fast-path.server.ts, registered once the bundle has loaded), static files from the build's
// client folder, everything else through Astro's handler (the node adapter in middleware mode). It exists to hand each request its TCP peer's own address as
// locals.socketAddress: the adapter alone derives the client address from X-Forwarded-For, which any visitor can set.
// Usage: node scripts/serve.mjs [outDir]   (outDir: PLUMBLINE_OUT_DIR or dist/; HOST and PORT as for the adapter)
import { statSync } from 'node:fs';
import http from 'node:http';
import { join, resolve } from 'node:path';
import { setTimeout } from 'node:timers';
import { pathToFileURL } from 'node:url';
import { pino } from 'pino';
import send from 'send';

const outDir = resolve(process.argv[2] ?? process.env.PLUMBLINE_OUT_DIR ?? 'dist');
const clientDir = join(outDir, 'client');
const { handler } = await import(pathToFileURL(join(outDir, 'server', 'entry.mjs')).href);
const host = process.env.HOST ?? '127.0.0.1';
const port = Number(process.env.PORT ?? 4321);
// This script runs outside the bundle, so it cannot share src/lib/log.server.ts; its few lines use the same form.
const log = pino({ level: process.env.LOG_LEVEL ?? 'info', timestamp: pino.stdTimeFunctions.isoTime });

/** The built file a GET may be answered with, or null (routes, missing files, folders). */
function staticFile(pathname) {
  if (pathname.includes('\0')) return null;
  const file = join(clientDir, pathname);
  if (!file.startsWith(clientDir + '/')) return null;
  try {
    return statSync(file).isFile() ? pathname : null;
  } catch {
    return null;
  }
}

/** Where the bundle registers its fast path for published reads (see src/lib/publishing/fast-path.server.ts). */
const FAST_PATH = Symbol.for('plumbline.fastPath');

const server = http.createServer((req, res) => {
  const fastPath = globalThis[FAST_PATH];
  if (fastPath && (req.method === 'GET' || req.method === 'HEAD') && req.url?.startsWith('/b/')) {
    // It answers and says true, or says false having touched nothing (then the request goes on as below); a promise
    // of either when it had to look something up first.
    const answered = fastPath(req, res);
    if (answered === true) return;
    if (answered === false) return serve(req, res);
    answered.then(
      (done) => done || serve(req, res),
      (err) => {
        log.error({ err }, 'published read failed');
        res.destroy();
      },
    );
    return;
  }
  serve(req, res);
});

function serve(req, res) {
  const encoded = (req.url ?? '/').split(/[?#]/)[0];
  let pathname;
  try {
    pathname = decodeURI(encoded);
  } catch {
    res.writeHead(400).end('Bad request.');
    return;
  }
  const file = req.method === 'GET' || req.method === 'HEAD' ? staticFile(pathname) : null;
  if (file) {
    // send decodes the path itself.
    send(req, encoded, { root: clientDir, dotfiles: 'deny', index: false })
      .on('headers', (r) => {
        // Hashed build assets never change.
        if (file.startsWith('/_astro/')) r.setHeader('cache-control', 'public, max-age=31536000, immutable');
      })
      .on('error', () => {
        if (!res.headersSent) res.writeHead(404).end('Not found.');
      })
      .pipe(res);
    return;
  }
  // A body refused part-way (413, or 401 before an upload is read) is never read to its end, so the connection cannot
  // carry another request: the answer says so. Node would then close the socket at once, and a client still sending
  // would meet a reset instead of reading the answer; so the close is a half-close: the rest is read and discarded,
  // and the socket goes when the client stops, or 2 s later if it keeps sending.
  const writeHead = res.writeHead;
  res.writeHead = function (...args) {
    if (!req.complete) {
      res.setHeader('connection', 'close');
      const socket = req.socket;
      socket.destroySoon = function () {
        this.end();
        req.resume();
        const timer = setTimeout(() => this.destroy(), 2000);
        timer.unref();
        this.once('end', () => {
          clearTimeout(timer);
          this.destroy();
        });
      };
    }
    return writeHead.apply(this, args);
  };
  // No `next`: a path no route matches gets Astro's own 404 page.
  handler(req, res, undefined, { socketAddress: req.socket.remoteAddress });
}

server.listen(port, host, () => {
  log.info({ url: `http://${host}:${port}` }, 'Plumbline listening');
  // The app starts its job worker on its first request (it resumes builds a stopped process left): send one now.
  fetch(`http://${host.includes(':') ? `[${host}]` : host}:${port}/`, { redirect: 'manual', headers: { 'x-request-id': 'boot' } }).catch(() => undefined);
});
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => process.exit(0));
