// Every API route × every kind of caller → the status the policy promises (PRODUCT.md "People and roles").
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { closeDb } from '../support/db';
import { CALLERS, makeBrand, makeCast, type Cast } from './fixtures';
import type { Route } from './matrix/route';

// Each area lists its routes in matrix/<area>.routes.ts; a new endpoint needs a row there.
const ROUTES: Route[] = Object.values(import.meta.glob<{ default: Route[] }>('./matrix/*.routes.ts', { eager: true })).flatMap((m) => m.default);

let cast: Cast;
beforeAll(async () => {
  cast = await makeCast();
});
afterAll(closeDb);

describe.each(ROUTES)('$method $file', (route) => {
  test.each(CALLERS.map((c) => [c, route.expect[c]] as const))('%s → %i', async (caller, status) => {
    // A fresh brand per case, so a delete or a role change in one case cannot colour the next.
    const fixture = await makeBrand(cast);
    const client = cast.clients[caller];
    const u = route.upload?.();
    const r = u
      ? await client.upload(route.path(fixture), u.filename, u.content, u.type, u.fields)
      : await client.request(route.method, route.path(fixture), route.body?.(fixture));
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
