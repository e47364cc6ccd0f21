// Settings controls shared by the block views: identity pickers by id, toggles, text and number fields.
import { useId, type ReactNode } from 'react';
import type { Identity } from '@/lib/identity/types';
import { colorsInOrder, logosInOrder } from '@/lib/guideline/identity';
import { safeHex } from '@/components/guideline/parts';

export function Field({ label, hint, children }: { label: string; hint?: string; children: (id: string) => ReactNode }) {
  const id = useId();
  return (
    <div>
      <label htmlFor={id} className="label">{label}</label>
      {children(id)}
      {hint ? <p className="hint">{hint}</p> : null}
    </div>
  );
}

export function TextInput({ label, value, onChange, max, multiline, hint }: { label: string; value: string; onChange: (v: string) => void; max: number; multiline?: boolean; hint?: string }) {
  return (
    <Field label={label} hint={hint}>
      {(id) =>
        multiline ? (
          <textarea id={id} className="field min-h-20" value={value} maxLength={max} onChange={(e) => onChange(e.target.value)} />
        ) : (
          <input id={id} className="field" value={value} maxLength={max} onChange={(e) => onChange(e.target.value)} />
        )
      }
    </Field>
  );
}

export function NumberInput({ label, value, onChange, min, max, step, unit }: { label: string; value: number; onChange: (v: number) => void; min: number; max: number; step: number; unit?: string }) {
  return (
    <Field label={`${label}${unit ? ` (${unit})` : ''}`}>
      {(id) => (
        <div className="flex items-center gap-3">
          <input id={id} type="range" className="w-full accent-plumb" min={min} max={max} step={step} value={value} onChange={(e) => onChange(Number(e.target.value))} />
          <output htmlFor={id} className="w-14 text-right font-mono text-sm">{value}</output>
        </div>
      )}
    </Field>
  );
}

export function Toggle({ label, checked, onChange }: { label: string; checked: boolean; onChange: (v: boolean) => void }) {
  return (
    <label className="flex items-center gap-2 text-sm font-medium">
      <input type="checkbox" className="size-4 accent-plumb" checked={checked} onChange={(e) => onChange(e.target.checked)} />
      {label}
    </label>
  );
}

/** Tick several options, kept in the given order of ticking (missing ids stay listed so they can be removed). */
export function MultiPick({ legend, options, value, onChange, missingLabel }: { legend: string; options: { id: string; label: string; swatch?: string }[]; value: string[]; onChange: (v: string[]) => void; missingLabel: string }) {
  const missing = value.filter((id) => !options.some((o) => o.id === id));
  const toggle = (id: string, on: boolean) => onChange(on ? [...value, id] : value.filter((v) => v !== id));
  return (
    <fieldset>
      <legend className="label">{legend}</legend>
      {options.length === 0 ? <p className="hint">Nothing in the identity yet: add it on the identity screen first.</p> : null}
      <div className="flex flex-wrap gap-2">
        {options.map((o) => (
          <label key={o.id} className="flex items-center gap-2 rounded-md border border-rule bg-card px-2.5 py-1.5 text-sm">
            <input type="checkbox" className="size-4 accent-plumb" checked={value.includes(o.id)} onChange={(e) => toggle(o.id, e.target.checked)} />
            {o.swatch ? <span className="size-4 rounded-sm border border-black/10" style={{ backgroundColor: safeHex(o.swatch, '#ffffff') }} aria-hidden="true" /> : null}
            {o.label}
          </label>
        ))}
        {missing.map((id) => (
          <label key={id} className="flex items-center gap-2 rounded-md border border-dashed border-rule-strong px-2.5 py-1.5 text-sm text-ink-soft">
            <input type="checkbox" className="size-4" checked onChange={() => toggle(id, false)} />
            {missingLabel}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

export function Select<T extends string>({ label, value, options, onChange, hint }: { label: string; value: T; options: { value: T; label: string }[]; onChange: (v: T) => void; hint?: string }) {
  return (
    <Field label={label} hint={hint}>
      {(id) => (
        <select id={id} className="field" value={value} onChange={(e) => onChange(e.target.value as T)}>
          {options.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
        </select>
      )}
    </Field>
  );
}

const NONE = '';

/** One colour by id (or none); a removed id stays selectable as "removed" until changed. */
export function ColorSelect({ label, identity, value, onChange, noneLabel = 'None' }: { label: string; identity: Identity; value: string | null; onChange: (v: string | null) => void; noneLabel?: string }) {
  const options = [{ value: NONE, label: noneLabel }, ...colorsInOrder(identity).map((c) => ({ value: c.id, label: `${c.name} (${c.hex})` }))];
  if (value && !options.some((o) => o.value === value)) options.push({ value, label: 'Removed colour' });
  return <Select label={label} value={value ?? NONE} options={options} onChange={(v) => onChange(v === NONE ? null : v)} />;
}

export function LogoSelect({ label, identity, value, onChange }: { label: string; identity: Identity; value: string | null; onChange: (v: string | null) => void }) {
  const options = [{ value: NONE, label: 'Choose a logo' }, ...logosInOrder(identity).map((l) => ({ value: l.id, label: `${l.name} (${l.variant})` }))];
  if (value && !options.some((o) => o.value === value)) options.push({ value, label: 'Removed logo' });
  return <Select label={label} value={value ?? NONE} options={options} onChange={(v) => onChange(v === NONE ? null : v)} />;
}

export const colorOptions = (identity: Identity) => colorsInOrder(identity).map((c) => ({ id: c.id, label: c.name, swatch: c.hex }));
export const logoOptions = (identity: Identity) => logosInOrder(identity).map((l) => ({ id: l.id, label: `${l.name} (${l.variant})` }));
