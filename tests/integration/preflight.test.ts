// The check before publishing over HTTP: a brand started from the brand-book template lists its template text and
// stand-in images; publishing anyway works and the audit trail keeps what was still open.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Client, signUpFresh } from '../support/client';
import { closeDb, sql } from '../support/db';

let owner: Client;
let brandId: string;
const api = (p = '') => `/api/brands/${brandId}${p}`;

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('preflight-owner'));
  brandId = (await owner.post('/api/brands', { name: 'Preflight Provisions' })).body.brand.id;
  await owner.post(api('/colors'), { name: 'Ink', value: '#1b1b1b' });
  await owner.post(api('/colors'), { name: 'Paper', value: '#fbf8f2' });
});
afterAll(closeDb);

describe('check before publishing', () => {
  test('a template straight from the box is not ready: its instructions and stand-in images are listed by block', async () => {
    const { revision } = (await owner.get(api('/guideline'))).body;
    expect((await owner.post(api('/guideline/template'), { template: 'brand-book', baseRevision: revision })).status).toBe(200);
    const check = await owner.get(api('/versions/check'));
    expect(check.status).toBe(200);
    const codes = check.body.findings.map((f: { code: string }) => f.code);
    expect(codes).toContain('template_text');
    expect(codes).toContain('image_placeholder');
    const imagery = check.body.findings.find((f: { code: string }) => f.code === 'image_placeholder');
    expect(imagery.where).toMatch(/^Imagery/);
    expect(imagery.blockId).toBeTruthy();
  });

  test('publishing anyway is allowed, and the trail records what was still open', async () => {
    const published = await owner.post(api('/versions'), { note: 'Early look for the client; copy to follow.' });
    expect(published.status).toBe(201);
    const rows = await sql(`SELECT details FROM audit_events WHERE brand_id = $1 AND action = 'version.preflight'`, [brandId]);
    expect(rows).toHaveLength(1);
    expect(rows[0].details.open.map((o: { code: string }) => o.code)).toContain('template_text');
  });
});
