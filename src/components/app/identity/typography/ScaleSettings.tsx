// The type scale's settings: base size, ratio, steps, line heights and the column, with the route's own limits.
import { zodResolver } from '@hookform/resolvers/zod';
import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { rangeOf } from '@/lib/client/form';
import { typeScaleBody } from '@/lib/identity/schemas';
import type { Identity } from '@/lib/identity/types';
import { SCALE_RATIOS } from '@/lib/type/scale';
import { messageOf, type NoticeState } from '../shared';
import { useSaveTypeScale, type TypeScaleSettings } from './typography.queries';
import { formatNumber, SITE_LOCALE } from '@/lib/format';

const ratioEntries = Object.entries(SCALE_RATIOS) as [keyof typeof SCALE_RATIOS, (typeof SCALE_RATIOS)[keyof typeof SCALE_RATIOS]][];
type ScaleValues = TypeScaleSettings;
const limit = typeScaleBody.shape;

export function ScaleSettings({ brandId, scale, canEdit, onNotice }: { brandId: string; scale: Identity['typeScale']; canEdit: boolean; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const { register, handleSubmit, formState: { errors, isDirty }, reset } = useForm<ScaleValues>({
    resolver: zodResolver(typeScaleBody),
    values: {
      basePx: scale.basePx,
      ratioName: scale.ratioName,
      stepsUp: scale.stepsUp,
      stepsDown: scale.stepsDown,
      bodyLineHeight: scale.bodyLineHeight,
      headingLineHeight: scale.headingLineHeight,
      columnPx: scale.columnPx,
    },
  });
  const save = useSaveTypeScale(brandId, {
    onSuccess: (_r, v) => {
      onNotice({ kind: 'ok', text: 'Type scale saved.' });
      reset(v);
    },
    onError: (e) => onNotice({ kind: 'error', text: messageOf(e, 'The type scale could not be saved.') }),
  });
  const num = { valueAsNumber: true } as const;
  const field = (name: keyof ScaleValues, label: string, props: Record<string, unknown>, hint?: string) => (
    <div>
      <label htmlFor={`${id}-${name}`} className="label">{label}</label>
      <input id={`${id}-${name}`} type="number" className="field font-mono text-sm" disabled={!canEdit} aria-invalid={!!errors[name]} {...props} {...register(name, num)} />
      {errors[name] ? <p className="error-text">{errors[name]?.message}</p> : hint && <p className="hint">{hint}</p>}
    </div>
  );
  return (
    <form onSubmit={handleSubmit((v) => save.mutate(v))} noValidate className="panel min-w-0 space-y-4 self-start p-5" aria-labelledby={`${id}-title`}>
      <h3 id={`${id}-title`} className="font-semibold">Scale settings</h3>
      {field('basePx', 'Base size (px)', { step: 0.5, ...rangeOf(limit.basePx) }, 'The body text size; step 0 of the scale.')}
      <div>
        <label htmlFor={`${id}-ratio`} className="label">Ratio</label>
        <select id={`${id}-ratio`} className="field" disabled={!canEdit} {...register('ratioName')}>
          {ratioEntries.map(([key, r]) => <option key={key} value={key}>{r.label} — {r.interval} ({formatNumber(r.ratio, SITE_LOCALE, 3)})</option>)}
        </select>
        <p className="hint">Each step is the one below times this ratio, named after the musical interval.</p>
      </div>
      <div className="grid grid-cols-2 gap-3">
        {field('stepsUp', 'Steps up', { step: 1, ...rangeOf(limit.stepsUp) })}
        {field('stepsDown', 'Steps down', { step: 1, ...rangeOf(limit.stepsDown) })}
        {field('headingLineHeight', 'Heading line height', { step: 0.05, ...rangeOf(limit.headingLineHeight) })}
        {field('bodyLineHeight', 'Body line height', { step: 0.05, ...rangeOf(limit.bodyLineHeight) })}
      </div>
      {field('columnPx', 'Column width (px)', { step: 10, ...rangeOf(limit.columnPx) }, 'The text column the measure is worked out for.')}
      {canEdit && (
        <button type="submit" className="btn-primary w-full" disabled={save.isPending || !isDirty}>{save.isPending ? 'Saving…' : isDirty ? 'Save scale' : 'Saved'}</button>
      )}
    </form>
  );
}
