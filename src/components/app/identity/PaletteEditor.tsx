// The palette: large swatches with every notation and a copy button per value; add, edit, reorder and remove colours.
import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation } from '@tanstack/react-query';
import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { api } from '@/lib/client/api';
import { parseColor } from '@/lib/color/parse';
import { PRINT_CAUTION } from '@/lib/cautions';
import { COLOR_ROLES, type ColorRole, type IdentityColor } from '@/lib/identity/types';
import { Caution, CopyButton, IdentityRoot, inkOn, LoadState, messageOf, Notice, useIdentity, useRefreshIdentity } from './shared';

const ROLE_LABEL: Record<ColorRole, string> = {
  primary: 'Primary',
  secondary: 'Secondary',
  accent: 'Accent',
  neutral: 'Neutral',
  background: 'Background',
  text: 'Text',
  support: 'Support',
};

const fmt = (n: number) => String(Math.round(n * 100) / 100);
const cmykText = (c: readonly number[]) => c.map((v) => fmt(v)).join(' ');

/** Every value of one colour, as label → text to copy. */
function valueRows(c: IdentityColor): { key: string; label: string; value: string; print?: boolean }[] {
  const rows = [
    { key: 'hex', label: 'HEX', value: c.hex },
    { key: 'rgb', label: 'RGB', value: `rgb(${c.rgb.join(' ')})` },
    { key: 'hsl', label: 'HSL', value: c.hsl.css },
    { key: 'oklch', label: 'OKLCH', value: c.oklch.css },
    { key: 'lab', label: 'Lab D50', value: c.lab.css },
    { key: 'lab65', label: 'Lab D65', value: `${fmt(c.lab65.l)} ${fmt(c.lab65.a)} ${fmt(c.lab65.b)}` },
    { key: 'cmyk', label: 'CMYK formula', value: cmykText(c.cmyk), print: true },
    { key: 'cmykIcc', label: 'CMYK profiled', value: cmykText(c.cmykIcc), print: true },
  ];
  if (c.cmykOverride) rows.push({ key: 'cmykOverride', label: 'CMYK proofed', value: cmykText(c.cmykOverride), print: true });
  if (c.spot) rows.push({ key: 'spot', label: 'Spot', value: c.spot, print: true });
  return rows;
}

const colorForm = z.object({
  name: z.string().trim().min(1, 'Give the colour a name.').max(80, 'A colour name can be at most 80 characters.'),
  value: z.string().trim().min(1, 'Type a colour value, e.g. #1f6f5c or oklch(55% 0.1 170).').max(200),
  role: z.string(),
});
type ColorFormValues = z.infer<typeof colorForm>;

/** A small live swatch for what is being typed; the server's answer stays the judge. */
function TypedSwatch({ value }: { value: string }) {
  const parsed = value.trim() ? parseColor(value.trim()) : null;
  return (
    <span
      aria-hidden="true"
      className="block h-10 w-10 shrink-0 rounded-md border border-rule-strong"
      style={parsed?.ok ? { background: parsed.color.hex } : { background: 'repeating-linear-gradient(45deg, #f8f6f2 0 6px, #e4dfd6 6px 12px)' }}
    />
  );
}

