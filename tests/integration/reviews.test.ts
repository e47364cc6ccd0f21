// Reviews: a request e-mailed to reviewers, comments anchored to a block id, replies, resolve, decisions; publish notices.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Client, joinBrand, signUpFresh } from '../support/client';
import { closeDb, sql } from '../support/db';
import { lastMailTo, linkIn, mailTo, waitForMail } from '../support/mailbox';
import { publishAndWait } from '../support/publish';

let designer: Client;
let designerEmail: string;
let reviewer: Client;
let reviewerEmail: string;
let brandId: string;
let reviewId: string;
let threadId: string;
const b = () => `/api/brands/${brandId}`;
const doc = { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 'colour-section', title: 'Colour', eyebrow: '', intro: '' } }, { type: 'paragraph', attrs: { id: 'colour-text' }, content: [{ type: 'text', text: 'Use Roast for headings.' }] }] };

beforeAll(async () => {
  ({ client: designer, email: designerEmail } = await signUpFresh('reviewed'));
  ({ client: reviewer, email: reviewerEmail } = await signUpFresh('reviewer'));
  brandId = (await designer.post('/api/brands', { name: 'Brackwater Rowing Club' })).body.brand.id;
  await joinBrand(designer, brandId, { client: reviewer, email: reviewerEmail }, 'reviewer');
  expect((await designer.request('PUT', `${b()}/guideline`, { baseRevision: 0, doc })).status).toBe(200);
});
afterAll(closeDb);

describe('requesting a review', () => {
  test('each reviewer is e-mailed a link to the review of the current revision', async () => {
    const r = await designer.post(`${b()}/reviews`, { message: 'Colour section first, please.' });
    expect(r.status).toBe(201);
    reviewId = r.body.review.id;
    expect(r.body.review).toMatchObject({ revision: 1, status: 'open' });
    expect(r.body.notified).toEqual([reviewerEmail]);
    const mail = lastMailTo(reviewerEmail);
    expect(mail.subject).toBe('Please review the Brackwater Rowing Club guidelines');
    const { url } = linkIn(mail, '/app/brands/');
    const page = await reviewer.get(new URL(url).pathname);
    expect(page.status).toBe(200);
    expect(page.body).toContain('Brackwater Rowing Club');
  });
});

describe('comments anchored to blocks', () => {
  test('a comment names a block of the draft; an unknown block or an empty comment is refused', async () => {
    const r = await reviewer.post(`${b()}/comments`, { blockId: 'colour-section', reviewId, body: 'Is Roast dark enough on the website?' });
    expect(r.status).toBe(201);
    threadId = r.body.comment.id;
    expect(r.body.comment).toMatchObject({ blockId: 'colour-section', revision: 1, blockPresent: true, resolvedAt: null });
    const unknown = await reviewer.post(`${b()}/comments`, { blockId: 'no-such-block', body: 'Hello' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.code).toBe('unknown_block');
    const empty = await reviewer.post(`${b()}/comments`, { blockId: 'colour-section', body: '   ' });
    expect(empty.status).toBe(400);
    const long = await reviewer.post(`${b()}/comments`, { blockId: 'colour-section', body: 'z'.repeat(4001) });
    expect(long.status).toBe(400);
    expect(long.body.error.message).toMatch(/4,000 characters/);
  });

  test('a reply joins the thread and its block; resolving hides the thread from the open list and the count', async () => {
    const reply = await designer.post(`${b()}/comments`, { parentId: threadId, body: 'It passes 7:1 on white; see the contrast block.' });
    expect(reply.status).toBe(201);
    expect(reply.body.comment).toMatchObject({ blockId: 'colour-section', parentId: threadId });
    const open = await designer.get(`${b()}/comments?open=1`);
    expect(open.body.comments.map((c: { id: string }) => c.id)).toEqual([threadId, reply.body.comment.id]);
    expect((await designer.get(`${b()}/reviews`)).body.openComments).toBe(1);
    const resolved = await reviewer.patch(`${b()}/comments/${threadId}`, { resolved: true });
    expect(resolved.status).toBe(200);
    expect(resolved.body.comment.resolvedBy).toBe('Test reviewer');
    expect((await designer.get(`${b()}/comments?open=1`)).body.comments).toEqual([]);
    expect((await designer.get(`${b()}/reviews`)).body.openComments).toBe(0);
    const rows = await sql(`SELECT action FROM audit_events WHERE brand_id = $1 AND action LIKE 'comment.%' ORDER BY created_at`, [brandId]);
    expect(rows.map((r) => r.action)).toEqual(['comment.add', 'comment.reply', 'comment.resolve']);
  });
});

describe('deciding', () => {
  test('an editor may not decide; asking for changes needs a note; approval is recorded and the requester is told', async () => {
    expect((await designer.post(`${b()}/reviews/${reviewId}/decision`, { outcome: 'approved' })).status).toBe(200);
    // The designer is the brand's owner, who may decide too; use a fresh request to check the reviewer path.
    const second = await designer.post(`${b()}/reviews`, {});
    const id2 = second.body.review.id;
    const noNote = await reviewer.post(`${b()}/reviews/${id2}/decision`, { outcome: 'changes_requested' });
    expect(noNote.status).toBe(400);
    const ok = await reviewer.post(`${b()}/reviews/${id2}/decision`, { outcome: 'approved', note: 'Good to go.' });
    expect(ok.status).toBe(200);
    expect(ok.body.review).toMatchObject({ status: 'approved', decidedBy: 'Test reviewer' });
    expect(lastMailTo(designerEmail).subject).toBe('Test reviewer approved the Brackwater Rowing Club draft');
    const summary = (await designer.get(`${b()}/reviews`)).body;
    expect(summary.latest).toMatchObject({ id: id2, status: 'approved', revision: 1 });
    const twice = await reviewer.post(`${b()}/reviews/${id2}/decision`, { outcome: 'approved' });
    expect(twice.status).toBe(409);
  });
});

describe('publish notices', () => {
  test('a follower gets the version note and the what-changed lines by e-mail when a version is published', async () => {
    expect((await reviewer.request('PUT', `${b()}/follow`)).body).toEqual({ following: true });
    expect((await reviewer.get(`${b()}/follow`)).body).toEqual({ following: true });
    const before = mailTo(reviewerEmail).length;
    await publishAndWait(designer, brandId, 'Colour section settled.');
    await waitForMail(reviewerEmail, before); // the notice goes out from a queue job once the version is ready
    const mail = lastMailTo(reviewerEmail);
    expect(mailTo(reviewerEmail).length).toBe(before + 1);
    expect(mail.subject).toMatch(/^Brackwater Rowing Club guidelines: version \d+ is out$/);
    expect(mail.text).toContain('Colour section settled.');
    const { url } = linkIn(mail, '/b/');
    expect((await fetch(url)).status).toBeLessThan(500);
    await reviewer.delete(`${b()}/follow`);
    expect((await reviewer.get(`${b()}/follow`)).body).toEqual({ following: false });
  });
});
