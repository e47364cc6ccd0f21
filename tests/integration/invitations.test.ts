// Invitations over HTTP: accept by token with the invited address, wrong account, resend, revoke, expiry.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { baseUrl, Client, signUpFresh, signUpUnverified, verifyByMail } from '../support/client';
import { closeDb, sql } from '../support/db';
import { lastMailTo, linkIn } from '../support/mailbox';

let owner: Client;
let brandId: string;
const invite = async (email: string, role = 'reviewer') => {
  const r = await owner.post(`/api/brands/${brandId}/members`, { email, role });
  expect(r.status).toBe(201);
  return { id: r.body.invitation.id as string, ...linkIn(lastMailTo(email), '/invite/') };
};
/** Sign up with the invited address and prove it through the mailed link. */
const signUp = async (email: string) => {
  const { client } = await signUpUnverified(email, 'Invited Person');
  await verifyByMail(client, email);
  return client;
};
// RFC 2606 reserves .example for documentation and tests.
const fresh = (label: string) => `${label}-${Date.now()}-${Math.random().toString(36).slice(2, 7)}@client.example`;

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('inviter'));
  brandId = (await owner.post('/api/brands', { name: 'Harrow Bakery' })).body.brand.id;
});
afterAll(closeDb);

describe('accepting', () => {
  test('a new person signs up with the invited address and joins with the invited role; the link is then used up', async () => {
    const email = fresh('new');
    const { token } = await invite(email, 'reviewer');
    const info = await new Client().get(`/api/invitations/${token}`);
    expect(info.body.invitation).toMatchObject({ state: 'pending', email, role: 'reviewer', brand: { id: brandId, name: 'Harrow Bakery' } });
    const person = await signUp(email);
    const r = await person.post(`/api/invitations/${token}/accept`, {});
    expect(r.status).toBe(200);
    expect(r.body.joined).toMatchObject({ brandId, role: 'reviewer' });
    expect((await person.get(`/api/brands/${brandId}`)).status).toBe(200);
    const again = await person.post(`/api/invitations/${token}/accept`, {});
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('invitation_used');
    const [row] = await sql(`SELECT count(*)::int AS n FROM audit_events WHERE brand_id = $1 AND action = 'member.join'`, [brandId]);
    expect(row.n).toBeGreaterThanOrEqual(1);
  });

  test('following the link signed in with the invited address offers a button; pressing it joins and lands on the brand', async () => {
    const email = fresh('signed');
    const { token } = await invite(email, 'partner');
    const person = await signUp(email);
    const page = await person.get(`/invite/${token}`);
    expect(page.status).toBe(200);
    expect(page.body).toContain('Accept and open Harrow Bakery');
    expect(await sql(`SELECT 1 FROM brand_members m JOIN "user" u ON u.id = m.user_id WHERE m.brand_id = $1 AND u.email = $2`, [brandId, email])).toHaveLength(0);
    const r = await person.request('POST', `/invite/${token}`, '', { 'content-type': 'application/x-www-form-urlencoded' });
    expect(r.status).toBe(303);
    expect(r.headers.get('location')).toBe(`/app/brands/${brandId}?joined=1`);
    const [m] = await sql(`SELECT m.role FROM brand_members m JOIN "user" u ON u.id = m.user_id WHERE m.brand_id = $1 AND u.email = $2`, [brandId, email]);
    expect(m.role).toBe('partner');
  });

  test('someone signed in with another address is told whose invitation it is, and nothing changes', async () => {
    const email = fresh('intended');
    const { token } = await invite(email);
    const { client: other } = await signUpFresh('other');
    const r = await other.post(`/api/invitations/${token}/accept`, {});
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('wrong_account');
    expect(r.body.error.message).toContain(email);
    expect((await other.get(`/api/brands/${brandId}`)).status).toBe(404);
  });

  test('a wrong or malformed token gives a clear 404, on the API and on the page', async () => {
    const anon = new Client();
    const wrong = 'A'.repeat(43);
    for (const t of [wrong, 'short']) {
      const r = await anon.get(`/api/invitations/${t}`);
      expect(r.status).toBe(404);
      expect(r.body.error.message).toMatch(/not valid/);
    }
    const page = await fetch(`${baseUrl()}/invite/${wrong}`);
    expect(page.status).toBe(404);
    expect(await page.text()).toContain('This invitation link does not work');
  });
});

describe('resend, revoke, expiry', () => {
  test('resend mails a new link; the old one stops working', async () => {
    const email = fresh('resend');
    const first = await invite(email);
    const r = await owner.post(`/api/brands/${brandId}/invitations/${first.id}/resend`, {});
    expect(r.status).toBe(200);
    expect(r.body.mailed).toBe(true);
    const second = linkIn(lastMailTo(email), '/invite/');
    expect(second.token).not.toBe(first.token);
    expect((await new Client().get(`/api/invitations/${first.token}`)).status).toBe(404);
    expect((await new Client().get(`/api/invitations/${second.token}`)).body.invitation.state).toBe('pending');
  });

  test('a revoked invitation leaves the list and its page says it was withdrawn', async () => {
    const email = fresh('revoke');
    const { id, token } = await invite(email);
    expect((await owner.delete(`/api/brands/${brandId}/invitations/${id}`)).status).toBe(204);
    const list = await owner.get(`/api/brands/${brandId}/invitations`);
    expect(list.body.invitations.map((i: { id: string }) => i.id)).not.toContain(id);
    const page = await fetch(`${baseUrl()}/invite/${token}`);
    expect(page.status).toBe(410);
    expect(await page.text()).toContain('withdrawn');
    const person = await signUp(email);
    expect((await person.post(`/api/invitations/${token}/accept`, {})).body.error.code).toBe('invitation_revoked');
  });

  test('an expired invitation is refused with its own message and can be sent again', async () => {
    const email = fresh('expired');
    const { id, token } = await invite(email);
    await sql(`UPDATE invitations SET expires_at = now() - interval '1 minute' WHERE id = $1`, [id]);
    const person = await signUp(email);
    const r = await person.post(`/api/invitations/${token}/accept`, {});
    expect(r.status).toBe(410);
    expect(r.body.error.code).toBe('invitation_expired');
    const list = await owner.get(`/api/brands/${brandId}/invitations`);
    expect(list.body.invitations.find((i: { id: string }) => i.id === id).state).toBe('expired');
    expect((await owner.post(`/api/brands/${brandId}/invitations/${id}/resend`, {})).status).toBe(200);
    const renewed = linkIn(lastMailTo(email), '/invite/');
    expect((await person.post(`/api/invitations/${renewed.token}/accept`, {})).status).toBe(200);
  });
});
