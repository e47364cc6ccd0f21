// Members of a brand: adding people, invitations for unknown addresses, roles, and the last owner.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { joinBrand, signUpFresh, type Client } from '../support/client';
import { lastMailTo, linkIn } from '../support/mailbox';
import { closeDb, sql } from '../support/db';

let owner: Client;
let brandId: string;
beforeAll(async () => {
  ({ client: owner } = await signUpFresh('owner'));
  brandId = (await owner.post('/api/brands', { name: 'Members Test Brand' })).body.brand.id;
});
afterAll(closeDb);

describe('members', () => {
  test('an existing user is invited, not added, and sees the brand only after accepting', async () => {
    const { client: colleague, email } = await signUpFresh('colleague');
    expect((await colleague.get(`/api/brands/${brandId}`)).status).toBe(404);
    const r = await owner.post(`/api/brands/${brandId}/members`, { email: email.toUpperCase(), role: 'editor' });
    expect(r.status).toBe(201);
    expect(r.body.member).toBeUndefined();
    expect(r.body.invitation).toMatchObject({ email, role: 'editor' });
    expect((await colleague.get(`/api/brands/${brandId}`)).status).toBe(404);
    const { token } = linkIn(lastMailTo(email), '/invite/');
    expect((await colleague.post(`/api/invitations/${token}/accept`, {})).status).toBe(200);
    expect((await colleague.get(`/api/brands/${brandId}`)).body.brand.role).toBe('editor');
    const audit = await sql(`SELECT details FROM audit_events WHERE brand_id = $1 AND action = 'member.invite'`, [brandId]);
    expect(audit.map((a) => a.details.email)).toContain(email);
  });

  test('an unknown e-mail becomes a pending invitation, stored only as a token hash', async () => {
    const email = `newcomer-${Date.now()}@test.example`;
    const r = await owner.post(`/api/brands/${brandId}/members`, { email, role: 'reviewer' });
    expect(r.status).toBe(201);
    expect(r.body.invitation).toMatchObject({ email, role: 'reviewer' });
    expect(r.body.invitation.token).toBeUndefined();
    const list = await owner.get(`/api/brands/${brandId}/members`);
    expect(list.body.invitations).toContainEqual(expect.objectContaining({ email, role: 'reviewer' }));
    const [row] = await sql('SELECT token_hash FROM invitations WHERE email = $1', [email]);
    expect(row.token_hash).toMatch(/^[0-9a-f]{64}$/);
    const twice = await owner.post(`/api/brands/${brandId}/members`, { email, role: 'viewer' });
    expect(twice.status).toBe(409);
  });

  test('adding someone twice is a conflict', async () => {
    const person = await signUpFresh('twice');
    const email = person.email;
    await joinBrand(owner, brandId, person, 'viewer');
    const again = await owner.post(`/api/brands/${brandId}/members`, { email, role: 'partner' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_member');
  });

  test('bad member input: invalid e-mail, unknown role, unknown field', async () => {
    for (const body of [{ email: 'not-an-email', role: 'viewer' }, { email: 'a@b.example', role: 'boss' }, { email: 'a@b.example', role: 'viewer', admin: true }]) {
      const r = await owner.post(`/api/brands/${brandId}/members`, body);
      expect(r.status).toBe(400);
      expect(r.body.error.code).toBe('invalid_input');
    }
  });

  test('the last owner can be neither demoted nor removed; with a second owner both work', async () => {
    const list = await owner.get(`/api/brands/${brandId}/members`);
    const me = list.body.members.find((m: { role: string }) => m.role === 'owner');
    const demote = await owner.patch(`/api/brands/${brandId}/members/${me.id}`, { role: 'editor' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe('last_owner');
    const remove = await owner.delete(`/api/brands/${brandId}/members/${me.id}`);
    expect(remove.status).toBe(409);

    const secondPerson = await signUpFresh('second-owner');
    const second = secondPerson.client;
    await joinBrand(owner, brandId, secondPerson, 'owner');
    expect((await owner.patch(`/api/brands/${brandId}/members/${me.id}`, { role: 'editor' })).status).toBe(200);
    expect((await owner.get(`/api/brands/${brandId}/members`)).status).toBe(200); // editors still read members
    expect((await owner.post(`/api/brands/${brandId}/members`, { email: 'x@y.example', role: 'viewer' })).status).toBe(403);
    const roles = await sql(`SELECT action, details FROM audit_events WHERE brand_id = $1 AND action = 'member.role'`, [brandId]);
    expect(roles.at(-1)!.details).toMatchObject({ before: 'owner', after: 'editor' });
    expect((await second.get(`/api/brands/${brandId}`)).body.brand.role).toBe('owner');
  });

  test('a member id from another brand is not found', async () => {
    const other = (await owner.post('/api/brands', { name: 'Other Brand' })).body.brand.id;
    const list = await owner.get(`/api/brands/${other}/members`);
    const foreign = list.body.members[0].id;
    const r = await owner.delete(`/api/brands/${brandId}/members/${foreign}`);
    expect([403, 404]).toContain(r.status);
  });
});
