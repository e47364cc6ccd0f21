// Logos: upload, previews on light, dark and brand-colour grounds, the clear-space box and drawn bounds over
// the logo at any size, minimum sizes, recoloured variants, and the settings behind them.
import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation } from '@tanstack/react-query';
import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { api } from '@/lib/client/api';
import { TRADEMARK_CAUTION } from '@/lib/cautions';
import { LOGO_VARIANT_SLOT_LABELS, LOGO_VARIANT_SLOTS, LOGO_VARIANTS, type Box, type IdentityColor, type IdentityLogo, type LogoVariant, type LogoVariantSlot } from '@/lib/identity/types';
import { Caution, IdentityRoot, inkOn, LoadState, messageOf, Notice, uploadWithProgress, useIdentity, useRefreshIdentity } from './shared';

type NoticeState = { kind: 'ok' | 'error'; text: string } | null;
type Ground = 'light' | 'dark' | 'brand';
type FileKind = keyof IdentityLogo['files'];

const VARIANT_LABEL: Record<LogoVariant, string> = {
  primary: 'Primary',
  secondary: 'Secondary',
  mark: 'Mark',
  wordmark: 'Wordmark',
  lockup: 'Lockup',
  monogram: 'Monogram',
};
const FILE_LABEL: Record<FileKind, string> = { original: 'As uploaded', black: 'Black', white: 'White', reversed: 'Reversed', onDark: 'For dark grounds' };
const LIGHT = '#ffffff';
const DARK = '#1c1a17';

const union = (a: Box, b: Box): Box => {
  const x = Math.min(a.x, b.x);
  const y = Math.min(a.y, b.y);
  return { x, y, width: Math.max(a.x + a.width, b.x + b.width) - x, height: Math.max(a.y + a.height, b.y + b.height) - y };
};
const r2 = (n: number) => Math.round(n * 100) / 100;

/** The logo in its own units with the clear-space box and the drawn bounds drawn over it. */
function ClearSpaceStage({ logo, drawnPx, ground, file, showGuides }: { logo: IdentityLogo; drawnPx: number; ground: string; file: FileKind; showGuides: boolean }) {
  const box = logo.clearSpace.box;
  const view = union(logo.canvas, box);
  const pad = Math.max(view.width, view.height) * 0.04;
  const vb = { x: view.x - pad, y: view.y - pad, width: view.width + 2 * pad, height: view.height + 2 * pad };
  const widthPx = (drawnPx * vb.width) / logo.bounds.width;
  const guide = inkOn(ground) === '#ffffff' ? '#d9ccff' : '#4b3a8c';
  const unit = logo.clearSpace.unitSize * logo.clearSpace.multiple;
  return (
    <svg
      role="img"
      aria-label={`${logo.name} at ${drawnPx} px wide, with its clear space of ${logo.clearSpace.multiple} × ${logo.clearSpace.unitLabel} drawn around it`}
      viewBox={`${vb.x} ${vb.y} ${vb.width} ${vb.height}`}
      width={widthPx}
      height={(widthPx * vb.height) / vb.width}
      className="block max-w-none"
      data-logo-stage={logo.id}
    >
      <rect x={vb.x} y={vb.y} width={vb.width} height={vb.height} fill={ground} />
      {showGuides && (
        <>
          {/* The protected band between the drawn bounds and the clear-space edge, tinted; the outline is the box itself. */}
          <path
            d={`M${box.x} ${box.y}h${box.width}v${box.height}h${-box.width}Z M${logo.bounds.x} ${logo.bounds.y}v${logo.bounds.height}h${logo.bounds.width}v${-logo.bounds.height}Z`}
            fill={guide}
            fillOpacity={0.14}
            fillRule="evenodd"
            aria-hidden="true"
          />
          <rect data-overlay="clear-space" x={box.x} y={box.y} width={box.width} height={box.height} fill="none" stroke={guide} strokeWidth={1.5} strokeDasharray="6 4" vectorEffect="non-scaling-stroke" />
          {unit > 0 && (
            <g fill={guide} fillOpacity={0.35} aria-hidden="true">
              <rect x={box.x} y={box.y} width={unit} height={unit} />
              <rect x={box.x + box.width - unit} y={box.y + box.height - unit} width={unit} height={unit} />
            </g>
          )}
        </>
      )}
      <image href={logo.files[file]} x={logo.canvas.x} y={logo.canvas.y} width={logo.canvas.width} height={logo.canvas.height} preserveAspectRatio="none" />
      {showGuides && (
        <rect data-overlay="bounds" x={logo.bounds.x} y={logo.bounds.y} width={logo.bounds.width} height={logo.bounds.height} fill="none" stroke={guide} strokeWidth={1} vectorEffect="non-scaling-stroke" />
      )}
    </svg>
  );
}

