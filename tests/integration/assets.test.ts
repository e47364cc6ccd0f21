// The asset shelf's uploads and access: the bad-file corpus refused with nothing left behind, SVGs cleaned,
// duplicates recognised, states, and who sees what.
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { baseUrl } from '../support/client';
import { closeDb, sql } from '../support/db';
import { FIXTURE_SVG, makeBrand, makeCast, type Cast, type Fixture } from './fixtures';
import { waitForBuild } from '../support/publish';

const corpus = (name: string) => readFileSync(join(process.cwd(), 'tests/fixtures/files', name));

/** The server's files folder for a brand: the test cluster's folder under the system temp dir (global-setup puts it there). */
function brandFolder(brandId: string): string | null {
  for (const dir of readdirSync(tmpdir()).filter((d) => d.startsWith('plumbline-test-'))) {
    const path = join(tmpdir(), dir, 'files', brandId);
    if (existsSync(path)) return path;
  }
  return null;
}

/** Every stored file of a brand, as paths relative to its folder. */
function storedFiles(brandId: string): string[] {
  const root = brandFolder(brandId);
  if (!root) return [];
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const e of readdirSync(dir)) {
      const p = join(dir, e);
      if (statSync(p).isDirectory()) walk(p);
      else out.push(p.slice(root.length + 1));
    }
  };
  walk(root);
  return out.sort();
}

let cast: Cast;
let brand: Fixture;
beforeAll(async () => {
  cast = await makeCast();
  brand = await makeBrand(cast, 'Shelf Brand');
  // Its version's build writes files under the brand: done before the checks that nothing else is stored.
  await waitForBuild(cast.clients.owner, brand.brandId, 1);
});
afterAll(closeDb);

const shelf = () => `/api/brands/${brand.brandId}/assets`;

describe('the bad-file corpus is refused with a reason, and nothing is stored', () => {
  // Each row: file, name it is sent under, media type the browser claims, expected code. The claimed type is a lie on purpose.
  test.each([
    ['wrong-extension.svg', 'logo.svg', 'image/svg+xml', 'extension_mismatch'], // a PNG (ISO/IEC 15948 signature) named .svg
    ['polyglot.png', 'mark.png', 'image/png', 'polyglot'], // PNG with an HTML page after IEND
    ['polyglot.jpg', 'photo.jpg', 'image/jpeg', 'polyglot'], // JPEG with a ZIP header after EOI (ITU-T T.81 markers)
    ['entity.svg', 'entity.svg', 'image/svg+xml', 'svg_entity'], // entity expansion ("billion laughs", OWASP XXE guidance)
    ['bomb.png', 'bomb.png', 'image/png', 'too_many_pixels'], // 83 bytes declaring 50 000 × 50 000 px
    ['empty.png', 'empty.png', 'image/png', 'empty_file'],
    ['truncated.png', 'cut.png', 'image/png', 'truncated'], // chunk chain ends before IEND
    ['truncated.jpg', 'cut.jpg', 'image/jpeg', 'truncated'], // no EOI marker
    ['page-as.png', 'page.png', 'image/png', 'unsupported_file'], // HTML claiming to be PNG
    ['no-end.pdf', 'brief.pdf', 'application/pdf', 'truncated'], // no %%EOF (ISO 32000-1 §7.5.5)
    ['script.pdf', 'brief.pdf', 'application/pdf', 'pdf_script'], // OpenAction /JavaScript (ISO 32000-1 §12.6.4.16)
    ['animation.gif', 'anim.gif', 'image/gif', 'unsupported_file'], // a real GIF: not a kind we keep
  ])('%s → %s', async (file, name, type, code) => {
    const before = { rows: await sql('SELECT count(*)::int AS n FROM assets WHERE brand_id = $1', [brand.brandId]), files: storedFiles(brand.brandId) };
    const r = await cast.clients.owner.upload(shelf(), name, corpus(file), type);
    expect(r.status, JSON.stringify(r.body)).toBe(400);
    expect(r.body.error.code).toBe(code);
    expect(r.body.error.message.length).toBeGreaterThan(10);
    expect(r.body.rejected).toEqual([{ filename: name, code, message: r.body.error.message }]);
    expect(await sql('SELECT count(*)::int AS n FROM assets WHERE brand_id = $1', [brand.brandId])).toEqual(before.rows);
    expect(storedFiles(brand.brandId)).toEqual(before.files);
  });

  test('a file over the 25 MB limit is refused as too_large and leaves nothing', async () => {
    const before = storedFiles(brand.brandId);
    const big = Buffer.alloc(26 * 1024 * 1024, 0x20);
    corpus('wrong-extension.svg').copy(big); // a PNG signature in front, so only size can refuse it
    const r = await cast.clients.owner.upload(shelf(), 'huge.png', big, 'image/png');
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('too_large');
    expect(storedFiles(brand.brandId)).toEqual(before);
  });

  test('an SVG with a script and an event handler is kept only after cleaning (OWASP XSS prevention: no script in served SVG)', async () => {
    const r = await cast.clients.owner.upload(shelf(), 'script.svg', corpus('script.svg'), 'image/svg+xml');
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    const asset = r.body.assets[0];
    expect(asset.sanitised).toEqual(expect.arrayContaining(['element <script>', 'attribute onload']));
    const file = await cast.clients.owner.get(`/api/assets/${asset.id}/file`);
    expect(file.status).toBe(200);
    expect(file.body).not.toMatch(/<script|onload/i);
    expect(file.body).toMatch(/<rect/);
    expect(file.headers.get('content-security-policy')).toContain('sandbox');
  });

  test('several files at once: good ones kept, bad ones reported beside them', async () => {
    const form = new FormData();
    form.append('file', new Blob([FIXTURE_SVG.replace('#1d2a44', '#335577')], { type: 'image/svg+xml' }), 'good.svg');
    form.append('file', new Blob([new Uint8Array(corpus('bomb.png'))], { type: 'image/png' }), 'bomb.png');
    const r = await uploadForm(cast, shelf(), form);
    expect(r.status).toBe(201);
    expect(r.body.assets.map((a: { name: string }) => a.name)).toEqual(['good']);
    expect(r.body.rejected).toEqual([expect.objectContaining({ filename: 'bomb.png', code: 'too_many_pixels' })]);
  });
});

