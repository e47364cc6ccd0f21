// Send a set of routes to the client's contact (again, after comments); the link needs no account.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { firstError, maxLengthOf } from '@/lib/client/form';
import { sendRoutesBody } from '@/lib/palette-routes/schemas';
import type { RouteSetView } from '@/lib/palette-routes/views';
import { failed, mailed, type SetNote } from '../chrome';
import { useSendSet, type SendSet } from './palettes.queries';

const limit = sendRoutesBody.shape;

export function SendRoutesForm({ brandId, set, onNote }: { brandId: string; set: RouteSetView; onNote: SetNote }) {
  const { register, handleSubmit, formState: { errors } } = useForm<SendSet>({
    resolver: zodResolver(sendRoutesBody, undefined, { raw: true }),
    defaultValues: { contactName: set.contactName ?? '', contactEmail: set.contactEmail ?? '', message: '' },
  });
  const send = useSendSet(brandId, set.id, { onSuccess: (r, sent) => onNote(mailed(r, `“${set.title}” was sent to ${sent.contactEmail}.`)), onError: failed(onNote) });
  const submit = handleSubmit(
    (values) => {
      onNote(null);
      send.mutate(values);
    },
    (wrong) => onNote({ kind: 'error', text: firstError(wrong) ?? 'Check the contact.' }),
  );
  return (
    <form aria-label={`Send ${set.title}`} onSubmit={submit} className="mt-4 flex flex-wrap items-end gap-2 rounded-lg bg-paper p-4">
      <div><label className="label" htmlFor={`rc-${set.id}`}>Client contact</label><input id={`rc-${set.id}`} className="field w-40" maxLength={maxLengthOf(limit.contactName)} aria-invalid={errors.contactName ? true : undefined} {...register('contactName')} /></div>
      <div><label className="label" htmlFor={`re-${set.id}`}>E-mail</label><input id={`re-${set.id}`} type="email" className="field w-56" maxLength={maxLengthOf(limit.contactEmail)} aria-invalid={errors.contactEmail ? true : undefined} {...register('contactEmail')} /></div>
      <div className="min-w-56 flex-1"><label className="label" htmlFor={`rm-${set.id}`}>Message (optional)</label><input id={`rm-${set.id}`} className="field" maxLength={maxLengthOf(limit.message)} {...register('message')} /></div>
      <button className="btn-primary" disabled={send.isPending}>{set.status === 'draft' ? 'Send for a choice' : 'Send a new link'}</button>
    </form>
  );
}
