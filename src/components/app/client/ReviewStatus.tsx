// Shown before publishing: the latest review decision on the draft and how many comment threads are still open.
import { useQuery } from '@tanstack/react-query';
import { api } from '@/lib/client/api';
import type { ReviewSummary, ReviewView } from '@/lib/reviews/views';
import { QueryRoot } from '@/components/app/QueryRoot';
import { formatDate } from '@/lib/format';

function Status({ brandId }: { brandId: string }) {
  const q = useQuery({ queryKey: ['reviews', brandId], queryFn: () => api<{ reviews: ReviewView[] } & ReviewSummary>(`/api/brands/${brandId}/reviews`) });
  if (q.isPending) return <p className="text-sm text-ink-soft" role="status">Checking the review…</p>;
  if (q.isError) return <p className="text-sm text-danger" role="alert">The review status could not be loaded: {q.error.message}</p>;
  const { latest, openComments, draftRevision } = q.data;
  const tone = latest?.status === 'approved' && latest.revision === draftRevision && openComments === 0 ? 'bg-ok/10 text-ok' : 'bg-warn-wash text-warn';
  let text: string;
  if (!latest) text = 'No review yet: the draft has not been approved by a reviewer.';
  else if (latest.status === 'open') text = `A review of the draft, asked for on ${formatDate(latest.requestedAt)}, is waiting for a decision.`;
  else if (latest.status === 'approved') text = `${latest.decidedBy ?? 'A reviewer'} approved the draft${latest.decidedAt ? ` on ${formatDate(latest.decidedAt)}` : ''}${latest.revision === draftRevision ? '' : ' (it has been changed since)'}.`;
  else text = `${latest.decidedBy ?? 'A reviewer'} asked for changes to the draft${latest.decisionNote ? `: “${latest.decisionNote}”` : '.'}`;
  return (
    <div className={`rounded-md px-4 py-3 text-sm ${tone}`} role="status" aria-label="Review status">
      <p className="font-semibold">{text}</p>
      <p className="mt-1">{openComments === 0 ? 'No open comments.' : `${openComments} comment thread${openComments === 1 ? '' : 's'} still open.`} <a className="underline" href={`/app/brands/${brandId}/client#reviews`}>See the review</a></p>
    </div>
  );
}

/** The latest review decision and open comment count for a brand (mount on the publishing page). */
export default function ReviewStatus({ brandId }: { brandId: string }) {
  return (
    <QueryRoot>
      <Status brandId={brandId} />
    </QueryRoot>
  );
}
