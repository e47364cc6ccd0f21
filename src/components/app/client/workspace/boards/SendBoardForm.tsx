// Send a board to the client's contact for a decision on direction (again, once changed).
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { firstError, maxLengthOf } from '@/lib/client/form';
import { sendBoardBody } from '@/lib/moodboards/schemas';
import type { BoardView } from '@/lib/moodboards/views';
import { failed, mailed, type SetNote } from '../chrome';
import { useSendBoard, type SendBoard } from './boards.queries';

const limit = sendBoardBody.shape;

export function SendBoardForm({ brandId, board, onNote }: { brandId: string; board: BoardView; onNote: SetNote }) {
  const { register, handleSubmit, formState: { errors } } = useForm<SendBoard>({
    resolver: zodResolver(sendBoardBody, undefined, { raw: true }),
    defaultValues: { contactName: board.contactName ?? '', contactEmail: board.contactEmail ?? '' },
  });
  const send = useSendBoard(brandId, board.id, { onSuccess: (r, sent) => onNote(mailed(r, `“${board.title}” was sent to ${sent.contactEmail}.`)), onError: failed(onNote) });
  const submit = handleSubmit(
    (values) => {
      onNote(null);
      send.mutate(values);
    },
    (wrong) => onNote({ kind: 'error', text: firstError(wrong) ?? 'Check the contact.' }),
  );
  return (
    <form aria-label={`Send ${board.title}`} onSubmit={submit} className="flex flex-wrap items-end gap-2">
      <div><label className="label" htmlFor={`cn-${board.id}`}>Client contact</label><input id={`cn-${board.id}`} className="field w-36" maxLength={maxLengthOf(limit.contactName)} aria-invalid={errors.contactName ? true : undefined} {...register('contactName')} /></div>
      <div><label className="label" htmlFor={`ce-${board.id}`}>E-mail</label><input id={`ce-${board.id}`} type="email" className="field w-52" maxLength={maxLengthOf(limit.contactEmail)} aria-invalid={errors.contactEmail ? true : undefined} {...register('contactEmail')} /></div>
      <button className="btn-primary" disabled={send.isPending}>{board.status === 'draft' ? 'Send for a decision' : 'Send again'}</button>
    </form>
  );
}
