// Sign-up, sign-in and sign-out through better-auth on the real server and database.
import { randomUUID } from 'node:crypto';
import { afterAll, describe, expect, test } from 'vitest';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '@db/seeders/demo';
import { freePort } from '../../scripts/lib/postgres';
import { startServer } from '../../scripts/lib/prepare';
import { Client, baseUrl, signIn, verifyByMail } from '../support/client';
import { lastMailTo } from '../support/mailbox';
import { closeDb, sql } from '../support/db';
import { inject } from 'vitest';
import { request as httpRequest } from 'node:http';

afterAll(closeDb);

const fresh = () => `someone-${randomUUID().slice(0, 8)}@test.example`;

describe('sign-up', () => {
  test('creates an account and a session cookie that is httpOnly and SameSite=Lax', async () => {
    const client = new Client();
    const email = fresh();
    const r = await client.post('/api/auth/sign-up/email', { email, password: 'long-enough-pass', name: 'Ada Test' });
    expect(r.status).toBe(200);
    expect(r.body.user.email).toBe(email);
    const cookie = r.headers.getSetCookie().find((c) => c.includes('session_token'))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i); // plain http on loopback; https sites get Secure
    // The address is proven by the mailed link before the account may work on brands.
    expect(lastMailTo(email).subject).toBe('Confirm your e-mail address for Plumbline');
    const before = await client.get('/api/brands');
    expect(before.status).toBe(403);
    expect(before.body.error.code).toBe('email_unverified');
    await verifyByMail(client, email);
    expect((await client.get('/api/brands')).status).toBe(200);
    const [row] = await sql('SELECT count(*)::int AS n FROM session s JOIN "user" u ON u.id = s."userId" WHERE u.email = $1', [email]);
    expect(row.n).toBe(1);
  });

  test('refuses a duplicate e-mail and changes nothing', async () => {
    const email = fresh();
    await new Client().post('/api/auth/sign-up/email', { email, password: 'long-enough-pass', name: 'First' });
    const again = await new Client().post('/api/auth/sign-up/email', { email, password: 'another-long-pass', name: 'Second' });
    expect(again.status).toBe(422);
    expect(again.body.code).toMatch(/USER_ALREADY_EXISTS/);
    const rows = await sql('SELECT name FROM "user" WHERE email = $1', [email]);
    expect(rows).toEqual([{ name: 'First' }]);
  });

  test('refuses a short password with a message and creates no user', async () => {
    const email = fresh();
    const r = await new Client().post('/api/auth/sign-up/email', { email, password: 'short', name: 'Shorty' });
    expect(r.status).toBe(400);
    expect(r.body.code).toBe('PASSWORD_TOO_SHORT');
    expect(r.body.message).toBeTypeOf('string');
    expect(await sql('SELECT 1 FROM "user" WHERE email = $1', [email])).toHaveLength(0);
  });
});

describe('sign-in and sign-out', () => {
  test.each(DEMO_PEOPLE.map((p) => [p.key, p.email]))('demo %s signs in (%s)', async (_key, email) => {
    const client = await signIn(email, DEMO_PASSWORD);
    expect(client.signedIn).toBe(true);
  });

  test('a wrong password is refused in words', async () => {
    const r = await new Client().post('/api/auth/sign-in/email', { email: DEMO_PEOPLE[0].email, password: 'not-the-password' });
    expect(r.status).toBe(401);
    expect(r.body.code).toBe('INVALID_EMAIL_OR_PASSWORD');
  });

  test('sign-out ends the session', async () => {
    const client = await signIn(DEMO_PEOPLE[1].email);
    expect((await client.get('/api/brands')).status).toBe(200);
    expect((await client.post('/api/auth/sign-out', {})).status).toBe(200);
    expect((await client.get('/api/brands')).status).toBe(401);
  });

  test('a request from another origin is refused (origin check)', async () => {
    const r = await new Client().request('POST', '/api/auth/sign-in/email', { email: DEMO_PEOPLE[0].email, password: DEMO_PASSWORD }, { origin: 'http://evil.example' });
    expect(r.status).toBe(403);
  });
});

describe('rate limiter', () => {
  test('counts attempts in PostgreSQL, so the limit holds across two server processes', async () => {
    const siteUrl = baseUrl();
    const common = { host: '127.0.0.1', databaseUrl: inject('databaseUrl'), siteUrl, secret: 'test-secret-that-is-long-enough-for-better-auth', signInLimit: 3 };
    const ports = [await freePort(), await freePort()];
    const servers = await Promise.all(ports.map((port) => startServer({ ...common, port }, { quiet: true })));
    try {
      const email = `limited-${randomUUID().slice(0, 8)}@test.example`;
      // From a loopback address of its own, so the rest of the suite's sign-ins do not share its bucket.
      const attempt = (i: number) => postFrom('127.0.0.7', ports[i % 2], '/api/auth/sign-in/email', siteUrl, { email, password: 'wrong-password-here' });
      const statuses: number[] = [];
      for (let i = 0; i < 5; i++) statuses.push(await attempt(i));
      // Three attempts per minute per address, shared by both processes: the fourth is refused.
      expect(statuses.slice(0, 3)).toEqual([401, 401, 401]);
      expect(statuses.slice(3)).toEqual([429, 429]);
      const rows = await sql(`SELECT count(*)::int AS n FROM "rateLimit" WHERE key LIKE '%sign-in/email%'`);
      expect(rows[0].n).toBeGreaterThan(0);
    } finally {
      for (const s of servers) s.kill('SIGTERM');
    }
  });
});

/** POST JSON from a chosen local address; resolves to the status code. */
function postFrom(localAddress: string, port: number, path: string, origin: string, body: unknown): Promise<number> {
  return new Promise((ok, fail) => {
    const payload = JSON.stringify(body);
    const req = httpRequest(
      { host: '127.0.0.1', port, path, method: 'POST', localAddress, headers: { 'content-type': 'application/json', origin, 'content-length': Buffer.byteLength(payload) } },
      (res) => {
        res.resume();
        res.on('end', () => ok(res.statusCode ?? 0));
      },
    );
    req.on('error', fail);
    req.end(payload);
  });
}
