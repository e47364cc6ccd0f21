// The working draft of the guidelines.
import { only, type Route } from './route';

export default [
  { method: 'GET', file: 'brands/[id]/guideline/index.ts', path: (f) => `/api/brands/${f.brandId}/guideline`, expect: only(200, ['owner', 'editor', 'reviewer']) },
  {
    method: 'PUT',
    file: 'brands/[id]/guideline/index.ts',
    path: (f) => `/api/brands/${f.brandId}/guideline`,
    body: () => ({ baseRevision: 1, doc: { type: 'doc', content: [] } }),
    expect: only(200, ['owner', 'editor']),
  },
  {
    method: 'POST',
    file: 'brands/[id]/guideline/template.ts',
    path: (f) => `/api/brands/${f.brandId}/guideline/template`,
    body: () => ({ template: 'essentials', baseRevision: 1 }),
    expect: only(200, ['owner', 'editor']),
  },
] satisfies Route[];
