// Mood boards: images, swatches, type samples and notes sent to a client contact for a decision on direction.
import type { Readable } from 'node:stream';
import { Op } from 'sequelize';
import { Brand, BrandColor } from '@db/models';
import { MoodBoard, MoodBoardDecision, MoodBoardItem, type Verdict } from '@db/models/collaboration';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import { parseColor } from '@/lib/color';
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
import { createColor } from '@/lib/identity/identity.server';
import type { IdentityColor } from '@/lib/identity/types';
import { hashToken, longDate, newToken } from '@/lib/invitations/tokens';
import { peopleById } from '@/lib/invitations/people.server';
import { sendTemplate, siteLink, type MailOutcome } from '@/lib/mail/mail.server';
import { storage } from '@/lib/storage/index.server';
import { newKey } from '@/lib/storage/storage';
import { inspectUpload } from '@/lib/uploads/inspect.server';
import { UPLOAD_RULES } from '@/lib/uploads/rules';
import type { BoardItemView, BoardView, DecisionView, PublicBoard } from './views';

export type { BoardItemView, BoardView, DecisionView, PublicBoard } from './views';

export const BOARD_DAYS = 30;
export const MAX_BOARD_IMAGE_BYTES = UPLOAD_RULES.boardImage.maxBytes;
/** Largest image accepted, in pixels (about 50 megapixels), checked by sharp before any decoding. */
export const MAX_BOARD_IMAGE_PIXELS = UPLOAD_RULES.boardImage.maxPixels;
export const MAX_BOARD_ITEMS = 60;

const itemView = (i: MoodBoardItem): BoardItemView => ({
  id: i.id,
  kind: i.kind,
  position: i.position,
  caption: i.caption,
  ...(i.kind === 'image' ? { image: { width: i.width ?? 0, height: i.height ?? 0 } } : {}),
  ...(i.kind === 'swatch' ? { swatch: { name: i.colorName ?? '', value: i.colorValue ?? '', hex: i.colorHex ?? '#000000' } } : {}),
  ...(i.kind === 'type' ? { type: { family: i.fontFamily ?? '', sample: i.sampleText ?? '' } } : {}),
  verdict: i.verdict,
  verdictComment: i.verdictComment,
});

const decisionView = (d: MoodBoardDecision): DecisionView => ({
  id: d.id,
  outcome: d.outcome,
  comment: d.comment,
  decidedBy: d.decidedByName,
  decidedAt: d.createdAt.toISOString(),
  kept: d.verdicts.filter((v) => v.verdict === 'keep').length,
  dropped: d.verdicts.filter((v) => v.verdict === 'drop').length,
});

async function views(boards: MoodBoard[]): Promise<BoardView[]> {
  if (!boards.length) return [];
  const ids = boards.map((b) => b.id);
  const [items, decisions, people] = await Promise.all([
    MoodBoardItem.findAll({ where: { boardId: ids }, order: [['position', 'ASC'], ['createdAt', 'ASC']] }),
    MoodBoardDecision.findAll({ where: { boardId: ids }, order: [['createdAt', 'DESC']] }),
    peopleById(boards.map((b) => b.createdById)),
  ]);
  return boards.map((b) => ({
    id: b.id,
    title: b.title,
    intro: b.intro,
    status: b.status,
    contactName: b.contactName,
    contactEmail: b.contactEmail,
    sentAt: b.sentAt?.toISOString() ?? null,
    expiresAt: b.expiresAt?.toISOString() ?? null,
    createdBy: people.get(b.createdById ?? '')?.name ?? null,
    items: items.filter((i) => i.boardId === b.id).map(itemView),
    decisions: decisions.filter((d) => d.boardId === b.id).map(decisionView),
  }));
}

/** The brand's boards, newest first, with items and decisions. */
export async function listBoards(brand: Brand): Promise<BoardView[]> {
  return views(await MoodBoard.findAll({ where: { brandId: brand.id }, order: [['createdAt', 'DESC']] }));
}

async function boardOf(brand: Brand, boardId: string): Promise<MoodBoard> {
  const board = await MoodBoard.findOne({ where: { id: boardId, brandId: brand.id } });
  if (!board) throw new ApiError(404, 'not_found', 'That mood board was not found on this brand.');
  return board;
}

export async function boardView(brand: Brand, boardId: string): Promise<BoardView> {
  return (await views([await boardOf(brand, boardId)]))[0];
}

const auditOf = (caller: Caller | null, brand: Brand, action: string, targetId: string, details: Record<string, unknown> = {}) =>
  ({ actorId: caller?.id ?? null, action, targetType: 'moodBoard', targetId, brandId: brand.id, studioId: brand.studioId, details });

