// The finishing work of the reveal over HTTP: a logo's light parts printed in the ink or cut out (the setting stored on
// the logo, read back by pixel sampling from the draft, the proofs and a published version); the presentation's
// photographs cut around their focus from the version's renditions (decoded with sharp, a general-purpose image
// library); the "Without colour" slide; and the demo's palette routes with the client's choice on record.
// Worked example: #e0a526 has WCAG 2.2 relative luminance 0.4290, 2.19:1 against white, under SC 1.4.11's 3:1.
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { DEMO_BRANDS, DEMO_PEOPLE } from '@db/seeders/demo';
import { baseUrl, Client, signIn, signUpFresh } from '../support/client';
import { closeDb, sql } from '../support/db';
import { waitForBuild } from '../support/publish';

/** An open book (two blues, a paper-white spine) and an amber lamp standing apart: our own test drawing. */
const BOOK_AND_LAMP = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 160 120"><path d="M80 30 C62 18 36 16 14 22 L14 100 C36 94 62 96 80 108 Z" fill="#1f3a5f"/><path d="M80 30 C98 18 124 16 146 22 L146 100 C124 94 98 96 80 108 Z" fill="#2b4c78"/><path d="M80 30 L80 108" stroke="#faf7f0" stroke-width="6"/><circle cx="118" cy="12" r="9" fill="#e0a526"/></svg>`;
const LAMP = [118, 12] as const;
const SPINE = [80, 70] as const;

let owner: Client;
let brandId: string;
let slug: string;
let logoId: string;
const api = (p = '') => `/api/brands/${brandId}${p}`;

/** GET with the client's cookies; the bytes. */
async function bytesOf(client: Client, path: string): Promise<{ status: number; type: string | null; body: Buffer }> {
  const r = await fetch(baseUrl() + path, { headers: { cookie: client.cookieHeader() } });
  return { status: r.status, type: r.headers.get('content-type'), body: Buffer.from(await r.arrayBuffer()) };
}

/** Alpha at logo units (x, y) of an SVG drawn at 2 px per unit (or of a PNG proof, located by fractions). */
async function alphaAt(svg: Buffer, [x, y]: readonly [number, number]): Promise<number> {
  const { data, info } = await sharp(svg, { density: 144 }).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  return data[(Math.round(y * 2) * info.width + Math.round(x * 2)) * 4 + 3];
}

/** Ask for a PDF until it is ready (the job runs in the background); resolves to its bytes. */
async function pdfOf(client: Client, path: string): Promise<Buffer> {
  for (let polls = 0; polls < 240; polls++) {
    const r = await fetch(baseUrl() + path, { headers: { accept: 'application/json', cookie: client.cookieHeader() } });
    if (r.headers.get('content-type')?.includes('application/pdf')) return Buffer.from(await r.arrayBuffer());
    expect(r.status).toBe(202);
    await new Promise((res) => setTimeout(res, 500));
  }
  throw new Error('the PDF was not ready within 2 minutes');
}

/** A draft with one section heading, so there is something to publish. */
async function minimalDraft(client: Client, id: string): Promise<void> {
  const { revision } = (await client.get(`/api/brands/${id}/guideline`)).body;
  const doc = { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 's0', title: 'Logo', eyebrow: '', intro: '' } }] };
  expect((await client.request('PUT', `/api/brands/${id}/guideline`, { baseRevision: revision, doc })).status).toBe(200);
}

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('reveal-finisher'));
  const brand = (await owner.post('/api/brands', { name: 'Lamp Lane Readers' })).body.brand;
  brandId = brand.id;
  slug = brand.slug;
  const up = await owner.upload(api('/logos'), 'book.svg', BOOK_AND_LAMP, 'image/svg+xml', { variant: 'mark' });
  expect(up.status).toBe(201);
  logoId = up.body.logo.id;
}, 60_000);
afterAll(closeDb);

