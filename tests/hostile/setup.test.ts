// The machine as a hostile visitor finds it: the database asks everybody for a password, the share cookie carries
// its flags, and a deleted brand leaves no file behind.
import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { findServerBinaries } from '../../scripts/lib/postgres';
import { shareCookieOptions } from '@/lib/publishing/share-cookie';
import { baseUrl, type Client } from '../support/client';
import { closeDb } from '../support/db';
import { makeBrand, makeCast, type Cast } from '../integration/fixtures';

const cluster = () => {
  const url = new URL(inject('databaseUrl'));
  return { host: url.hostname, port: Number(url.port), dir: inject('clusterDir') };
};

/** Connect and run one query; resolves to the error PostgreSQL (or the driver) raised, or null when it got in. */
async function tryConnect(config: pg.ClientConfig): Promise<(Error & { code?: string }) | null> {
  const client = new pg.Client({ connectionTimeoutMillis: 5000, ...config });
  try {
    await client.connect();
    await client.query('SELECT 1');
    return null;
  } catch (err) {
    return err as Error & { code?: string };
  } finally {
    await client.end().catch(() => {});
  }
}

/** Every file under `dir`, relative to it. */
function walk(dir: string, root = dir): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? walk(join(dir, e.name), root) : [relative(root, join(dir, e.name))]));
}

afterAll(closeDb);