/** A multipart POST of several files with the owner's session (the test client's upload() sends one file). */
async function uploadForm(c: Cast, path: string, form: FormData) {
  const jar = (c.clients.owner as unknown as { cookies: Map<string, string> }).cookies;
  const res = await fetch(baseUrl() + path, {
    method: 'POST',
    headers: { origin: baseUrl(), cookie: [...jar].map(([k, v]) => `${k}=${v}`).join('; ') },
    body: form,
  });
  return { status: res.status, body: await res.json() };
}

describe('uploads that are kept', () => {
  test('an identical re-upload in the same brand is recognised by its content hash (SHA-256, FIPS 180-4)', async () => {
    const svg = FIXTURE_SVG.replace('#c8553d', '#aa7711');
    const first = await cast.clients.editor.upload(shelf(), 'twice.svg', svg, 'image/svg+xml');
    const again = await cast.clients.owner.upload(shelf(), 'renamed.svg', svg, 'image/svg+xml');
    expect(first.status).toBe(201);
    expect(again.status).toBe(200);
    expect(again.body.assets[0]).toMatchObject({ id: first.body.assets[0].id, duplicate: true });
    const rows = await sql('SELECT count(*)::int AS n FROM assets WHERE brand_id = $1 AND content_hash = (SELECT content_hash FROM assets WHERE id = $2)', [brand.brandId, first.body.assets[0].id]);
    expect(rows[0].n).toBe(1);
  });

  test('a PNG, a font and a PDF get their kinds from their bytes', async () => {
    const font = readFileSync(join(process.cwd(), 'node_modules/@fontsource-variable/dm-sans/files/dm-sans-latin-wght-normal.woff2'));
    const pdf = Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj\n2 0 obj << /Type /Pages /Kids [] /Count 0 >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n');
    const png = corpus('wrong-extension.svg');
    const a = await cast.clients.owner.upload(shelf(), 'dm-sans.woff2', font, 'application/octet-stream');
    const b = await cast.clients.owner.upload(shelf(), 'one-pager.pdf', pdf, 'application/pdf');
    const c = await cast.clients.owner.upload(shelf(), 'swatch.png', png, 'image/png', { kind: 'logo' });
    expect([a.status, b.status, c.status]).toEqual([201, 201, 201]);
    expect(a.body.assets[0]).toMatchObject({ kind: 'font', format: 'woff2', state: 'draft', renderable: false });
    expect(b.body.assets[0]).toMatchObject({ kind: 'document', format: 'pdf' });
    expect(c.body.assets[0]).toMatchObject({ kind: 'logo', format: 'png', width: 64, height: 32 });
    const renderFont = await cast.clients.owner.get(`/api/assets/${a.body.assets[0].id}/file?format=png&width=100`);
    expect(renderFont.status).toBe(400);
    expect(renderFont.body.error.code).toBe('no_renditions');
  });
});

