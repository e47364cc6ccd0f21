// Add a piece to a board: a colour swatch, a type sample or a note (checked with the route's own schema), or an image.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, type Resolver } from 'react-hook-form';
import { ApiClientError } from '@/lib/client/api';
import { firstError, maxLengthOf } from '@/lib/client/form';
import { newItemSchema } from '@/lib/moodboards/schemas';
import type { BoardView } from '@/lib/moodboards/views';
import { failed, type SetNote } from '../chrome';
import { useAddImage, useAddPiece, type NewPiece } from './boards.queries';
import { acceptAttribute } from '@/lib/uploads/rules';

interface PieceFields { kind: 'swatch' | 'type' | 'note'; name: string; value: string; family: string; sample: string; caption: string }
const EMPTY = { name: '', value: '', family: '', sample: '', caption: '' };

/** The body the route takes for the chosen kind: only that kind's fields. */
const pieceBody = (p: PieceFields): NewPiece =>
  p.kind === 'swatch' ? { kind: 'swatch', name: p.name, value: p.value } : p.kind === 'type' ? { kind: 'type', family: p.family, sample: p.sample } : { kind: 'note', caption: p.caption };

// The route's union schema judges the body; its error paths (name, value, family, sample, caption) are the form's fields.
const checkPiece = zodResolver(newItemSchema, undefined, { raw: true });
const pieceResolver: Resolver<PieceFields> = async (values, context, options) => {
  // The options name the form's fields; the check only reads them to place errors, which share the fields' names.
  const result = await checkPiece(pieceBody(values), context, options as never);
  return Object.keys(result.errors).length ? { values: {}, errors: result.errors as never } : { values, errors: {} };
};

const [swatch, type, note] = newItemSchema.options;
const limit = { name: maxLengthOf(swatch.shape.name), value: maxLengthOf(swatch.shape.value), family: maxLengthOf(type.shape.family), sample: maxLengthOf(type.shape.sample), caption: maxLengthOf(note.shape.caption) };

export function AddPieceForm({ brandId, board, onNote }: { brandId: string; board: BoardView; onNote: SetNote }) {
  const { register, handleSubmit, watch, reset, getValues, formState: { errors } } = useForm<PieceFields>({ resolver: pieceResolver, defaultValues: { kind: 'swatch', ...EMPTY } });
  const add = useAddPiece(brandId, board.id, { onSuccess: () => reset({ kind: getValues('kind'), ...EMPTY }), onError: failed(onNote) });
  const image = useAddImage(brandId, board.id, {
    onError: (e) => onNote({ kind: 'error', text: e instanceof ApiClientError && e.code === 'http_error' ? 'The image could not be added.' : e.message }),
  });
  const kind = watch('kind');
  const id = (prefix: string) => `${prefix}-${board.id}`;
  const invalid = (name: keyof PieceFields) => (errors[name] ? true : undefined);
  const submit = handleSubmit(
    (values) => {
      onNote(null);
      add.mutate(pieceBody(values));
    },
    (wrong) => onNote({ kind: 'error', text: firstError(wrong) ?? 'Check the piece.' }),
  );
  return (
    <form aria-label={`Add a piece to ${board.title}`} onSubmit={submit} className="flex flex-wrap items-end gap-2">
      <div>
        <label className="label" htmlFor={id('kind')}>Add</label>
        <select id={id('kind')} className="field" {...register('kind')}>
          <option value="swatch">Colour swatch</option><option value="type">Type sample</option><option value="note">Note</option>
        </select>
      </div>
      {kind === 'swatch' && <>
        <div><label className="label" htmlFor={id('sn')}>Name</label><input id={id('sn')} className="field w-32" maxLength={limit.name} aria-invalid={invalid('name')} {...register('name')} /></div>
        <div><label className="label" htmlFor={id('sv')}>Colour</label><input id={id('sv')} className="field w-36 font-mono" placeholder="#6b4226" maxLength={limit.value} aria-invalid={invalid('value')} {...register('value')} /></div>
      </>}
      {kind === 'type' && <>
        <div><label className="label" htmlFor={id('tf')}>Typeface</label><input id={id('tf')} className="field w-36" maxLength={limit.family} aria-invalid={invalid('family')} {...register('family')} /></div>
        <div><label className="label" htmlFor={id('ts')}>Sample text</label><input id={id('ts')} className="field w-44" maxLength={limit.sample} aria-invalid={invalid('sample')} {...register('sample')} /></div>
      </>}
      {kind === 'note' && <div className="flex-1"><label className="label" htmlFor={id('nt')}>Note</label><input id={id('nt')} className="field" maxLength={limit.caption} aria-invalid={invalid('caption')} {...register('caption')} /></div>}
      <button className="btn-quiet" disabled={add.isPending}>Add</button>
      <label className="btn-quiet cursor-pointer">Upload an image<input type="file" accept={acceptAttribute('boardImage')} className="sr-only" onChange={(e) => { const f = e.target.files?.[0]; if (f) image.mutate(f); e.target.value = ''; }} /></label>
    </form>
  );
}
