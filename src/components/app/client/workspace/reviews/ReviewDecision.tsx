// A reviewer's decision on an open review: approve the draft, or request changes with a note.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { firstError, maxLengthOf } from '@/lib/client/form';
import { decideReviewBody } from '@/lib/reviews/schemas';
import { failed, type SetNote } from '../chrome';
import { useDecideReview } from './reviews.queries';

const form = decideReviewBody.pick({ note: true });
type Outcome = 'approved' | 'changes_requested';

export function ReviewDecision({ brandId, reviewId, onNote }: { brandId: string; reviewId: string; onNote: SetNote }) {
  const { register, handleSubmit, formState: { errors } } = useForm<{ note?: string }>({ resolver: zodResolver(form, undefined, { raw: true }), defaultValues: { note: '' } });
  const decide = useDecideReview(brandId, { onSuccess: () => onNote({ kind: 'ok', text: 'Decision recorded.' }), onError: failed(onNote) });
  const choose = (outcome: Outcome) =>
    handleSubmit(
      ({ note }) => decide.mutate({ id: reviewId, outcome, note: note ?? '' }),
      (wrong) => onNote({ kind: 'error', text: firstError(wrong) ?? 'Check the note.' }),
    );
  return (
    <div className="mt-2 flex flex-wrap items-end gap-2">
      <div className="min-w-64 flex-1"><label className="label" htmlFor={`dn-${reviewId}`}>Your note (needed when asking for changes)</label><input id={`dn-${reviewId}`} className="field" maxLength={maxLengthOf(form.shape.note)} aria-invalid={errors.note ? true : undefined} {...register('note')} /></div>
      <button type="button" className="btn-primary" onClick={choose('approved')}>Approve the draft</button>
      <button type="button" className="btn-quiet" onClick={choose('changes_requested')}>Request changes</button>
    </div>
  );
}
