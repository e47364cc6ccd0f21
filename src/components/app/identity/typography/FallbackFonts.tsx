// A typeface's fallback stack, typed as names separated by commas and checked with the route's own schema.
import { useId } from 'react';
import { useForm } from 'react-hook-form';
import type { UseMutationResult } from '@tanstack/react-query';
import { updateTypefaceBody } from '@/lib/identity/schemas';
import type { IdentityTypeface } from '@/lib/identity/types';
import { messageOf } from '../shared';
import type { TypefaceChanges } from './typography.queries';

const fallbackList = updateTypefaceBody.shape.fallback;
const names = (text: string) => text.split(',').map((s) => s.trim()).filter(Boolean);
/** The schema's first word on the list, or true when it accepts it. */
const checkList = (text: string) => {
  const result = fallbackList.safeParse(names(text));
  return result.success || result.error.issues[0].message;
};

export function FallbackFonts({ face, patch }: { face: IdentityTypeface; patch: UseMutationResult<unknown, Error, TypefaceChanges> }) {
  const id = useId();
  const { register, handleSubmit, setError, clearErrors, formState: { errors } } = useForm<{ fallback: string }>({ defaultValues: { fallback: face.fallback.join(', ') } });
  const save = handleSubmit(({ fallback }) =>
    patch.mutate({ fallback: names(fallback) }, { onSuccess: () => clearErrors(), onError: (e) => setError('fallback', { message: messageOf(e, 'The fallback stack could not be saved.') }) }),
  );
  const error = errors.fallback?.message;
  return (
    <div>
      <label htmlFor={`${id}-fallback`} className="label">Fallback fonts</label>
      <div className="flex gap-2">
        <input id={`${id}-fallback`} className="field font-mono text-sm" aria-invalid={!!error} aria-describedby={`${id}-fallback-note`} {...register('fallback', { validate: checkList })} />
        <button type="button" className="btn-quiet" onClick={save} disabled={patch.isPending}>Save</button>
      </div>
      <p id={`${id}-fallback-note`} className={error ? 'error-text' : 'hint'} role={error ? 'alert' : undefined}>
        {error ?? 'Used while the font loads or where it cannot be served; separate names with commas.'}
      </p>
    </div>
  );
}
