// Every API route × every kind of caller → the status the policy promises (PRODUCT.md "People and roles").
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { beforeAll, describe, expect, test } from 'vitest';
import { CALLERS, makeBrand, makeCast, type Cast, type CallerName } from './fixtures';

interface Route {
  method: string;
  /** Route file pattern as Astro names it, so the table can be checked against src/pages/api. */
  file: string;
  path: (f: { brandId: string; targetMemberId: string }) => string;
  body?: () => unknown;
  expect: Record<CallerName, number>;
}

const all = (ok: number, overrides: Partial<Record<CallerName, number>> = {}): Record<CallerName, number> => ({
  anonymous: 401,
  owner: ok,
  editor: ok,
  reviewer: ok,
  partner: ok,
  viewer: ok,
  outsider: ok,
  ...overrides,
});
const only = (ok: number, allowed: CallerName[]): Record<CallerName, number> => {
  const row = all(403, { outsider: 404 });
  for (const c of allowed) row[c] = ok;
  return row;
};
let n = 0;
const unique = () => `invitee-${Date.now()}-${n++}@test.example`;

const ROUTES: Route[] = [
  { method: 'GET', file: 'brands/index.ts', path: () => '/api/brands', expect: all(200) },
  { method: 'POST', file: 'brands/index.ts', path: () => '/api/brands', body: () => ({ name: 'Matrix Made' }), expect: all(201) },
  { method: 'GET', file: 'brands/[id]/index.ts', path: (f) => `/api/brands/${f.brandId}`, expect: all(200, { outsider: 404 }) },
  { method: 'PATCH', file: 'brands/[id]/index.ts', path: (f) => `/api/brands/${f.brandId}`, body: () => ({ name: 'Renamed' }), expect: only(200, ['owner', 'editor']) },
  { method: 'DELETE', file: 'brands/[id]/index.ts', path: (f) => `/api/brands/${f.brandId}`, expect: only(204, ['owner']) },
  { method: 'GET', file: 'brands/[id]/members/index.ts', path: (f) => `/api/brands/${f.brandId}/members`, expect: only(200, ['owner', 'editor']) },
  { method: 'POST', file: 'brands/[id]/members/index.ts', path: (f) => `/api/brands/${f.brandId}/members`, body: () => ({ email: unique(), role: 'viewer' }), expect: only(201, ['owner']) },
  { method: 'PATCH', file: 'brands/[id]/members/[memberId].ts', path: (f) => `/api/brands/${f.brandId}/members/${f.targetMemberId}`, body: () => ({ role: 'partner' }), expect: only(200, ['owner']) },
  { method: 'DELETE', file: 'brands/[id]/members/[memberId].ts', path: (f) => `/api/brands/${f.brandId}/members/${f.targetMemberId}`, expect: only(204, ['owner']) },
];

let cast: Cast;
beforeAll(async () => {
  cast = await makeCast();
});

describe.each(ROUTES)('$method $file', (route) => {
  test.each(CALLERS.map((c) => [c, route.expect[c]] as const))('%s → %i', async (caller, status) => {
    // A fresh brand per case, so a delete or a role change in one case cannot colour the next.
    const fixture = await makeBrand(cast);
    const r = await cast.clients[caller].request(route.method, route.path(fixture), route.body?.());
    expect(r.status, JSON.stringify(r.body)).toBe(status);
    if (status >= 400) {
      expect(r.body.error.code).toBeTypeOf('string');
      expect(r.body.error.message).toBeTypeOf('string');
    }
  });
});

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
