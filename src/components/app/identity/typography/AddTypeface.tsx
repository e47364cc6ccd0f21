// Add a typeface for a role: one of the open fonts Plumbline ships, or the brand's own font file.
import { zodResolver } from '@hookform/resolvers/zod';
import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { shippedTypefaceBody } from '@/lib/identity/schemas';
import { TYPEFACE_ROLES } from '@/lib/identity/types';
import { SHIPPED_FONTS } from '@/lib/type/shipped-fonts';
import { messageOf, type NoticeState } from '../shared';
import { ROLE_LABEL } from './labels';
import { useAddShippedTypeface, useUploadTypeface, type ShippedTypeface } from './typography.queries';
import { acceptAttribute } from '@/lib/uploads/rules';

const choice = shippedTypefaceBody.pick({ shipped: true, role: true });

export function AddTypeface({ brandId, onNotice }: { brandId: string; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const { register, handleSubmit, getValues } = useForm<ShippedTypeface>({ resolver: zodResolver(choice, undefined, { raw: true }), defaultValues: { role: 'heading', shipped: SHIPPED_FONTS[0].key } });
  const [file, setFile] = useState<File | null>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const addShipped = useAddShippedTypeface(brandId, {
    onSuccess: (r, { role }) => {
      setError(null);
      onNotice({ kind: 'ok', text: `${r.typeface.family} added for ${ROLE_LABEL[role].toLowerCase()}.` });
    },
    onError: (e) => setError(messageOf(e, 'The font could not be added.')),
  });
  const upload = useUploadTypeface(brandId, {
    onSuccess: (r) => {
      setError(null);
      setFile(null);
      onNotice({ kind: 'ok', text: `${r.typeface.family} uploaded. Confirm its licence before it is served on published pages.` });
    },
    onError: (e) => setError(messageOf(e, 'The font file was refused.')),
    onSettled: () => setProgress(null),
  });
  const add = handleSubmit((values) => addShipped.mutate(values), () => setError('Choose a role and an open font.'));
  const send = (f: File) => {
    setProgress(0);
    upload.mutate({ file: f, role: getValues('role'), onProgress: setProgress });
  };
  return (
    <div className="rounded-xl border border-dashed border-rule-strong p-5">
      <h3 className="font-semibold">Add a typeface</h3>
      <div className="mt-3 grid gap-5 md:grid-cols-[12rem_1fr_1fr]">
        <div>
          <label htmlFor={`${id}-role`} className="label">For</label>
          <select id={`${id}-role`} className="field" {...register('role')}>
            {TYPEFACE_ROLES.map((r) => <option key={r} value={r}>{ROLE_LABEL[r]}</option>)}
          </select>
        </div>
        <div>
          <label htmlFor={`${id}-shipped`} className="label">An open font Plumbline ships</label>
          <div className="flex gap-2">
            <select id={`${id}-shipped`} className="field" {...register('shipped')}>
              {SHIPPED_FONTS.map((f) => <option key={f.key} value={f.key}>{f.family} ({f.category})</option>)}
            </select>
            <button type="button" className="btn-primary" disabled={addShipped.isPending} onClick={add}>{addShipped.isPending ? 'Adding…' : 'Add'}</button>
          </div>
          <p className="hint">Licensed under the SIL Open Font License; free to embed.</p>
        </div>
        <div>
          <label htmlFor={`${id}-file`} className="label">Or upload a font file</label>
          <div className="flex gap-2">
            <input
              id={`${id}-file`}
              type="file"
              accept={acceptAttribute('typeface')}
              className="field py-1.5 text-sm file:mr-3 file:rounded file:border-0 file:bg-paper file:px-2 file:py-1 file:text-sm file:font-semibold"
              onChange={(e) => setFile(e.target.files?.[0] ?? null)}
            />
            <button type="button" className="btn-quiet" disabled={!file || upload.isPending} onClick={() => file && send(file)}>Upload</button>
          </div>
          <p className="hint">WOFF2, WOFF, TTF or OTF, up to 10 MB.</p>
          {progress !== null && (
            <div className="mt-2" role="status">
              <progress className="h-2 w-full accent-plumb" max={1} value={progress} aria-label="Upload progress" />
              <span className="text-xs text-ink-soft">{progress < 1 ? `Uploading… ${Math.round(progress * 100)}%` : 'Reading the font…'}</span>
            </div>
          )}
        </div>
      </div>
      {error && <p role="alert" className="mt-4 rounded-md bg-danger-wash px-3 py-2 text-sm text-danger">{error}</p>}
    </div>
  );
}
