// Publish-to-ready: the time from the publish request to the version `ready` (every step of the build job: the
// version's files, pages, tokens and the A4, Letter and slides PDFs), for a 20-section version with 12 photographs.
// Baseline measured in the same run, the physical floor of the same work: writing the same bytes (every file of the
// manifest) to the same storage, plus printing the same built print HTML once in a warm Chromium.
import { mkdirSync, rmSync } from 'node:fs';
import { readFile, rename, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import pg from 'pg';
import puppeteer from 'puppeteer-core';
import sharp from 'sharp';
import { benchServer, call, median, type BenchServer } from './support/server';

const PHOTOS = 12;
const SECTIONS = 20;

/** A 1600 × 1067 photograph-like JPEG (smooth colour field plus grain), different for each seed. */
async function photo(seed: number): Promise<Buffer> {
  const width = 1600;
  const height = 1067;
  const pixels = Buffer.alloc(width * height * 3);
  let state = seed * 2654435761;
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      state = (state * 1103515245 + 12345) >>> 0;
      const grain = (state >>> 24) / 16 - 8;
      const i = (y * width + x) * 3;
      pixels[i] = Math.max(0, Math.min(255, 60 + ((x * (seed + 3)) % 160) + grain));
      pixels[i + 1] = Math.max(0, Math.min(255, 40 + ((y * (seed + 5)) % 150) + grain));
      pixels[i + 2] = Math.max(0, Math.min(255, 90 + (((x + y) * 2) % 120) + grain));
    }
  }
  return sharp(pixels, { raw: { width, height, channels: 3 } }).jpeg({ quality: 82 }).toBuffer();
}

async function brandWithPhotos(server: BenchServer, cookie: string): Promise<{ id: string; slug: string }> {
  const brand = (await call(server, cookie, 'POST', '/api/brands', { name: `Bench Build ${Date.now()}` })).brand;
  const base = `/api/brands/${brand.id}`;
  const colors = [];
  for (const [name, value] of [['Ink', '#1d2a44'], ['Paper', '#f7f3ea'], ['Signal', '#c8553d']]) colors.push((await call(server, cookie, 'POST', `${base}/colors`, { name, value })).color.id);
  await call(server, cookie, 'POST', `${base}/typefaces`, { shipped: 'fraunces', role: 'heading' });
  await call(server, cookie, 'POST', `${base}/typefaces`, { shipped: 'dm-sans', role: 'body' });
  const form = new FormData();
  form.append('kind', 'photo');
  for (let i = 0; i < PHOTOS; i++) form.append('file', new Blob([new Uint8Array(await photo(i + 1))], { type: 'image/jpeg' }), `bench-photo-${i + 1}.jpg`);
  const up = await fetch(`${server.baseUrl}${base}/assets`, { method: 'POST', headers: { origin: server.baseUrl, cookie }, body: form });
  if (!up.ok) throw new Error(`photo upload answered ${up.status}: ${await up.text()}`);
  const photos = ((await up.json()).assets as { id: string }[]).map((a) => a.id);
  for (const [i, id] of photos.entries()) await call(server, cookie, 'PATCH', `${base}/assets/${id}`, { state: 'approved', altText: `Bench photograph ${i + 1}`, caption: '', tags: ['photography'] });
  const content: unknown[] = [];
  for (let i = 0; i < SECTIONS; i++) {
    content.push({ type: 'sectionHeading', attrs: { id: `s${i}`, title: `Section ${i + 1}`, eyebrow: 'Guidelines', intro: 'What this part covers and why it matters.' } });
    content.push({ type: 'paragraph', attrs: { id: `p${i}` }, content: [{ type: 'text', text: 'Guidance for the people who apply the brand every day, with the reasoning behind it so they can decide well when a case is new.' }] });
    if (i % 4 === 0) content.push({ type: 'colorPalette', attrs: { id: `c${i}`, colorIds: colors, showPrint: true, note: '' } });
    if (i % 4 === 1) content.push({ type: 'contrastPairs', attrs: { id: `k${i}`, pairs: [{ foreground: colors[0], background: colors[1] }], note: '' } });
    // Three sections show four photographs each: all twelve.
    if (i % 5 === 2) content.push({ type: 'imagery', attrs: { id: `im${i}`, columns: 2, aspect: '3:2', items: photos.slice(((i - 2) / 5) * 4, ((i - 2) / 5) * 4 + 4).map((src, n) => ({ src, alt: '', verdict: n % 3 === 2 ? 'dont' : 'do', caption: '' })) } });
  }
  const { revision } = await call(server, cookie, 'GET', `${base}/guideline`);
  await call(server, cookie, 'PUT', `${base}/guideline`, { baseRevision: revision, doc: { type: 'doc', content } });
  return brand;
}

