// The client address of the request being served, from the socket address our server entry hands over.
import type { APIContext } from 'astro';
import { TRUSTED_PROXIES } from 'astro:env/server';
import { clientAddress, trustedProxies } from './client-address';

const trust = trustedProxies(TRUSTED_PROXIES);

/**
 * The address limiters key on. scripts/serve.mjs passes the socket's address as locals.socketAddress; only
 * `astro dev` (no such entry) falls back to Astro's own guess.
 */
export function requestClientAddress(context: Pick<APIContext, 'request' | 'locals' | 'clientAddress'>): string {
  const socket = context.locals.socketAddress;
  if (socket) return clientAddress(context.request, socket, trust);
  if (import.meta.env.DEV) return context.clientAddress;
  throw new Error('No socket address: serve the build with scripts/serve.mjs, which passes locals.socketAddress.');
}