describe('the project cluster asks every connection for a password', () => {
  it('ASVS 5.0 V13.2.1 loopback TCP without a password is refused (no trust authentication)', async () => {
    const { host, port } = cluster();
    for (const user of ['postgres', 'plumbline']) {
      // No password at all: the server asks for SCRAM and the connection cannot go on.
      const bare = await tryConnect({ host, port, user, database: 'postgres' });
      expect(bare, `${user} without a password`).not.toBeNull();
      expect(bare!.message).toMatch(/password|SASL/i);
      // A wrong password: PostgreSQL itself answers 28P01 invalid_password (PostgreSQL 15 manual, Appendix A).
      const wrong = await tryConnect({ host, port, user, database: 'postgres', password: 'not-the-password' });
      expect(wrong?.code, `${user} with a wrong password`).toBe('28P01');
    }
  });

  it('ASVS 5.0 V13.2.3 the application role has no default credential (plumbline/plumbline is refused)', async () => {
    const { host, port } = cluster();
    expect((await tryConnect({ host, port, user: 'plumbline', password: 'plumbline', database: 'plumbline' }))?.code).toBe('28P01');
    // …while the generated one, kept in the cluster's folder, gets in.
    expect(await tryConnect({ connectionString: inject('databaseUrl') })).toBeNull();
  });

  it('ASVS 5.0 V13.2.1 the Unix socket asks for a password too, even of the postgres OS user (no peer or trust)', () => {
    const { port, dir } = cluster();
    const hba = readFileSync(join(dir, 'pgdata', 'pg_hba.conf'), 'utf8');
    const rules = hba.split('\n').map((l) => l.replace(/#.*/, '').trim()).filter(Boolean);
    expect(rules.length).toBeGreaterThan(0);
    for (const rule of rules) expect(rule).toMatch(/\sscram-sha-256$/);
    if (process.getuid?.() !== 0) return; // only root can act as the postgres OS user
    const psql = join(findServerBinaries()!, 'psql');
    const env = { ...process.env, PGPASSWORD: '' };
    let failure = '';
    try {
      execFileSync('runuser', ['-u', 'postgres', '--', psql, '-X', '-w', '-h', join(dir, 'socket'), '-p', String(port), '-U', 'postgres', '-d', 'postgres', '-tAc', 'SELECT 1'], { env, stdio: 'pipe' });
    } catch (err) {
      failure = String((err as { stderr?: Buffer }).stderr ?? err);
    }
    expect(failure).toMatch(/no password supplied|password authentication failed/);
  });

  it('ASVS 5.0 V13.3.2 the kept passwords are readable by their owner only', () => {
    const { dir } = cluster();
    for (const file of ['superuser-password', 'app-password', 'database-url']) {
      // Mode 0600: no group or other bits.
      expect((execFileSync('stat', ['-c', '%a', join(dir, file)]).toString().trim()), file).toBe('600');
    }
  });
});

describe('share cookie flags', () => {
  let cast: Cast;
  let shareUrl: string;
  beforeAll(async () => {
    cast = await makeCast();
    const { brandId } = await makeBrand(cast, 'Cookie Flag Works');
    shareUrl = (await cast.clients.owner.post(`/api/brands/${brandId}/share-links`, { label: 'flags' })).body.shareLink.url;
  });

  it('ASVS 5.0 V3.3.4 / V3.3.2 opening a share link sets an HttpOnly, SameSite=Lax cookie for the whole site', async () => {
    const res = await fetch(baseUrl() + new URL(shareUrl).pathname, { redirect: 'manual' });
    expect(res.status).toBe(303);
    const cookie = res.headers.getSetCookie().find((c) => c.startsWith('plumbline_share='));
    expect(cookie).toBeDefined();
    expect(cookie).toMatch(/;\s*HttpOnly/i);
    expect(cookie).toMatch(/;\s*SameSite=Lax/i);
    expect(cookie).toMatch(/;\s*Path=\//i);
    // The test server's SITE_URL is http://127.0.0.1:…, so the cookie cannot be Secure (a browser would drop it).
    expect(cookie).not.toMatch(/;\s*Secure/i);
  });

  it('ASVS 5.0 V3.3.1 the share cookie is Secure whenever SITE_URL is https, also behind a proxy that speaks http to us', () => {
    // The page sets the cookie with exactly these options (src/pages/s/[token].astro); the request's own scheme plays no part.
    expect(shareCookieOptions('https://guidelines.example', null).secure).toBe(true);
    expect(shareCookieOptions(baseUrl(), null).secure).toBe(false);
  });
});

describe('brand deletion leaves no stored file behind', () => {
  let cast: Cast;
  let owner: Client;
  let brandId: string;
  let slug: string;

  beforeAll(async () => {
    cast = await makeCast();
    owner = cast.clients.owner;
    // makeBrand: a logo, a typeface, an approved asset, a published version (its file copies), board images.
    ({ brandId } = await makeBrand(cast, 'Doomed Brand'));
    slug = (await owner.get(`/api/brands/${brandId}`)).body.brand.slug;
    const assets = (await owner.get(`/api/brands/${brandId}/assets`)).body.assets as { id: string }[];
    // A rendition, cached in storage.
    const rendition = await fetch(`${baseUrl()}/api/assets/${assets[0].id}/file?format=png&width=64`, { headers: { cookie: owner.cookieHeader() } });
    expect(rendition.status).toBe(200);
    // The version's built files (its PDFs among them), in storage once the build job has made it ready.
    for (let i = 0; i < 240; i++) {
      const r = await fetch(`${baseUrl()}/b/${slug}/v/1/guideline.pdf?size=a4`, { headers: { accept: 'application/json', cookie: owner.cookieHeader() } });
      if (r.headers.get('content-type')?.includes('application/pdf')) break;
      expect(r.status, JSON.stringify(await r.clone().json())).toBe(202);
      await r.arrayBuffer();
      await new Promise((res) => setTimeout(res, 500));
    }
  });

  it('ASVS 5.0 V14.2.7 deleting a brand removes its originals, renditions, version copies and PDFs from the files folder', async () => {
    const filesDir = inject('filesDir');
    const before = walk(filesDir).filter((f) => f.startsWith(`${brandId}/`));
    const kinds = new Set(before.map((f) => f.split('/')[1]));
    // Each kind of file a brand keeps was there to be deleted (a version's copies, pages and PDFs live under build/).
    for (const kind of ['logo', 'asset', 'rendition', 'build']) expect([...kinds], kind).toContain(kind);

    expect((await owner.delete(`/api/brands/${brandId}`)).status).toBe(204);

    expect(existsSync(join(filesDir, brandId))).toBe(false);
    expect(walk(filesDir).filter((f) => f.includes(brandId))).toEqual([]);
    // Other brands' files are untouched.
    expect(walk(filesDir).length).toBeGreaterThan(0);
  });
});
