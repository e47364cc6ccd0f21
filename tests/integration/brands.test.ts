// Brands through the API: create, read, rename, delete, and bad input that changes nothing.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { signUpFresh, type Client } from '../support/client';
import { closeDb, sql } from '../support/db';

let designer: Client;
let designerId: string;
beforeAll(async () => {
  ({ client: designer, id: designerId } = await signUpFresh('designer'));
});
afterAll(closeDb);

describe('brand lifecycle', () => {
  test('create → listed with owner role → rename → delete, each with an audit row', async () => {
    const created = await designer.post('/api/brands', { name: 'Harbour Bakehouse' });
    expect(created.status).toBe(201);
    const { id, slug, name } = created.body.brand;
    expect(name).toBe('Harbour Bakehouse');
    expect(slug).toMatch(/^harbour-bakehouse(-\d+)?$/);

    const list = await designer.get('/api/brands');
    expect(list.body.brands).toContainEqual(expect.objectContaining({ id, name, slug, role: 'owner' }));

    const one = await designer.get(`/api/brands/${id}`);
    expect(one.body.brand).toMatchObject({ id, name, slug, role: 'owner' });

    const renamed = await designer.patch(`/api/brands/${id}`, { name: 'Harbour Bakehouse & Café' });
    expect(renamed.status).toBe(200);
    expect(renamed.body.brand.name).toBe('Harbour Bakehouse & Café');
    expect(renamed.body.brand.slug).toBe(slug); // the public address does not move on rename

    expect((await designer.delete(`/api/brands/${id}`)).status).toBe(204);
    expect((await designer.get(`/api/brands/${id}`)).status).toBe(404);

    const trail = await sql('SELECT action, target_id FROM audit_events WHERE actor_id = $1 ORDER BY created_at', [designerId]);
    expect(trail.map((r) => r.action)).toEqual(expect.arrayContaining(['studio.create', 'brand.create', 'brand.update', 'brand.delete']));
  });

  test('two brands of the same name get distinct public slugs', async () => {
    const a = await designer.post('/api/brands', { name: 'Twin Peaks Dairy' });
    const b = await designer.post('/api/brands', { name: 'Twin Peaks Dairy' });
    expect(a.body.brand.slug).not.toBe(b.body.brand.slug);
    expect(b.body.brand.slug).toBe(`${a.body.brand.slug}-2`);
  });

  test('a slug can be changed, but not to one already taken', async () => {
    const a = await designer.post('/api/brands', { name: 'Slug Owner' });
    const b = await designer.post('/api/brands', { name: 'Slug Wanter' });
    const clash = await designer.patch(`/api/brands/${b.body.brand.id}`, { slug: a.body.brand.slug });
    expect(clash.status).toBe(409);
    expect(clash.body.error.code).toBe('slug_taken');
    const bad = await designer.patch(`/api/brands/${b.body.brand.id}`, { slug: 'Not A Slug!' });
    expect(bad.status).toBe(400);
    const ok = await designer.patch(`/api/brands/${b.body.brand.id}`, { slug: `wanted-${Date.now()}` });
    expect(ok.status).toBe(200);
  });
});

describe('bad input is refused clearly and changes nothing', () => {
  const cases: [string, unknown, number, string][] = [
    ['empty name', { name: '' }, 400, 'invalid_input'],
    ['blank name', { name: '    ' }, 400, 'invalid_input'],
    ['overlong name', { name: 'x'.repeat(121) }, 400, 'invalid_input'],
    ['missing name', {}, 400, 'invalid_input'],
    ['name of the wrong type', { name: 42 }, 400, 'invalid_input'],
    ['unknown field', { name: 'Fine', colour: 'red' }, 400, 'invalid_input'],
    ['malformed JSON', '{"name": "Fine"', 400, 'malformed_json'],
    ['a JSON array', '[]', 400, 'invalid_input'],
  ];
  test.each(cases)('%s', async (_label, body, status, code) => {
    const before = await designer.get('/api/brands');
    const r = await designer.request('POST', '/api/brands', body);
    expect(r.status).toBe(status);
    expect(r.body.error.code).toBe(code);
    expect(r.body.error.message.length).toBeGreaterThan(10);
    const after = await designer.get('/api/brands');
    expect(after.body.brands).toEqual(before.body.brands);
  });

  test('the unknown field is named in the error', async () => {
    const r = await designer.post('/api/brands', { name: 'Fine', colour: 'red' });
    expect(r.body.error.message).toContain('colour');
  });

  test('a body that is not JSON at all is refused with 415', async () => {
    const r = await designer.request('POST', '/api/brands', 'name=Fine', { 'content-type': 'application/x-www-form-urlencoded' });
    expect([403, 415]).toContain(r.status); // Astro's own origin check may answer first for form posts
  });

  test('a malformed brand id is a 404, not a crash', async () => {
    const r = await designer.get('/api/brands/not-a-uuid');
    expect(r.status).toBe(404);
    expect(r.body.error.code).toBe('not_found');
  });

  test('an unsupported method answers 405 in our error shape', async () => {
    const r = await designer.request('PUT', '/api/brands', { name: 'x' });
    expect(r.status).toBe(405);
    expect(r.body.error.code).toBe('method_not_allowed');
  });
});
