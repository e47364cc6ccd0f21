// The one logger: pino, JSON lines on stdout. Each request runs in an AsyncLocalStorage scope, so every line written
// while it is served carries its `reqId` without anyone passing it along.
import { AsyncLocalStorage } from 'node:async_hooks';
import { randomUUID } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import { pino, type DestinationStream, type Logger } from 'pino';
import { LOG_LEVEL } from 'astro:env/server';

export type { Logger };

const requestScope = new AsyncLocalStorage<{ reqId: string }>();

/** A logger writing to `destination` (stdout by default); tests pass a stream to read the lines back. */
export function createLogger(options: { level?: string; destination?: DestinationStream } = {}): Logger {
  return pino(
    {
      level: options.level ?? 'info',
      timestamp: pino.stdTimeFunctions.isoTime,
      mixin: () => {
        const scope = requestScope.getStore();
        return scope ? { reqId: scope.reqId } : {};
      },
    },
    options.destination ?? pino.destination({ dest: 1, sync: true }),
  );
}

/** The application's logger; the level is the LOG_LEVEL setting (default info). */
export const log = createLogger({ level: LOG_LEVEL });

/** The id of the request being served, when there is one. */
export const currentRequestId = (): string | undefined => requestScope.getStore()?.reqId;

/** A caller's own X-Request-Id is kept only when it is a short, plain token (it ends up in logs and headers). */
const SAFE_REQUEST_ID = /^[A-Za-z0-9._-]{8,64}$/;

/** The request's id: the incoming X-Request-Id when it is safe, otherwise a new one. */
export const requestIdFrom = (header: string | null | undefined): string => (header && SAFE_REQUEST_ID.test(header) ? header : randomUUID());

/**
 * Paths whose segment after the prefix is a secret (share, brief, board, palette, pay and invitation links; password reset):
 * logged as `:token`, so a log reader cannot open them. tests/unit/log.test.ts checks every `[token]` route is here.
 */
const SECRET_SEGMENT = /^(\/(?:s|brief|board|palette|invite|pay)\/|\/api\/(?:briefs|invitations|moodboards|palette-routes|pay)\/|\/api\/auth\/reset-password\/)[^/]+/;

/** The path as logged: no query string (it can hold tokens and addresses), secret segments replaced. */
export const loggedPath = (pathname: string): string => pathname.split(/[?#]/)[0].replace(SECRET_SEGMENT, '$1:token');

/** The same response with one more header (some responses, e.g. Response.redirect(), have immutable headers). */
function withHeader(response: Response, name: string, value: string): Response {
  try {
    response.headers.set(name, value);
    return response;
  } catch {
    const copy = new Response(response.body, response);
    copy.headers.set(name, value);
    return copy;
  }
}

/**
 * Serve one request in its id's scope: the answer carries `X-Request-Id`, and one line says method, path, status
 * and the milliseconds to the answer's head. A failure that escapes is logged with the id and thrown on.
 */
export async function serveLogged(
  logger: Logger,
  request: { method: string; pathname: string; requestId: string },
  serve: () => Promise<Response>,
): Promise<Response> {
  return requestScope.run({ reqId: request.requestId }, async () => {
    const started = performance.now();
    const line = (status: number) => ({ method: request.method, path: loggedPath(request.pathname), status, ms: Math.round(performance.now() - started) });
    let response: Response;
    try {
      response = await serve();
    } catch (err) {
      logger.error({ err, method: request.method, path: loggedPath(request.pathname) }, 'unexpected failure');
      logger.info(line(500), 'request');
      throw err;
    }
    logger.info(line(response.status), 'request');
    return withHeader(response, 'x-request-id', request.requestId);
  });
}
