// Typography: the brand's typefaces by role (shipped open fonts or uploads, with the licence confirmation),
// the type scale settings, and a preview of every step in the brand's own fonts with the measure.
import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation } from '@tanstack/react-query';
import { useEffect, useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { api } from '@/lib/client/api';
import { FONT_LICENCE_CAUTION } from '@/lib/cautions';
import { typeScaleBody } from '@/lib/identity/schemas';
import { TYPEFACE_ROLES, type Identity, type IdentityTypeface, type TypefaceRole } from '@/lib/identity/types';
import { cssFontFamilyList, cssUrl } from '@/lib/safe/escape';
import { SCALE_RATIOS } from '@/lib/type/scale';
import { SHIPPED_FONTS } from '@/lib/type/shipped-fonts';
import { Caution, IdentityRoot, LoadState, messageOf, Notice, uploadWithProgress, useIdentity, useRefreshIdentity } from './shared';
import { When } from '@/components/ui/When';

const ROLE_LABEL: Record<TypefaceRole, string> = { heading: 'Headings', body: 'Body text', accent: 'Accent' };
const SPECIMEN = 'Quiet harbours, bright kites & 24 jars of quince jam.';
const RUNNING_TEXT =
  'Set in the brand’s body face at the base size, this paragraph runs at the column width the measure is computed for. ' +
  'Read a few lines: the eye should find the start of each new line without hunting for it, and the rhythm of words should ' +
  'feel even. If the lines feel long, narrow the column or raise the size; if they feel choppy, widen it.';

type NoticeState = { kind: 'ok' | 'error'; text: string } | null;

/** Loads a face from its file under a private family name, so the preview shows the real font. */
function useFontFace(face: IdentityTypeface | undefined): { family: string | null; state: 'none' | 'loading' | 'ready' | 'failed' } {
  const [state, setState] = useState<'none' | 'loading' | 'ready' | 'failed'>('none');
  const family = face ? `plumbline-preview-${face.id}` : null;
  useEffect(() => {
    if (!face || !family) return setState('none');
    if ([...document.fonts].some((f) => f.family === family && f.status === 'loaded')) return setState('ready');
    let live = true;
    setState('loading');
    const weights = face.metrics.isVariable ? `${face.metrics.weight.min} ${face.metrics.weight.max}` : String(face.metrics.weight.default || 400);
    const ff = new FontFace(family, cssUrl(face.fileUrl), { weight: weights });
    ff.load()
      .then((loaded) => {
        document.fonts.add(loaded);
        if (live) setState('ready');
      })
      .catch(() => live && setState('failed'));
    return () => {
      live = false;
    };
  }, [face, family]);
  return { family, state };
}

/** The CSS font-family for a face: the loaded preview first, then its fallback stack. */
const stackOf = (family: string | null, face: IdentityTypeface | undefined) =>
  cssFontFamilyList([family, ...(face?.fallback ?? []), 'sans-serif'].filter((f): f is string => !!f));

function TypefaceCard({ brandId, face, canEdit, onNotice }: { brandId: string; face: IdentityTypeface; canEdit: boolean; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const refresh = useRefreshIdentity(brandId);
  const { family, state } = useFontFace(face);
  const [fallback, setFallback] = useState(face.fallback.join(', '));
  const [fallbackError, setFallbackError] = useState<string | null>(null);
  const patch = useMutation({
    mutationFn: (body: Record<string, unknown>) => api<{ typeface: IdentityTypeface }>(`/api/brands/${brandId}/typefaces/${face.id}`, { method: 'PATCH', body }),
    onSuccess: async () => {
      setFallbackError(null);
      await refresh();
    },
  });
  const remove = useMutation({
    mutationFn: () => api(`/api/brands/${brandId}/typefaces/${face.id}`, { method: 'DELETE' }),
    onSuccess: async () => {
      onNotice({ kind: 'ok', text: `${face.family} removed.` });
      await refresh();
    },
    onError: (e) => onNotice({ kind: 'error', text: messageOf(e, 'The typeface could not be removed.') }),
  });
  const saveFallback = () => {
    const list = fallback.split(',').map((s) => s.trim()).filter(Boolean);
    patch.mutate({ fallback: list }, { onError: (e) => setFallbackError(messageOf(e, 'The fallback stack could not be saved.')) });
  };
  const m = face.metrics;
  const weights = m.isVariable ? `${m.weight.min}–${m.weight.max} (variable)` : String(m.weight.default);
  return (
    <li className="panel overflow-hidden">
      <div className="border-b border-rule px-5 py-5" style={{ fontFamily: stackOf(family, face) }}>
        <p className="eyebrow" style={{ fontFamily: 'var(--font-sans)' }}>{ROLE_LABEL[face.role]} · {face.source === 'shipped' ? 'shipped open font' : 'uploaded'}</p>
        <p className="mt-2 text-5xl leading-tight text-ink">{face.family}</p>
        <p className="mt-2 text-xl text-ink-soft">{SPECIMEN}</p>
        {state === 'loading' && <p className="mt-2 text-xs text-ink-faint" role="status" style={{ fontFamily: 'var(--font-sans)' }}>Loading the font for preview…</p>}
        {state === 'failed' && <p className="mt-2 text-xs text-danger" role="alert" style={{ fontFamily: 'var(--font-sans)' }}>The font file could not be loaded for preview; the fallback stack is shown.</p>}
      </div>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 px-5 py-3 text-sm sm:grid-cols-4">
        <div><dt className="text-xs text-ink-faint">Weights</dt><dd>{weights}</dd></div>
        <div><dt className="text-xs text-ink-faint">Units per em</dt><dd className="font-mono">{m.unitsPerEm}</dd></div>
        <div><dt className="text-xs text-ink-faint">x-height</dt><dd className="font-mono">{m.xHeight}</dd></div>
        <div><dt className="text-xs text-ink-faint">Cap height</dt><dd className="font-mono">{m.capHeight}</dd></div>
      </dl>
      <div className="space-y-4 border-t border-rule px-5 py-4">
        {canEdit ? (
          <div>
            <label htmlFor={`${id}-fallback`} className="label">Fallback fonts</label>
            <div className="flex gap-2">
              <input id={`${id}-fallback`} className="field font-mono text-sm" value={fallback} onChange={(e) => setFallback(e.target.value)} aria-invalid={!!fallbackError} aria-describedby={`${id}-fallback-note`} />
              <button type="button" className="btn-quiet" onClick={saveFallback} disabled={patch.isPending}>Save</button>
            </div>
            <p id={`${id}-fallback-note`} className={fallbackError ? 'error-text' : 'hint'} role={fallbackError ? 'alert' : undefined}>
              {fallbackError ?? 'Used while the font loads or where it cannot be served; separate names with commas.'}
            </p>
          </div>
        ) : (
          <p className="text-sm text-ink-soft">Fallback: <span className="font-mono">{face.fallback.join(', ') || 'none'}</span></p>
        )}
        {face.source === 'shipped' ? (
          <p className="text-sm text-ink-soft">Licence: SIL Open Font License 1.1 — it allows embedding on web pages; Plumbline ships the file.</p>
        ) : (
          <div className={`rounded-md px-3 py-2.5 text-sm ${face.licence.confirmed ? 'bg-paper' : 'bg-warn-wash'}`}>
            <label className="flex items-start gap-2.5">
              <input
                type="checkbox"
                className="mt-1 h-4 w-4 accent-plumb"
                checked={face.licence.confirmed}
                disabled={!canEdit || patch.isPending}
                onChange={(e) => patch.mutate({ licenceConfirmed: e.target.checked }, { onError: (err) => onNotice({ kind: 'error', text: messageOf(err, 'The licence could not be saved.') }) })}
              />
              <span>
                <span className="font-semibold">The licence allows this font on the web.</span>{' '}
                {face.licence.confirmed
                  ? <>Confirmed{face.licence.confirmedAt ? <> on <When value={face.licence.confirmedAt} /></> : ''}: published pages serve this font.</>
                  : 'Until this is ticked, published pages show the fallback fonts instead.'}
              </span>
            </label>
          </div>
        )}
        {canEdit && (
          <button
            type="button"
            className="btn-danger px-3 py-1.5"
            disabled={remove.isPending}
            onClick={() => { if (confirm(`Remove ${face.family} from the ${ROLE_LABEL[face.role].toLowerCase()} role?`)) remove.mutate(); }}
          >
            {remove.isPending ? 'Removing…' : 'Remove typeface'}
          </button>
        )}
      </div>
    </li>
  );
}

function AddTypeface({ brandId, onNotice }: { brandId: string; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const refresh = useRefreshIdentity(brandId);
  const [role, setRole] = useState<TypefaceRole>('heading');
  const [shipped, setShipped] = useState(SHIPPED_FONTS[0].key);
  const [file, setFile] = useState<File | null>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const addShipped = useMutation({
    mutationFn: () => api<{ typeface: IdentityTypeface }>(`/api/brands/${brandId}/typefaces`, { method: 'POST', body: { shipped, role } }),
    onSuccess: async (r) => {
      setError(null);
      onNotice({ kind: 'ok', text: `${r.typeface.family} added for ${ROLE_LABEL[role].toLowerCase()}.` });
      await refresh();
    },
    onError: (e) => setError(messageOf(e, 'The font could not be added.')),
  });
  const upload = useMutation({
    mutationFn: (f: File) => {
      const form = new FormData();
      form.set('file', f);
      form.set('role', role);
      setProgress(0);
      return uploadWithProgress<{ typeface: IdentityTypeface }>(`/api/brands/${brandId}/typefaces`, form, setProgress);
    },
    onSuccess: async (r) => {
      setError(null);
      setFile(null);
      onNotice({ kind: 'ok', text: `${r.typeface.family} uploaded. Confirm its licence before it is served on published pages.` });
      await refresh();
    },
    onError: (e) => setError(messageOf(e, 'The font file was refused.')),
    onSettled: () => setProgress(null),
  });
  return (
    <div className="rounded-xl border border-dashed border-rule-strong p-5">
      <h3 className="font-semibold">Add a typeface</h3>
      <div className="mt-3 grid gap-5 md:grid-cols-[12rem_1fr_1fr]">
        <div>
          <label htmlFor={`${id}-role`} className="label">For</label>
          <select id={`${id}-role`} className="field" value={role} onChange={(e) => setRole(e.target.value as TypefaceRole)}>
            {TYPEFACE_ROLES.map((r) => <option key={r} value={r}>{ROLE_LABEL[r]}</option>)}
          </select>
        </div>
        <div>
          <label htmlFor={`${id}-shipped`} className="label">An open font Plumbline ships</label>
          <div className="flex gap-2">
            <select id={`${id}-shipped`} className="field" value={shipped} onChange={(e) => setShipped(e.target.value)}>
              {SHIPPED_FONTS.map((f) => <option key={f.key} value={f.key}>{f.family} ({f.category})</option>)}
            </select>
            <button type="button" className="btn-primary" disabled={addShipped.isPending} onClick={() => addShipped.mutate()}>{addShipped.isPending ? 'Adding…' : 'Add'}</button>
          </div>
          <p className="hint">Licensed under the SIL Open Font License; free to embed.</p>
        </div>
        <div>
          <label htmlFor={`${id}-file`} className="label">Or upload a font file</label>
          <div className="flex gap-2">
            <input
              id={`${id}-file`}
              type="file"
              accept=".woff2,.woff,.ttf,.otf,font/woff2,font/woff,font/ttf,font/otf"
              className="field py-1.5 text-sm file:mr-3 file:rounded file:border-0 file:bg-paper file:px-2 file:py-1 file:text-sm file:font-semibold"
              onChange={(e) => setFile(e.target.files?.[0] ?? null)}
            />
            <button type="button" className="btn-quiet" disabled={!file || upload.isPending} onClick={() => file && upload.mutate(file)}>Upload</button>
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

const ratioEntries = Object.entries(SCALE_RATIOS) as [keyof typeof SCALE_RATIOS, (typeof SCALE_RATIOS)[keyof typeof SCALE_RATIOS]][];
type ScaleValues = z.infer<typeof typeScaleBody>;

function ScaleSettings({ brandId, scale, canEdit, onNotice }: { brandId: string; scale: Identity['typeScale']; canEdit: boolean; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const refresh = useRefreshIdentity(brandId);
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
  const save = useMutation({
    mutationFn: (v: ScaleValues) => api<{ typeScale: Identity['typeScale'] }>(`/api/brands/${brandId}/type-scale`, { method: 'PUT', body: v }),
    onSuccess: async (r, v) => {
      onNotice({ kind: 'ok', text: 'Type scale saved.' });
      reset(v);
      await refresh();
      return r;
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
      {field('basePx', 'Base size (px)', { step: 0.5, min: 10, max: 32 }, 'The body text size; step 0 of the scale.')}
      <div>
        <label htmlFor={`${id}-ratio`} className="label">Ratio</label>
        <select id={`${id}-ratio`} className="field" disabled={!canEdit} {...register('ratioName')}>
          {ratioEntries.map(([key, r]) => <option key={key} value={key}>{r.label} — {r.interval} ({r.ratio.toFixed(3)})</option>)}
        </select>
        <p className="hint">Each step is the one below times this ratio, named after the musical interval.</p>
      </div>
      <div className="grid grid-cols-2 gap-3">
        {field('stepsUp', 'Steps up', { step: 1, min: 1, max: 10 })}
        {field('stepsDown', 'Steps down', { step: 1, min: 0, max: 4 })}
        {field('headingLineHeight', 'Heading line height', { step: 0.05, min: 0.9, max: 2 })}
        {field('bodyLineHeight', 'Body line height', { step: 0.05, min: 1, max: 2.5 })}
      </div>
      {field('columnPx', 'Column width (px)', { step: 10, min: 200, max: 1600 }, 'The text column the measure is worked out for.')}
      {canEdit && (
        <button type="submit" className="btn-primary w-full" disabled={save.isPending || !isDirty}>{save.isPending ? 'Saving…' : isDirty ? 'Save scale' : 'Saved'}</button>
      )}
    </form>
  );
}

const VERDICT: Record<'too-short' | 'comfortable' | 'too-long', string> = {
  'too-short': 'short — lines break often; widen the column or lower the size',
  comfortable: 'comfortable',
  'too-long': 'long — readers may lose their place; narrow the column or raise the size',
};

function ScalePreview({ identity }: { identity: Identity }) {
  const heading = identity.typefaces.find((f) => f.role === 'heading') ?? identity.typefaces[0];
  const body = identity.typefaces.find((f) => f.role === 'body') ?? identity.typefaces[0];
  const h = useFontFace(heading);
  const b = useFontFace(body);
  const scale = identity.typeScale;
  const m = scale.measure;
  return (
    <div className="min-w-0 space-y-6">
      <ol className="panel divide-y divide-rule" aria-label="Type scale preview">
        {scale.steps.map((s) => {
          const face = s.role === 'heading' ? heading : body;
          const fam = s.role === 'heading' ? h.family : b.family;
          return (
            <li key={s.step} className="grid gap-x-5 gap-y-1 px-5 py-4 md:grid-cols-[8.5rem_1fr]">
              <div className="text-xs leading-5 text-ink-soft">
                <p className="font-semibold text-ink">{s.name} <span className="font-normal text-ink-faint">· step {s.step > 0 ? `+${s.step}` : s.step}</span></p>
                <p className="font-mono">{s.px} px · {s.rem} rem · {s.pt} pt</p>
                <p>line height {s.lineHeight} · {face?.family ?? 'no typeface yet'}</p>
              </div>
              <p className="min-w-0 overflow-hidden text-ellipsis break-words text-ink" style={{ fontFamily: stackOf(fam, face), fontSize: `${s.px}px`, lineHeight: s.lineHeight, fontWeight: s.role === 'heading' ? 600 : 400 }}>
                {s.step > 0 ? 'Roasted by the river' : 'Every bag carries the date it was roasted and the farm it came from.'}
              </p>
            </li>
          );
        })}
      </ol>
      <section className="panel p-5" aria-labelledby="measure-title">
        <h3 id="measure-title" className="font-semibold">Measure</h3>
        {m ? (
          <p className="mt-1 text-sm" data-measure={m.charsPerLine}>
            At a {scale.columnPx} px column and {scale.basePx} px body text, about <strong className="font-mono">{m.charsPerLine}</strong> characters per line:{' '}
            <strong className={m.verdict === 'comfortable' ? 'text-ok' : 'text-warn'}>{VERDICT[m.verdict]}</strong>. A comfortable single column holds {m.range.min}–{m.range.max} characters,
            about {m.range.ideal} being ideal (Bringhurst, <cite>The Elements of Typographic Style</cite>). Counted from the body font’s own character widths.
          </p>
        ) : (
          <p className="mt-1 text-sm text-ink-soft">Add a body typeface to see how many characters fit on a line at this column width.</p>
        )}
        <div className="mt-4 overflow-x-auto" tabIndex={0} role="region" aria-label="Running text at the column width, scrollable">
          <p
            className="border-x border-dashed border-rule-strong text-ink"
            style={{ width: `${scale.columnPx}px`, maxWidth: 'none', fontFamily: stackOf(b.family, body), fontSize: `${scale.basePx}px`, lineHeight: scale.bodyLineHeight }}
          >
            {RUNNING_TEXT}
          </p>
        </div>
      </section>
    </div>
  );
}

function Typography({ brandId, canEdit }: { brandId: string; canEdit: boolean }) {
  const identity = useIdentity(brandId);
  const [notice, setNotice] = useState<NoticeState>(null);
  if (!identity.data) return <LoadState query={identity} what="typography" />;
  const faces = identity.data.typefaces;
  return (
    <div className="space-y-8">
      <Caution title="Font licences">{FONT_LICENCE_CAUTION} Uploaded fonts are not served on published pages until you tick the licence box.</Caution>
      <Notice notice={notice} />
      {faces.length === 0 ? (
        <div className="rounded-xl border border-rule bg-paper/60 px-6 py-10 text-center">
          <p className="text-lg font-semibold">No typefaces yet</p>
          <p className="mt-1 text-ink-soft">
            {canEdit ? 'Pick an open font below or upload the brand’s own, first for headings, then for body text.' : 'The brand’s designers have not chosen typefaces yet.'}
          </p>
        </div>
      ) : (
        <ul className="grid gap-5 lg:grid-cols-2" aria-label="Typefaces">
          {faces.map((f) => <TypefaceCard key={f.id} brandId={brandId} face={f} canEdit={canEdit} onNotice={setNotice} />)}
        </ul>
      )}
      {canEdit && <AddTypeface brandId={brandId} onNotice={setNotice} />}
      <div>
        <h3 className="text-lg font-semibold">Type scale</h3>
        <div className="mt-3 grid gap-6 lg:grid-cols-[18rem_1fr]">
          <ScaleSettings brandId={brandId} scale={identity.data.typeScale} canEdit={canEdit} onNotice={setNotice} />
          <ScalePreview identity={identity.data} />
        </div>
      </div>
    </div>
  );
}

export default function TypographyPanel({ brandId, canEdit }: { brandId: string; canEdit: boolean }) {
  return (
    <IdentityRoot>
      <Typography brandId={brandId} canEdit={canEdit} />
    </IdentityRoot>
  );
}
