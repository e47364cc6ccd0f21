// The working draft of the guidelines.
import { only, withoutClientWork, type Route } from './route';

// No row here refers to client work, so their own brands are built without it.
export default withoutClientWork([
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
] satisfies Route[]);
