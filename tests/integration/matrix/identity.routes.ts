// The identity: colours, logos, typefaces, type scale, palette report and tokens.
import { FIXTURE_SVG } from '../fixtures';
import { only, withoutClientWork, type Route } from './route';

const readers = only(200, ['owner', 'editor', 'reviewer']);
const makers = (ok: number) => only(ok, ['owner', 'editor']);
const b = (f: { brandId: string }) => `/api/brands/${f.brandId}`;

// No row here refers to client work, so their own brands are built without it.
export default withoutClientWork([
  { method: 'GET', file: 'brands/[id]/identity.ts', path: (f) => `${b(f)}/identity`, expect: readers },
  { method: 'GET', file: 'brands/[id]/palette-report.ts', path: (f) => `${b(f)}/palette-report`, expect: readers },
  { method: 'GET', file: 'brands/[id]/mockups/[template].ts', path: (f) => `${b(f)}/mockups/social-post?format=png`, expect: readers },
  { method: 'GET', file: 'brands/[id]/tokens.ts', path: (f) => `${b(f)}/tokens?format=css`, expect: readers },
  { method: 'POST', file: 'brands/[id]/colors/index.ts', path: (f) => `${b(f)}/colors`, body: () => ({ name: 'Crema', value: '#e9d8b8' }), expect: makers(201) },
  { method: 'PATCH', file: 'brands/[id]/colors/[colorId].ts', path: (f) => `${b(f)}/colors/${f.colorId}`, body: () => ({ name: 'Deep ink' }), expect: makers(200) },
  { method: 'DELETE', file: 'brands/[id]/colors/[colorId].ts', path: (f) => `${b(f)}/colors/${f.colorId}`, expect: makers(204) },
  { method: 'PUT', file: 'brands/[id]/colors/order.ts', path: (f) => `${b(f)}/colors/order`, body: (f) => ({ ids: [f.colorId] }), expect: makers(200) },
  {
    method: 'PUT',
    file: 'brands/[id]/type-scale.ts',
    path: (f) => `${b(f)}/type-scale`,
    body: () => ({ basePx: 17, ratioName: 'perfect-fourth', stepsUp: 5, stepsDown: 1, bodyLineHeight: 1.5, headingLineHeight: 1.1, columnPx: 560 }),
    expect: makers(200),
  },
  {
    method: 'POST',
    file: 'brands/[id]/logos/index.ts',
    path: (f) => `${b(f)}/logos`,
    upload: () => ({ filename: 'lockup.svg', content: FIXTURE_SVG.replace('#c8553d', `#${Math.floor(Math.random() * 0xffffff).toString(16).padStart(6, '0')}`), type: 'image/svg+xml', fields: { variant: 'lockup' } }),
    expect: makers(201),
  },
  { method: 'PATCH', file: 'brands/[id]/logos/[logoId]/index.ts', path: (f) => `${b(f)}/logos/${f.logoId}`, body: () => ({ clearSpaceMultiple: 2 }), expect: makers(200) },
  { method: 'DELETE', file: 'brands/[id]/logos/[logoId]/index.ts', path: (f) => `${b(f)}/logos/${f.logoId}`, expect: makers(204) },
  {
    method: 'POST',
    file: 'brands/[id]/logos/[logoId]/variants/[slot].ts',
    path: (f) => `${b(f)}/logos/${f.logoId}/variants/white`,
    upload: () => ({ filename: 'white.svg', content: FIXTURE_SVG.replace('#c8553d', '#ffffff'), type: 'image/svg+xml', fields: {} }),
    expect: makers(200),
  },
  { method: 'DELETE', file: 'brands/[id]/logos/[logoId]/variants/[slot].ts', path: (f) => `${b(f)}/logos/${f.logoId}/variants/reversed`, expect: only(404, ['owner', 'editor']) },
  { method: 'GET', file: 'brands/[id]/logos/[logoId]/file.ts', path: (f) => `${b(f)}/logos/${f.logoId}/file?variant=white`, expect: readers },
  { method: 'GET', file: 'brands/[id]/logos/[logoId]/proofs/index.ts', path: (f) => `${b(f)}/logos/${f.logoId}/proofs`, expect: readers },
  { method: 'GET', file: 'brands/[id]/logos/[logoId]/proofs/[proof].ts', path: (f) => `${b(f)}/logos/${f.logoId}/proofs/greyscale`, expect: readers },
  { method: 'POST', file: 'brands/[id]/typefaces/index.ts', path: (f) => `${b(f)}/typefaces`, body: () => ({ shipped: 'fraunces', role: 'heading' }), expect: makers(201) },
  { method: 'PATCH', file: 'brands/[id]/typefaces/[typefaceId]/index.ts', path: (f) => `${b(f)}/typefaces/${f.typefaceId}`, body: () => ({ fallback: ['Arial', 'sans-serif'] }), expect: makers(200) },
  { method: 'DELETE', file: 'brands/[id]/typefaces/[typefaceId]/index.ts', path: (f) => `${b(f)}/typefaces/${f.typefaceId}`, expect: makers(204) },
  { method: 'GET', file: 'brands/[id]/typefaces/[typefaceId]/file.ts', path: (f) => `${b(f)}/typefaces/${f.typefaceId}/file`, expect: readers },
] satisfies Route[]);
