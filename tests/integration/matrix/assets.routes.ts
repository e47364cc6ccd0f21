// The asset shelf: uploads, states, renditions, bundles and the download log.
import { FIXTURE_SVG } from '../fixtures';
import { only, withoutClientWork, type Route } from './route';

const b = (f: { brandId: string }) => `/api/brands/${f.brandId}`;
const makers = (ok: number) => only(ok, ['owner', 'editor']);
/** Members whose role includes downloads (asset.download): viewers are refused. */
const downloaders = (ok: number) => only(ok, ['owner', 'editor', 'reviewer', 'partner']);
const randomInk = () => `#${Math.floor(Math.random() * 0xffffff).toString(16).padStart(6, '0')}`;

// No row here refers to client work, so their own brands are built without it.
export default withoutClientWork([
  { method: 'GET', file: 'brands/[id]/assets/index.ts', path: (f) => `${b(f)}/assets`, expect: downloaders(200) },
  {
    method: 'POST',
    file: 'brands/[id]/assets/index.ts',
    path: (f) => `${b(f)}/assets`,
    upload: () => ({ filename: 'matrix-mark.svg', content: FIXTURE_SVG.replace('#c8553d', randomInk()), type: 'image/svg+xml' }),
    expect: makers(201),
  },
  { method: 'GET', file: 'brands/[id]/assets/[assetId].ts', path: (f) => `${b(f)}/assets/${f.assetId}`, expect: downloaders(200) },
  { method: 'PATCH', file: 'brands/[id]/assets/[assetId].ts', path: (f) => `${b(f)}/assets/${f.assetId}`, body: () => ({ state: 'retired', tags: ['matrix'] }), expect: makers(200) },
  { method: 'DELETE', file: 'brands/[id]/assets/[assetId].ts', path: (f) => `${b(f)}/assets/${f.assetId}`, expect: makers(204) },
  { method: 'GET', file: 'assets/[assetId]/file.ts', path: (f) => `/api/assets/${f.assetId}/file?format=png&width=64`, expect: downloaders(200) },
  // Packs a zip of what the brand has; it writes the download log only.
  { method: 'POST', file: 'brands/[id]/bundles.ts', path: (f) => `${b(f)}/bundles`, body: (f) => ({ assetIds: [f.assetId] }), expect: downloaders(200), mutates: false },
  // A pattern tile of the mark: members who read the draft preview it; makers put it on the shelf (a new seed each time).
  { method: 'GET', file: 'brands/[id]/patterns/index.ts', path: (f) => `${b(f)}/patterns?logoId=${f.logoId}&layout=grid&format=svg`, expect: only(200, ['owner', 'editor', 'reviewer']) },
  {
    method: 'POST',
    file: 'brands/[id]/patterns/index.ts',
    path: (f) => `${b(f)}/patterns`,
    body: (f) => ({ settings: { logoId: f.logoId, layout: 'scatter', seed: Math.floor(Math.random() * 2 ** 31) } }),
    expect: makers(201),
  },
  { method: 'GET', file: 'brands/[id]/downloads/index.ts', path: (f) => `${b(f)}/downloads`, expect: only(200, ['owner']) },
] satisfies Route[]);
