// A logo's settings: name, variant, clear-space unit and multiple, thinnest stroke and chosen minimum sizes,
// checked with the route's own schema (its limits and words) before they are sent.
import { zodResolver } from '@hookform/resolvers/zod';
import { useId } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { maxLengthOf, rangeOf } from '@/lib/client/form';
import { updateLogoBody } from '@/lib/identity/schemas';
import { LOGO_VARIANTS, type IdentityLogo } from '@/lib/identity/types';
import { messageOf, type NoticeState } from '../shared';
import { VARIANT_LABEL } from './labels';
import { useUpdateLogo } from './logos.queries';

type SettingsValues = z.input<typeof updateLogoBody>;
const field = updateLogoBody.shape;
/** An empty minimum means "use the suggestion" (null); anything else is read as a number for the schema to judge. */
const orSuggestion = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? null : v === null || v === undefined ? null : Number(v));

export function LogoSettings({ brandId, logo, onNotice }: { brandId: string; logo: IdentityLogo; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const chosenPx = logo.minimumSize.screenPx !== logo.minimumSize.suggested.screenPx ? logo.minimumSize.screenPx : null;
  const chosenMm = logo.minimumSize.printMm !== logo.minimumSize.suggested.printMm ? logo.minimumSize.printMm : null;
  const { register, handleSubmit, formState: { errors, isDirty }, reset } = useForm<SettingsValues, unknown, z.output<typeof updateLogoBody>>({
    resolver: zodResolver(updateLogoBody),
    values: {
      name: logo.name,
      variant: logo.variant,
      clearSpaceLabel: logo.clearSpace.unitLabel,
      clearSpaceUnit: logo.clearSpace.unitSize,
      clearSpaceMultiple: logo.clearSpace.multiple,
      thinnestStroke: logo.minimumSize.thinnestStroke,
      minScreenPx: chosenPx,
      minPrintMm: chosenMm,
    },
  });
  const save = useUpdateLogo(brandId, logo.id, {
    onSuccess: (r) => {
      onNotice({ kind: 'ok', text: `${r.logo.name} saved.` });
      reset();
    },
    onError: (e) => onNotice({ kind: 'error', text: messageOf(e, 'The logo settings could not be saved.') }),
  });
  const num = { valueAsNumber: true } as const;
  const minimum = { setValueAs: orSuggestion } as const;
  const err = (k: keyof SettingsValues) => errors[k] && <p className="error-text">{errors[k]?.message}</p>;
  const sizeError = errors.minScreenPx?.message ?? errors.minPrintMm?.message;
  return (
    <form onSubmit={handleSubmit((v) => save.mutate(v))} noValidate className="space-y-4" aria-label={`Settings of ${logo.name}`}>
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor={`${id}-name`} className="label">Name</label>
          <input id={`${id}-name`} className="field" maxLength={maxLengthOf(field.name)} aria-invalid={!!errors.name} {...register('name')} />
          {err('name')}
        </div>
        <div>
          <label htmlFor={`${id}-variant`} className="label">Variant</label>
          <select id={`${id}-variant`} className="field" {...register('variant')}>
            {LOGO_VARIANTS.map((v) => <option key={v} value={v}>{VARIANT_LABEL[v]}</option>)}
          </select>
        </div>
      </div>
      <fieldset className="space-y-3">
        <legend className="label">Clear space</legend>
        <div>
          <label htmlFor={`${id}-label`} className="mb-1 block text-xs font-semibold text-ink-soft">The unit is…</label>
          <input id={`${id}-label`} className="field" maxLength={maxLengthOf(field.clearSpaceLabel)} aria-invalid={!!errors.clearSpaceLabel} {...register('clearSpaceLabel')} />
          {err('clearSpaceLabel')}
        </div>
        <div className="grid grid-cols-2 gap-3">
          <div>
            <label htmlFor={`${id}-unit`} className="mb-1 block text-xs font-semibold text-ink-soft">Unit size (logo units)</label>
            <input id={`${id}-unit`} type="number" step="any" className="field font-mono text-sm" aria-invalid={!!errors.clearSpaceUnit} {...register('clearSpaceUnit', num)} />
            {err('clearSpaceUnit')}
          </div>
          <div>
            <label htmlFor={`${id}-multiple`} className="mb-1 block text-xs font-semibold text-ink-soft">Keep clear by (× unit)</label>
            <input id={`${id}-multiple`} type="number" step="0.25" {...rangeOf(field.clearSpaceMultiple)} className="field font-mono text-sm" aria-invalid={!!errors.clearSpaceMultiple} {...register('clearSpaceMultiple', num)} />
            {err('clearSpaceMultiple')}
          </div>
        </div>
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="label">Minimum size</legend>
        <div>
          <label htmlFor={`${id}-stroke`} className="mb-1 block text-xs font-semibold text-ink-soft">Thinnest stroke (logo units)</label>
          <input id={`${id}-stroke`} type="number" step="any" className="field font-mono text-sm" aria-invalid={!!errors.thinnestStroke} {...register('thinnestStroke', num)} />
          {err('thinnestStroke') ?? <p className="hint">Measured from the file; correct it if a hairline was missed or a gap was taken for a stroke.</p>}
        </div>
        <div className="grid grid-cols-2 gap-3">
          <div>
            <label htmlFor={`${id}-px`} className="mb-1 block text-xs font-semibold text-ink-soft">On screen (px wide)</label>
            <input id={`${id}-px`} inputMode="numeric" className="field font-mono text-sm" placeholder={`${logo.minimumSize.suggested.screenPx} suggested`} aria-invalid={!!sizeError} {...register('minScreenPx', minimum)} />
          </div>
          <div>
            <label htmlFor={`${id}-mm`} className="mb-1 block text-xs font-semibold text-ink-soft">In print (mm wide)</label>
            <input id={`${id}-mm`} inputMode="decimal" className="field font-mono text-sm" placeholder={`${logo.minimumSize.suggested.printMm} suggested`} aria-invalid={!!sizeError} {...register('minPrintMm', minimum)} />
          </div>
        </div>
        <p className={sizeError ? 'error-text' : 'hint'} role={sizeError ? 'alert' : undefined}>{sizeError ?? 'Leave empty to use the suggestion.'}</p>
      </fieldset>
      <button type="submit" className="btn-primary" disabled={save.isPending || !isDirty}>{save.isPending ? 'Saving…' : 'Save logo settings'}</button>
    </form>
  );
}
