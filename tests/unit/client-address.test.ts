// The limiter key: the socket's own address unless it is a proxy named in TRUSTED_PROXIES, then the
// X-Forwarded-For chain from the right. OWASP ASVS 5.0 V2.4.1 (anti-automation) and the OWASP Authentication
// Cheat Sheet (limits must not be bypassable by request headers); RFC 7239 §5.2 / de-facto XFF: each proxy appends.
import { describe, expect, test } from 'vitest';
import { clientAddress, trustedProxies } from '@/lib/http/client-address';

const req = (xff?: string) => new Request('http://127.0.0.1/', { headers: xff ? { 'x-forwarded-for': xff } : {} });

describe('clientAddress', () => {
  test.each([
    ['no TRUSTED_PROXIES: XFF is ignored', '', '203.0.113.9', '198.51.100.1', '203.0.113.9'],
    ['a trusted proxy: the hop it saw', '10.0.0.1', '10.0.0.1', '198.51.100.1', '198.51.100.1'],
    ['a spoofed entry left of the real one is skipped', '10.0.0.1', '10.0.0.1', '1.2.3.4, 198.51.100.1', '198.51.100.1'],
    ['two trusted hops (CIDR) are both skipped', '10.0.0.0/8', '10.0.0.1', '1.2.3.4, 198.51.100.1, 10.2.3.4', '198.51.100.1'],
    ['an untrusted socket is believed whatever XFF says', '10.0.0.1', '203.0.113.9', '198.51.100.1', '203.0.113.9'],
    ['IPv6 CIDR', '2001:db8::/48', '2001:db8::1', '2001:db8::2, 2001:db8:1::9', '2001:db8:1::9'],
    ['IPv4-mapped socket address of a trusted proxy', '127.0.0.1', '::ffff:127.0.0.1', '198.51.100.1', '198.51.100.1'],
    ['a malformed hop names no one: the connection is the key', '10.0.0.1', '10.0.0.1', 'not-an-ip', '10.0.0.1'],
    ['all hops trusted: the leftmost one', '10.0.0.0/8', '10.0.0.1', '10.0.0.7', '10.0.0.7'],
  ])('%s', (_why, setting, socket, xff, expected) => {
    expect(clientAddress(req(xff), socket, trustedProxies(setting))).toBe(expected);
  });

  test('without a trust function, XFF rotation never changes the key', () => {
    const keys = new Set(Array.from({ length: 20 }, (_, i) => clientAddress(req(`198.51.100.${i}`), '203.0.113.9')));
    expect([...keys]).toEqual(['203.0.113.9']);
  });

  test('a bad TRUSTED_PROXIES entry is refused, not silently ignored', () => {
    expect(() => trustedProxies('10.0.0.1, not-a-network')).toThrow();
  });
});
