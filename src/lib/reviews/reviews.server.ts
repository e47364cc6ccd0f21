// Reviews of the working draft: requests to reviewers, comments anchored to a block id, replies, decisions.
import { Brand, GuidelineDraft } from '@db/models';
import { blockLabels } from '@/lib/guideline/block-label';
import { ReviewComment, ReviewRequest } from '@db/models/collaboration';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
import { membersWithRoles, peopleById } from '@/lib/invitations/people.server';
import { sendTemplate, siteLink } from '@/lib/mail/mail.server';
import type { CommentView, ReviewSummary, ReviewView } from './views';

export type { CommentView, ReviewSummary, ReviewView } from './views';

const brandAudit = (caller: Caller, brand: Brand, action: string, targetType: string, targetId: string, details: Record<string, unknown> = {}) =>
  ({ actorId: caller.id, action, targetType, targetId, brandId: brand.id, studioId: brand.studioId, details });

async function draftOf(brandId: string): Promise<{ revision: number; blockIds: Set<string>; labels: Map<string, string> }> {
  const draft = await GuidelineDraft.findByPk(brandId);
  const ids = (draft?.doc.content ?? []).map((n) => (n as { attrs?: { id?: unknown } }).attrs?.id).filter((x): x is string => typeof x === 'string');
  return { revision: draft?.revision ?? 0, blockIds: new Set(ids), labels: blockLabels(draft?.doc) };
}

async function reviewViews(rows: ReviewRequest[]): Promise<ReviewView[]> {
  const people = await peopleById(rows.flatMap((r) => [r.requestedById, r.decidedById]));
  return rows.map((r) => ({
    id: r.id,
    revision: r.revision,
    message: r.message,
    status: r.status,
    requestedBy: people.get(r.requestedById ?? '')?.name ?? null,
    requestedAt: r.createdAt.toISOString(),
    decidedBy: people.get(r.decidedById ?? '')?.name ?? null,
    decidedAt: r.decidedAt?.toISOString() ?? null,
    decisionNote: r.decisionNote,
  }));
}

/** The brand's review requests, newest first, and the summary shown before publishing. */
export async function listReviews(brand: Brand): Promise<{ reviews: ReviewView[] } & ReviewSummary> {
  const rows = await ReviewRequest.findAll({ where: { brandId: brand.id }, order: [['createdAt', 'DESC']] });
  const reviews = await reviewViews(rows);
  const openComments = await ReviewComment.count({ where: { brandId: brand.id, parentId: null, resolvedAt: null } });
  const { revision } = await draftOf(brand.id);
  return { reviews, latest: reviews.find((r) => r.status !== 'open') ?? reviews[0] ?? null, openComments, draftRevision: revision };
}

/** Ask the brand's reviewers (or the chosen ones) to review the current draft revision; each gets an e-mail. */
export async function requestReview(caller: Caller, brand: Brand, body: { message?: string; reviewerIds?: string[] }): Promise<{ review: ReviewView; notified: string[]; problems: string[] }> {
  const { revision } = await draftOf(brand.id);
  let reviewers = await membersWithRoles(brand.id, ['reviewer', 'owner']);
  reviewers = reviewers.filter((r) => r.id !== caller.id && (body.reviewerIds ? body.reviewerIds.includes(r.id) : r.role === 'reviewer'));
  if (body.reviewerIds && reviewers.length !== new Set(body.reviewerIds).size) {
    throw new ApiError(400, 'invalid_reviewer', 'Each person asked to review must be a reviewer or owner of this brand (and not you).', { path: 'reviewerIds' });
  }
  if (!reviewers.length) throw new ApiError(409, 'no_reviewers', 'This brand has no reviewers yet. Add the client’s decision makers as reviewers on the overview page first.');
  const row = await sequelize.transaction(async (t) => {
    const created = await ReviewRequest.create({ brandId: brand.id, revision, message: body.message ?? '', requestedById: caller.id, decidedById: null, decidedAt: null, decisionNote: null }, { transaction: t });
    await audit(brandAudit(caller, brand, 'review.request', 'review', created.id, { revision, reviewers: reviewers.map((r) => r.id) }), t);
    return created;
  });
  const problems: string[] = [];
  for (const r of reviewers) {
    const outcome = await sendTemplate(
      r.email,
      'review-request',
      { reviewerName: r.name, requesterName: caller.name || caller.email, brandName: brand.name, revision, message: body.message ?? '', link: siteLink(`/app/brands/${brand.id}/client#review-${row.id}`) },
      brand.id,
    );
    if (!outcome.sent) problems.push(`${r.email}: ${outcome.problem}`);
  }
  return { review: (await reviewViews([row]))[0], notified: reviewers.map((r) => r.email), problems };
}

/** A reviewer's decision on a request: approve, or ask for changes with a note. */
export async function decideReview(caller: Caller, brand: Brand, reviewId: string, body: { outcome: 'approved' | 'changes_requested'; note?: string }): Promise<ReviewView> {
  const row = await ReviewRequest.findOne({ where: { id: reviewId, brandId: brand.id } });
  if (!row) throw new ApiError(404, 'not_found', 'That review request was not found on this brand.');
  if (row.status !== 'open') throw new ApiError(409, 'already_decided', `This review was already decided (${row.status === 'approved' ? 'approved' : 'changes requested'}). Ask for a new review of the latest draft.`);
  if (body.outcome === 'changes_requested' && !body.note?.trim()) throw new ApiError(400, 'invalid_input', 'Say what should change, so the designer knows where to start.', { path: 'note' });
  await sequelize.transaction(async (t) => {
    await row.update({ status: body.outcome, decidedById: caller.id, decidedAt: new Date(), decisionNote: body.note?.trim() || null }, { transaction: t });
    await audit(brandAudit(caller, brand, 'review.decide', 'review', row.id, { outcome: body.outcome, revision: row.revision }), t);
  });
  const requester = (await peopleById([row.requestedById])).get(row.requestedById ?? '');
  if (requester && requester.id !== caller.id) {
    await sendTemplate(
      requester.email,
      'review-decision',
      { deciderName: caller.name || caller.email, outcomeWords: body.outcome === 'approved' ? 'approved' : 'asked for changes to', brandName: brand.name, revision: row.revision, note: body.note ?? '', link: siteLink(`/app/brands/${brand.id}/client#review-${row.id}`) },
      brand.id,
    );
  }
  return (await reviewViews([row]))[0];
}

