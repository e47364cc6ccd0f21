// Reviews: requests to review the draft with their decisions, asking for one, and the comment threads on the draft.
import { useState } from 'react';
import type { ReviewView } from '@/lib/reviews/views';
import { date, Notice, Panel, type ClientCaps, type Note } from '../chrome';
import { CommentThread } from './CommentThread';
import { RequestReviewForm } from './RequestReviewForm';
import { ReviewDecision } from './ReviewDecision';
import { useComments, useReviews } from './reviews.queries';

const REVIEW_STATUS: Record<ReviewView['status'], string> = { open: 'Waiting for a decision', approved: 'Approved', changes_requested: 'Changes requested' };

export function Reviews({ brandId, caps }: { brandId: string; caps: ClientCaps }) {
  const [note, setNote] = useState<Note>(null);
  const reviews = useReviews(brandId);
  const comments = useComments(brandId);
  const all = comments.data?.comments ?? [];
  const threads = all.filter((c) => !c.parentId);
  return (
    <Panel id="reviews" title="Reviews" intro="Reviewers read the working draft, comment on its blocks, and approve it or ask for changes.">
      <Notice note={note} />
      {reviews.data && <p className="mt-3 text-sm text-ink-soft">{reviews.data.openComments} open comment thread{reviews.data.openComments === 1 ? '' : 's'}</p>}
      {reviews.isError && <p className="mt-4 text-danger" role="alert">{reviews.error.message}</p>}
      {reviews.data?.reviews.length === 0 && <p className="mt-4 text-ink-soft">No review yet. {caps.edit ? 'When the draft is ready, ask the brand’s reviewers below.' : ''}</p>}
      <ul className="mt-2 divide-y divide-rule">
        {reviews.data?.reviews.map((r) => (
          <li key={r.id} id={`review-${r.id}`} className="py-3">
            <p className="font-semibold">Review of the draft as of {date(r.requestedAt)} · <span className={r.status === 'approved' ? 'text-ok' : r.status === 'changes_requested' ? 'text-warn' : 'text-ink-soft'}>{REVIEW_STATUS[r.status]}</span></p>
            <p className="text-sm text-ink-soft">Asked by {r.requestedBy ?? 'a former member'} on {date(r.requestedAt)}{r.message ? `: “${r.message}”` : ''}</p>
            {r.decidedAt && <p className="text-sm">{r.decidedBy} decided on {date(r.decidedAt)}{r.decisionNote ? `: “${r.decisionNote}”` : ''}</p>}
            {caps.decide && r.status === 'open' && <ReviewDecision brandId={brandId} reviewId={r.id} onNote={setNote} />}
          </li>
        ))}
      </ul>
      {caps.edit && <RequestReviewForm brandId={brandId} onNote={setNote} />}
      <h3 className="mt-6 text-lg font-bold">Comments on the draft</h3>
      {threads.length === 0 ? <p className="mt-2 text-sm text-ink-soft">No comments yet. Reviewers comment on a block from the guidelines editor’s margin.</p> : (
        <ul className="mt-2 space-y-3">
          {threads.map((t) => <CommentThread key={t.id} brandId={brandId} thread={t} replies={all.filter((c) => c.parentId === t.id)} canComment={caps.comment} onNote={setNote} />)}
        </ul>
      )}
    </Panel>
  );
}
