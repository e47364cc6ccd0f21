// The brand's asset shelf: drop files in, approve them, pick a rendition, pack a bundle; owners also see who downloaded what.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef, useState, type DragEvent } from 'react';
import { api } from '@/lib/client/api';
import { formatFileSize, SITE_LOCALE } from '@/lib/format';
import type { FocalPoint } from '@/lib/assets/photo';
import { EXPIRING_DEFAULT_DAYS, formatDay, RIGHTS_CAUTION, type ExpiryStatus } from '@/lib/assets/expiry';
import { EMPTY_FILTERS, filterParams, type ShelfFilters } from '@/lib/assets/filters';
import { ACCEPT_ATTRIBUTE, ASSET_FORMATS, ASSET_KINDS, PHOTO_ACCEPT_ATTRIBUTE, STATE_LABELS, type AssetKind, type AssetState } from '@/lib/assets/kinds';
import { QueryRoot } from '@/components/app/QueryRoot';
import { DownloadLog } from './DownloadLog';
import { PhotoDetails } from './PhotoDetails';
import { RenditionPicker } from './RenditionPicker';
import { downloadBundle } from './bundle';
import { uploadFile } from './upload';

export interface ShelfAsset {
  id: string;
  name: string;
  kind: AssetKind;
  format: string;
  state: AssetState;
  byteSize: number;
  width: number | null;
  height: number | null;
  tags: string[];
  description: string | null;
  usageNotes: string | null;
  altText: string | null;
  caption: string | null;
  focus: FocalPoint | null;
  rights: string | null;
  credit: string | null;
  expiresOn: string | null;
  expiry: ExpiryStatus | null;
  renderable: boolean;
  files: { original: string; preview: string | null };
}

export interface ShelfProps {
  brandId: string;
  brandColors: { name: string; hex: string }[];
  canUpload: boolean;
  canApprove: boolean;
  seesDrafts: boolean;
  canReadLog: boolean;
  /** The filters in the page's address when it was opened (already checked by the shelf's query schema). */
  initialFilters: ShelfFilters;
  /** Why the address's filters were not used, when they were not. */
  filterProblem: string | null;
}

type Backdrop = 'light' | 'dark' | 'brand';
interface Transfer { name: string; progress: number; error?: string; done?: boolean }

const STATE_BADGE: Record<AssetState, string> = {
  draft: 'bg-warn-wash text-warn',
  approved: 'bg-plumb-wash text-plumb-deep',
  retired: 'bg-paper text-ink-faint line-through',
};
const KIND_LABEL: Record<AssetKind, string> = { logo: 'Logo', image: 'Image', photo: 'Photograph', document: 'Document', font: 'Font', archive: 'Archive', pattern: 'Pattern' };
// The site's locale, so the server's render and the browser's agree.
const size = (bytes: number) => formatFileSize(bytes, SITE_LOCALE);

