// After the server is up: give the main demo brand guidelines and a published version, through the API itself,
// and keep one demo share link (its token is shown only once, so its URL is saved under .data/).
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { DEMO_BRANDS, DEMO_PASSWORD, DEMO_PEOPLE } from '@db/seeders/demo';
import { withDemoCopy, type DemoShelfPhoto } from './demo-copy';
import { DEMO_PHOTOS, drawDemoPhoto } from './demo-photos';

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

async function signIn(siteUrl: string, email: string, retry = true): Promise<string> {
  const res = await fetch(`${siteUrl}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: siteUrl },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  // Restarted several times within a minute: the sign-in limiter answers 429; wait it out once.
  if (res.status === 429 && retry) {
    const wait = Math.min(60, Number(res.headers.get('x-retry-after') ?? 30));
    console.log(`  (sign-in limit reached from a recent start; waiting ${wait} s)`);
    await new Promise((r) => setTimeout(r, wait * 1000));
    return signIn(siteUrl, email, false);
  }
  if (!res.ok) throw new Error(`demo sign-in answered ${res.status}`);
  return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}

/** The demo shelf: both logos approved, an older mark kept as a draft, and a partner's first downloads. */
async function stockShelf(siteUrl: string, cookie: string, brandId: string): Promise<void> {
  const base = `/api/brands/${brandId}`;
  if ((await call(siteUrl, cookie, 'GET', `${base}/assets`)).assets.length > 0) return;
  const form = new FormData();
  for (const file of ['larchmere-lockup.svg', 'larchmere-mark.svg']) {
    form.append('file', new Blob([readFileSync(join(import.meta.dirname, '../../db/seeders/files', file))], { type: 'image/svg+xml' }), file);
  }
  const older = readFileSync(join(import.meta.dirname, '../../db/seeders/files/larchmere-mark.svg'), 'utf8').replace('#c8553d', '#8a6a4f');
  form.append('file', new Blob([older], { type: 'image/svg+xml' }), 'larchmere-mark-earlier.svg');
  const res = await fetch(siteUrl + `${base}/assets`, { method: 'POST', headers: { origin: siteUrl, cookie }, body: form });
  if (!res.ok) throw new Error(`demo upload answered ${res.status}`);
  const { assets } = await res.json();
  const notes: Record<string, { tags: string[]; usageNotes: string }> = {
    'larchmere-lockup.svg': { tags: ['primary'], usageNotes: 'The primary lockup. Use on Steam, Crema or white; reversed on Roast or Char.' },
    'larchmere-mark.svg': { tags: ['icon'], usageNotes: 'The tree mark on its own: app icons, stamps, cup sleeves.' },
  };
  for (const asset of assets as { id: string; originalFilename: string }[]) {
    const note = notes[asset.originalFilename];
    if (note) await call(siteUrl, cookie, 'PATCH', `${base}/assets/${asset.id}`, { state: 'approved', ...note });
  }
  await stockPhotos(siteUrl, cookie, brandId);
  // The print partner's first visit, so the owner's download log has something to show.
  const partner = await signIn(siteUrl, DEMO_PEOPLE[3].email);
  const lockup = (assets as { id: string; originalFilename: string }[]).find((a) => a.originalFilename === 'larchmere-lockup.svg')!;
  for (const query of ['format=png&width=1024', 'preset=favicon']) await (await fetch(`${siteUrl}/api/assets/${lockup.id}/file?${query}`, { headers: { cookie: partner } })).arrayBuffer();
  await (await fetch(`${siteUrl}${base}/bundles`, { method: 'POST', headers: { cookie: partner, origin: siteUrl, 'content-type': 'application/json' }, body: JSON.stringify({ allLogos: true }) })).arrayBuffer();
}

/** The demo's own photographs (drawn in code), uploaded as photographs with alt text, caption and focal point, and approved. */
async function stockPhotos(siteUrl: string, cookie: string, brandId: string): Promise<void> {
  const base = `/api/brands/${brandId}`;
  const form = new FormData();
  form.append('kind', 'photo');
  for (const photo of DEMO_PHOTOS) form.append('file', new Blob([new Uint8Array(await drawDemoPhoto(photo))], { type: 'image/jpeg' }), photo.filename);
  const res = await fetch(siteUrl + `${base}/assets`, { method: 'POST', headers: { origin: siteUrl, cookie }, body: form });
  if (!res.ok) throw new Error(`demo photo upload answered ${res.status}: ${await res.text()}`);
  const { assets } = await res.json();
  for (const asset of assets as { id: string; originalFilename: string }[]) {
    const photo = DEMO_PHOTOS.find((p) => p.filename === asset.originalFilename);
    if (photo) await call(siteUrl, cookie, 'PATCH', `${base}/assets/${asset.id}`, { altText: photo.altText, caption: photo.caption, focus: photo.focus, tags: ['photography'], state: 'approved' });
  }
}

/** The demo's shelf pattern, drawn by the generator from the tree mark (Roast on Crema, columns dropped by half) and approved. */
async function stockPattern(siteUrl: string, cookie: string, brandId: string): Promise<string | null> {
  const base = `/api/brands/${brandId}`;
  const { assets } = await call(siteUrl, cookie, 'GET', `${base}/assets?kind=pattern&state=approved`);
  if (assets.length) return assets[0].id;
  const { identity } = await call(siteUrl, cookie, 'GET', `${base}/identity`);
  const mark = (identity.logos as { id: string; variant: string }[]).find((l) => l.variant === 'mark');
  const colour = (name: string) => (identity.colors as { id: string; name: string }[]).find((c) => c.name === name)?.id ?? null;
  if (!mark) return null;
  const settings = { logoId: mark.id, layout: 'half-drop', scale: 28, spacing: 1, rotation: 0, seed: 1, groundColorId: colour('Crema'), inkColorId: colour('Roast'), opacity: 1 };
  const { asset } = await call(siteUrl, cookie, 'POST', `${base}/patterns`, { settings, name: 'Larch pattern, half-drop' });
  await call(siteUrl, cookie, 'PATCH', `${base}/assets/${asset.id}`, { state: 'approved', tags: ['pattern'], usageNotes: 'Behind content on packaging, stationery bands and signs; never under body text.' });
  return asset.id;
}

/**
 * The demo's handover: an unpaid invoice for the final files, sent to the client's decision maker (a demo account, so
 * the pay link can be opened from the sent-mail page). Until it is paid on the local test checkout, the partner and
 * the share link see the final files held back. Set once; a later start leaves it as it is (paid or not).
 */
async function sendDemoHandover(siteUrl: string, cookie: string, brandId: string): Promise<void> {
  const base = `/api/brands/${brandId}/handover`;
  const { invoice, paymentsReady } = await call(siteUrl, cookie, 'GET', base);
  if (invoice) return;
  const due = new Date(Date.now() + 14 * 86_400_000).toISOString().slice(0, 10);
  // Invented figure for the demo: £4,800.00, in pence.
  await call(siteUrl, cookie, 'PUT', base, { amount: 480_000, currency: 'GBP', dueOn: due, releases: 'final-files', clientEmail: DEMO_PEOPLE[2].email });
  if (paymentsReady) await call(siteUrl, cookie, 'POST', `${base}/send`, {});
}

/** The approved demo photographs on the shelf, in the order the imagery block shows them. */
async function shelfPhotos(siteUrl: string, cookie: string, brandId: string): Promise<DemoShelfPhoto[]> {
  const { assets } = await call(siteUrl, cookie, 'GET', `/api/brands/${brandId}/assets?kind=photo&state=approved`);
  return DEMO_PHOTOS.flatMap((photo) => {
    const asset = (assets as { id: string; originalFilename: string }[]).find((a) => a.originalFilename === photo.filename);
    return asset ? [{ id: asset.id, verdict: photo.verdict }] : [];
  });
}

/** Wait until the brand's newest version is built (the server's job builds it after publishing); says how it ended. */
async function waitForBuilt(siteUrl: string, cookie: string, brandId: string, timeoutMs = 300_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const { versions } = await call(siteUrl, cookie, 'GET', `/api/brands/${brandId}/versions`);
    const newest = versions[0] as { number: number; state: string; buildError: string | null } | undefined;
    if (!newest || newest.state === 'ready') return;
    if (newest.state === 'failed') throw new Error(`version ${newest.number} could not be built: ${newest.buildError}`);
    if (Date.now() > until) throw new Error(`version ${newest.number} was still building after ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 500));
  }
}

