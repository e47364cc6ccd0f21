// Start a new mood board by its title.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { firstError, maxLengthOf } from '@/lib/client/form';
import { createBoardBody } from '@/lib/moodboards/schemas';
import { failed, type SetNote } from '../chrome';
import { useStartBoard, type NewBoard } from './boards.queries';

export function StartBoardForm({ brandId, onNote }: { brandId: string; onNote: SetNote }) {
  const { register, handleSubmit, reset, formState: { errors } } = useForm<NewBoard>({ resolver: zodResolver(createBoardBody, undefined, { raw: true }), defaultValues: { title: '' } });
  const create = useStartBoard(brandId, { onSuccess: () => reset({ title: '' }), onError: failed(onNote) });
  const submit = handleSubmit(
    (values) => {
      onNote(null);
      create.mutate(values);
    },
    (wrong) => onNote({ kind: 'error', text: firstError(wrong) ?? 'Check the title.' }),
  );
  return (
    <form className="mt-2 flex flex-wrap items-end gap-3 border-t border-rule pt-4" aria-label="Start a mood board" onSubmit={submit}>
      <div className="min-w-64 flex-1"><label className="label" htmlFor="board-title">New board title</label><input id="board-title" className="field" maxLength={maxLengthOf(createBoardBody.shape.title)} aria-invalid={errors.title ? true : undefined} {...register('title')} /></div>
      <button className="btn-quiet" disabled={create.isPending}>Start a board</button>
    </form>
  );
}
