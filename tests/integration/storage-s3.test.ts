// The built server with STORAGE=s3, against the local S3-compatible fake (s3rver) on a free loopback port and the
// suite's database: an upload goes into the object store and comes back byte-identical (SHA-256, FIPS 180-4, from
// node:crypto); deleting the brand empties its prefix; the database holds object keys only, and refuses a path.
import type { ChildProcess } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startServer } from '../../scripts/lib/prepare';
import { freePort } from '../../scripts/lib/postgres';
import { startFakeS3, type FakeS3 } from '@/lib/storage/fake-s3';
import { S3Storage } from '@/lib/storage/s3.server';
import { SAFE_KEY } from '@/lib/storage/storage';
import { Client } from '../support/client';
import { closeDb, sql } from '../support/db';

const MB = 1024 * 1024;
let dir: string;
let fake: FakeS3;
let server: ChildProcess;
let owner: Client;
let base: string;
let brandId: string;

/** A GET as the owner, keeping the body's bytes. */
async function fetchBytes(path: string): Promise<{ status: number; headers: Headers; bytes: Buffer }> {
  const res = await fetch(base + path, { headers: { cookie: owner.cookieHeader() } });
  return { status: res.status, headers: res.headers, bytes: Buffer.from(await res.arrayBuffer()) };
}

/**
 * A PDF of `size` bytes: a catalog, an empty page tree and one stream of hexadecimal digits (the ASCIIHexDecode
 * alphabet, ISO 32000-1 §7.4.2), ending with %%EOF (§7.5.5). Made of digits, it can carry no markup or script by chance.
 */
function bulkyPdf(size: number): Buffer {
  const head = '%PDF-1.4\n1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj\n2 0 obj << /Type /Pages /Kids [] /Count 0 >> endobj\n';
  const tail = '\nendstream endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n';
  const open = (n: number) => `3 0 obj << /Length ${n} /Filter /ASCIIHexDecode >> stream\n`;
  const n = size - head.length - tail.length - open(size).length;
  let state = 42;
  const digits = Buffer.alloc(n);
  for (let i = 0; i < n; i++) {
    state = (state * 1103515245 + 12345) & 0x7fffffff;
    digits[i] = '0123456789abcdef'.charCodeAt((state >> 16) & 15);
  }
  return Buffer.concat([Buffer.from(head + open(n)), digits, Buffer.from(tail)]);
}

const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'plumbline-s3-server-'));
  fake = await startFakeS3({ dir: join(dir, 's3'), bucket: 'plumbline-e2e' });
  const port = await freePort();
  base = `http://127.0.0.1:${port}`;
  server = await startServer(
    {
      host: '127.0.0.1',
      port,
      databaseUrl: inject('databaseUrl'),
      siteUrl: base,
      secret: 'storage-s3-secret-long-enough-for-better-auth',
      signInLimit: 10_000,
      // A local folder that must stay empty: every file goes to the object store.
      filesDir: join(dir, 'files'),
      storage: { driver: 's3', ...fake.settings },
    },
    { quiet: true },
  );
  owner = new Client(base);
  const email = `s3-owner-${Date.now()}@test.example`;
  expect((await owner.post('/api/auth/sign-up/email', { email, password: 'correct-horse-battery', name: 'Store Owner' })).status).toBe(200);
  // This server has no mail catcher: the address is proven directly in the database (the proof has its own tests).
  await sql('UPDATE "user" SET "emailVerified" = true WHERE email = $1', [email]);
  brandId = (await owner.post('/api/brands', { name: 'Object Store Works' })).body.brand.id;
});

afterAll(async () => {
  if (server && server.exitCode === null) {
    const exited = new Promise((r) => server.once('exit', r));
    server.kill('SIGTERM');
    await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
    if (server.exitCode === null) server.kill('SIGKILL');
  }
  await fake?.close();
  rmSync(dir, { recursive: true, force: true });
  await closeDb();
});

