// Who is asking: the address every limiter keys on. Only the connection itself and proxies we name are believed.
import { isIP } from 'node:net';
import proxyaddr from 'proxy-addr';

/** A compiled TRUSTED_PROXIES setting: comma-separated IPs or CIDRs; empty trusts no one. Throws on a bad entry. */
export function trustedProxies(setting: string | undefined): (address: string) => boolean {
  const list = (setting ?? '').split(',').map((s) => s.trim()).filter(Boolean);
  const trust = proxyaddr.compile(list);
  return (address) => trust(address, 0);
}

const TRUST_NONE = trustedProxies('');

/**
 * The client's address: the socket's own address, unless that socket is a trusted proxy, in which case the
 * X-Forwarded-For chain is walked from the right, skipping trusted hops, to the first address we do not trust.
 */
export function clientAddress(request: Request, socketAddress: string, trust: (address: string) => boolean = TRUST_NONE): string {
  const forwarded = request.headers.get('x-forwarded-for') ?? undefined;
  const headers: Record<string, string> = forwarded ? { 'x-forwarded-for': forwarded } : {};
  // proxy-addr reads a Node request's shape and does the walk.
  const req = { socket: { remoteAddress: socketAddress }, headers } as unknown as Parameters<typeof proxyaddr>[0];
  const found = proxyaddr(req, (address) => trust(address));
  // A malformed hop (only a trusted proxy could have sent it) names no one: key on the connection instead.
  return isIP(found) ? found : socketAddress;
}