function AddColorForm({ brandId, onAdded }: { brandId: string; onAdded: (name: string) => void }) {
  const refresh = useRefreshIdentity(brandId);
  const id = useId();
  const { register, handleSubmit, reset, watch, formState: { errors } } = useForm<ColorFormValues>({
    resolver: zodResolver(colorForm),
    defaultValues: { name: '', value: '', role: '' },
  });
  const add = useMutation({
    mutationFn: (v: ColorFormValues) =>
      api<{ color: IdentityColor }>(`/api/brands/${brandId}/colors`, { method: 'POST', body: { name: v.name, value: v.value, role: v.role || null } }),
    onSuccess: async (r) => {
      reset({ name: '', value: '', role: '' });
      onAdded(r.color.name);
      await refresh();
    },
  });
  const valueError = errors.value?.message ?? (add.isError ? messageOf(add.error, 'The colour could not be added.') : undefined);
  return (
    <form onSubmit={handleSubmit((v) => add.mutate(v))} noValidate className="rounded-xl border border-dashed border-rule-strong p-5" aria-labelledby={`${id}-title`}>
      <h3 id={`${id}-title`} className="font-semibold">Add a colour</h3>
      <div className="mt-3 grid gap-4 sm:grid-cols-[1fr_1.4fr_auto_auto] sm:items-start">
        <div>
          <label htmlFor={`${id}-name`} className="label">Name</label>
          <input id={`${id}-name`} className="field" placeholder="e.g. Harbour Blue" aria-invalid={!!errors.name} {...register('name')} />
          {errors.name && <p className="error-text">{errors.name.message}</p>}
        </div>
        <div>
          <label htmlFor={`${id}-value`} className="label">Value</label>
          <div className="flex items-center gap-2">
            <TypedSwatch value={watch('value')} />
            <input
              id={`${id}-value`}
              className="field font-mono text-sm"
              placeholder="#1f6f5c, rgb(31 111 92), oklch(48% 0.08 170)…"
              autoComplete="off"
              spellCheck={false}
              aria-invalid={!!valueError}
              aria-describedby={`${id}-value-note`}
              {...register('value', { onChange: () => add.isError && add.reset() })}
            />
          </div>
          <p id={`${id}-value-note`} className={valueError ? 'error-text' : 'hint'} role={add.isError ? 'alert' : undefined}>
            {valueError ?? 'Any CSS notation: hex, rgb(), hsl(), oklch(), lab() or a colour name.'}
          </p>
        </div>
        <div>
          <label htmlFor={`${id}-role`} className="label">Role</label>
          <select id={`${id}-role`} className="field" {...register('role')}>
            <option value="">No role</option>
            {COLOR_ROLES.map((r) => <option key={r} value={r}>{ROLE_LABEL[r]}</option>)}
          </select>
        </div>
        <button type="submit" className="btn-primary sm:mt-7" disabled={add.isPending}>{add.isPending ? 'Adding…' : 'Add colour'}</button>
      </div>
    </form>
  );
}

const editForm = colorForm.extend({
  c: z.string(),
  m: z.string(),
  y: z.string(),
  k: z.string(),
  spot: z.string().max(120, 'Keep the spot reference under 120 characters.'),
});
type EditValues = z.infer<typeof editForm>;

/** Four CMYK boxes → [c,m,y,k], null when all empty, or a message when only some are filled or out of range. */
function readCmyk(v: EditValues): [number, number, number, number] | null | string {
  const parts = [v.c, v.m, v.y, v.k].map((s) => s.trim());
  if (parts.every((p) => p === '')) return null;
  if (parts.some((p) => p === '')) return 'Fill in all four CMYK numbers, or leave all four empty to use the computed values.';
  const nums = parts.map(Number);
  if (nums.some((n) => !Number.isFinite(n) || n < 0 || n > 100)) return 'CMYK numbers run from 0 to 100.';
  return nums as [number, number, number, number];
}

