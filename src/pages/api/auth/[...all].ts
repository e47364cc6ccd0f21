// better-auth's own routes (/api/auth/sign-up/email, /sign-in/email, /sign-out, …).
import type { APIRoute } from 'astro';
import { CLIENT_IP_HEADER } from '@/lib/auth/auth-options';
import { auth } from '@/lib/auth/auth.server';
import { AppError } from '@/lib/errors';
import { errorResponse, readBody } from '@/lib/http/api';
import { requestClientAddress } from '@/lib/http/client-address.server';

/** Sign-in, sign-up and the rest carry a few fields; anything bigger is refused as it streams in. */
const MAX_AUTH_BODY_BYTES = 16 * 1024;

/** Hand the request to better-auth with the connection's own address, so a client cannot pick its own limiter key. */
export const ALL: APIRoute = async (context) => {
  const { request } = context;
  const headers = new Headers(request.headers);
  headers.set(CLIENT_IP_HEADER, requestClientAddress(context));
  const init: RequestInit = { method: request.method, headers };
  if (request.method !== 'GET' && request.method !== 'HEAD') {
    try {
      init.body = new Uint8Array(await readBody(request, MAX_AUTH_BODY_BYTES));
    } catch (err) {
      if (err instanceof AppError) return errorResponse(err);
      throw err;
    }
    headers.delete('content-length');
    headers.delete('transfer-encoding');
  }
  return auth.handler(new Request(request.url, init));
};