// ---------------------------------------------------------------- comments

async function commentViews(brandId: string, rows: ReviewComment[]): Promise<CommentView[]> {
  const [people, draft] = await Promise.all([peopleById(rows.flatMap((c) => [c.authorId, c.resolvedById])), draftOf(brandId)]);
  return rows.map((c) => ({
    id: c.id,
    blockId: c.blockId,
    parentId: c.parentId,
    reviewId: c.reviewId,
    revision: c.revision,
    body: c.body,
    author: { id: c.authorId, name: people.get(c.authorId ?? '')?.name ?? 'Former member' },
    createdAt: c.createdAt.toISOString(),
    resolvedAt: c.resolvedAt?.toISOString() ?? null,
    resolvedBy: people.get(c.resolvedById ?? '')?.name ?? null,
    blockPresent: draft.blockIds.has(c.blockId),
    blockLabel: draft.labels.get(c.blockId) ?? null,
  }));
}

/** Comments in thread order (each thread's first comment, then its replies); `open` keeps unresolved threads only. */
export async function listComments(brand: Brand, opts: { open?: boolean; blockId?: string } = {}): Promise<CommentView[]> {
  const where: Record<string, unknown> = { brandId: brand.id };
  if (opts.blockId) where.blockId = opts.blockId;
  const rows = await ReviewComment.findAll({ where, order: [['createdAt', 'ASC']] });
  const threads = rows.filter((r) => !r.parentId && (!opts.open || !r.resolvedAt));
  const ordered = threads.flatMap((t) => [t, ...rows.filter((r) => r.parentId === t.id)]);
  return commentViews(brand.id, ordered);
}

/** A new comment on a block of the current draft, or a reply to a thread. */
export async function addComment(caller: Caller, brand: Brand, body: { blockId?: string; parentId?: string; reviewId?: string; body: string }): Promise<CommentView> {
  const draft = await draftOf(brand.id);
  let blockId = body.blockId;
  let reviewId = body.reviewId ?? null;
  if (body.parentId) {
    const parent = await ReviewComment.findOne({ where: { id: body.parentId, brandId: brand.id } });
    if (!parent) throw new ApiError(404, 'not_found', 'The comment you are replying to was not found.');
    if (parent.parentId) throw new ApiError(400, 'invalid_input', 'Reply to the first comment of a thread.', { path: 'parentId' });
    if (blockId && blockId !== parent.blockId) throw new ApiError(400, 'invalid_input', 'A reply belongs to the block of its thread.', { path: 'blockId' });
    blockId = parent.blockId;
    reviewId = parent.reviewId;
  } else {
    if (!blockId) throw new ApiError(400, 'invalid_input', 'Say which block the comment is about (blockId).', { path: 'blockId' });
    if (!draft.blockIds.has(blockId)) throw new ApiError(400, 'unknown_block', `The draft has no block "${blockId}" (it may have been removed). Reload the draft and comment again.`, { path: 'blockId' });
  }
  if (reviewId && !(await ReviewRequest.count({ where: { id: reviewId, brandId: brand.id } }))) {
    throw new ApiError(404, 'not_found', 'That review request was not found on this brand.');
  }
  const row = await sequelize.transaction(async (t) => {
    const created = await ReviewComment.create(
      { brandId: brand.id, reviewId, parentId: body.parentId ?? null, blockId: blockId!, revision: draft.revision, body: body.body.trim(), authorId: caller.id, resolvedAt: null, resolvedById: null },
      { transaction: t },
    );
    await audit(brandAudit(caller, brand, body.parentId ? 'comment.reply' : 'comment.add', 'comment', created.id, { blockId, revision: draft.revision }), t);
    return created;
  });
  return (await commentViews(brand.id, [row]))[0];
}

/** Resolve a thread (or open it again); replies follow their thread. */
export async function resolveComment(caller: Caller, brand: Brand, commentId: string, resolved: boolean): Promise<CommentView> {
  const row = await ReviewComment.findOne({ where: { id: commentId, brandId: brand.id } });
  if (!row) throw new ApiError(404, 'not_found', 'That comment was not found on this brand.');
  if (row.parentId) throw new ApiError(400, 'invalid_input', 'Resolve the thread from its first comment.', { path: 'commentId' });
  await sequelize.transaction(async (t) => {
    await row.update(resolved ? { resolvedAt: row.resolvedAt ?? new Date(), resolvedById: row.resolvedById ?? caller.id } : { resolvedAt: null, resolvedById: null }, { transaction: t });
    await audit(brandAudit(caller, brand, resolved ? 'comment.resolve' : 'comment.reopen', 'comment', row.id, { blockId: row.blockId }), t);
  });
  return (await commentViews(brand.id, [row]))[0];
}

/** Open threads per block id, for the editor margin. */
export async function openThreadsByBlock(brand: Brand): Promise<Record<string, CommentView[]>> {
  const out: Record<string, CommentView[]> = {};
  for (const c of await listComments(brand, { open: true })) (out[c.blockId] ??= []).push(c);
  return out;
}