function EditColorForm({ brandId, color, onDone }: { brandId: string; color: IdentityColor; onDone: (text: string) => void }) {
  const refresh = useRefreshIdentity(brandId);
  const id = useId();
  const [cmykError, setCmykError] = useState<string | null>(null);
  const o = color.cmykOverride;
  const { register, handleSubmit, watch, formState: { errors } } = useForm<EditValues>({
    resolver: zodResolver(editForm),
    defaultValues: {
      name: color.name,
      value: color.value,
      role: color.role ?? '',
      c: o ? String(o[0]) : '',
      m: o ? String(o[1]) : '',
      y: o ? String(o[2]) : '',
      k: o ? String(o[3]) : '',
      spot: color.spot ?? '',
    },
  });
  const save = useMutation({
    mutationFn: (body: Record<string, unknown>) => api<{ color: IdentityColor }>(`/api/brands/${brandId}/colors/${color.id}`, { method: 'PATCH', body }),
    onSuccess: async (r) => {
      onDone(`${r.color.name} saved.`);
      await refresh();
    },
  });
  const submit = handleSubmit((v) => {
    const cmyk = readCmyk(v);
    if (typeof cmyk === 'string') return setCmykError(cmyk);
    setCmykError(null);
    save.mutate({ name: v.name, value: v.value, role: v.role || null, cmyk, spot: v.spot.trim() || null });
  });
  const valueError = errors.value?.message ?? (save.isError ? messageOf(save.error, 'The colour could not be saved.') : undefined);
  return (
    <form onSubmit={submit} noValidate className="space-y-4 border-t border-rule p-4" aria-label={`Edit ${color.name}`}>
      <div>
        <label htmlFor={`${id}-name`} className="label">Name</label>
        <input id={`${id}-name`} className="field" aria-invalid={!!errors.name} {...register('name')} />
        {errors.name && <p className="error-text">{errors.name.message}</p>}
      </div>
      <div>
        <label htmlFor={`${id}-value`} className="label">Value</label>
        <div className="flex items-center gap-2">
          <TypedSwatch value={watch('value')} />
          <input id={`${id}-value`} className="field font-mono text-sm" spellCheck={false} autoComplete="off" aria-invalid={!!valueError} aria-describedby={`${id}-value-note`} {...register('value')} />
        </div>
        {valueError && <p id={`${id}-value-note`} className="error-text" role="alert">{valueError}</p>}
      </div>
      <div>
        <label htmlFor={`${id}-role`} className="label">Role</label>
        <select id={`${id}-role`} className="field" {...register('role')}>
          <option value="">No role</option>
          {COLOR_ROLES.map((r) => <option key={r} value={r}>{ROLE_LABEL[r]}</option>)}
        </select>
      </div>
      <fieldset>
        <legend className="label">Proofed CMYK (optional)</legend>
        <div className="grid grid-cols-4 gap-2">
          {(['c', 'm', 'y', 'k'] as const).map((ch) => (
            <div key={ch}>
              <label htmlFor={`${id}-${ch}`} className="mb-1 block text-xs font-semibold uppercase text-ink-soft">{ch}</label>
              <input id={`${id}-${ch}`} className="field px-2 font-mono text-sm" inputMode="decimal" aria-invalid={!!cmykError} {...register(ch)} />
            </div>
          ))}
        </div>
        <p className={cmykError ? 'error-text' : 'hint'} role={cmykError ? 'alert' : undefined}>
          {cmykError ?? 'The values your printer approved on a proof. Leave empty to show the computed ones.'}
        </p>
      </fieldset>
      <div>
        <label htmlFor={`${id}-spot`} className="label">Spot colour reference (optional)</label>
        <input id={`${id}-spot`} className="field" placeholder="the swatch-book reference your printer uses" aria-invalid={!!errors.spot} {...register('spot')} />
        {errors.spot && <p className="error-text">{errors.spot.message}</p>}
      </div>
      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={save.isPending}>{save.isPending ? 'Saving…' : 'Save'}</button>
        <button type="button" className="btn-quiet" onClick={() => onDone('')}>Cancel</button>
      </div>
    </form>
  );
}

function ColorCard({
  brandId,
  color,
  canEdit,
  index,
  count,
  onMove,
  onNotice,
  printNoteId,
}: {
  brandId: string;
  color: IdentityColor;
  canEdit: boolean;
  index: number;
  count: number;
  onMove: (from: number, to: number) => void;
  onNotice: (n: { kind: 'ok' | 'error'; text: string }) => void;
  printNoteId: string;
}) {
  const [editing, setEditing] = useState(false);
  const refresh = useRefreshIdentity(brandId);
  const remove = useMutation({
    mutationFn: () => api(`/api/brands/${brandId}/colors/${color.id}`, { method: 'DELETE' }),
    onSuccess: async () => {
      onNotice({ kind: 'ok', text: `${color.name} removed from the palette.` });
      await refresh();
    },
    onError: (e) => onNotice({ kind: 'error', text: messageOf(e, 'The colour could not be removed.') }),
  });
  const ink = inkOn(color.hex);
  return (
    <li className="panel flex flex-col overflow-hidden" data-color-hex={color.hex} aria-label={color.name}>
      <div className="flex h-44 flex-col justify-between p-4" style={{ background: color.hex, color: ink }}>
        <div className="flex items-start justify-between gap-2">
          {/* Full-strength ink: black or white, whichever reads better, always reaches 4.5:1 (WCAG 2.2 SC 1.4.3). */}
          <span className="text-xs font-semibold uppercase tracking-[0.14em]">{color.role ? ROLE_LABEL[color.role] : '\u00a0'}</span>
          <span className="text-xs">{index + 1} of {count}</span>
        </div>
        <div>
          <h3 className="text-2xl font-bold leading-tight">{color.name}</h3>
          <p className="font-mono text-sm">{color.hex}</p>
        </div>
      </div>
      <dl className="divide-y divide-rule text-sm">
        {valueRows(color).map((row) => (
          <div key={row.key} className="flex items-center gap-3 px-4 py-1.5">
            <dt className="w-[6.5rem] shrink-0 text-xs font-semibold text-ink-soft">
              {row.label}
              {row.print && <sup><a href={`#${printNoteId}`} className="ml-0.5 text-warn" aria-label="about print values">*</a></sup>}
            </dt>
            <dd className="flex min-w-0 flex-1 items-center gap-3">
              <span className="min-w-0 flex-1 truncate font-mono text-[0.8rem] text-ink" title={row.value}>{row.value}</span>
              <CopyButton value={row.value} label={`${row.label} of ${color.name}`} />
            </dd>
          </div>
        ))}
      </dl>
      {canEdit && !editing && (
        <div className="mt-auto flex flex-wrap items-center gap-2 border-t border-rule px-4 py-3">
          <button type="button" className="btn-quiet px-3 py-1.5" onClick={() => setEditing(true)}>Edit</button>
          <button type="button" className="btn-quiet px-2.5 py-1.5" disabled={index === 0} onClick={() => onMove(index, index - 1)} aria-label={`Move ${color.name} earlier`}>↑</button>
          <button type="button" className="btn-quiet px-2.5 py-1.5" disabled={index === count - 1} onClick={() => onMove(index, index + 1)} aria-label={`Move ${color.name} later`}>↓</button>
          <button
            type="button"
            className="btn-danger ml-auto px-3 py-1.5"
            disabled={remove.isPending}
            onClick={() => { if (confirm(`Remove ${color.name} from the palette? Guideline sections that use it will no longer show it.`)) remove.mutate(); }}
          >
            {remove.isPending ? 'Removing…' : 'Remove'}
          </button>
        </div>
      )}
      {canEdit && editing && (
        <EditColorForm
          brandId={brandId}
          color={color}
          onDone={(text) => {
            setEditing(false);
            if (text) onNotice({ kind: 'ok', text });
          }}
        />
      )}
    </li>
  );
}