/** Publish and poll the versions list until the new version has left `building`; milliseconds from the request. */
async function publishToReady(server: BenchServer, cookie: string, brandId: string, note: string): Promise<{ ms: number; number: number }> {
  const t0 = performance.now();
  const { version } = await call(server, cookie, 'POST', `/api/brands/${brandId}/versions`, { note });
  for (;;) {
    const { versions } = await call(server, cookie, 'GET', `/api/brands/${brandId}/versions`);
    const v = versions.find((x: { number: number }) => x.number === version.number);
    if (v.state === 'failed') throw new Error(`the build failed: ${v.buildError}`);
    if (v.state === 'ready') return { ms: performance.now() - t0, number: version.number };
    await new Promise((r) => setTimeout(r, 20));
  }
}

export default async function buildBench(): Promise<void> {
  const server = await benchServer();
  const cookie = await server.signUp('bench-build');
  const brand = await brandWithPhotos(server, cookie);

  // Five publishes of the same draft: the first also warms the server's Chromium; the median of the rest is reported.
  const runs: number[] = [];
  let last = 0;
  for (let i = 0; i < 5; i++) {
    const { ms, number } = await publishToReady(server, cookie, brand.id, `Bench ${i + 1}`);
    if (i > 0) runs.push(ms);
    last = number;
  }
  const product = median(runs);

  // The floor, part 1: the same bytes written to the same storage (write then rename, as the local-disk driver does).
  const db = new pg.Client({ connectionString: server.databaseUrl });
  await db.connect();
  const { rows } = await db.query(`SELECT manifest, published_at, built_at, build_steps FROM guideline_versions WHERE brand_id = $1 AND number = $2`, [brand.id, last]);
  await db.end();
  // Where the last run's time went: waiting for a worker, then each step, then the ready update.
  const steps = rows[0].build_steps as { id: string; startedAt: string; finishedAt: string }[];
  const at = (iso: string | Date) => new Date(iso).getTime();
  const parts = [`queue ${at(steps[0].startedAt) - at(rows[0].published_at)} ms`, ...steps.map((st) => `${st.id} ${at(st.finishedAt) - at(st.startedAt)} ms`), `ready ${at(rows[0].built_at) - at(steps[steps.length - 1].finishedAt)} ms`];
  const entries = Object.entries(rows[0].manifest.entries as Record<string, { key: string; size: number; type: string }>);
  const files = await Promise.all(entries.map(async ([path, e]) => ({ path, bytes: await readFile(join(server.filesDir, e.key)) })));
  const scratch = join(server.filesDir, brand.id, 'bench-floor');
  mkdirSync(scratch, { recursive: true });
  const w0 = performance.now();
  for (const [i, f] of files.entries()) {
    const target = join(scratch, `${i}.bin`);
    await writeFile(`${target}.partial`, f.bytes);
    await rename(`${target}.partial`, target);
  }
  const write = performance.now() - w0;
  rmSync(scratch, { recursive: true, force: true });

  // The floor, part 2: the same print HTML printed once in a warm Chromium (the built page when the build wrote one,
  // else the server's print page), its files fetched from the server.
  const builtPrint = files.find((f) => f.path === 'print?size=a4');
  const printUrl = `${server.baseUrl}/b/${brand.slug}/v/${last}/print?size=a4`;
  const html = builtPrint ? builtPrint.bytes.toString('utf8') : await (await fetch(printUrl, { headers: { cookie } })).text();
  const printHtml = html.replace('<head>', `<head><base href="${printUrl}">`); // its relative files resolve as on the site
  const browser = await puppeteer.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', headless: true, args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--no-first-run'] });
  const printOnce = async () => {
    const tab = await browser.newPage();
    await tab.setCookie(...cookie.split('; ').map((c) => ({ name: c.split('=')[0], value: c.slice(c.indexOf('=') + 1), url: server.baseUrl })));
    await tab.setContent(printHtml, { waitUntil: 'load' });
    await tab.evaluate(() => document.fonts.ready.then(() => undefined));
    await tab.pdf({ preferCSSPageSize: true, printBackground: true });
    await tab.close();
  };
  await printOnce(); // warm
  const p0 = performance.now();
  await printOnce();
  const print = performance.now() - p0;
  await browser.close();
  const floor = write + print;
  const bytes = files.reduce((n, f) => n + f.bytes.byteLength, 0);

  console.log(`publish-to-ready, ${SECTIONS} sections, ${PHOTOS} photos, A4 + Letter + slides PDFs: ${product.toFixed(0)} ms (median of ${runs.length}; runs ${runs.map((r) => r.toFixed(0)).join(', ')} ms)`);
  console.log(`last run, by part: ${parts.join(', ')}`);
  console.log(`floor: write the same ${files.length} files (${(bytes / 1024 / 1024).toFixed(1)} MB) ${write.toFixed(0)} ms + print the same print HTML once, warm ${print.toFixed(0)} ms = ${floor.toFixed(0)} ms`);
  console.log(`ratio publish-to-ready / floor: ${(product / floor).toFixed(2)}`);
}