function Shelf(props: ShelfProps) {
  const { brandId, canUpload, canApprove, seesDrafts } = props;
  const queryClient = useQueryClient();
  const [filters, setFilters] = useState<ShelfFilters>(props.initialFilters);
  const [words, setWords] = useState(props.initialFilters.q);
  const set = (patch: Partial<ShelfFilters>) => setFilters((f) => ({ ...f, ...patch }));
  // Typing settles for a moment before the search is asked for.
  useEffect(() => {
    const t = setTimeout(() => setFilters((f) => (f.q === words ? f : { ...f, q: words })), 250);
    return () => clearTimeout(t);
  }, [words]);
  const [backdrop, setBackdrop] = useState<Backdrop>('light');
  const [selected, setSelected] = useState<Set<string>>(new Set());
  const [openId, setOpenId] = useState<string | null>(null);
  const [notice, setNotice] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  const [bundleProgress, setBundleProgress] = useState<number | null>(null);

  // The same parameters drive the API and the page's address, so a filtered shelf can be shared and reloaded.
  const params = filterParams(filters);
  const search = params.toString();
  useEffect(() => {
    if (search !== window.location.search.replace(/^\?/, '')) window.history.replaceState(null, '', `${window.location.pathname}${search ? `?${search}` : ''}`);
  }, [search]);
  const key = ['assets', brandId, params.toString()];
  const assets = useQuery({ queryKey: key, queryFn: () => api<{ assets: ShelfAsset[] }>(`/api/brands/${brandId}/assets?${params}`) });
  const refresh = () => queryClient.invalidateQueries({ queryKey: ['assets', brandId] });

  const change = useMutation({
    mutationFn: ({ id, body }: { id: string; body: Record<string, unknown> }) => api<{ asset: ShelfAsset }>(`/api/brands/${brandId}/assets/${id}`, { method: 'PATCH', body }),
    onSuccess: (r, { body }) => { setNotice({ kind: 'ok', text: body.state ? `“${r.asset.name}” is now ${STATE_LABELS[r.asset.state].label.toLowerCase()}.` : `Saved the details of “${r.asset.name}”.` }); return refresh(); },
    onError: (e) => setNotice({ kind: 'error', text: e.message }),
  });
  const remove = useMutation({
    mutationFn: (id: string) => api(`/api/brands/${brandId}/assets/${id}`, { method: 'DELETE' }),
    onSuccess: () => { setNotice({ kind: 'ok', text: 'Asset deleted, with every file made from it.' }); return refresh(); },
    onError: (e) => setNotice({ kind: 'error', text: e.message }),
  });

  const pack = async (body: { assetIds?: string[]; allLogos?: boolean }) => {
    setNotice(null);
    setBundleProgress(0);
    try {
      await downloadBundle(brandId, body, setBundleProgress);
      setNotice({ kind: 'ok', text: 'Bundle downloaded. USAGE.txt inside sums up clear space, sizes and colours.' });
    } catch (e) {
      setNotice({ kind: 'error', text: (e as Error).message });
    } finally {
      setTimeout(() => setBundleProgress(null), 800);
    }
  };

  const toggle = (id: string) => setSelected((s) => { const n = new Set(s); if (n.has(id)) n.delete(id); else n.add(id); return n; });
  const backdropStyle = backdrop === 'light' ? '#ffffff' : backdrop === 'dark' ? '#1f1d1b' : (props.brandColors[0]?.hex ?? '#4b3a8c');
  const list = assets.data?.assets ?? [];
  const approvedSelected = list.filter((a) => selected.has(a.id) && a.state === 'approved').map((a) => a.id);

  return (
    <div className="space-y-8">
      {notice && (
        <p role={notice.kind === 'error' ? 'alert' : 'status'} className={`rounded-md px-3 py-2 text-sm ${notice.kind === 'error' ? 'bg-danger-wash text-danger' : 'bg-plumb-wash text-plumb-deep'}`}>{notice.text}</p>
      )}
      {canUpload && <DropZone brandId={brandId} onDone={refresh} />}

      <section className="panel" aria-labelledby="shelf-title">
        <div className="flex flex-wrap items-end gap-4 border-b border-rule px-6 py-5">
          <div className="mr-auto">
            <h2 id="shelf-title" className="text-xl font-bold">On the shelf</h2>
            <p className="mt-1 text-sm text-ink-soft">{seesDrafts ? 'Drafts are seen by the studio and reviewers; only approved files reach partners and share links.' : 'Approved files of this brand, ready to download.'}</p>
          </div>
          <fieldset>
            <legend className="label">Preview on</legend>
            <div className="flex gap-1" role="radiogroup">
              {(['light', 'dark', 'brand'] as Backdrop[]).map((b) => (
                <button key={b} type="button" role="radio" aria-checked={backdrop === b} onClick={() => setBackdrop(b)} className={`rounded-md border px-3 py-1.5 text-sm ${backdrop === b ? 'border-plumb bg-plumb-wash text-plumb-deep' : 'border-rule-strong bg-card text-ink-soft'}`}>
                  {b === 'brand' ? (props.brandColors[0]?.name ?? 'Brand') : b === 'light' ? 'Light' : 'Dark'}
                </button>
              ))}
            </div>
          </fieldset>
        </div>
        <div className="flex flex-wrap items-end gap-4 border-b border-rule px-6 py-4" role="search" aria-label="Find and filter the shelf">
          <div>
            <label htmlFor="f-q" className="label">Find</label>
            <input id="f-q" type="search" className="field w-48 py-1.5 text-sm" value={words} onChange={(e) => setWords(e.target.value)} placeholder="Name, tag, rights, credit" maxLength={100} />
          </div>
          {seesDrafts && (
            <div>
              <label htmlFor="f-state" className="label">State</label>
              <select id="f-state" className="field py-1.5 text-sm" value={filters.state} onChange={(e) => set({ state: e.target.value as AssetState | '' })}>
                <option value="">Any</option>
                {(Object.keys(STATE_LABELS) as AssetState[]).map((s) => <option key={s} value={s}>{STATE_LABELS[s].label}</option>)}
              </select>
            </div>
          )}
          <div>
            <label htmlFor="f-kind" className="label">Kind</label>
            <select id="f-kind" className="field py-1.5 text-sm" value={filters.kind} onChange={(e) => set({ kind: e.target.value as AssetKind | '' })}>
              <option value="">Any</option>
              {ASSET_KINDS.map((k) => <option key={k} value={k}>{KIND_LABEL[k]}</option>)}
            </select>
          </div>
          <div>
            <label htmlFor="f-tag" className="label">Tag</label>
            <input id="f-tag" className="field w-32 py-1.5 text-sm" value={filters.tag} onChange={(e) => set({ tag: e.target.value })} placeholder="e.g. print" />
          </div>
          <div>
            <label htmlFor="f-format" className="label">Format</label>
            <select id="f-format" className="field py-1.5 text-sm" value={filters.format} onChange={(e) => set({ format: e.target.value as ShelfFilters['format'] })}>
              <option value="">Any</option>
              {ASSET_FORMATS.map((f) => <option key={f} value={f}>{f.toUpperCase()}</option>)}
            </select>
          </div>
          <div>
            <label htmlFor="f-rights" className="label">Usage rights</label>
            <select id="f-rights" className="field py-1.5 text-sm" value={filters.rights} onChange={(e) => set({ rights: e.target.value as ShelfFilters['rights'] })}>
              <option value="">Any</option>
              <option value="with">Written down</option>
              <option value="without">Not written down</option>
            </select>
          </div>
          <div>
            <label htmlFor="f-expiry" className="label">Expiry</label>
            <div className="flex items-center gap-1">
              <select id="f-expiry" className="field py-1.5 text-sm" value={filters.expiry} onChange={(e) => set({ expiry: e.target.value as ShelfFilters['expiry'], days: e.target.value === 'expiring' ? (filters.days || EXPIRING_DEFAULT_DAYS) : 0 })}>
                <option value="">Any</option>
                <option value="expired">Expired</option>
                <option value="expiring">Expiring within…</option>
                <option value="none">No expiry date</option>
              </select>
              {filters.expiry === 'expiring' && (
                <>
                  <input type="number" min={1} max={3660} className="field w-20 py-1.5 text-sm" aria-label="Days ahead" value={filters.days || ''} onChange={(e) => set({ days: Number(e.target.value) || 0 })} />
                  <span className="text-sm text-ink-soft">days</span>
                </>
              )}
            </div>
          </div>
          {params.toString() && <button type="button" className="btn-quiet px-3 py-1.5 text-sm" onClick={() => { setWords(''); setFilters(EMPTY_FILTERS); }}>Clear filters</button>}
        </div>

        <div className="flex flex-wrap items-center gap-3 border-b border-rule px-6 py-3 text-sm">
          <button type="button" className="btn-quiet" disabled={bundleProgress !== null} onClick={() => pack({ allLogos: true })}>Download all approved logos (.zip)</button>
          <button type="button" className="btn-quiet" disabled={bundleProgress !== null || approvedSelected.length === 0} onClick={() => pack({ assetIds: approvedSelected })}>
            Download selected ({approvedSelected.length})
          </button>
          {bundleProgress !== null && (
            <div className="flex items-center gap-2" role="status" aria-live="polite">
              <progress max={1} value={bundleProgress} className="h-2 w-40 accent-plumb" aria-label="Bundle progress" />
              <span className="text-ink-soft">{bundleProgress >= 1 ? 'Done' : `Packing… ${Math.round(bundleProgress * 100)}%`}</span>
            </div>
          )}
        </div>

        {props.filterProblem && <p className="px-6 pt-4 text-sm text-warn" role="status">The address held filters the shelf does not know ({props.filterProblem}); showing everything instead.</p>}
        {assets.isPending && <p className="px-6 py-8 text-ink-soft" role="status">Loading the shelf…</p>}
        {assets.isError && <p className="px-6 py-8 text-danger" role="alert">The shelf could not be loaded: {assets.error.message}</p>}
        {assets.isSuccess && list.length === 0 && (
          <div className="px-6 py-12 text-center">
            <p className="text-lg font-semibold">{params.toString() ? 'Nothing matches these filters.' : 'The shelf is empty.'}</p>
            <p className="mt-2 text-ink-soft">
              {params.toString() ? 'Clear a filter to see more.' : canUpload ? 'Drop the final logo files, photos, fonts or PDFs above. They start as drafts; approve them to hand them out.' : 'Nothing has been approved for download yet. The studio will let you know when files are ready.'}
            </p>
          </div>
        )}
        {list.length > 0 && (
          <ul className="grid gap-4 p-6 sm:grid-cols-2 lg:grid-cols-3" aria-label="Assets">
            {list.map((a) => (
              <li key={a.id} className="flex flex-col overflow-hidden rounded-lg border border-rule">
                <div className="flex h-40 items-center justify-center p-4" style={{ background: backdropStyle }}>
                  {a.files.preview ? (
                    <img src={a.files.preview} alt={`Preview of ${a.name}`} className="max-h-full max-w-full object-contain" loading="lazy" />
                  ) : (
                    <span className={`font-mono text-sm ${backdrop === 'light' ? 'text-ink-soft' : 'text-white/80'}`}>{a.format.toUpperCase()}</span>
                  )}
                </div>
                <div className="flex flex-1 flex-col gap-2 border-t border-rule p-4">
                  <div className="flex items-start gap-2">
                    {a.state === 'approved' && (
                      <input type="checkbox" className="mt-1 accent-plumb" checked={selected.has(a.id)} onChange={() => toggle(a.id)} aria-label={`Select ${a.name} for a bundle`} />
                    )}
                    <div className="min-w-0 flex-1">
                      <p className="truncate font-semibold" title={a.name}>{a.name}</p>
                      <p className="text-xs text-ink-soft">{KIND_LABEL[a.kind]} · {a.format.toUpperCase()} · {size(a.byteSize)}{a.width && a.height ? ` · ${Math.round(a.width)}×${Math.round(a.height)}` : ''}</p>
                    </div>
                    <span className={`rounded px-2 py-0.5 text-xs font-semibold ${STATE_BADGE[a.state]}`} title={STATE_LABELS[a.state].summary}>{STATE_LABELS[a.state].label}</span>
                  </div>
                  {a.tags.length > 0 && <p className="text-xs text-ink-faint">{a.tags.map((t) => `#${t}`).join(' ')}</p>}
                  {a.usageNotes && <p className="text-sm text-ink-soft">{a.usageNotes}</p>}
                  <RightsSummary asset={a} />
                  {a.kind === 'photo' && !a.altText && <p className="text-sm text-warn">No alt text yet: add it under “Photo details” before approving.</p>}
                  <div className="mt-auto flex flex-wrap gap-2 pt-2">
                    <button type="button" className="btn-quiet px-3 py-1.5" aria-expanded={openId === a.id} onClick={() => setOpenId(openId === a.id ? null : a.id)}>Get a file</button>
                    {canApprove && a.state !== 'approved' && <button type="button" className="btn-primary px-3 py-1.5" onClick={() => change.mutate({ id: a.id, body: { state: 'approved' } })}>Approve</button>}
                    {canApprove && a.state === 'approved' && <button type="button" className="btn-quiet px-3 py-1.5" onClick={() => change.mutate({ id: a.id, body: { state: 'retired' } })}>Retire</button>}
                    {canApprove && a.state !== 'draft' && <button type="button" className="btn-quiet px-3 py-1.5" onClick={() => change.mutate({ id: a.id, body: { state: 'draft' } })}>Back to draft</button>}
                    {canUpload && <button type="button" className="btn-danger px-3 py-1.5" onClick={() => { if (confirm(`Delete “${a.name}” and every file made from it?`)) remove.mutate(a.id); }}>Delete</button>}
                  </div>
                  {canApprove && a.kind === 'photo' && <PhotoDetails asset={a} onSave={(body) => change.mutate({ id: a.id, body })} />}
                  {canApprove && <DetailsEditor asset={a} onSave={(body) => change.mutate({ id: a.id, body })} />}
                  {openId === a.id && <RenditionPicker asset={a} brandColors={props.brandColors} />}
                </div>
              </li>
            ))}
          </ul>
        )}
      </section>

      {props.canReadLog && <DownloadLog brandId={brandId} />}
    </div>
  );
}

