// After the server is up: give the main demo brand guidelines and a published version, through the API itself,
// and keep one demo share link (its token is shown only once, so its URL is saved under .data/).
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { DEMO_BRANDS, DEMO_PASSWORD, DEMO_PEOPLE } from '../../db/seeders/demo';

async function call(siteUrl: string, cookie: string, method: string, path: string, body?: unknown) {
  const res = await fetch(siteUrl + path, {
    method,
    headers: { origin: siteUrl, cookie, ...(body ? { 'content-type': 'application/json' } : {}) },
    body: body ? JSON.stringify(body) : undefined,
  });
  const json = res.status === 204 ? null : await res.json();
  if (!res.ok) throw new Error(`${method} ${path} answered ${res.status}: ${JSON.stringify(json)}`);
  return json;
}

/** Make sure the first demo brand is published; returns the demo share link URL. */
export async function publishDemo(siteUrl: string, dataDir: string): Promise<string | null> {
  const signIn = await fetch(`${siteUrl}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: siteUrl },
    body: JSON.stringify({ email: DEMO_PEOPLE[0].email, password: DEMO_PASSWORD }),
  });
  if (!signIn.ok) throw new Error(`demo sign-in answered ${signIn.status}`);
  const cookie = signIn.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  const { brands } = await call(siteUrl, cookie, 'GET', '/api/brands');
  const brand = brands.find((b: { slug: string }) => b.slug === DEMO_BRANDS[0].slug);
  if (!brand) return null;
  const base = `/api/brands/${brand.id}`;
  const { versions } = await call(siteUrl, cookie, 'GET', `${base}/versions`);
  const linkFile = join(dataDir, 'demo-share-link.txt');
  if (versions.length === 0) {
    const draft = await call(siteUrl, cookie, 'GET', `${base}/guideline`);
    if (draft.doc.content.length === 0) await call(siteUrl, cookie, 'POST', `${base}/guideline/template`, { template: 'brand-book', baseRevision: draft.revision });
    await call(siteUrl, cookie, 'POST', `${base}/versions`, { note: 'First edition of the Larchmere guidelines: logo, colour, type and imagery.' });
  }
  if (!existsSync(linkFile)) {
    const { shareLink } = await call(siteUrl, cookie, 'POST', `${base}/share-links`, { label: 'Demo link for the signage agency', allowDownloads: true });
    writeFileSync(linkFile, shareLink.url);
  }
  return readFileSync(linkFile, 'utf8').trim();
}