function Tile({ src, ground, label }: { src: string; ground: string; label: string }) {
  return (
    <figure className="overflow-hidden rounded-lg border border-rule">
      <div className="flex h-28 items-center justify-center p-4" style={{ background: ground }}>
        <img src={src} alt="" className="max-h-full max-w-full object-contain" />
      </div>
      <figcaption className="border-t border-rule px-3 py-1.5 text-xs text-ink-soft">{label}</figcaption>
    </figure>
  );
}

const settingsForm = z.object({
  name: z.string().trim().min(1, 'Give the logo a name.').max(120),
  variant: z.enum(LOGO_VARIANTS),
  clearSpaceLabel: z.string().trim().min(1, 'Say what the unit is, e.g. “the height of the letter o”.').max(120),
  clearSpaceUnit: z.number({ error: 'Type the unit as a number.' }).positive('The clear-space unit must be larger than 0.').max(1e5),
  clearSpaceMultiple: z.number({ error: 'Type the multiple as a number.' }).min(0.25, 'Use a multiple of at least 0.25.').max(10, 'Use a multiple of at most 10.'),
  thinnestStroke: z.number({ error: 'Type the stroke as a number.' }).positive('The thinnest stroke must be larger than 0.').max(1e5),
  minScreenPx: z.string(),
  minPrintMm: z.string(),
});
type SettingsValues = z.infer<typeof settingsForm>;

