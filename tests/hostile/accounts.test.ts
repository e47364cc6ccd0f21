// A stranger who signs up with a client's e-mail address, against invitations, brands and the captured-mail viewer;
// and an account that tries to send mail without end. Each case names the OWASP requirement it checks.
import type { ChildProcess } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { freePort } from '../../scripts/lib/postgres';
import { startServer } from '../../scripts/lib/prepare';
import { baseUrl, Client, signUpFresh, signUpUnverified, verifyByMail } from '../support/client';
import { closeDb, sql } from '../support/db';
import { lastMailTo, linkIn, mailTo } from '../support/mailbox';

// RFC 2606 reserves .example for tests.
const clientAddress = () => `brand-manager-${randomUUID().slice(0, 8)}@client.example`;

let owner: Client;
let brandId: string;
const members = (id: string) => `/api/brands/${id}/members`;

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('hostile-owner'));
  brandId = (await owner.post('/api/brands', { name: 'Quarry Lane Bakery' })).body.brand.id;
});
afterAll(closeDb);

const memberRows = (id: string, userId: string) => sql('SELECT role FROM brand_members WHERE brand_id = $1 AND user_id = $2', [id, userId]);

describe('an account that has not proven its address', () => {
  it('V8.2.1 (ASVS 5.0): cannot accept an invitation sent to the address it signed up with', async () => {
    const address = clientAddress();
    expect((await owner.post(members(brandId), { email: address, role: 'editor' })).status).toBe(201);
    const { token } = linkIn(lastMailTo(address), '/invite/');
    // The stranger learns the token somehow (e.g. a forwarded mail) and registers the client's address first.
    const stranger = await signUpUnverified(address, 'Not The Client');
    const r = await stranger.client.post(`/api/invitations/${token}/accept`, {});
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('email_unverified');
    const page = await stranger.client.request('POST', `/invite/${token}`, '', { 'content-type': 'application/x-www-form-urlencoded' });
    expect(page.status).toBe(200);
    expect(page.body).toContain('Check your inbox');
    expect(await memberRows(brandId, stranger.id)).toEqual([]);
    expect((await new Client().get(`/api/invitations/${token}`)).body.invitation.state).toBe('pending');
  });

  it('V8.2.1 (ASVS 5.0): cannot act on any brand, not even one it is already a member of', async () => {
    const stranger = await signUpUnverified(clientAddress());
    // A membership from before addresses were proven (inserted directly, as no route makes one any more).
    await sql(`INSERT INTO brand_members (id, brand_id, user_id, role, created_at, updated_at) VALUES (gen_random_uuid(), $1, $2, 'editor', now(), now())`, [brandId, stranger.id]);
    const attempts = [
      await stranger.client.get('/api/brands'),
      await stranger.client.post('/api/brands', { name: 'Stranger Works' }),
      await stranger.client.get(`/api/brands/${brandId}`),
      await stranger.client.get(members(brandId)),
      await stranger.client.patch(`/api/brands/${brandId}`, { name: 'Taken Over' }),
      await stranger.client.post(`/api/brands/${brandId}/colors`, { name: 'Ink', value: '#000000' }),
    ];
    for (const r of attempts) {
      expect(r.status, JSON.stringify(r.body)).toBe(403);
      expect(r.body.error.code).toBe('email_unverified');
    }
    expect((await stranger.client.get(`/app/brands/${brandId}`)).status).toBe(302);
    expect((await owner.get(`/api/brands/${brandId}`)).body.brand.name).toBe('Quarry Lane Bakery');
    // Once the address is proven through the link, the same session works.
    await verifyByMail(stranger.client, stranger.email);
    expect((await stranger.client.get(`/api/brands/${brandId}`)).status).toBe(200);
  });

  it('V8.2.2 (ASVS 5.0): cannot read the mail sent to the address it signed up with', async () => {
    const address = clientAddress();
    await owner.post(members(brandId), { email: address, role: 'reviewer' });
    await owner.post(`/api/brands/${brandId}/briefs`, { template: 'new-identity', contactName: 'Client', contactEmail: address });
    const stranger = await signUpUnverified(address);
    const api = await stranger.client.get('/api/mail');
    expect(api.status).toBe(403);
    expect(api.body.error.code).toBe('email_unverified');
    expect(JSON.stringify(api.body)).not.toMatch(/\/invite\/|\/brief\//);
    const page = await stranger.client.get('/app/mail');
    expect(page.status).toBe(403);
    expect(page.body).not.toMatch(/\/invite\/|\/brief\/|invited you/);
    const ids = mailTo(address).map((m) => m.id);
    for (const id of ids) expect((await stranger.client.get(`/app/mail?m=${id}`)).body).not.toContain('invited you');
  });
});

describe('adding people to a brand', () => {
  it('V6.3.8 (ASVS 5.0) and the OWASP Authentication Cheat Sheet (account enumeration): an address with an account gets an invitation, not a membership, with the same answer as an unknown address', async () => {
    const existing = await signUpFresh('existing');
    const unknown = clientAddress();
    const [a, b] = [await owner.post(members(brandId), { email: existing.email, role: 'viewer' }), await owner.post(members(brandId), { email: unknown, role: 'viewer' })];
    expect(a.status).toBe(b.status);
    expect(a.status).toBe(201);
    // Same fields, same types, same words once the address, ids and times are set aside.
    const shape = (body: any, email: string) => JSON.parse(JSON.stringify(body).replaceAll(email, 'ADDRESS').replace(/"(id|expiresAt|createdAt)":"[^"]+"/g, '"$1":"X"'));
    expect(shape(a.body, existing.email)).toEqual(shape(b.body, unknown));
    expect(Object.keys(a.body).sort()).toEqual(['invitation', 'mailed']);
    const body = (email: string) => lastMailTo(email).text.replaceAll(email, 'ADDRESS').replace(/\/invite\/\S+/, '/invite/TOKEN');
    expect(body(existing.email)).toBe(body(unknown));
    // Nobody joined: the existing account is still outside until it accepts.
    expect(await memberRows(brandId, existing.id)).toEqual([]);
    expect((await existing.client.get(`/api/brands/${brandId}`)).status).toBe(404);
    const listed = (await owner.get(members(brandId))).body;
    expect(listed.members.map((m: { email: string }) => m.email)).not.toContain(existing.email);
    expect(listed.invitations.map((i: { email: string }) => i.email)).toEqual(expect.arrayContaining([existing.email, unknown]));
  });
});

describe('the captured-mail viewer', () => {
  it('V8.2.2 (ASVS 5.0): a message addressed to someone else is not found, on the page and in the API', async () => {
    const recipient = await signUpFresh('recipient');
    await owner.post(members(brandId), { email: recipient.email, role: 'viewer' });
    const theirs = lastMailTo(recipient.email);
    const reader = await signUpFresh('other-reader');
    const other = reader.client;
    expect((await other.get(`/app/mail?m=${theirs.id}`)).status).toBe(404);
    expect((await owner.get(`/app/mail?m=${theirs.id}`)).status).toBe(404); // the sender too: the link is the recipient's key
    const listed = (await other.get('/api/mail')).body.messages as { id: string; envelope: { to: string[] } }[];
    expect(listed.map((m) => m.id)).not.toContain(theirs.id);
    expect(listed.every((m) => m.envelope.to.includes(reader.email))).toBe(true);
    expect((await recipient.client.get(`/app/mail?m=${theirs.id}`)).status).toBe(200);
  });
});

describe('with other settings', () => {
  const servers: ChildProcess[] = [];
  let limited: string;
  let relayed: string;
  beforeAll(async () => {
    const common = { host: '127.0.0.1', databaseUrl: inject('databaseUrl'), siteUrl: baseUrl(), secret: 'test-secret-that-is-long-enough-for-better-auth', signInLimit: 10_000 };
    const [p1, p2] = [await freePort(), await freePort()];
    // No SMTP host at all: nothing leaves the machine, but each send still counts against the account.
    const a = startServer({ ...common, port: p1, mailSendLimit: 2 }, { quiet: true });
    // A relay that is not on loopback is real e-mail: the catcher folder must not be shown, even if one is named.
    const b = startServer({ ...common, port: p2, mail: { smtpHost: 'relay.invalid', smtpPort: 587, captureDir: inject('mailDir') } }, { quiet: true });
    servers.push(await a, await b);
    [limited, relayed] = [`http://127.0.0.1:${p1}`, `http://127.0.0.1:${p2}`];
  });
  afterAll(() => {
    for (const s of servers) s.kill('SIGTERM');
  });
  const at = (site: string, who: Client, method: string, path: string, body?: unknown) =>
    fetch(site + path, { method, headers: { cookie: who.cookieHeader(), 'content-type': 'application/json', origin: site }, body: body === undefined ? undefined : JSON.stringify(body) });

  it('V8.2.2 (ASVS 5.0): the viewer answers 404 when a real SMTP relay is configured', async () => {
    const { client: person } = await signUpFresh('relay-reader');
    for (const path of ['/api/mail', '/app/mail']) {
      expect((await at(relayed, person, 'GET', path)).status).toBe(404);
      expect((await fetch(relayed + path, { redirect: 'manual' })).status).toBe(404);
    }
  });

  it('V2.4.1 (ASVS 5.0): each account may send only MAIL_SEND_LIMIT messages an hour; the next is a 429 and saves nothing', async () => {
    const { client: sender } = await signUpFresh('busy-sender');
    const id = (await sender.post('/api/brands', { name: 'Chalkpit Cycles' })).body.brand.id;
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) statuses.push((await at(limited, sender, 'POST', members(id), { email: clientAddress(), role: 'viewer' })).status);
    expect(statuses).toEqual([201, 201, 429]);
    const refused = await at(limited, sender, 'POST', `/api/brands/${id}/briefs`, { template: 'new-identity', contactName: 'C', contactEmail: clientAddress() });
    expect(refused.status).toBe(429);
    expect((await refused.json()).error).toMatchObject({ code: 'too_many_messages', message: expect.stringMatching(/2 e-mails in the last hour/) });
    const [row] = await sql('SELECT count(*)::int AS n FROM invitations WHERE brand_id = $1', [id]);
    expect(row.n).toBe(2);
    expect((await sql('SELECT 1 FROM briefs WHERE brand_id = $1', [id])).length).toBe(0);
    // Another account has its own count.
    const { client: colleague } = await signUpFresh('quiet-sender');
    const theirs = (await colleague.post('/api/brands', { name: 'Flint Row Press' })).body.brand.id;
    expect((await at(limited, colleague, 'POST', members(theirs), { email: clientAddress(), role: 'viewer' })).status).toBe(201);
  });

  it('V2.4.1 (ASVS 5.0) and the OWASP Forgot Password Cheat Sheet (limit requests): a new address link can be asked for only a few times', async () => {
    const person = await signUpUnverified(clientAddress());
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) statuses.push((await person.client.post('/api/account/verification', { next: '/app' })).status);
    expect(statuses).toEqual([200, 200, 200, 429]);
    // The sign-up link and three more, nothing after.
    expect(mailTo(person.email)).toHaveLength(4);
    // better-auth's own open resend route is switched off: every resend goes through the limited one.
    expect((await new Client().post('/api/auth/send-verification-email', { email: person.email })).status).toBe(404);
  });
});