describe('light parts in one colour, the designer’s setting', () => {
  test('a new logo cuts them out, as before: the lamp vanishes from the black version; the proofs name the lamp as the colour it decides', async () => {
    const logo = (await owner.get(api('/identity'))).body.identity.logos.find((l: { id: string }) => l.id === logoId);
    expect(logo.lightParts).toBe('holes');
    expect(logo.files.black).toBe(`/api/brands/${brandId}/logos/${logoId}/file?variant=black`);
    const black = await bytesOf(owner, logo.files.black);
    expect(await alphaAt(black.body, LAMP)).toBe(0);
    const proofs = (await owner.get(api(`/logos/${logoId}/proofs`))).body.proofs;
    expect(proofs.lightParts).toBe('holes');
    expect(proofs.lightColours).toEqual(['#e0a526']);
    expect(proofs.compare.lightParts).toBe('ink');
  });

  test('a value that is no choice is refused with a readable error, and the logo keeps its setting', async () => {
    const r = await owner.patch(api(`/logos/${logoId}`), { lightParts: 'outline' });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBeTruthy();
    expect(JSON.stringify(r.body.error)).toMatch(/holes, ink/);
    expect((await owner.get(api('/identity'))).body.identity.logos[0].lightParts).toBe('holes');
    const query = await owner.get(api(`/logos/${logoId}/file?variant=black&lightParts=outline`));
    expect(query.status).toBe(400);
  });

  test('printed in the ink: the black and white versions and the proofs show the lamp; the spine stays a gap; the change is audited', async () => {
    const r = await owner.patch(api(`/logos/${logoId}`), { lightParts: 'ink' });
    expect(r.status).toBe(200);
    expect(r.body.logo.lightParts).toBe('ink');
    // New addresses for the one-colour versions, so no screen keeps the old drawing.
    expect(r.body.logo.files.black).toContain('lightParts=ink');
    for (const variant of ['black', 'white']) {
      const file = await bytesOf(owner, api(`/logos/${logoId}/file?variant=${variant}`));
      expect(await alphaAt(file.body, LAMP), `${variant}: the lamp prints`).toBe(255);
      expect(await alphaAt(file.body, SPINE), `${variant}: the spine is a gap`).toBe(0);
    }
    const proofs = (await owner.get(api(`/logos/${logoId}/proofs`))).body.proofs;
    expect(proofs.lightParts).toBe('ink');
    expect(proofs.files.blackOnWhite).toContain('lightParts=ink');
    // The proof is the knockout on white: the lamp's spot is black where it prints, white where cut out.
    const proofPixel = async (path: string) => {
      const { data, info } = await sharp((await bytesOf(owner, path)).body).raw().toBuffer({ resolveWithObject: true });
      // The drawing is 640 px on its longer side (160 units → 4 px a unit) with a 64 px margin.
      return data[(Math.round(64 + LAMP[1] * 4) * info.width + Math.round(64 + LAMP[0] * 4)) * info.channels];
    };
    expect(await proofPixel(proofs.files.blackOnWhite)).toBe(0);
    expect(await proofPixel(proofs.compare.blackOnWhite)).toBe(255);
    const [row] = await sql(`SELECT details FROM audit_events WHERE action = 'logo.update' AND target_id = $1 ORDER BY created_at DESC LIMIT 1`, [logoId]);
    expect(row.details.changes).toEqual({ lightParts: 'ink' });
  });

  test('a published version keeps the setting it was published with', async () => {
    await minimalDraft(owner, brandId);
    expect((await owner.post(api('/versions'), { note: 'Lamp in ink' })).status).toBe(201);
    expect((await waitForBuild(owner, brandId, 1)).state).toBe('ready');
    expect((await owner.patch(api(`/logos/${logoId}`), { lightParts: 'holes' })).status).toBe(200);
    const published = await bytesOf(owner, `/b/${slug}/v/1/files/${logoId}?variant=black`);
    expect(published.status).toBe(200);
    expect(await alphaAt(published.body, LAMP), 'version 1: printed in ink').toBe(255);
    const draft = await bytesOf(owner, api(`/logos/${logoId}/file?variant=black`));
    expect(await alphaAt(draft.body, LAMP), 'the draft: cut out again').toBe(0);
  });
});