function LogoSettings({ brandId, logo, onNotice }: { brandId: string; logo: IdentityLogo; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const refresh = useRefreshIdentity(brandId);
  const [sizeError, setSizeError] = useState<string | null>(null);
  const chosenPx = logo.minimumSize.screenPx !== logo.minimumSize.suggested.screenPx ? String(logo.minimumSize.screenPx) : '';
  const chosenMm = logo.minimumSize.printMm !== logo.minimumSize.suggested.printMm ? String(logo.minimumSize.printMm) : '';
  const { register, handleSubmit, formState: { errors, isDirty }, reset } = useForm<SettingsValues>({
    resolver: zodResolver(settingsForm),
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
  const save = useMutation({
    mutationFn: (body: Record<string, unknown>) => api<{ logo: IdentityLogo }>(`/api/brands/${brandId}/logos/${logo.id}`, { method: 'PATCH', body }),
    onSuccess: async (r) => {
      onNotice({ kind: 'ok', text: `${r.logo.name} saved.` });
      reset();
      await refresh();
    },
    onError: (e) => onNotice({ kind: 'error', text: messageOf(e, 'The logo settings could not be saved.') }),
  });
  const submit = handleSubmit((v) => {
    const px = v.minScreenPx.trim() === '' ? null : Number(v.minScreenPx);
    const mm = v.minPrintMm.trim() === '' ? null : Number(v.minPrintMm);
    if (px !== null && (!Number.isInteger(px) || px < 4 || px > 4000)) return setSizeError('The screen minimum is a whole number of px from 4 to 4000, or empty for the suggestion.');
    if (mm !== null && (!Number.isFinite(mm) || mm < 1 || mm > 2000)) return setSizeError('The print minimum is a number of mm from 1 to 2000, or empty for the suggestion.');
    setSizeError(null);
    const { minScreenPx: _a, minPrintMm: _b, ...rest } = v;
    save.mutate({ ...rest, minScreenPx: px, minPrintMm: mm });
  });
  const num = { valueAsNumber: true } as const;
  const err = (k: keyof SettingsValues) => errors[k] && <p className="error-text">{errors[k]?.message}</p>;
  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label={`Settings of ${logo.name}`}>
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor={`${id}-name`} className="label">Name</label>
          <input id={`${id}-name`} className="field" aria-invalid={!!errors.name} {...register('name')} />
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
          <input id={`${id}-label`} className="field" aria-invalid={!!errors.clearSpaceLabel} {...register('clearSpaceLabel')} />
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
            <input id={`${id}-multiple`} type="number" step="0.25" className="field font-mono text-sm" aria-invalid={!!errors.clearSpaceMultiple} {...register('clearSpaceMultiple', num)} />
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
            <input id={`${id}-px`} inputMode="numeric" className="field font-mono text-sm" placeholder={`${logo.minimumSize.suggested.screenPx} suggested`} aria-invalid={!!sizeError} {...register('minScreenPx')} />
          </div>
          <div>
            <label htmlFor={`${id}-mm`} className="mb-1 block text-xs font-semibold text-ink-soft">In print (mm wide)</label>
            <input id={`${id}-mm`} inputMode="decimal" className="field font-mono text-sm" placeholder={`${logo.minimumSize.suggested.printMm} suggested`} aria-invalid={!!sizeError} {...register('minPrintMm')} />
          </div>
        </div>
        <p className={sizeError ? 'error-text' : 'hint'} role={sizeError ? 'alert' : undefined}>{sizeError ?? 'Leave empty to use the suggestion.'}</p>
      </fieldset>
      <button type="submit" className="btn-primary" disabled={save.isPending || !isDirty}>{save.isPending ? 'Saving…' : 'Save logo settings'}</button>
    </form>
  );
}

function LogoCard({ brandId, logo, brandColor, canEdit, onNotice }: { brandId: string; logo: IdentityLogo; brandColor: IdentityColor | undefined; canEdit: boolean; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const refresh = useRefreshIdentity(brandId);
  const grounds: { key: Ground; label: string; hex: string }[] = [
    { key: 'light', label: 'Light', hex: LIGHT },
    { key: 'dark', label: 'Dark', hex: DARK },
    ...(brandColor ? [{ key: 'brand' as const, label: brandColor.name, hex: brandColor.hex }] : []),
  ];
  const [ground, setGround] = useState<Ground>('light');
  const [file, setFile] = useState<FileKind>('original');
  const [showGuides, setShowGuides] = useState(true);
  const minPx = logo.minimumSize.screenPx;
  const [drawnPx, setDrawnPx] = useState(Math.max(minPx, Math.min(360, Math.round(logo.bounds.width))));
  const groundHex = grounds.find((g) => g.key === ground)?.hex ?? LIGHT;
  const remove = useMutation({
    mutationFn: () => api(`/api/brands/${brandId}/logos/${logo.id}`, { method: 'DELETE' }),
    onSuccess: async () => {
      onNotice({ kind: 'ok', text: `${logo.name} removed.` });
      await refresh();
    },
    onError: (e) => onNotice({ kind: 'error', text: messageOf(e, 'The logo could not be removed.') }),
  });
  const ms = logo.minimumSize;
  return (
    <li className="panel overflow-hidden" aria-labelledby={`${id}-name`}>
      <div className="flex flex-wrap items-baseline justify-between gap-3 border-b border-rule px-5 py-4">
        <h3 id={`${id}-name`} className="text-lg font-semibold">
          {logo.name} <span className="ml-1 text-sm font-normal text-ink-soft">{VARIANT_LABEL[logo.variant]} · {logo.format.toUpperCase()}</span>
        </h3>
        <a className="text-sm font-semibold text-plumb hover:underline" href={`${logo.files.original}?download=1`}>Download original</a>
      </div>

      <div className="grid gap-6 p-5 lg:grid-cols-[1fr_19rem]">
        <div className="min-w-0 space-y-4">
          <div className="flex flex-wrap items-center gap-x-6 gap-y-3 text-sm">
            <fieldset className="flex flex-wrap items-center gap-1">
              <legend className="sr-only">Background</legend>
              {grounds.map((g) => (
                <label key={g.key} className={`flex cursor-pointer items-center gap-1.5 rounded-md border px-2.5 py-1 has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-plumb ${ground === g.key ? 'border-plumb bg-plumb-wash' : 'border-rule-strong'}`}>
                  <input type="radio" name={`${id}-ground`} className="sr-only" checked={ground === g.key} onChange={() => setGround(g.key)} />
                  <span aria-hidden="true" className="h-3.5 w-3.5 rounded-sm border border-rule-strong" style={{ background: g.hex }} />
                  {g.key === 'brand' ? `On ${g.label}` : `On ${g.label.toLowerCase()}`}
                </label>
              ))}
            </fieldset>
            <label className="flex items-center gap-2">
              <span className="text-ink-soft">File</span>
              <select className="field w-auto py-1 text-sm" value={file} onChange={(e) => setFile(e.target.value as FileKind)}>
                {(Object.keys(FILE_LABEL) as FileKind[]).map((k) => <option key={k} value={k}>{FILE_LABEL[k]}</option>)}
              </select>
            </label>
            <label className="flex items-center gap-2">
              <input type="checkbox" className="h-4 w-4 accent-plumb" checked={showGuides} onChange={(e) => setShowGuides(e.target.checked)} />
              Show clear space and bounds
            </label>
          </div>
          <div>
            <label htmlFor={`${id}-size`} className="flex flex-wrap justify-between gap-2 text-sm">
              <span className="font-semibold">Drawn width: <span className="font-mono">{drawnPx} px</span></span>
              {drawnPx < minPx ? (
                <span className="font-semibold text-danger">Below the {minPx} px screen minimum</span>
              ) : (
                <span className="text-ink-soft">minimum {minPx} px</span>
              )}
            </label>
            <input id={`${id}-size`} type="range" min={8} max={720} step={1} value={drawnPx} onChange={(e) => setDrawnPx(Number(e.target.value))} className="mt-1 w-full accent-plumb" />
          </div>
          <div className="overflow-auto rounded-lg border border-rule" style={{ background: groundHex, maxHeight: '32rem' }}>
            <div className="flex min-h-48 items-center justify-center p-4">
              <ClearSpaceStage logo={logo} drawnPx={drawnPx} ground={groundHex} file={file} showGuides={showGuides} />
            </div>
          </div>
          <p className="text-xs text-ink-soft">
            Dashed: the clear space, {logo.clearSpace.multiple} × {logo.clearSpace.unitLabel} ({r2(logo.clearSpace.unitSize * logo.clearSpace.multiple)} logo units) on every side of the
            drawn bounds (solid line); the shaded squares show one unit. Transparent margins in the file do not count.
          </p>
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
            {grounds.map((g) => <Tile key={g.key} src={logo.files.original} ground={g.hex} label={`As uploaded, on ${g.key === 'brand' ? g.label : g.label.toLowerCase()}`} />)}
            <Tile src={logo.files.black} ground={LIGHT} label="Black, on light" />
            <Tile src={logo.files.white} ground={DARK} label="White, on dark" />
            <Tile src={logo.files.reversed} ground={brandColor?.hex ?? DARK} label={`Reversed, on ${brandColor?.name ?? 'dark'}`} />
          </div>
          <p className="text-xs text-ink-soft">
            One-colour versions are computed from the drawing: shapes painted in the ground’s colour are cut out, so they show whatever ground the logo sits on.
            {logo.format === 'png' ? ' From a PNG they are traced pixel by pixel; upload a vector file of your own for print.' : ''}
          </p>
          <OwnVariants brandId={brandId} logo={logo} canEdit={canEdit} onNotice={onNotice} />
        </div>

        <div className="space-y-5">
          <section aria-label="Minimum sizes" className="rounded-lg bg-paper px-4 py-3">
            <h4 className="text-sm font-semibold">Minimum size</h4>
            <table className="mt-2 w-full text-sm">
              <thead className="text-xs text-ink-faint">
                <tr><th scope="col" className="text-left font-semibold"></th><th scope="col" className="text-right font-semibold">Suggested</th><th scope="col" className="text-right font-semibold">Chosen</th></tr>
              </thead>
              <tbody className="font-mono">
                <tr><th scope="row" className="text-left font-sans font-normal">Screen</th><td className="text-right">{ms.suggested.screenPx} px</td><td className="text-right font-semibold">{ms.screenPx} px</td></tr>
                <tr><th scope="row" className="text-left font-sans font-normal">Print</th><td className="text-right">{ms.suggested.printMm} mm</td><td className="text-right font-semibold">{ms.printMm} mm</td></tr>
              </tbody>
            </table>
            <p className="mt-2 text-xs leading-relaxed text-ink-soft">
              Suggested so the thinnest stroke ({r2(ms.thinnestStroke)} logo units) stays at least 1 px on screen and 0.25 pt in print. These thresholds are common practice, not a
              standard: check small sizes with your printer.
            </p>
          </section>
          {canEdit && (
            <>
              <LogoSettings brandId={brandId} logo={logo} onNotice={onNotice} />
              <button
                type="button"
                className="btn-danger w-full"
                disabled={remove.isPending}
                onClick={() => { if (confirm(`Remove ${logo.name} and its file from the identity?`)) remove.mutate(); }}
              >
                {remove.isPending ? 'Removing…' : 'Remove logo'}
              </button>
            </>
          )}
        </div>
      </div>
    </li>
  );
}

/** The designer's own files for the one-colour and dark-ground versions; each wins everywhere over the computed one. */
function OwnVariants({ brandId, logo, canEdit, onNotice }: { brandId: string; logo: IdentityLogo; canEdit: boolean; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const refresh = useRefreshIdentity(brandId);
  const own = new Set(logo.ownVariants ?? []);
  const [busy, setBusy] = useState<LogoVariantSlot | null>(null);
  const upload = useMutation({
    mutationFn: ({ slot, file }: { slot: LogoVariantSlot; file: File }) => {
      const form = new FormData();
      form.set('file', file);
      setBusy(slot);
      return uploadWithProgress<{ logo: IdentityLogo }>(`/api/brands/${brandId}/logos/${logo.id}/variants/${slot}`, form, () => {});
    },
    onSuccess: async (_r, { slot }) => {
      onNotice({ kind: 'ok', text: `Your file is now the “${LOGO_VARIANT_SLOT_LABELS[slot]}” version of ${logo.name}.` });
      await refresh();
    },
    onError: (e) => onNotice({ kind: 'error', text: messageOf(e, 'That file was refused.') }),
    onSettled: () => setBusy(null),
  });
  const drop = useMutation({
    mutationFn: (slot: LogoVariantSlot) => api(`/api/brands/${brandId}/logos/${logo.id}/variants/${slot}`, { method: 'DELETE' }),
    onSuccess: async () => {
      onNotice({ kind: 'ok', text: 'The computed version is used again.' });
      await refresh();
    },
    onError: (e) => onNotice({ kind: 'error', text: messageOf(e, 'The file could not be removed.') }),
  });
  if (!canEdit && own.size === 0) return null;
  return (
    <section aria-labelledby={`${id}-own`} className="rounded-lg bg-paper px-4 py-3">
      <h4 id={`${id}-own`} className="text-sm font-semibold">Your own versions</h4>
      <p className="mt-1 text-xs text-ink-soft">A file uploaded here replaces the computed version on the site, in the PDF, in patterns and in downloads.</p>
      <ul className="mt-2 space-y-2 text-sm">
        {LOGO_VARIANT_SLOTS.map((slot) => (
          <li key={slot} className="flex flex-wrap items-center justify-between gap-2">
            <span>
              {LOGO_VARIANT_SLOT_LABELS[slot]}: <span className="font-semibold">{own.has(slot) ? 'your file' : slot === 'on-dark' ? 'the logo as drawn' : 'computed'}</span>
            </span>
            {canEdit && (
              <span className="flex gap-2">
                <label className="btn-quiet cursor-pointer px-2 py-1 text-xs">
                  {busy === slot ? 'Uploading…' : own.has(slot) ? 'Replace' : 'Upload SVG or PNG'}
                  <input
                    type="file"
                    accept=".svg,.png,image/svg+xml,image/png"
                    className="sr-only"
                    aria-label={`Upload your own file for ${LOGO_VARIANT_SLOT_LABELS[slot]}`}
                    onChange={(e) => {
                      const file = e.target.files?.[0];
                      if (file) upload.mutate({ slot, file });
                      e.target.value = '';
                    }}
                  />
                </label>
                {own.has(slot) && (
                  <button type="button" className="btn-quiet px-2 py-1 text-xs" disabled={drop.isPending} onClick={() => drop.mutate(slot)}>
                    Use computed
                  </button>
                )}
              </span>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}

function UploadLogo({ brandId, onNotice }: { brandId: string; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const refresh = useRefreshIdentity(brandId);
  const [file, setFile] = useState<File | null>(null);
  const [variant, setVariant] = useState<LogoVariant>('primary');
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [inputKey, setInputKey] = useState(0);
  const upload = useMutation({
    mutationFn: (f: File) => {
      const form = new FormData();
      form.set('file', f);
      form.set('variant', variant);
      setProgress(0);
      return uploadWithProgress<{ logo: IdentityLogo; duplicate: boolean }>(`/api/brands/${brandId}/logos`, form, setProgress);
    },
    onSuccess: async (r) => {
      setError(null);
      setFile(null);
      setInputKey((k) => k + 1);
      onNotice({ kind: 'ok', text: r.duplicate ? `That file is already here as ${r.logo.name}.` : `${r.logo.name} uploaded; its bounds and clear space are measured below.` });
      await refresh();
    },
    onError: (e) => setError(messageOf(e, 'The logo was refused.')),
    onSettled: () => setProgress(null),
  });
  return (
    <form
      className="rounded-xl border border-dashed border-rule-strong p-5"
      aria-labelledby={`${id}-title`}
      onSubmit={(e) => {
        e.preventDefault();
        if (file) upload.mutate(file);
        else setError('Choose an SVG or PNG file first.');
      }}
    >
      <h3 id={`${id}-title`} className="font-semibold">Upload a logo</h3>
      <div className="mt-3 grid gap-4 sm:grid-cols-[1fr_12rem_auto] sm:items-start">
        <div>
          <label htmlFor={`${id}-file`} className="label">File</label>
          <input
            key={inputKey}
            id={`${id}-file`}
            type="file"
            accept=".svg,.png,image/svg+xml,image/png"
            className="field py-1.5 text-sm file:mr-3 file:rounded file:border-0 file:bg-paper file:px-2 file:py-1 file:text-sm file:font-semibold"
            onChange={(e) => { setFile(e.target.files?.[0] ?? null); setError(null); }}
          />
          <p className="hint">SVG is best: it stays sharp at every size. PNG works too, up to 5 MB.</p>
        </div>
        <div>
          <label htmlFor={`${id}-variant`} className="label">Variant</label>
          <select id={`${id}-variant`} className="field" value={variant} onChange={(e) => setVariant(e.target.value as LogoVariant)}>
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

function Logos({ brandId, canEdit }: { brandId: string; canEdit: boolean }) {
  const identity = useIdentity(brandId);
  const [notice, setNotice] = useState<NoticeState>(null);
  if (!identity.data) return <LoadState query={identity} what="logos" />;
  const { logos, colors } = identity.data;
  const brandColor = colors.find((c) => c.role === 'primary') ?? colors[0];
  return (
    <div className="space-y-6">
      <Caution title="Trademark clearance">{TRADEMARK_CAUTION}</Caution>
      <Notice notice={notice} />
      {logos.length === 0 ? (
        <div className="rounded-xl border border-rule bg-paper/60 px-6 py-10 text-center">
          <p className="text-lg font-semibold">No logos yet</p>
          <p className="mt-1 text-ink-soft">
            {canEdit
              ? 'Upload the primary logo below, as an SVG if you have one. Plumbline measures its drawn bounds, clear space and minimum sizes.'
              : 'The brand’s designers have not uploaded a logo yet.'}
          </p>
        </div>
      ) : (
        <ul className="space-y-6" aria-label="Logos">
          {logos.map((l) => <LogoCard key={l.id} brandId={brandId} logo={l} brandColor={brandColor} canEdit={canEdit} onNotice={setNotice} />)}
        </ul>
      )}
      {canEdit && <UploadLogo brandId={brandId} onNotice={setNotice} />}
    </div>
  );
}

export default function LogoPanel({ brandId, canEdit }: { brandId: string; canEdit: boolean }) {
  return (
    <IdentityRoot>
      <Logos brandId={brandId} canEdit={canEdit} />
    </IdentityRoot>
  );
}