describe('states and who sees what', () => {
  let draftId: string;
  beforeAll(async () => {
    const r = await cast.clients.owner.upload(shelf(), 'draft-mark.svg', FIXTURE_SVG.replace('#c8553d', '#44aa66'), 'image/svg+xml');
    draftId = r.body.assets[0].id;
  });

  test('a partner sees approved assets only; a draft is 404 to them, in the list, by id and as a file', async () => {
    const list = await cast.clients.partner.get(shelf());
    expect(list.status).toBe(200);
    expect(list.body.assets.every((a: { state: string }) => a.state === 'approved')).toBe(true);
    expect(list.body.assets.map((a: { id: string }) => a.id)).toContain(brand.assetId);
    expect(list.body.assets.map((a: { id: string }) => a.id)).not.toContain(draftId);
    expect((await cast.clients.partner.get(`${shelf()}/${draftId}`)).status).toBe(404);
    expect((await cast.clients.partner.get(`/api/assets/${draftId}/file`)).status).toBe(404);
    expect((await cast.clients.partner.get(`${shelf()}?state=draft`)).body.assets).toEqual([]);
  });

  test('a reviewer sees drafts; a viewer is refused files (403)', async () => {
    const list = await cast.clients.reviewer.get(`${shelf()}?state=draft`);
    expect(list.body.assets.map((a: { id: string }) => a.id)).toContain(draftId);
    const viewer = await cast.clients.viewer.get(`/api/assets/${brand.assetId}/file?format=png&width=64`);
    expect(viewer.status).toBe(403);
    expect(viewer.body.error.code).toBe('forbidden');
  });

  test('draft → approved → retired → approved → draft; retired is hidden from partners; a bad move is 409', async () => {
    const patch = (body: unknown) => cast.clients.editor.patch(`${shelf()}/${draftId}`, body);
    expect((await patch({ state: 'approved', tags: ['Print', 'print', 'web'], usageNotes: 'Use on cream only.' })).body.asset).toMatchObject({ state: 'approved', tags: ['print', 'web'] });
    expect((await cast.clients.partner.get(`${shelf()}/${draftId}`)).status).toBe(200);
    expect((await cast.clients.partner.get(`${shelf()}?tag=print`)).body.assets.map((a: { id: string }) => a.id)).toEqual([draftId]);
    expect((await patch({ state: 'retired' })).status).toBe(200);
    expect((await cast.clients.partner.get(`${shelf()}/${draftId}`)).status).toBe(404);
    expect((await patch({ state: 'approved' })).status).toBe(200);
    expect((await patch({ state: 'draft' })).status).toBe(200);
    const bad = await patch({ state: 'retired' });
    expect(bad.status).toBe(409);
    expect(bad.body.error.code).toBe('invalid_transition');
    const unknown = await patch({ state: 'archived' });
    expect(unknown.status).toBe(400);
    const audits = await sql("SELECT action FROM audit_events WHERE target_id = $1 AND action = 'asset.state'", [draftId]);
    expect(audits.length).toBe(4);
  });

  test('deleting an asset removes its row, its file and its renditions', async () => {
    const up = await cast.clients.owner.upload(shelf(), 'to-go.svg', FIXTURE_SVG.replace('#c8553d', '#123456'), 'image/svg+xml');
    const id = up.body.assets[0].id;
    expect((await cast.clients.owner.get(`/api/assets/${id}/file?format=png&width=100`)).status).toBe(200);
    const keys = (await sql('SELECT storage_key FROM assets WHERE id = $1 UNION ALL SELECT storage_key FROM asset_renditions WHERE asset_id = $1', [id])).map((r) => r.storage_key as string);
    expect(keys.length).toBe(2);
    for (const k of keys) expect(storedFiles(brand.brandId)).toContain(k.slice(brand.brandId.length + 1));
    expect((await cast.clients.owner.delete(`${shelf()}/${id}`)).status).toBe(204);
    expect(await sql('SELECT id FROM assets WHERE id = $1', [id])).toEqual([]);
    for (const k of keys) expect(storedFiles(brand.brandId)).not.toContain(k.slice(brand.brandId.length + 1));
  });
});