const EXPIRY_BADGE: Record<ExpiryStatus, string> = { expired: 'bg-danger-wash text-danger', expiring: 'bg-warn-wash text-warn', valid: 'bg-paper text-ink-soft' };

/** Rights, credit and expiry day of one asset, as its card shows them. */
function RightsSummary({ asset }: { asset: ShelfAsset }) {
  if (!asset.rights && !asset.credit && !asset.expiresOn) return null;
  return (
    <dl className="space-y-1 rounded-md bg-paper px-3 py-2 text-xs" data-asset-rights={asset.id}>
      {asset.expiresOn && asset.expiry && (
        <div className="flex items-center gap-2">
          <dt className="font-semibold">Expires</dt>
          <dd><span className={`rounded px-1.5 py-0.5 font-semibold ${EXPIRY_BADGE[asset.expiry]}`}>{formatDay(asset.expiresOn, SITE_LOCALE)}{asset.expiry === 'expired' ? ' · expired' : asset.expiry === 'expiring' ? ' · soon' : ''}</span></dd>
        </div>
      )}
      {asset.credit && <div><dt className="inline font-semibold">Credit </dt><dd className="inline">{asset.credit}</dd></div>}
      {asset.rights && <div><dt className="inline font-semibold">Rights </dt><dd className="inline line-clamp-3 whitespace-pre-line" title={asset.rights}>{asset.rights}</dd></div>}
    </dl>
  );
}

