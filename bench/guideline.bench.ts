// The editor's save path and size: validating and saving a 200-block document over HTTP (median ms, against
// a bare PUT of an empty document in the same run), and the editor island's JavaScript, gzipped.
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { benchServer, call, median } from './support/server';

const ROUNDS = 15;

/** 200 blocks of the kinds a full brand book holds. */
function bigDoc(colorId: string): unknown {
  const content: unknown[] = [];
  for (let i = 0; i < 40; i++) {
    content.push({ type: 'sectionHeading', attrs: { id: `s${i}`, title: `Section ${i + 1}`, eyebrow: 'Part', intro: 'What this part covers.' } });
    content.push({ type: 'paragraph', attrs: { id: `p${i}` }, content: [{ type: 'text', text: 'Guidance text for this section, a sentence or two long, with the reasons behind it.' }] });
    content.push({ type: 'bulletList', attrs: { id: `l${i}` }, content: [1, 2, 3].map((n) => ({ type: 'listItem', content: [{ type: 'paragraph', content: [{ type: 'text', text: `Point ${n}` }] }] })) });
    content.push({ type: 'colorPalette', attrs: { id: `c${i}`, colorIds: [colorId], showPrint: true, note: '' } });
    content.push({ type: 'callout', attrs: { id: `n${i}`, tone: 'note', title: 'Note', text: 'A short aside.' } });
  }
  return { type: 'doc', content };
}

/** Gzipped bytes of a built island and every chunk it imports, from dist's client folder. */
function islandSize(clientDir: string, entry: string): number {
  const seen = new Set<string>();
  let total = 0;
  const visit = (file: string) => {
    if (seen.has(file)) return;
    seen.add(file);
    const code = readFileSync(join(clientDir, file));
    total += gzipSync(code, { level: 9 }).length;
    for (const m of code.toString('utf8').matchAll(/(?:from|import)\s*"\.\/([^"]+\.js)"/g)) visit(m[1]);
  };
  visit(entry);
  return total;
}

export default async function guidelineBench(): Promise<void> {
  const server = await benchServer();
  const cookie = await server.signUp('bench-editor');
  const brand = (await call(server, cookie, 'POST', '/api/brands', { name: 'Bench Editor Co' })).brand;
  const color = (await call(server, cookie, 'POST', `/api/brands/${brand.id}/colors`, { name: 'Ink', value: '#1d2a44' })).color;
  const doc = bigDoc(color.id);
  const empty = { type: 'doc', content: [] };
  let revision = (await call(server, cookie, 'GET', `/api/brands/${brand.id}/guideline`)).revision;
  const time = async (body: unknown) => {
    const t0 = performance.now();
    revision = (await call(server, cookie, 'PUT', `/api/brands/${brand.id}/guideline`, { baseRevision: revision, doc: body })).revision;
    return performance.now() - t0;
  };
  for (let i = 0; i < 3; i++) await time(doc); // warm up
  const full: number[] = [];
  const bare: number[] = [];
  for (let i = 0; i < ROUNDS; i++) {
    bare.push(await time(empty));
    full.push(await time(doc));
  }
  const bytes = Buffer.byteLength(JSON.stringify(doc));
  console.log(`200-block document (${(bytes / 1024).toFixed(0)} KB JSON): validate + save median ${median(full).toFixed(1)} ms (goal < 50 ms)`);
  console.log(`empty document, same route: median ${median(bare).toFixed(1)} ms → the 200 blocks cost ${(median(full) / median(bare)).toFixed(2)}× a bare save`);

  const clientDir = join(process.env.PLUMBLINE_OUT_DIR!, 'client', '_astro');
  const entry = readdirSync(clientDir).find((f) => /^GuidelineEditor\..*\.js$/.test(f));
  const client = readdirSync(clientDir).find((f) => /^client\..*\.js$/.test(f));
  if (!entry) throw new Error('the editor island was not found in the build');
  const island = islandSize(clientDir, entry);
  const react = client ? islandSize(clientDir, client) : 0;
  console.log(`editor island: ${(island / 1024).toFixed(1)} KB gzipped, plus the React runtime ${(react / 1024).toFixed(1)} KB shared by every island (goal < 250 KB)`);
}
