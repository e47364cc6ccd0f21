// Ask the brand's reviewers to review the draft as it stands, with an optional line for them.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { firstError, maxLengthOf } from '@/lib/client/form';
import { requestReviewBody } from '@/lib/reviews/schemas';
import { failed, type SetNote } from '../chrome';
import { useRequestReview, type RequestReview } from './reviews.queries';

const form = requestReviewBody.pick({ message: true });

export function RequestReviewForm({ brandId, onNote }: { brandId: string; onNote: SetNote }) {
  const { register, handleSubmit, reset, formState: { errors } } = useForm<RequestReview>({ resolver: zodResolver(form, undefined, { raw: true }), defaultValues: { message: '' } });
  const request = useRequestReview(brandId, {
    onSuccess: (r) => {
      reset({ message: '' });
      onNote(r.problems.length ? { kind: 'error', text: `Saved, but some e-mails failed: ${r.problems.join('; ')}` } : { kind: 'ok', text: `Review requested from ${r.notified.join(', ')}.` });
    },
    onError: failed(onNote),
  });
  const submit = handleSubmit(
    (values) => {
      onNote(null);
      request.mutate(values);
    },
    (wrong) => onNote({ kind: 'error', text: firstError(wrong) ?? 'Check the message.' }),
  );
  return (
    <form className="mt-2 flex flex-wrap items-end gap-3 border-t border-rule pt-4" aria-label="Request a review" onSubmit={submit}>
      <div className="min-w-64 flex-1"><label className="label" htmlFor="review-message">A line for the reviewers (optional)</label><input id="review-message" className="field" maxLength={maxLengthOf(form.shape.message)} aria-invalid={errors.message ? true : undefined} {...register('message')} /></div>
      <button className="btn-primary" disabled={request.isPending}>Request a review of the draft</button>
    </form>
  );
}
