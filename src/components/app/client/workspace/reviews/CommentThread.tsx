// One comment thread on a block of the draft: its comments, a reply, and resolving or opening it again.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { firstError, maxLengthOf } from '@/lib/client/form';
import { addCommentBody } from '@/lib/reviews/schemas';
import type { CommentView } from '@/lib/reviews/views';
import { date, failed, type SetNote } from '../chrome';
import { useReply, useResolveThread } from './reviews.queries';

const form = addCommentBody.pick({ body: true });

export function CommentThread({ brandId, thread, replies, canComment, onNote }: { brandId: string; thread: CommentView; replies: CommentView[]; canComment: boolean; onNote: SetNote }) {
  const { register, handleSubmit, reset, formState: { errors } } = useForm<{ body: string }>({ resolver: zodResolver(form, undefined, { raw: true }), defaultValues: { body: '' } });
  const answer = useReply(brandId, { onSuccess: () => reset({ body: '' }), onError: failed(onNote) });
  const resolve = useResolveThread(brandId, { onError: failed(onNote) });
  const reply = handleSubmit(
    ({ body }) => answer.mutate({ parentId: thread.id, body }),
    (wrong) => onNote({ kind: 'error', text: firstError(wrong) ?? 'Check the reply.' }),
  );
  const t = thread;
  return (
    <li className={`rounded-lg border border-rule p-3 ${t.resolvedAt ? 'bg-paper' : ''}`}>
      <p className="text-xs text-ink-soft">{t.blockPresent ? `On ${t.blockLabel ?? 'a block'}` : 'On a block removed since'} · {date(t.createdAt)}{t.resolvedAt ? ` · resolved by ${t.resolvedBy}` : ''}</p>
      {[t, ...replies].map((c) => (
        <p key={c.id} className={`mt-1 text-sm ${c.parentId ? 'ml-4 border-l-2 border-rule pl-3' : ''}`}><strong>{c.author.name}</strong> {c.body}</p>
      ))}
      {canComment && (
        <div className="mt-2 flex flex-wrap gap-2">
          {!t.resolvedAt && <><label className="sr-only" htmlFor={`rp-${t.id}`}>Reply</label><input id={`rp-${t.id}`} className="field flex-1 py-1.5 text-sm" placeholder="Reply…" maxLength={maxLengthOf(form.shape.body)} aria-invalid={errors.body ? true : undefined} {...register('body')} />
          <button type="button" className="btn-quiet px-3 py-1.5" onClick={reply}>Reply</button></>}
          <button type="button" className="btn-quiet px-3 py-1.5" onClick={() => resolve.mutate({ id: t.id, resolved: !t.resolvedAt })}>{t.resolvedAt ? 'Open again' : 'Resolve'}</button>
        </div>
      )}
    </li>
  );
}
