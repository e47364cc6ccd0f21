// The shape of a role-matrix row, and helpers to write the expected statuses briefly.
import type { CallerName, Fixture } from '../fixtures';

export interface Route {
  method: string;
  /** Route file pattern as Astro names it, so the table can be checked against src/pages/api. */
  file: string;
  path: (f: Fixture) => string;
  body?: (f: Fixture) => unknown;
  /** A multipart upload instead of a JSON body. */
  upload?: () => { filename: string; content: string | Uint8Array; type: string; fields?: Record<string, string> };
  expect: Record<CallerName, number>;
  /**
   * Whether an answered (2xx) request changes the fixture brand so that a later case could be answered otherwise.
   * Unset: every method but GET changes it. A changing case gets a brand of its own; every other case runs on one
   * shared brand, and the matrix checks that it left the brand as it found it.
   */
  mutates?: boolean;
  /** `false`: a brand of its own for this row may leave the client work out (makeBrand's `clientWork`). */
  clientWork?: boolean;
}

/** Rows that never refer to client work: their own brands are built without it. */
export const withoutClientWork = (routes: Route[]): Route[] => routes.map((r) => ({ ...r, clientWork: false }));

/** True when an answered request of this row needs a brand of its own. */
export const changesFixture = (route: Route, status: number): boolean => status < 300 && (route.mutates ?? route.method !== 'GET');

export const all = (ok: number, overrides: Partial<Record<CallerName, number>> = {}): Record<CallerName, number> => ({
  anonymous: 401,
  owner: ok,
  editor: ok,
  reviewer: ok,
  partner: ok,
  viewer: ok,
  outsider: ok,
  ...overrides,
});
export const only = (ok: number, allowed: CallerName[]): Record<CallerName, number> => {
  const row = all(403, { outsider: 404 });
  for (const c of allowed) row[c] = ok;
  return row;
};
let n = 0;
export const unique = () => `invitee-${Date.now()}-${n++}@test.example`;