/** Make sure the first demo brand is published, built and stocked; returns the demo share link URL. */
export async function publishDemo(siteUrl: string, dataDir: string): Promise<string | null> {
  const cookie = await signIn(siteUrl, DEMO_PEOPLE[0].email);
  const { brands } = await call(siteUrl, cookie, 'GET', '/api/brands');
  const brand = brands.find((b: { slug: string }) => b.slug === DEMO_BRANDS[0].slug);
  if (!brand) return null;
  const base = `/api/brands/${brand.id}`;
  await stockShelf(siteUrl, cookie, brand.id);
  const { versions } = await call(siteUrl, cookie, 'GET', `${base}/versions`);
  const linkFile = join(dataDir, 'demo-share-link.txt');
  if (versions.length === 0) {
    const draft = await call(siteUrl, cookie, 'GET', `${base}/guideline`);
    if (draft.doc.content.length === 0) {
      const started = await call(siteUrl, cookie, 'POST', `${base}/guideline/template`, { template: 'brand-book', baseRevision: draft.revision });
      const patternId = await stockPattern(siteUrl, cookie, brand.id);
      await call(siteUrl, cookie, 'PUT', `${base}/guideline`, { baseRevision: started.revision, doc: withDemoCopy(started.doc, await shelfPhotos(siteUrl, cookie, brand.id), patternId) });
    }
    await call(siteUrl, cookie, 'POST', `${base}/versions`, { note: 'First edition of the Larchmere guidelines: logo, colour, type and imagery.' });
  }
  // The share link printed at start must open a built version.
  await waitForBuilt(siteUrl, cookie, brand.id);
  if (!existsSync(linkFile)) {
    const { shareLink } = await call(siteUrl, cookie, 'POST', `${base}/share-links`, { label: 'Demo link for the signage agency', allowDownloads: true, allowPresentation: true });
    writeFileSync(linkFile, shareLink.url);
  }
  await sendDemoHandover(siteUrl, cookie, brand.id);
  return readFileSync(linkFile, 'utf8').trim();
}