describe('the server on an S3-compatible store', () => {
  it('keeps an uploaded file in the object store and gives it back byte-identical', async () => {
    const pdf = bulkyPdf(8 * MB);
    const up = await owner.upload(`/api/brands/${brandId}/assets`, 'print-run.pdf', pdf, 'application/pdf');
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const assetId = up.body.assets[0].id as string;

    const [row] = await sql<{ storage_key: string }>('SELECT storage_key FROM assets WHERE id = $1', [assetId]);
    expect(row.storage_key).toMatch(SAFE_KEY);
    const store = new S3Storage(fake.settings);
    expect(await store.stat(row.storage_key)).toEqual({ size: pdf.length, contentType: 'application/pdf' });
    // Nothing went to local disk.
    expect(existsSync(join(dir, 'files')) ? readdirSync(join(dir, 'files')) : []).toEqual([]);

    const down = await fetchBytes(`/api/assets/${assetId}/file?download=1`);
    expect(down.status).toBe(200);
    expect(down.headers.get('content-type')).toBe('application/pdf');
    expect(down.headers.get('content-length')).toBe(String(pdf.length));
    expect(sha256(down.bytes)).toBe(sha256(pdf));
  });

  it('draws a rendition from the stored original and keeps it in the store too', async () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 40 20"><rect x="2" y="2" width="36" height="16" fill="#1d2a44"/></svg>';
    const up = await owner.upload(`/api/brands/${brandId}/assets`, 'bar.svg', svg, 'image/svg+xml');
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const assetId = up.body.assets[0].id as string;
    const png = await fetchBytes(`/api/assets/${assetId}/file?format=png&width=200`);
    expect(png.status).toBe(200);
    // PNG signature (ISO/IEC 15948 §5.2).
    expect([...png.bytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    const keys = await sql<{ storage_key: string }>('SELECT storage_key FROM asset_renditions WHERE asset_id = $1', [assetId]);
    expect(keys.length).toBeGreaterThan(0);
    for (const { storage_key } of keys) expect(await new S3Storage(fake.settings).exists(storage_key)).toBe(true);
  });

  it('empties the brand’s prefix in the store when the brand is deleted', async () => {
    const keys = (await sql<{ storage_key: string }>('SELECT storage_key FROM assets WHERE brand_id = $1', [brandId])).map((r) => r.storage_key);
    expect(keys.length).toBeGreaterThan(0);
    expect((await owner.delete(`/api/brands/${brandId}`)).status).toBe(204);
    const store = new S3Storage(fake.settings);
    for (const key of keys) expect(await store.exists(key)).toBe(false);
  });
});

describe('what the database holds for a file', () => {
  const COLUMNS = ['assets', 'asset_renditions', 'brand_logos', 'brand_typefaces', 'mood_board_items', 'pdf_exports'];

  it('is an object key in every column that names a stored file', async () => {
    for (const table of COLUMNS) {
      const rows = await sql<{ storage_key: string }>(`SELECT storage_key FROM ${table} WHERE storage_key IS NOT NULL`);
      for (const { storage_key } of rows) expect(storage_key, table).toMatch(SAFE_KEY);
    }
    const logos = await sql<{ key: string }>(`SELECT v->>'key' AS key FROM brand_logos, jsonb_each(variant_files) AS e(slot, v)`);
    const versions = await sql<{ key: string }>(`SELECT v->>'key' AS key FROM guideline_versions, jsonb_each(files) AS e(name, v)`);
    for (const { key } of [...logos, ...versions]) expect(key).toMatch(SAFE_KEY);
  });

  it('refuses a machine path in place of a key', async () => {
    const [logo] = await sql<{ id: string; brand_id: string }>('SELECT id, brand_id FROM brand_logos LIMIT 1');
    expect(logo).toBeTruthy();
    for (const path of ['/srv/plumbline/.data/files/logo.svg', `../${logo.brand_id}/logo/x.svg`, `${logo.brand_id}/logo/../../etc/passwd`]) {
      await expect(sql('UPDATE brand_logos SET storage_key = $1 WHERE id = $2', [path, logo.id])).rejects.toThrow(/brand_logos_storage_key_is_object_key/);
      await expect(sql(`UPDATE brand_logos SET variant_files = jsonb_build_object('black', jsonb_build_object('key', $1::text)) WHERE id = $2`, [path, logo.id])).rejects.toThrow(
        /brand_logos_variant_files_is_object_key/,
      );
    }
    await expect(sql(`UPDATE guideline_versions SET manifest = jsonb_build_object('entries', jsonb_build_object('/', jsonb_build_object('key', '/tmp/page.html'))) WHERE false`)).resolves.toEqual([]);
  });
});
