// E-mail end to end: what the fake SMTP server captured, parsed by mailparser (the reference parser), and the sent-mail list.
import { simpleParser } from 'mailparser';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { renderMail, renderTemplate } from '@/lib/mail/templates';
import { baseUrl, Client, signUpFresh } from '../support/client';
import { closeDb } from '../support/db';
import { lastMailTo, linkIn, mailTo } from '../support/mailbox';
import { unique } from './matrix/route';

let owner: Client;
let ownerEmail: string;
let brandId: string;
beforeAll(async () => {
  ({ client: owner, email: ownerEmail } = await signUpFresh('mailer'));
  brandId = (await owner.post('/api/brands', { name: 'Saltmarsh Ceramics' })).body.brand.id;
});
afterAll(closeDb);

const everyValue = {
  brandName: 'Brand', inviterName: 'Ina', roleLabel: 'reviewer', roleSummary: 'reads drafts', email: 'a@b.example', expiresOn: '1 May 2027',
  contactName: 'Cam', senderName: 'Sen', studioName: 'Studio', briefTitle: 'Brief', message: 'Hi', boardTitle: 'Board', itemCount: 3,
  outcomeWords: 'approved', kept: 2, dropped: 1, comment: 'Fine', reviewerName: 'Rev', requesterName: 'Req', revision: 4, deciderName: 'Dec',
  note: 'Note', versionNumber: 2, publisherName: 'Pub', summary: ['one'], followLink: 'http://127.0.0.1/f', name: 'Nia', hours: 24,
  setTitle: 'Routes', routeCount: 2, routeNames: ['Ash', 'Oak'], chosenName: 'Oak', routeComments: ['Ash: too cold'],
};

describe('templates', () => {
  test('values are HTML-escaped in the HTML part and left as typed in the text part', () => {
    expect(renderTemplate('<p>{{name}}</p>', { name: 'Tom & <Jerry>' }, 'html')).toBe('<p>Tom &amp; &lt;Jerry&gt;</p>');
    expect(renderTemplate('{{name}}', { name: 'Tom & <Jerry>' }, 'text')).toBe('Tom & <Jerry>');
  });
  test('a list section repeats per item; a section without {{.}} shows once', () => {
    expect(renderTemplate('{{#xs}}Changes:{{/xs}}{{#xs}} [{{.}}]{{/xs}}{{^ys}} none{{/ys}}', { xs: ['a', 'b'], ys: [] }, 'text')).toBe('Changes: [a] [b] none');
  });
  test('every template renders a subject, a text part and an HTML part holding the link', () => {
    for (const name of ['invitation', 'brief-request', 'brief-submitted', 'board-request', 'board-decision', 'palette-routes-request', 'palette-routes-decision', 'review-request', 'review-decision', 'published', 'verify-email']) {
      const m = renderMail(name, { ...everyValue, link: 'http://127.0.0.1/x/abc' });
      expect(m.subject, name).not.toMatch(/\{\{|\s{2}|^\s|:\s*$/);
      expect(m.text, name).toContain('http://127.0.0.1/x/abc');
      expect(m.html, name).toContain('href="http://127.0.0.1/x/abc"');
    }
  });
});

describe('sending through the fake', () => {
  test('an invitation reaches the invited address with a From header that parses as an RFC 5322 mailbox', async () => {
    const invitee = unique();
    const r = await owner.post(`/api/brands/${brandId}/members`, { email: invitee, role: 'reviewer' });
    expect(r.status).toBe(201);
    expect(r.body.mailed).toBe(true);
    const mail = lastMailTo(invitee);
    expect(mail.envelope.to).toEqual([invitee]);
    expect(mail.to).toEqual([invitee]);
    expect(mail.subject).toBe(`Test mailer invited you to Saltmarsh Ceramics on Plumbline`);
    // RFC 2606: .invalid is reserved and never resolves, so the default sender cannot reach anyone by accident.
    expect(mail.from).toBe('mail@plumbline.invalid');
    expect(mail.brandId).toBe(brandId);
    expect(mail.html).toContain('Accept the invitation');
  });

  test('the captured HTML and text agree with mailparser reading a message we build the same way', async () => {
    // mailparser is the reference: a multipart/alternative message with both parts must come back as both.
    const m = renderMail('invitation', { brandName: 'Q & A', link: 'http://127.0.0.1/invite/x', email: 'a@b.example' });
    const raw = `From: a@b.example\r\nTo: c@d.example\r\nSubject: ${m.subject}\r\nMIME-Version: 1.0\r\nContent-Type: multipart/alternative; boundary=zz\r\n\r\n--zz\r\nContent-Type: text/plain; charset=utf-8\r\n\r\n${m.text}\r\n--zz\r\nContent-Type: text/html; charset=utf-8\r\n\r\n${m.html}\r\n--zz--\r\n`;
    const parsed = await simpleParser(raw);
    expect(parsed.subject).toBe(m.subject);
    expect(parsed.text).toContain('Q & A');
    expect(parsed.html).toContain('Q &amp; A');
  });

  test('the link in the e-mail is on the configured site and works when followed', async () => {
    const invitee = unique();
    await owner.post(`/api/brands/${brandId}/members`, { email: invitee, role: 'viewer' });
    const { url } = linkIn(lastMailTo(invitee), '/invite/');
    expect(url.startsWith(baseUrl())).toBe(true);
    const page = await fetch(url);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('Join Saltmarsh Ceramics as viewer');
  });
});

describe('the captured-mail viewer', () => {
  let invitee: { client: Client; email: string };
  beforeAll(async () => {
    invitee = await signUpFresh('mail-reader');
    expect((await owner.post(`/api/brands/${brandId}/members`, { email: invitee.email, role: 'viewer' })).status).toBe(201);
  });

  test('a person reads the mail sent to their own address; the sender and a stranger do not; anonymous is refused', async () => {
    const mine = await invitee.client.get('/api/mail');
    expect(mine.status).toBe(200);
    expect(mine.body.messages.length).toBeGreaterThan(0);
    expect(mine.body.messages.every((m: { envelope: { to: string[] } }) => m.envelope.to.includes(invitee.email))).toBe(true);
    expect(mine.body.messages.some((m: { brandId: string }) => m.brandId === brandId)).toBe(true);
    const sender = await owner.get('/api/mail');
    expect(sender.body.messages.some((m: { brandId: string }) => m.brandId === brandId)).toBe(false);
    const { client: stranger } = await signUpFresh('stranger');
    const theirs = await stranger.get('/api/mail');
    expect(theirs.body.messages.some((m: { brandId: string }) => m.brandId === brandId)).toBe(false);
    expect((await new Client().get('/api/mail')).status).toBe(401);
    // The owner's own inbox holds only the link that proved their address.
    expect(mailTo(ownerEmail).map((m) => m.subject)).toEqual(['Confirm your e-mail address for Plumbline']);
  });

  test('the viewer page shows the captured subject to its recipient', async () => {
    const page = await invitee.client.get('/app/mail');
    expect(page.status).toBe(200);
    expect(page.body).toContain('invited you to Saltmarsh Ceramics');
    expect((await owner.get('/app/mail')).body).not.toContain('invited you to Saltmarsh Ceramics');
  });
});