function DetailsEditor({ asset, onSave }: { asset: ShelfAsset; onSave: (body: Record<string, unknown>) => void }) {
  const [tags, setTags] = useState(asset.tags.join(', '));
  const [notes, setNotes] = useState(asset.usageNotes ?? '');
  const [rights, setRights] = useState(asset.rights ?? '');
  const [credit, setCredit] = useState(asset.credit ?? '');
  const [expiresOn, setExpiresOn] = useState(asset.expiresOn ?? '');
  const save = () => onSave({ tags: tags.split(',').map((t) => t.trim()).filter(Boolean), usageNotes: notes.trim() || null, rights: rights.trim() || null, credit: credit.trim() || null, expiresOn: expiresOn || null });
  return (
    <details className="text-sm">
      <summary className="cursor-pointer text-ink-soft">Tags, usage notes, rights and expiry</summary>
      <form className="mt-2 space-y-2" onSubmit={(e) => { e.preventDefault(); save(); }}>
        <label className="label" htmlFor={`tags-${asset.id}`}>Tags, separated by commas</label>
        <input id={`tags-${asset.id}`} className="field py-1.5 text-sm" value={tags} onChange={(e) => setTags(e.target.value)} />
        <label className="label" htmlFor={`notes-${asset.id}`}>Usage notes (shown to partners and packed into bundles)</label>
        <textarea id={`notes-${asset.id}`} className="field py-1.5 text-sm" rows={2} value={notes} onChange={(e) => setNotes(e.target.value)} />
        <label className="label" htmlFor={`rights-${asset.id}`}>Usage rights or licence terms (shown next to the download)</label>
        <textarea id={`rights-${asset.id}`} className="field py-1.5 text-sm" rows={3} maxLength={4000} value={rights} onChange={(e) => setRights(e.target.value)} aria-describedby={`rights-hint-${asset.id}`} />
        <p id={`rights-hint-${asset.id}`} className="hint">{RIGHTS_CAUTION}</p>
        <label className="label" htmlFor={`credit-${asset.id}`}>Credit line</label>
        <input id={`credit-${asset.id}`} className="field py-1.5 text-sm" maxLength={200} value={credit} onChange={(e) => setCredit(e.target.value)} placeholder="e.g. Photo: A. Person for the studio" />
        <label className="label" htmlFor={`expires-${asset.id}`}>Expires on (retired automatically that day; owners are told a week before)</label>
        <input id={`expires-${asset.id}`} type="date" className="field py-1.5 text-sm" value={expiresOn} onChange={(e) => setExpiresOn(e.target.value)} />
        <button className="btn-quiet px-3 py-1.5">Save details</button>
      </form>
    </details>
  );
}