export type NewItem =
  | { kind: 'swatch'; name: string; value: string; caption?: string }
  | { kind: 'type'; family: string; sample: string; caption?: string }
  | { kind: 'note'; caption: string };

/** Column values of a non-image item; a swatch's colour goes through the one colour parser. */
function itemColumns(item: NewItem) {
  const base = { caption: item.caption ?? '', storageKey: null, contentType: null, width: null, height: null, colorName: null, colorValue: null, colorHex: null, fontFamily: null, sampleText: null, verdict: null, verdictComment: null };
  if (item.kind === 'swatch') {
    const parsed = parseColor(item.value);
    if (!parsed.ok) throw new ApiError(400, 'invalid_color', parsed.error.message, { path: 'value' });
    return { ...base, colorName: item.name, colorValue: item.value, colorHex: parsed.color.hex };
  }
  if (item.kind === 'type') return { ...base, fontFamily: item.family, sampleText: item.sample };
  if (!item.caption.trim()) throw new ApiError(400, 'invalid_input', 'A note needs some text.', { path: 'caption' });
  return base;
}

function refuseApproved(board: MoodBoard) {
  if (board.status === 'approved') throw new ApiError(409, 'board_approved', 'This board has been approved as the direction; start a new board for further ideas.');
}

/** Start a board, optionally with swatches, type samples and notes. */
export async function createBoard(caller: Caller, brand: Brand, body: { title: string; intro?: string; items?: NewItem[] }): Promise<BoardView> {
  const columns = (body.items ?? []).map(itemColumns);
  const board = await sequelize.transaction(async (t) => {
    const row = await MoodBoard.create(
      { brandId: brand.id, title: body.title, intro: body.intro ?? '', contactName: null, contactEmail: null, tokenHash: null, expiresAt: null, sentAt: null, createdById: caller.id },
      { transaction: t },
    );
    await MoodBoardItem.bulkCreate(columns.map((c, i) => ({ ...c, boardId: row.id, kind: body.items![i].kind, position: i })), { transaction: t });
    await audit(auditOf(caller, brand, 'moodboard.create', row.id, { title: body.title, items: columns.length }), t);
    return row;
  });
  return boardView(brand, board.id);
}

export async function updateBoard(caller: Caller, brand: Brand, boardId: string, changes: { title?: string; intro?: string }): Promise<BoardView> {
  const board = await boardOf(brand, boardId);
  await sequelize.transaction(async (t) => {
    await board.update(changes, { transaction: t });
    await audit(auditOf(caller, brand, 'moodboard.update', board.id, changes), t);
  });
  return boardView(brand, board.id);
}

export async function deleteBoard(caller: Caller, brand: Brand, boardId: string): Promise<void> {
  const board = await boardOf(brand, boardId);
  const keys = (await MoodBoardItem.findAll({ where: { boardId: board.id, storageKey: { [Op.ne]: null } }, attributes: ['storageKey'] })).map((i) => i.storageKey!);
  await sequelize.transaction(async (t) => {
    await audit(auditOf(caller, brand, 'moodboard.delete', board.id, { title: board.title }), t);
    await board.destroy({ transaction: t });
  });
  await Promise.all(keys.map((k) => storage.delete(k)));
}

async function nextPosition(boardId: string): Promise<number> {
  const count = await MoodBoardItem.count({ where: { boardId } });
  if (count >= MAX_BOARD_ITEMS) throw new ApiError(409, 'board_full', `A board holds at most ${MAX_BOARD_ITEMS} pieces; start a second board.`);
  return ((await MoodBoardItem.max<number, MoodBoardItem>('position', { where: { boardId } })) ?? -1) + 1;
}

/** Add a swatch, type sample or note. */
export async function addItem(caller: Caller, brand: Brand, boardId: string, item: NewItem): Promise<BoardItemView> {
  const board = await boardOf(brand, boardId);
  refuseApproved(board);
  const columns = itemColumns(item);
  const position = await nextPosition(board.id);
  const row = await sequelize.transaction(async (t) => {
    const created = await MoodBoardItem.create({ ...columns, boardId: board.id, kind: item.kind, position }, { transaction: t });
    await audit(auditOf(caller, brand, 'moodboard.item.add', board.id, { itemId: created.id, kind: item.kind }), t);
    return created;
  });
  return itemView(row);
}

