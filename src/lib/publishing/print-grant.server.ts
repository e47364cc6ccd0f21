// A short-lived, signed pass that lets our own PDF renderer read one version's print page and its files.
import { createHmac, timingSafeEqual } from 'node:crypto';
import { AUTH_SECRET } from 'astro:env/server';

export const PRINT_COOKIE = 'plumbline_print';
const LIFETIME_MS = 10 * 60 * 1000;

const sign = (versionId: string, expires: number) => createHmac('sha256', AUTH_SECRET).update(`print:${versionId}:${expires}`).digest('base64url');

/** A pass for one version, valid for ten minutes. */
export function printPass(versionId: string): string {
  const expires = Date.now() + LIFETIME_MS;
  return `${versionId}.${expires}.${sign(versionId, expires)}`;
}

/** The version id a pass opens, when it is ours and still valid. */
export function versionFromPass(value: string | undefined): string | null {
  const [versionId, expiresText, sig] = (value ?? '').split('.');
  const expires = Number(expiresText);
  if (!versionId || !sig || !Number.isFinite(expires) || expires < Date.now()) return null;
  const expected = sign(versionId, expires);
  return expected.length === sig.length && timingSafeEqual(Buffer.from(expected), Buffer.from(sig)) ? versionId : null;
}
