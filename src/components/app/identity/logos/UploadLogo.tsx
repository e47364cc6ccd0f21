// Upload a logo (SVG or PNG) as one of the variants; progress while it travels, then while it is measured.
import { zodResolver } from '@hookform/resolvers/zod';
import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { logoFields } from '@/lib/identity/schemas';
import { LOGO_VARIANTS } from '@/lib/identity/types';
import { messageOf, type NoticeState } from '../shared';
import { VARIANT_LABEL } from './labels';
import { useUploadLogo } from './logos.queries';
import { acceptAttribute } from '@/lib/uploads/rules';

// The route's own field schema, and the file the form must hold before it sends anything.
const uploadForm = logoFields.pick({ variant: true }).extend({
  file: z.custom<File | null>((v) => typeof File !== 'undefined' && v instanceof File, 'Choose an SVG or PNG file first.'),
});
type UploadValues = z.input<typeof uploadForm>;

export function UploadLogo({ brandId, onNotice }: { brandId: string; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const [progress, setProgress] = useState<number | null>(null);
  const [inputKey, setInputKey] = useState(0);
  const { register, handleSubmit, setValue, setError, clearErrors, formState: { errors } } = useForm<UploadValues>({
    resolver: zodResolver(uploadForm, undefined, { raw: true }),
    defaultValues: { variant: 'primary', file: null },
  });
  const upload = useUploadLogo(brandId, {
    onSuccess: (r) => {
      clearErrors();
      setValue('file', null);
      setInputKey((k) => k + 1);
      onNotice({ kind: 'ok', text: r.duplicate ? `That file is already here as ${r.logo.name}.` : `${r.logo.name} uploaded; its bounds and clear space are measured below.` });
    },
    onError: (e) => setError('root', { message: messageOf(e, 'The logo was refused.') }),
    onSettled: () => setProgress(null),
  });
  const submit = handleSubmit(({ file, variant }) => {
    setProgress(0);
    upload.mutate({ file: file!, variant: variant ?? 'primary', onProgress: setProgress });
  });
  const error = errors.file?.message ?? errors.root?.message;
  return (
    <form className="rounded-xl border border-dashed border-rule-strong p-5" aria-labelledby={`${id}-title`} onSubmit={submit}>
      <h3 id={`${id}-title`} className="font-semibold">Upload a logo</h3>
      <div className="mt-3 grid gap-4 sm:grid-cols-[1fr_12rem_auto] sm:items-start">
        <div>
          <label htmlFor={`${id}-file`} className="label">File</label>
          <input
            key={inputKey}
            id={`${id}-file`}
            type="file"
            accept={acceptAttribute('logo')}
            className="field py-1.5 text-sm file:mr-3 file:rounded file:border-0 file:bg-paper file:px-2 file:py-1 file:text-sm file:font-semibold"
            onChange={(e) => { setValue('file', e.target.files?.[0] ?? null); clearErrors(); }}
          />
          <p className="hint">SVG is best: it stays sharp at every size. PNG works too, up to 5 MB.</p>
        </div>
        <div>
          <label htmlFor={`${id}-variant`} className="label">Variant</label>
          <select id={`${id}-variant`} className="field" {...register('variant')}>
            {LOGO_VARIANTS.map((v) => <option key={v} value={v}>{VARIANT_LABEL[v]}</option>)}
          </select>
        </div>
        <button type="submit" className="btn-primary sm:mt-7" disabled={upload.isPending}>{upload.isPending ? 'Uploading…' : 'Upload logo'}</button>
      </div>
      {progress !== null && (
        <div className="mt-3" role="status">
          <progress className="h-2 w-full accent-plumb" max={1} value={progress} aria-label="Upload progress" />
          <span className="text-xs text-ink-soft">{progress < 1 ? `Uploading… ${Math.round(progress * 100)}%` : 'Checking the file and measuring its bounds…'}</span>
        </div>
      )}
      {error && <p role="alert" className="mt-3 rounded-md bg-danger-wash px-3 py-2 text-sm text-danger">{error}</p>}
    </form>
  );
}