function DropZone({ brandId, onDone }: { brandId: string; onDone: () => void }) {
  const input = useRef<HTMLInputElement>(null);
  const [over, setOver] = useState(false);
  const [transfers, setTransfers] = useState<Transfer[]>([]);
  const [asLogo, setAsLogo] = useState(false);
  const [asPhoto, setAsPhoto] = useState(false);

  const send = async (files: File[]) => {
    const start = transfers.length;
    setTransfers((t) => [...t, ...files.map((f) => ({ name: f.name, progress: 0 }))]);
    const update = (i: number, patch: Partial<Transfer>) => setTransfers((t) => t.map((x, j) => (j === start + i ? { ...x, ...patch } : x)));
    await Promise.all(
      files.map(async (file, i) => {
        try {
          const reply = await uploadFile(`/api/brands/${brandId}/assets`, file, (p) => update(i, { progress: p }), asPhoto ? { kind: 'photo' } : asLogo ? { kind: 'logo' } : {});
          const a = reply.assets[0];
          update(i, { progress: 1, done: true, error: a?.duplicate ? 'Already on the shelf (same file): kept the existing one.' : a?.sanitised.length ? `Cleaned: removed ${a.sanitised.join(', ')}.` : undefined });
        } catch (e) {
          update(i, { progress: 1, error: (e as Error).message });
        }
      }),
    );
    onDone();
  };
  const drop = (e: DragEvent) => {
    e.preventDefault();
    setOver(false);
    void send([...e.dataTransfer.files]);
  };

  return (
    <section className="panel" aria-labelledby="upload-title">
      <div
        onDragOver={(e) => { e.preventDefault(); setOver(true); }}
        onDragLeave={() => setOver(false)}
        onDrop={drop}
        className={`m-4 rounded-lg border-2 border-dashed px-6 py-8 text-center transition-colors ${over ? 'border-plumb bg-plumb-wash' : 'border-rule-strong'}`}
      >
        <h2 id="upload-title" className="text-lg font-bold">Add files to the shelf</h2>
        <p className="mt-1 text-sm text-ink-soft">Drop files here, or <button type="button" className="font-semibold text-plumb underline" onClick={() => input.current?.click()}>choose them</button>. SVG, PNG, JPEG, WebP, AVIF, PDF, fonts (WOFF2, WOFF, TTF, OTF) or ZIP, up to 25 MB each. New files start as drafts.</p>
        <label className="mt-3 inline-flex items-center gap-2 text-sm text-ink-soft">
          <input type="checkbox" className="accent-plumb" checked={asLogo} onChange={(e) => { setAsLogo(e.target.checked); if (e.target.checked) setAsPhoto(false); }} /> Treat PNG, JPEG and WebP files as logos (SVGs always are)
        </label>
        <label className="mt-1 flex items-center justify-center gap-2 text-sm text-ink-soft">
          <input type="checkbox" className="accent-plumb" checked={asPhoto} onChange={(e) => { setAsPhoto(e.target.checked); if (e.target.checked) setAsLogo(false); }} /> Upload as photographs (JPEG, PNG, WebP or AVIF), for the imagery block; each needs alt text before it is approved
        </label>
        <input ref={input} type="file" multiple accept={asPhoto ? PHOTO_ACCEPT_ATTRIBUTE : ACCEPT_ATTRIBUTE} className="sr-only" aria-label="Choose files to upload" onChange={(e) => { void send([...(e.target.files ?? [])]); e.target.value = ''; }} />
      </div>
      {transfers.length > 0 && (
        <ul className="space-y-2 border-t border-rule px-6 py-4 text-sm" aria-label="Uploads">
          {transfers.map((t, i) => (
            <li key={i}>
              <div className="flex items-center gap-3">
                <span className="w-56 truncate" title={t.name}>{t.name}</span>
                <progress max={1} value={t.progress} className="h-2 flex-1 accent-plumb" aria-label={`Upload of ${t.name}`} />
                <span className={t.error && !t.done ? 'text-danger' : 'text-ink-soft'}>{t.done ? 'Added' : t.error ? 'Refused' : `${Math.round(t.progress * 100)}%`}</span>
              </div>
              {t.error && <p className={t.done ? 'hint' : 'error-text'}>{t.error}</p>}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

export default function AssetShelf(props: ShelfProps) {
  return (
    <QueryRoot>
      <Shelf {...props} />
    </QueryRoot>
  );
}
