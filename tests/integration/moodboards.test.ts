// Mood boards: pieces (image, swatch, type, note), sent by e-mail, decided by the client's link, adopted into the identity.
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Client, signUpFresh } from '../support/client';
import { closeDb, sql } from '../support/db';
import { lastMailTo, linkIn } from '../support/mailbox';

let designer: Client;
let designerEmail: string;
let brandId: string;
let boardId: string;
const b = () => `/api/brands/${brandId}/moodboards`;
const contact = `board-${Date.now()}@client.example`;

/** CRC-32 as the PNG specification (Annex D) defines it, for a hand-made chunk. */
function crc32(bytes: Buffer): number {
  let c = ~0;
  for (const byte of bytes) {
    c ^= byte;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  }
  return ~c >>> 0;
}
function pngClaiming(width: number, height: number): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
    const out = Buffer.alloc(body.length + 8);
    out.writeUInt32BE(data.length, 0);
    body.copy(out, 4);
    out.writeUInt32BE(crc32(body), body.length + 4);
    return out;
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([8, 2, 0, 0, 0], 8);
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', ihdr), chunk('IDAT', Buffer.from([0x78, 0x9c, 0x03, 0x00, 0x00, 0x00, 0x00, 0x01])), chunk('IEND', Buffer.alloc(0))]);
}

beforeAll(async () => {
  ({ client: designer, email: designerEmail } = await signUpFresh('boarder'));
  brandId = (await designer.post('/api/brands', { name: 'Ottery Tea House' })).body.brand.id;
});
afterAll(closeDb);

