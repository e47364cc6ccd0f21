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
}

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

