// Versions and share links.
import { only, withoutClientWork, type Route } from './route';

const b = (f: { brandId: string }) => `/api/brands/${f.brandId}`;
const everyone = only(200, ['owner', 'editor', 'reviewer', 'partner', 'viewer']);

// No row here refers to client work, so their own brands are built without it.
export default withoutClientWork([
  { method: 'GET', file: 'brands/[id]/versions/index.ts', path: (f) => `${b(f)}/versions`, expect: everyone },
  { method: 'POST', file: 'brands/[id]/versions/index.ts', path: (f) => `${b(f)}/versions`, body: () => ({ note: 'Matrix publish' }), expect: only(201, ['owner', 'editor']) },
  // Version 1 of a fixture brand is building or built, never failed: a retry is refused, and changes nothing.
  { method: 'POST', file: 'brands/[id]/versions/[number]/build.ts', path: (f) => `${b(f)}/versions/1/build`, expect: only(409, ['owner', 'editor']), mutates: false },
  { method: 'GET', file: 'brands/[id]/versions/check.ts', path: (f) => `${b(f)}/versions/check`, expect: only(200, ['owner', 'editor']) },
  { method: 'GET', file: 'brands/[id]/versions/compare.ts', path: (f) => `${b(f)}/versions/compare?from=1&to=draft`, expect: only(200, ['owner', 'editor', 'reviewer']) },
  { method: 'GET', file: 'brands/[id]/share-links/index.ts', path: (f) => `${b(f)}/share-links`, expect: only(200, ['owner']) },
  { method: 'POST', file: 'brands/[id]/share-links/index.ts', path: (f) => `${b(f)}/share-links`, body: () => ({ allowDownloads: true }), expect: only(201, ['owner']) },
  { method: 'PATCH', file: 'brands/[id]/share-links/[linkId].ts', path: (f) => `${b(f)}/share-links/${f.shareLinkId}`, body: () => ({ allowPresentation: true }), expect: only(200, ['owner']) },
  { method: 'DELETE', file: 'brands/[id]/share-links/[linkId].ts', path: (f) => `${b(f)}/share-links/${f.shareLinkId}`, expect: only(204, ['owner']) },
] satisfies Route[]);
