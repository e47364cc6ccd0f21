// The demo's conversations with the client: an answered brief, an approved mood board, a review of the draft,
// and the designer following the brand. Added once; running again leaves them alone.
import { randomBytes, createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Sequelize } from 'sequelize';
import { AuditEvent, Brand, GuidelineDraft } from '@db/models';
import { Brief, BrandFollow, MoodBoard, MoodBoardDecision, MoodBoardItem, ReviewComment, ReviewRequest } from '@db/models/collaboration';

/** A stored hash of a token nobody holds: seeded links are records, not working links. */
const unusedHash = () => createHash('sha256').update(randomBytes(32)).digest('hex');
const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000);

const ANSWERS = {
  audience: 'Neighbourhood regulars who come in before work, and the cafés in the valley that buy our beans wholesale.',
  values: ['Careful sourcing', 'Plain speaking', 'Warmth'],
  personality: 'A friendly roaster in a canvas apron: knows a lot, never shows off.',
  never: 'Precious, expensive-looking, or like a chain.',
  competitors: ['The supermarket own-brand', 'Two city roasters with subscription boxes'],
  likes: 'Old seed-packet labels, enamel signs, letterpress menus.',
  dislikes: 'Black-and-gold luxury packaging; anything with a moustache.',
  deliverables: ['Logo and mark', 'Colour palette', 'Type system', 'Brand guidelines', 'Packaging'],
  timeline: 'New bags on the shelf by the spring market.',
  budget: '5,000 – 15,000',
};