/** Add an uploaded image, read by the one upload inspector (type from its bytes, pixel cap before decoding) before anything is stored. */
export async function addImage(caller: Caller, brand: Brand, boardId: string, file: File, caption: string): Promise<BoardItemView> {
  const board = await boardOf(brand, boardId);
  refuseApproved(board);
  const bytes = Buffer.from(await file.arrayBuffer());
  const image = await inspectUpload(bytes, { as: 'boardImage', filename: file.name });
  const position = await nextPosition(board.id);
  const key = newKey(brand.id, 'board', image.ext);
  await storage.put(key, bytes, image.mime);
  try {
    const row = await sequelize.transaction(async (t) => {
      const created = await MoodBoardItem.create(
        { boardId: board.id, kind: 'image', position, caption, storageKey: key, contentType: image.mime, width: image.width!, height: image.height!, colorName: null, colorValue: null, colorHex: null, fontFamily: null, sampleText: null, verdict: null, verdictComment: null },
        { transaction: t },
      );
      await audit(auditOf(caller, brand, 'moodboard.item.add', board.id, { itemId: created.id, kind: 'image', bytes: bytes.length }), t);
      return created;
    });
    return itemView(row);
  } catch (err) {
    await storage.delete(key);
    throw err;
  }
}

export async function deleteItem(caller: Caller, brand: Brand, boardId: string, itemId: string): Promise<void> {
  const board = await boardOf(brand, boardId);
  refuseApproved(board);
  const item = await MoodBoardItem.findOne({ where: { id: itemId, boardId: board.id } });
  if (!item) throw new ApiError(404, 'not_found', 'That piece was not found on this board.');
  await sequelize.transaction(async (t) => {
    await item.destroy({ transaction: t });
    await audit(auditOf(caller, brand, 'moodboard.item.remove', board.id, { itemId, kind: item.kind }), t);
  });
  if (item.storageKey) await storage.delete(item.storageKey);
}

/** An image piece as a stream from storage (a camera original may be 15 MB): never held whole. */
async function imageBytes(boardId: string, itemId: string): Promise<{ body: { stream: Readable; size: number }; contentType: string }> {
  const item = await MoodBoardItem.findOne({ where: { id: itemId, boardId, kind: 'image' } });
  const stored = item?.storageKey ? await storage.getStream(item.storageKey) : null;
  if (!item || !stored) throw new ApiError(404, 'not_found', 'That image was not found on this board.');
  return { body: { stream: stored.stream, size: stored.size }, contentType: item.contentType ?? 'application/octet-stream' };
}

export async function boardImage(brand: Brand, boardId: string, itemId: string) {
  return imageBytes((await boardOf(brand, boardId)).id, itemId);
}

/** E-mail the board to a client contact for a decision; a new link replaces any earlier one. */
export async function sendBoard(caller: Caller, brand: Brand, boardId: string, body: { contactName: string; contactEmail: string; message?: string }): Promise<{ board: BoardView; mail: MailOutcome }> {
  const board = await boardOf(brand, boardId);
  refuseApproved(board);
  const itemCount = await MoodBoardItem.count({ where: { boardId: board.id } });
  if (!itemCount) throw new ApiError(409, 'board_empty', 'Add at least one image, swatch, type sample or note before sending the board.');
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + BOARD_DAYS * 86_400_000);
  await sequelize.transaction(async (t) => {
    await board.update({ status: 'sent', contactName: body.contactName, contactEmail: body.contactEmail, tokenHash: hash, expiresAt, sentAt: new Date() }, { transaction: t });
    await audit(auditOf(caller, brand, 'moodboard.send', board.id, { contactEmail: body.contactEmail }), t);
  });
  const mail = await sendTemplate(
    body.contactEmail,
    'board-request',
    { contactName: body.contactName, senderName: caller.name || caller.email, boardTitle: board.title, brandName: brand.name, itemCount, message: body.message ?? '', expiresOn: longDate(expiresAt), link: siteLink(`/board/${token}`) },
    brand.id,
  );
  return { board: await boardView(brand, board.id), mail };
}

// ---------------------------------------------------------------- the client's side, by token

async function boardByToken(token: string): Promise<{ board: MoodBoard; brand: Brand }> {
  const board = await MoodBoard.findOne({ where: { tokenHash: hashToken(token) } });
  if (!board) throw new ApiError(404, 'not_found', 'This mood-board link is not valid. Check that the whole link was copied from the e-mail.');
  if (board.status !== 'approved' && board.expiresAt && board.expiresAt.getTime() <= Date.now()) {
    throw new ApiError(410, 'board_expired', `This mood-board link has expired (links work for ${BOARD_DAYS} days). Ask your designer to send it again.`);
  }
  return { board, brand: (await Brand.findByPk(board.brandId))! };
}

