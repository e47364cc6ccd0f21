// The working draft over HTTP: no lost update under concurrent saves, bad documents refused by path.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { signUpFresh, type Client } from '../support/client';
import { closeDb, sql } from '../support/db';

let designer: Client;
let brandId: string;
let colorId: string;
const url = () => `/api/brands/${brandId}/guideline`;

const section = (id: string, title: string) => ({ type: 'sectionHeading', attrs: { id, title, eyebrow: '', intro: '' } });
const paragraph = (id: string, text: string) => ({ type: 'paragraph', attrs: { id }, content: [{ type: 'text', text }] });
const doc = (...content: unknown[]) => ({ type: 'doc', content });

beforeAll(async () => {
  ({ client: designer } = await signUpFresh('guidelines'));
  brandId = (await designer.post('/api/brands', { name: 'Guideline Test Co' })).body.brand.id;
  colorId = (await designer.post(`/api/brands/${brandId}/colors`, { name: 'Ink', value: '#1d2a44' })).body.color.id;
});
afterAll(closeDb);

describe('saving the draft', () => {
  test('a new brand starts at revision 0 with an empty document', async () => {
    const r = await designer.get(url());
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ revision: 0, doc: { type: 'doc', content: [] } });
  });

  test('save → revision + 1 → read back the same document', async () => {
    const d = doc(section('s1', 'Colour'), { type: 'colorPalette', attrs: { id: 'p1', colorIds: [colorId], showPrint: true, note: '' } }, paragraph('t1', 'Use Ink for text.'));
    const r = await designer.request('PUT', url(), { baseRevision: 0, doc: d });
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ revision: 1 });
    const back = await designer.get(url());
    expect(back.body.revision).toBe(1);
    expect(back.body.doc.content.map((n: any) => n.type)).toEqual(['sectionHeading', 'colorPalette', 'paragraph']);
    expect(back.body.doc.content[1].attrs.colorIds).toEqual([colorId]);
  });

  test('two saves from the same revision at once: exactly one 200 and one 409, and the winner is kept whole', async () => {
    const base = (await designer.get(url())).body.revision;
    const a = doc(section('a', 'Version A'));
    const b = doc(section('b', 'Version B'), paragraph('b2', 'second'));
    const [ra, rb] = await Promise.all([designer.request('PUT', url(), { baseRevision: base, doc: a }), designer.request('PUT', url(), { baseRevision: base, doc: b })]);
    expect([ra.status, rb.status].sort()).toEqual([200, 409]);
    const loser = ra.status === 409 ? ra : rb;
    expect(loser.body.error.code).toBe('conflict');
    expect(loser.body.current.revision).toBe(base + 1);
    const stored = (await designer.get(url())).body;
    expect(stored.revision).toBe(base + 1);
    expect(stored.doc).toEqual(ra.status === 200 ? a : b);
  });

  const bad: [string, unknown, RegExp][] = [
    ['an unknown block', doc({ type: 'marquee', attrs: { id: 'x' } }), /content\.0/],
    ['bad attributes', doc({ type: 'colorPalette', attrs: { id: 'p', colorIds: 'all', showPrint: true, note: '' } }), /content\.0\.attrs\.colorIds/],
    ['a javascript: link', doc({ type: 'paragraph', attrs: { id: 'l' }, content: [{ type: 'text', text: 'x', marks: [{ type: 'link', attrs: { href: 'javascript:alert(1)' } }] }] }), /content\.0\.content\.0\.marks/],
    ['not a doc', { type: 'page', content: [] }, /type/],
  ];
  test.each(bad)('%s is refused naming the first bad path; nothing changes', async (_label, d, path) => {
    const before = (await designer.get(url())).body;
    const r = await designer.request('PUT', url(), { baseRevision: before.revision, doc: d });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_input');
    expect(r.body.error.details.path).toMatch(path);
    expect((await designer.get(url())).body).toEqual(before);
  });

  test('an oversized document is refused', async () => {
    const base = (await designer.get(url())).body.revision;
    const huge = doc(...Array.from({ length: 300 }, (_, i) => paragraph(`p${i}`, 'x'.repeat(9000))));
    const r = await designer.request('PUT', url(), { baseRevision: base, doc: huge });
    expect([400, 413]).toContain(r.status);
  });

  test('every save leaves an audit row with its revision', async () => {
    const rows = await sql(`SELECT details FROM audit_events WHERE brand_id = $1 AND action = 'guideline.save' ORDER BY created_at`, [brandId]);
    expect(rows.map((r) => r.details.revision)).toContain(1);
  });
});

describe('starter templates', () => {
  test.each(['essentials', 'brand-book'])('%s fills the draft from the identity', async (template) => {
    const base = (await designer.get(url())).body.revision;
    const r = await designer.post(`${url()}/template`, { template, baseRevision: base });
    expect(r.status).toBe(200);
    expect(r.body.revision).toBe(base + 1);
    const types = r.body.doc.content.map((n: any) => n.type);
    expect(types).toContain('sectionHeading');
    expect(types).toContain('colorPalette');
    const palette = r.body.doc.content.find((n: any) => n.type === 'colorPalette');
    expect(palette.attrs.colorIds).toContain(colorId);
  });

  test('an unknown template is refused with the choices', async () => {
    const r = await designer.post(`${url()}/template`, { template: 'glossy', baseRevision: 0 });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/essentials/);
  });
});