describe('the presentation’s photographs', () => {
  /** A 3000 × 2000 picture with a bright square where the subject is: 75 % across, 50 % down. */
  const cameraPhoto = (n: number) =>
    sharp(Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="3000" height="2000"><rect width="3000" height="2000" fill="#4a33${20 + n}"/><rect x="2150" y="900" width="200" height="200" fill="#ffe08a"/></svg>`))
      .jpeg({ quality: 80 })
      .toBuffer();

  test('cut to the slide around the focus, from the version’s own renditions, with the shelf’s alt text and caption', async () => {
    const ids: string[] = [];
    for (const n of [1, 2]) {
      const up = await owner.upload(api('/assets'), `reading-${n}.jpg`, await cameraPhoto(n), 'image/jpeg', { kind: 'photo' });
      expect(up.status).toBe(201);
      const id = up.body.assets[0].id;
      const ok = await owner.patch(api(`/assets/${id}`), { state: 'approved', altText: `A lamp-lit reading table, ${n}.`, caption: `Evening reading, ${n}.`, focus: { x: 0.75, y: 0.5 } });
      expect(ok.status).toBe(200);
      ids.push(id);
    }
    const { revision } = (await owner.get(api('/guideline'))).body;
    const items = ids.map((src) => ({ src, alt: '', verdict: 'do', caption: '' }));
    expect((await owner.request('PUT', api('/guideline'), { baseRevision: revision, doc: { type: 'doc', content: [{ type: 'imagery', attrs: { id: 'img', items, columns: 2 } }] } })).status).toBe(200);
    expect((await owner.post(api('/versions'), { note: 'With photographs' })).status).toBe(201);
    expect((await waitForBuild(owner, brandId, 2)).state).toBe('ready');

    const html: string = (await owner.get(`/b/${slug}/v/2/presentation`)).body;
    const slide = /<section[^>]*data-slide="photographs"[\s\S]*?<\/section>/.exec(html)?.[0] ?? '';
    expect(slide).toContain('alt="A lamp-lit reading table, 1."');
    expect(slide).toContain('<figcaption>Evening reading, 2.</figcaption>');
    const images = [...slide.matchAll(/<img [^>]*>/g)].map((m) => m[0]);
    expect(images).toHaveLength(2);
    for (const img of images) {
      const srcset = /srcSet="([^"]+)"|srcset="([^"]+)"/i.exec(img)!;
      const entries = (srcset[1] ?? srcset[2]).replaceAll('&amp;', '&').split(', ').map((e) => e.split(' '));
      expect(entries.length).toBeGreaterThan(1);
      for (const [url, descriptor] of entries) {
        const file = await bytesOf(owner, url);
        expect(file.status, url).toBe(200);
        expect(file.type).toBe('image/jpeg');
        const meta = await sharp(file.body).metadata();
        // The srcset's width descriptor is the file's width (HTML srcset), and two photographs are cut to 4:3.
        expect(meta.width).toBe(Number(descriptor.slice(0, -1)));
        expect(Math.abs(meta.width! / meta.height! - 4 / 3)).toBeLessThan(0.01);
      }
      // Cut around the focus: the bright square (the subject) is inside the crop, at its centre or near it.
      const [largest] = entries.at(-1)!;
      const { data, info } = await sharp((await bytesOf(owner, largest)).body).raw().toBuffer({ resolveWithObject: true });
      const centre = (Math.round(info.height / 2) * info.width + Math.round(info.width * 0.5)) * info.channels;
      // 3000 × 2000 cut to 4:3 is 2667 × 2000; centred on x = 2250 it runs from 333 to 3000, so the square (2150–2350)
      // sits at 68–76 % across: sample there.
      const subject = (Math.round(info.height / 2) * info.width + Math.round(info.width * 0.72)) * info.channels;
      expect(data[subject], 'the subject is in the crop').toBeGreaterThan(200);
      expect(data[centre], 'and the ground beside it').toBeLessThan(120);
    }
  });
});

describe('the demo', () => {
  test('Larchmere has two palette routes; the client’s choice is recorded, audited, and is the palette in use', async () => {
    const mara = await signIn(DEMO_PEOPLE[0].email);
    const brand = (await mara.get('/api/brands')).body.brands.find((b: { slug: string }) => b.slug === DEMO_BRANDS[0].slug);
    const listed = await mara.get(`/api/brands/${brand.id}/palette-routes`);
    expect(listed.status).toBe(200);
    const sets = listed.body.sets;
    expect(sets.length).toBeGreaterThanOrEqual(1);
    const set = sets.find((s: { title: string }) => s.title === 'Two ways to colour the roastery');
    expect(set.routes).toHaveLength(2);
    expect(set.status).toBe('chosen');
    const chosen = set.routes.find((r: { id: string }) => r.id === set.decision.chosenRouteId);
    expect(chosen.name).toBe('Roastery warmth');
    expect(set.decision.by).toBe('Priya Raman');
    expect(set.appliedAt).toBeTruthy();
    const decided = await sql(`SELECT details FROM audit_events WHERE action = 'paletteRoutes.decide' AND target_id = $1`, [set.id]);
    expect(decided).toHaveLength(1);
    expect(decided[0].details.chosenRoute).toBe('Roastery warmth');
    const palette = (await mara.get(`/api/brands/${brand.id}/identity`)).body.identity.colors.map((c: { hex: string }) => c.hex);
    expect(palette).toEqual(chosen.colors.map((c: { hex: string }) => c.hex));
  });

  test('Larchmere’s logos lean on colour (the red ring on the brown disc), so its presentation says so on its own slide', async () => {
    const mara = await signIn(DEMO_PEOPLE[0].email);
    const brand = (await mara.get('/api/brands')).body.brands.find((b: { slug: string }) => b.slug === DEMO_BRANDS[0].slug);
    if ((await mara.get(`/api/brands/${brand.id}/versions`)).body.versions.length === 0) {
      const draft = (await mara.get(`/api/brands/${brand.id}/guideline`)).body;
      if (draft.doc.content.length === 0) await mara.post(`/api/brands/${brand.id}/guideline/template`, { template: 'brand-book', baseRevision: draft.revision });
      const made = await mara.post(`/api/brands/${brand.id}/versions`, { note: 'For the reveal check' });
      expect(made.status).toBe(201);
      expect((await waitForBuild(mara, brand.id, made.body.version.number)).state).toBe('ready');
    }
    const html: string = (await mara.get(`/b/${brand.slug}/presentation`)).body;
    const slide = /<section[^>]*data-slide="without-colour"[\s\S]*?<\/section>/.exec(html)?.[0] ?? '';
    expect(slide).toMatch(/<strong>Roast<\/strong> and <strong>Ember<\/strong> touch at <strong>\d\.\d\d:1<\/strong>/);
    // The Pellow mark, whose lamp the designer prints in ink, reads in grey: no such slide there.
    const pellow = (await mara.get('/api/brands')).body.brands.find((b: { slug: string }) => b.slug === DEMO_BRANDS[1].slug);
    const pellowLogo = (await mara.get(`/api/brands/${pellow.id}/identity`)).body.identity.logos[0];
    expect(pellowLogo.lightParts).toBe('ink');
  });
});

describe('the presentation PDF keeps the new slide', () => {
  test('the "Without colour" page of a brand whose logo leans on colour', async () => {
    const RED_GREEN = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 200 100"><rect width="100" height="100" fill="#ff0000"/><rect x="100" width="100" height="100" fill="#009400"/></svg>';
    const { client } = await signUpFresh('reveal-pdf');
    const brand = (await client.post('/api/brands', { name: 'Red Green Signals' })).body.brand;
    expect((await client.upload(`/api/brands/${brand.id}/logos`, 'signal.svg', RED_GREEN, 'image/svg+xml', { variant: 'primary' })).status).toBe(201);
    await minimalDraft(client, brand.id);
    expect((await client.post(`/api/brands/${brand.id}/versions`, { note: 'Signals' })).status).toBe(201);
    expect((await waitForBuild(client, brand.id, 1)).state).toBe('ready');
    const html: string = (await client.get(`/b/${brand.slug}/v/1/presentation`)).body;
    const slides = [...html.matchAll(/<section[^>]*data-slide="([a-z-]+)"/g)].map((m) => m[1]);
    expect(slides).toContain('without-colour');
    const pdf = await pdfOf(client, `/b/${brand.slug}/v/1/presentation.pdf`);
    const { getDocument } = await import('pdfjs-dist/legacy/build/pdf.mjs');
    const doc = await getDocument({ data: new Uint8Array(pdf), useSystemFonts: false, isEvalSupported: false }).promise;
    expect(doc.numPages).toBe(slides.length);
    const page = await doc.getPage(slides.indexOf('without-colour') + 1);
    const text = (await page.getTextContent()).items.map((it) => ('str' in it ? it.str : '')).join(' ');
    expect(text).toContain('#FF0000');
    expect(text).toMatch(/touch at/);
  }, 180_000);
});
