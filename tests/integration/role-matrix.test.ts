// Every API route × every kind of caller → the status the policy promises (PRODUCT.md "People and roles").
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { closeDb } from '../support/db';
import { waitForBuild } from '../support/publish';
import { CALLERS, makeBrand, makeCast, type Cast, type Fixture } from './fixtures';
import { brandPool, type BrandKind, type BrandPool } from './matrix/brand-pool';
import { brandState } from './matrix/brand-state';
import { changesFixture, type Route } from './matrix/route';

// Each area lists its routes in matrix/<area>.routes.ts; a new endpoint needs a row there.
const ROUTES: Route[] = Object.values(import.meta.glob<{ default: Route[] }>('./matrix/*.routes.ts', { eager: true })).flatMap((m) => m.default);

// A case whose answered request changes the brand (a delete, a role change, a new version…) gets a brand of its own,
// so it cannot colour the next case. Every other case, refusals of changing routes included, runs on one shared brand
// built the same way: a refused request therefore always meets a brand on which the right caller would succeed.
// Rows that never refer to client work get their own brands without it (about half the cost of a brand).
const kindOf = (route: Route): BrandKind => ({ clientWork: route.clientWork ?? true });
const OWN_BRANDS = ROUTES.flatMap((route) => CALLERS.filter((c) => changesFixture(route, route.expect[c])).map(() => kindOf(route)));

let cast: Cast;
let shared: Fixture;
let sharedState: Record<string, string>;
let pool: BrandPool;
beforeAll(async () => {
  cast = await makeCast();
  // Built while the shared cases run, three at a time, so one build's requests are computed while another's wait.
  pool = brandPool(cast, OWN_BRANDS, 3);
  shared = await makeBrand(cast);
  // The shared brand's published versions are built by a job: its state is taken once they are all done, or a build
  // finishing during some case would look like that case changing the brand.
  const listed = await cast.clients.owner.get<{ versions: { number: number }[] }>(`/api/brands/${shared.brandId}/versions`);
  for (const v of listed.body.versions) await waitForBuild(cast.clients.owner, shared.brandId, v.number);
  sharedState = await brandState(shared.brandId);
});
afterAll(async () => {
  await pool?.close();
  await closeDb();
});

describe.each(ROUTES)('$method $file', (route) => {
  test.each(CALLERS.map((c) => [c, route.expect[c]] as const))('%s → %i', async (caller, status) => {
    const own = changesFixture(route, status);
    const fixture = own ? await pool.take(kindOf(route)) : shared;
    const client = cast.clients[caller];
    const u = route.upload?.();
    const r = u
      ? await client.upload(route.path(fixture), u.filename, u.content, u.type, u.fields)
      : await client.request(route.method, route.path(fixture), route.body?.(fixture));
    // Read before the status is judged, so a request that wrongly wrote is both reported and cleaned up after.
    const changed = own ? [] : changedTables(sharedState, await brandState(shared.brandId));
    if (changed.length) {
      // The next cases get a clean shared brand again.
      shared = await makeBrand(cast);
      sharedState = await brandState(shared.brandId);
    }
    expect(r.status, JSON.stringify(r.body)).toBe(status);
    if (status >= 400) {
      expect(r.body.error.code).toBeTypeOf('string');
      expect(r.body.error.message).toBeTypeOf('string');
    }
    // A row that may change the brand when answered is marked `mutates: true`; a refused request changes nothing.
    expect(changed, 'tables of the shared fixture brand this case changed').toEqual([]);
  });
});

/** The tables whose rows of the brand differ between two brandState() readings. */
function changedTables(before: Record<string, string>, after: Record<string, string>): string[] {
  return [...new Set([...Object.keys(before), ...Object.keys(after)])].filter((t) => before[t] !== after[t]).sort();
}

/** Every method exported by every endpoint file under src/pages/api (better-auth's own routes aside). */
function endpointsOnDisk(): string[] {
  const root = join(process.cwd(), 'src/pages/api');
  const found: string[] = [];
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir)) {
      const path = join(dir, entry);
      if (statSync(path).isDirectory()) walk(path);
      else if (path.endsWith('.ts')) {
        const file = relative(root, path);
        if (file.startsWith('auth/')) continue;
        for (const m of readFileSync(path, 'utf8').matchAll(/export const (GET|POST|PUT|PATCH|DELETE) /g)) found.push(`${m[1]} ${file}`);
      }
    }
  };
  walk(root);
  return found.sort();
}

test('the matrix covers every API route on disk', () => {
  expect(ROUTES.map((r) => `${r.method} ${r.file}`).sort()).toEqual(endpointsOnDisk());
});
