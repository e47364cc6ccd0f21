// The brief: sent by e-mail, answered without an account (autosaved, resumable), submitted, read and exported.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { baseUrl, Client, signUpFresh } from '../support/client';
import { closeDb, sql } from '../support/db';
import { lastMailTo, linkIn } from '../support/mailbox';
import { csvField } from '@/lib/briefs/questionnaire';

let designer: Client;
let designerEmail: string;
let brandId: string;
let briefId: string;
let token: string;
const anon = new Client();
const contact = `contact-${Date.now()}@client.example`;
const url = () => `/api/briefs/${token}`;

beforeAll(async () => {
  ({ client: designer, email: designerEmail } = await signUpFresh('briefer'));
  brandId = (await designer.post('/api/brands', { name: 'Fenwick Cycles' })).body.brand.id;
  const r = await designer.post(`/api/brands/${brandId}/briefs`, { template: 'new-identity', contactName: 'Ada Fenwick', contactEmail: contact, message: 'Looking forward to it.' });
  expect(r.status).toBe(201);
  briefId = r.body.brief.id;
  token = linkIn(lastMailTo(contact), '/brief/').token;
});
afterAll(closeDb);

describe('sending', () => {
  test('the contact gets an e-mail with the subject, the note and a link that opens the questionnaire', async () => {
    const mail = lastMailTo(contact);
    expect(mail.subject).toBe('Test briefer would like to hear about Fenwick Cycles');
    expect(mail.text).toContain('Looking forward to it.');
    const page = await fetch(linkIn(mail, '/brief/').url);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('Starting a new identity');
    expect(html).toContain('Who are the people you most want to reach?');
  });
  test('an unknown questionnaire is refused by name', async () => {
    const r = await designer.post(`/api/brands/${brandId}/briefs`, { template: 'nope', contactName: 'X', contactEmail: 'x@client.example' });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('unknown_template');
  });
});

describe('answering without an account', () => {
  test('autosaves merge, so a second save of other fields keeps the first; reopening shows both', async () => {
    expect((await anon.request('PUT', url(), { answers: { audience: 'Commuters who fix their own bikes.' } })).status).toBe(200);
    const r = await anon.request('PUT', url(), { answers: { values: ['Durable', 'Honest'], budget: '5,000 – 15,000' } });
    expect(r.status).toBe(200);
    expect(r.body.answered).toBe(3);
    const back = await anon.get(url());
    expect(back.body.brief.answers).toEqual({ audience: 'Commuters who fix their own bikes.', values: ['Durable', 'Honest'], budget: '5,000 – 15,000' });
    expect(back.body.brief.status).toBe('in_progress');
  });

  const bad: [string, unknown, number, RegExp][] = [
    ['an oversized answer (5,001 characters)', { answers: { audience: 'x'.repeat(5001) } }, 400, /longer than 5000 characters/],
    ['a choice that was not offered', { answers: { budget: 'A million' } }, 400, /offered answers/],
    ['an unknown question', { answers: { shoe_size: '42' } }, 400, /unknown field/],
    ['a body over 200 kB', { answers: { audience: 'y'.repeat(210_000) } }, 413, /too large/],
  ];
  test.each(bad)('%s is refused with a clear message and nothing saved is lost', async (_l, body, status, message) => {
    const r = await anon.request('PUT', url(), body);
    expect(r.status).toBe(status);
    expect(r.body.error.message).toMatch(message);
    expect((await anon.get(url())).body.brief.answers.audience).toBe('Commuters who fix their own bikes.');
  });

  test('submitting with required answers missing names them; after answering, it submits and locks', async () => {
    const early = await anon.post(`${url()}/submit`, {});
    expect(early.status).toBe(400);
    expect(early.body.error.code).toBe('answers_missing');
    expect(early.body.error.message).toContain('If the brand walked into a room');
    expect(early.body.error.details.map((d: { path: string }) => d.path)).toEqual(expect.arrayContaining(['personality', 'timeline']));
    await anon.request('PUT', url(), { answers: { personality: 'Cheerful mechanic', timeline: 'Before the spring rides', deliverables: ['Logo and mark', 'Signage'], competitors: ['=HYPERLINK("x")'] } });
    const r = await anon.post(`${url()}/submit`, {});
    expect(r.status).toBe(200);
    const late = await anon.request('PUT', url(), { answers: { audience: 'changed' } });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('already_submitted');
    expect(lastMailTo(designerEmail).subject).toBe('Ada Fenwick sent the answers for Fenwick Cycles');
  });

  test('a wrong token is a 404 and an expired link a 410, each with words a client can act on', async () => {
    const wrong = await anon.get(`/api/briefs/${'B'.repeat(43)}`);
    expect(wrong.status).toBe(404);
    expect(wrong.body.error.message).toMatch(/not valid/);
    const other = `late-${Date.now()}@client.example`;
    const created = await designer.post(`/api/brands/${brandId}/briefs`, { template: 'refresh', contactName: 'Late', contactEmail: other });
    const lateToken = linkIn(lastMailTo(other), '/brief/').token;
    await sql(`UPDATE briefs SET expires_at = now() - interval '1 day' WHERE id = $1`, [created.body.brief.id]);
    const r = await anon.request('PUT', `/api/briefs/${lateToken}`, { answers: { working: 'x' } });
    expect(r.status).toBe(410);
    expect(r.body.error.code).toBe('brief_expired');
    const page = await fetch(`${baseUrl()}/brief/${lateToken}`);
    expect(page.status).toBe(410);
    expect(await page.text()).toContain('has expired');
  });
});

describe('the designer’s side', () => {
  test('the answers are listed with the brand, and an audit row records the submission', async () => {
    const list = await designer.get(`/api/brands/${brandId}/briefs`);
    expect(list.body.briefs.find((b: { id: string }) => b.id === briefId)).toMatchObject({ status: 'submitted', contactEmail: contact });
    const detail = await designer.get(`/api/brands/${brandId}/briefs/${briefId}`);
    expect(detail.body.answers.personality).toBe('Cheerful mechanic');
    const rows = await sql(`SELECT action FROM audit_events WHERE target_id = $1 ORDER BY created_at`, [briefId]);
    expect(rows.map((r) => r.action)).toEqual(expect.arrayContaining(['brief.send', 'brief.answer', 'brief.submit']));
  });

  test('Markdown export holds each question and answer', async () => {
    const r = await designer.get(`/api/brands/${brandId}/briefs/${briefId}/export?format=md`);
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toContain('text/markdown');
    expect(r.body).toContain('**Who are the people you most want to reach?**');
    expect(r.body).toContain('- Durable');
  });

  test('CSV export follows RFC 4180 (CRLF rows, doubled quotes) and defuses formula cells (common practice, OWASP)', async () => {
    const r = await designer.get(`/api/brands/${brandId}/briefs/${briefId}/export?format=csv`);
    expect(r.headers.get('content-type')).toContain('text/csv');
    const text = r.body as string;
    expect(text.split('\r\n')[0]).toBe('section,question_id,question,answer');
    expect(text).toContain(`"'=HYPERLINK(""x"")"`);
    // RFC 4180 §2.6–2.7: fields with commas or quotes are enclosed in quotes, inner quotes doubled.
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('plain')).toBe('plain');
  });
});