describe('building a board', () => {
  test('a board starts with swatches whose colour goes through the one parser (CSS Color 4 oklch → sRGB hex)', async () => {
    const r = await designer.post(b(), { title: 'Garden at dusk', items: [{ kind: 'swatch', name: 'Leaf', value: '#5d7a3a' }, { kind: 'swatch', name: 'Pink', value: 'rgb(232 180 184)' }, { kind: 'type', family: 'Fraunces', sample: 'Afternoon tea' }, { kind: 'note', caption: 'Soft, never twee.' }] });
    expect(r.status).toBe(201);
    boardId = r.body.board.id;
    // CSS Color 4: rgb(232 180 184) is #e8b4b8.
    expect(r.body.board.items[1].swatch).toEqual({ name: 'Pink', value: 'rgb(232 180 184)', hex: '#e8b4b8' });
    expect((await designer.get('/api/brands/' + brandId + '/moodboards')).body.direction.state).toBe('waiting');
  });

  test('a bad colour, an image that is not an image, and an image over the pixel limit are refused; the board keeps its pieces', async () => {
    const bad = await designer.post(`${b()}/${boardId}/items`, { kind: 'swatch', name: 'X', value: 'not-a-colour' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('invalid_color');
    const text = await designer.upload(`${b()}/${boardId}/items`, 'photo.png', 'hello', 'image/png');
    expect(text.status).toBe(400);
    expect(text.body.error.code).toBe('not_an_image');
    // A PNG whose IHDR (PNG spec §11.2.2) claims 10000 × 10000 pixels (100 MP) is refused from its header alone.
    const huge = pngClaiming(10_000, 10_000);
    const big = await designer.upload(`${b()}/${boardId}/items`, 'huge.png', huge, 'image/png');
    expect(big.status).toBe(413);
    expect((await designer.get(`${b()}/${boardId}`)).body.board.items).toHaveLength(4);
  });

  test('an uploaded image is measured by sharp and served back whole, to members only', async () => {
    const png = await sharp({ create: { width: 30, height: 20, channels: 3, background: '#8a5a00' } }).png().toBuffer();
    const r = await designer.upload(`${b()}/${boardId}/items`, 'swatch.png', png, 'image/png', { caption: 'Teapot glaze' });
    expect(r.status).toBe(201);
    expect(r.body.item.image).toEqual({ width: 30, height: 20 });
    const path = `/api/brands/${brandId}/moodboards/${boardId}/items/${r.body.item.id}/image`;
    const back = await designer.get(path);
    expect(back.status).toBe(200);
    expect(back.headers.get('content-type')).toBe('image/png');
    expect(Number(back.headers.get('content-length'))).toBe(png.length);
    expect((await new Client().get(path)).status).toBe(401);
  });
});

describe('the client’s decision', () => {
  let token: string;
  test('sending mails the contact a link that opens the board without an account', async () => {
    const r = await designer.post(`${b()}/${boardId}/send`, { contactName: 'June Ottery', contactEmail: contact });
    expect(r.status).toBe(200);
    const mail = lastMailTo(contact);
    expect(mail.subject).toBe('A direction for Ottery Tea House is ready for your decision');
    const link = linkIn(mail, '/board/');
    token = link.token;
    const page = await fetch(link.url);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('Garden at dusk');
  });

  test('a decision naming a piece not on the board is refused; nothing is recorded', async () => {
    const r = await new Client().post(`/api/moodboards/${token}/decision`, { name: 'June', outcome: 'approved', items: [{ id: crypto.randomUUID(), verdict: 'keep' }] });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('unknown_item');
    expect(await sql('SELECT * FROM mood_board_decisions WHERE board_id = $1', [boardId])).toHaveLength(0);
  });

  test('keep/drop per piece and approval are recorded with an audit row; the designer is told; direction is approved', async () => {
    const board = (await new Client().get(`/api/moodboards/${token}`)).body.board;
    const items = board.items.map((i: { id: string; kind: string; swatch?: { name: string } }) => ({ id: i.id, verdict: i.swatch?.name === 'Pink' ? 'drop' : 'keep', comment: i.swatch?.name === 'Pink' ? 'Too sweet' : '' }));
    const r = await new Client().post(`/api/moodboards/${token}/decision`, { name: 'June Ottery', outcome: 'approved', comment: 'Yes, this one.', items });
    expect(r.status).toBe(200);
    expect(r.body.board.status).toBe('approved');
    const [d] = await sql('SELECT outcome, decided_by_name, verdicts FROM mood_board_decisions WHERE board_id = $1', [boardId]);
    expect(d.outcome).toBe('approved');
    expect(d.decided_by_name).toBe('June Ottery');
    expect(d.verdicts.filter((v: { verdict: string }) => v.verdict === 'drop')).toHaveLength(1);
    const [a] = await sql(`SELECT details FROM audit_events WHERE target_id = $1 AND action = 'moodboard.decide'`, [boardId]);
    expect(a.details).toMatchObject({ outcome: 'approved', kept: items.length - 1, dropped: 1 });
    expect(lastMailTo(designerEmail).subject).toBe('June Ottery approved: Garden at dusk');
    expect((await designer.get(b())).body.direction).toMatchObject({ state: 'approved', board: { id: boardId } });
    const again = await new Client().post(`/api/moodboards/${token}/decision`, { name: 'June', outcome: 'changes_requested', items: [] });
    expect(again.status).toBe(409);
  });

  test('the kept swatches join the identity in one step; a second time adds nothing', async () => {
    const r = await designer.post(`${b()}/${boardId}/adopt-swatches`, {});
    expect(r.status).toBe(200);
    expect(r.body.added.map((c: { name: string; hex: string }) => [c.name, c.hex])).toEqual([['Leaf', '#5d7a3a']]);
    const again = await designer.post(`${b()}/${boardId}/adopt-swatches`, {});
    expect(again.body.added).toEqual([]);
    expect(again.body.skipped).toEqual(['Leaf']);
    const identity = await designer.get(`/api/brands/${brandId}/identity`);
    expect(identity.body.colors?.map((c: { hex: string }) => c.hex) ?? identity.body.identity?.colors.map((c: { hex: string }) => c.hex)).toContain('#5d7a3a');
  });

  test('a wrong board token is a clear 404', async () => {
    const r = await new Client().get(`/api/moodboards/${'C'.repeat(43)}`);
    expect(r.status).toBe(404);
    expect(r.body.error.message).toMatch(/not valid/);
  });
});
