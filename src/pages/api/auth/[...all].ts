// better-auth's own routes (/api/auth/sign-up/email, /sign-in/email, /sign-out, …).
import type { APIRoute } from 'astro';
import { CLIENT_IP_HEADER } from '../../../lib/auth/auth-options';
import { auth } from '../../../lib/auth/auth.server';

/** Hand the request to better-auth with the socket's address, so a client cannot pick its own limiter key. */
export const ALL: APIRoute = async ({ request, clientAddress }) => {
  const headers = new Headers(request.headers);
  headers.set(CLIENT_IP_HEADER, clientAddress);
  const init: RequestInit & { duplex?: 'half' } = { method: request.method, headers };
  if (request.method !== 'GET' && request.method !== 'HEAD') {
    init.body = request.body;
    init.duplex = 'half';
  }
  return auth.handler(new Request(request.url, init));
};
