// Brands and members.
import { all, only, unique, type Route } from './route';

export default [
  { method: 'GET', file: 'brands/index.ts', path: () => '/api/brands', expect: all(200) },
  // A new brand of the caller's own: the fixture brand is not touched.
  { method: 'POST', file: 'brands/index.ts', path: () => '/api/brands', body: () => ({ name: 'Matrix Made' }), expect: all(201), mutates: false },
  { method: 'GET', file: 'brands/[id]/index.ts', path: (f) => `/api/brands/${f.brandId}`, expect: all(200, { outsider: 404 }) },
  { method: 'PATCH', file: 'brands/[id]/index.ts', path: (f) => `/api/brands/${f.brandId}`, body: () => ({ name: 'Renamed' }), expect: only(200, ['owner', 'editor']) },
  { method: 'DELETE', file: 'brands/[id]/index.ts', path: (f) => `/api/brands/${f.brandId}`, expect: only(204, ['owner']) },
  { method: 'GET', file: 'brands/[id]/members/index.ts', path: (f) => `/api/brands/${f.brandId}/members`, expect: only(200, ['owner', 'editor']) },
  { method: 'POST', file: 'brands/[id]/members/index.ts', path: (f) => `/api/brands/${f.brandId}/members`, body: () => ({ email: unique(), role: 'viewer' }), expect: only(201, ['owner']) },
  { method: 'PATCH', file: 'brands/[id]/members/[memberId].ts', path: (f) => `/api/brands/${f.brandId}/members/${f.targetMemberId}`, body: () => ({ role: 'partner' }), expect: only(200, ['owner']) },
  { method: 'DELETE', file: 'brands/[id]/members/[memberId].ts', path: (f) => `/api/brands/${f.brandId}/members/${f.targetMemberId}`, expect: only(204, ['owner']) },
] satisfies Route[];