function Palette({ brandId, canEdit }: { brandId: string; canEdit: boolean }) {
  const identity = useIdentity(brandId);
  const refresh = useRefreshIdentity(brandId);
  const [notice, setNotice] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  const printNoteId = useId();
  const reorder = useMutation({
    mutationFn: (ids: string[]) => api(`/api/brands/${brandId}/colors/order`, { method: 'PUT', body: { ids } }),
    onSuccess: () => refresh(),
    onError: (e) => {
      setNotice({ kind: 'error', text: messageOf(e, 'The new order could not be saved.') });
      return refresh();
    },
  });
  if (!identity.data) return <LoadState query={identity} what="palette" />;
  const colors = identity.data.colors;
  const move = (from: number, to: number) => {
    const ids = colors.map((c) => c.id);
    const [moved] = ids.splice(from, 1);
    ids.splice(to, 0, moved);
    reorder.mutate(ids);
  };
  return (
    <div className="space-y-5">
      <Notice notice={notice} />
      {colors.length === 0 ? (
        <div className="rounded-xl border border-rule bg-paper/60 px-6 py-10 text-center">
          <p className="text-lg font-semibold">No colours yet</p>
          <p className="mt-1 text-ink-soft">
            {canEdit
              ? 'Add the brand’s first colour below: type its value in any notation and Plumbline works out every other one.'
              : 'The brand’s designers have not added colours yet.'}
          </p>
        </div>
      ) : (
        <ol className="grid gap-5 md:grid-cols-2" aria-label="Palette" aria-busy={reorder.isPending}>
          {colors.map((c, i) => (
            <ColorCard key={c.id} brandId={brandId} color={c} canEdit={canEdit} index={i} count={colors.length} onMove={move} onNotice={setNotice} printNoteId={printNoteId} />
          ))}
        </ol>
      )}
      {colors.length > 0 && (
        <div id={printNoteId}>
          <Caution title="* Print values need a proof">
            {PRINT_CAUTION} “CMYK formula” is the plain arithmetic conversion; “CMYK profiled” goes through a generic press profile.
          </Caution>
        </div>
      )}
      {canEdit && <AddColorForm brandId={brandId} onAdded={(name) => setNotice({ kind: 'ok', text: `${name} added to the palette.` })} />}
    </div>
  );
}

export default function PaletteEditor({ brandId, canEdit }: { brandId: string; canEdit: boolean }) {
  return (
    <IdentityRoot>
      <Palette brandId={brandId} canEdit={canEdit} />
    </IdentityRoot>
  );
}