export async function openBoard(token: string): Promise<PublicBoard> {
  const { board, brand } = await boardByToken(token);
  const [v] = await views([board]);
  return { brandName: brand.name, title: v.title, intro: v.intro, status: v.status, contactName: v.contactName, items: v.items, decisions: v.decisions };
}

export async function boardImageByToken(token: string, itemId: string) {
  const { board } = await boardByToken(token);
  return imageBytes(board.id, itemId);
}

export interface DecisionInput {
  name: string;
  outcome: 'approved' | 'changes_requested';
  comment?: string;
  items: { id: string; verdict: Verdict; comment?: string }[];
}

/** Record the client's decision: each piece kept or dropped, the board approved or sent back. */
export async function decideBoard(token: string, input: DecisionInput): Promise<PublicBoard> {
  const { board, brand } = await boardByToken(token);
  if (board.status === 'approved') throw new ApiError(409, 'already_approved', 'This direction was already approved. Your designer will be in touch about the next step.');
  if (board.status !== 'sent') throw new ApiError(409, 'not_open', 'This board is not waiting for a decision at the moment.');
  const items = await MoodBoardItem.findAll({ where: { boardId: board.id } });
  const known = new Set(items.map((i) => i.id));
  const unknown = input.items.filter((v) => !known.has(v.id));
  if (unknown.length) throw new ApiError(400, 'unknown_item', 'The board changed while you were deciding. Reload the page to see the current pieces.', unknown.map((u) => ({ path: u.id, message: 'not on this board' })));
  const verdicts = input.items.map((v) => ({ itemId: v.id, verdict: v.verdict, comment: v.comment?.trim() ?? '' }));
  await sequelize.transaction(async (t) => {
    await MoodBoardDecision.create({ boardId: board.id, outcome: input.outcome, comment: input.comment?.trim() ?? '', decidedByName: input.name, decidedByEmail: board.contactEmail, verdicts }, { transaction: t });
    for (const v of verdicts) await MoodBoardItem.update({ verdict: v.verdict, verdictComment: v.comment || null }, { where: { id: v.itemId }, transaction: t });
    await board.update({ status: input.outcome }, { transaction: t });
    await audit(auditOf(null, brand, 'moodboard.decide', board.id, { outcome: input.outcome, by: input.name, email: board.contactEmail, kept: verdicts.filter((v) => v.verdict === 'keep').length, dropped: verdicts.filter((v) => v.verdict === 'drop').length }), t);
  });
  const creator = (await peopleById([board.createdById])).get(board.createdById ?? '');
  if (creator) {
    await sendTemplate(
      creator.email,
      'board-decision',
      {
        contactName: input.name,
        outcomeWords: input.outcome === 'approved' ? 'approved' : 'asked for changes to',
        boardTitle: board.title,
        brandName: brand.name,
        kept: verdicts.filter((v) => v.verdict === 'keep').length,
        dropped: verdicts.filter((v) => v.verdict === 'drop').length,
        comment: input.comment ?? '',
        link: siteLink(`/app/brands/${brand.id}/client#board-${board.id}`),
      },
      brand.id,
    );
  }
  return openBoard(token);
}

/** Add an approved board's kept swatches to the identity's palette in one step; colours already there are skipped. */
export async function adoptSwatches(caller: Caller, brand: Brand, boardId: string): Promise<{ added: IdentityColor[]; skipped: string[] }> {
  const board = await boardOf(brand, boardId);
  if (board.status !== 'approved') throw new ApiError(409, 'not_approved', 'Only an approved board’s swatches can join the identity. Send the board for a decision first.');
  const swatches = await MoodBoardItem.findAll({ where: { boardId: board.id, kind: 'swatch' }, order: [['position', 'ASC']] });
  const present = new Set((await BrandColor.findAll({ where: { brandId: brand.id }, attributes: ['hex'] })).map((c) => c.hex.toLowerCase()));
  const added: IdentityColor[] = [];
  const skipped: string[] = [];
  for (const s of swatches) {
    if (s.verdict === 'drop') continue;
    if (present.has((s.colorHex ?? '').toLowerCase())) {
      skipped.push(s.colorName ?? s.colorHex ?? '');
      continue;
    }
    added.push(await createColor(caller, brand, { name: (s.colorName || s.colorHex || 'Colour').slice(0, 80), value: s.colorValue ?? s.colorHex! }));
    present.add((s.colorHex ?? '').toLowerCase());
  }
  await audit(auditOf(caller, brand, 'moodboard.adopt', board.id, { added: added.map((c) => c.id), skipped }));
  return { added, skipped };
}