export async function seedCollaboration(sequelize: Sequelize, people: { designer: string; editor: string; reviewer: string }): Promise<void> {
  const brand = await Brand.findOne({ where: { slug: 'larchmere-coffee' } });
  if (!brand) return;
  await sequelize.transaction(async (transaction) => {
    const log = (action: string, targetType: string, targetId: string, actorId: string | null, details: Record<string, unknown> = {}) =>
      AuditEvent.create({ action, targetType, targetId, actorId, brandId: brand.id, studioId: brand.studioId, details }, { transaction });

    if (!(await Brief.count({ where: { brandId: brand.id }, transaction }))) {
      const questions = JSON.parse(readFileSync(join(process.cwd(), 'templates', 'questionnaires', 'new-identity.json'), 'utf8'));
      const brief = await Brief.create(
        { brandId: brand.id, template: questions.id, title: questions.title, questions, contactName: 'Priya Raman', contactEmail: 'priya@larchmere.example', tokenHash: unusedHash(), answers: ANSWERS, sentById: people.designer, expiresAt: daysAgo(-16), answeredAt: daysAgo(12), submittedAt: daysAgo(12), revokedAt: null },
        { transaction },
      );
      await log('brief.send', 'brief', brief.id, people.designer, { template: questions.id });
      await log('brief.submit', 'brief', brief.id, null, { by: 'priya@larchmere.example' });
    }

    if (!(await MoodBoard.count({ where: { brandId: brand.id }, transaction }))) {
      const board = await MoodBoard.create(
        { brandId: brand.id, title: 'Market stall, not boutique', intro: 'Warm roast browns, a crema neutral and one leafy green; a sturdy slab serif for labels.', status: 'approved', contactName: 'Priya Raman', contactEmail: 'priya@larchmere.example', tokenHash: unusedHash(), expiresAt: daysAgo(-20), sentAt: daysAgo(10), createdById: people.designer },
        { transaction },
      );
      const blank = { storageKey: null, contentType: null, width: null, height: null, colorName: null, colorValue: null, colorHex: null, fontFamily: null, sampleText: null, verdictComment: null };
      const items = await MoodBoardItem.bulkCreate(
        [
          { ...blank, boardId: board.id, kind: 'swatch' as const, position: 0, caption: '', colorName: 'Dark roast', colorValue: '#4a2c21', colorHex: '#4a2c21', verdict: 'keep' as const },
          { ...blank, boardId: board.id, kind: 'swatch' as const, position: 1, caption: '', colorName: 'Crema', colorValue: '#e9d8b8', colorHex: '#e9d8b8', verdict: 'keep' as const },
          { ...blank, boardId: board.id, kind: 'swatch' as const, position: 2, caption: '', colorName: 'Hedgerow', colorValue: '#5d7a3a', colorHex: '#5d7a3a', verdict: 'keep' as const },
          { ...blank, boardId: board.id, kind: 'swatch' as const, position: 3, caption: '', colorName: 'Enamel red', colorValue: '#b23a2e', colorHex: '#b23a2e', verdict: 'drop' as const, verdictComment: 'Too loud next to the green.' },
          { ...blank, boardId: board.id, kind: 'type' as const, position: 4, caption: 'Labels and headings', fontFamily: 'Bricolage Grotesque', sampleText: 'Roasted on Larchmere Lane', verdict: 'keep' as const },
          { ...blank, boardId: board.id, kind: 'note' as const, position: 5, caption: 'Stamped, slightly uneven printing on kraft bags: honest rather than polished.', verdict: 'keep' as const },
        ],
        { transaction },
      );
      await MoodBoardDecision.create(
        { boardId: board.id, outcome: 'approved', comment: 'This is us. Leave the red out.', decidedByName: 'Priya Raman', decidedByEmail: 'priya@larchmere.example', verdicts: items.map((i) => ({ itemId: i.id, verdict: i.verdict!, comment: i.verdictComment ?? '' })) },
        { transaction },
      );
      await log('moodboard.create', 'moodBoard', board.id, people.designer, { title: board.title });
      await log('moodboard.decide', 'moodBoard', board.id, null, { outcome: 'approved', by: 'Priya Raman' });
    }

    if (!(await ReviewRequest.count({ where: { brandId: brand.id }, transaction }))) {
      const draft = await GuidelineDraft.findByPk(brand.id, { transaction });
      const revision = draft?.revision ?? 0;
      const review = await ReviewRequest.create(
        { brandId: brand.id, revision, message: 'First full pass: logo, colour and type.', requestedById: people.editor, status: 'changes_requested', decidedById: people.reviewer, decidedAt: daysAgo(2), decisionNote: 'Nearly there; see my note on the colour section.' },
        { transaction },
      );
      await log('review.request', 'review', review.id, people.editor, { revision });
      await log('review.decide', 'review', review.id, people.reviewer, { outcome: 'changes_requested', revision });
    }

    // Comments need a draft with blocks; the demo draft may be written after the first seed, so this step repeats until it can run.
    const review = await ReviewRequest.findOne({ where: { brandId: brand.id }, order: [['createdAt', 'ASC']], transaction });
    const draft = await GuidelineDraft.findByPk(brand.id, { transaction });
    const revision = draft?.revision ?? 0;
    if (review && !(await ReviewComment.count({ where: { brandId: brand.id }, transaction }))) {
      const blocks = (draft?.doc.content ?? []).map((n) => (n as { attrs?: { id?: unknown } }).attrs?.id).filter((x): x is string => typeof x === 'string');
      if (blocks.length) {
        const anchor = blocks[Math.min(1, blocks.length - 1)];
        const thread = await ReviewComment.create(
          { brandId: brand.id, reviewId: review.id, parentId: null, blockId: anchor, revision, body: 'Can the crema be a touch warmer on screen?', authorId: people.reviewer, resolvedAt: null, resolvedById: null },
          { transaction },
        );
        await ReviewComment.create({ brandId: brand.id, reviewId: review.id, parentId: thread.id, blockId: anchor, revision, body: 'Trying two warmer options; will send both.', authorId: people.editor, resolvedAt: null, resolvedById: null }, { transaction });
        await ReviewComment.create({ brandId: brand.id, reviewId: review.id, parentId: null, blockId: blocks[0], revision, body: 'Love the opening line.', authorId: people.reviewer, resolvedAt: daysAgo(1), resolvedById: people.editor }, { transaction });
        await log('comment.add', 'comment', thread.id, people.reviewer, { blockId: anchor });
      }
    }

    // Timestamps set by Sequelize are "now"; backdate the story so the dates read in order.
    await sequelize.query(`UPDATE briefs SET created_at = now() - interval '14 days' WHERE brand_id = :b AND created_at > now() - interval '1 hour'`, { replacements: { b: brand.id }, transaction });
    await sequelize.query(`UPDATE mood_boards SET created_at = now() - interval '11 days' WHERE brand_id = :b AND created_at > now() - interval '1 hour'`, { replacements: { b: brand.id }, transaction });
    await sequelize.query(`UPDATE review_requests SET created_at = now() - interval '3 days' WHERE brand_id = :b AND created_at > now() - interval '1 hour'`, { replacements: { b: brand.id }, transaction });
    await BrandFollow.findOrCreate({ where: { brandId: brand.id, userId: people.designer }, defaults: { brandId: brand.id, userId: people.designer }, transaction });
  });
}
