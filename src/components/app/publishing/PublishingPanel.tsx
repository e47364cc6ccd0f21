// Publishing: what changed since the last version, the publish form, the versions, and (for owners) share links.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { api } from '@/lib/client/api';
import type { ShareLinkView } from '@/lib/publishing/views';
import type { Finding, FindingCode } from '@/lib/publishing/preflight';
import { QueryRoot } from '@/components/app/QueryRoot';
import { When } from '@/components/ui/When';
import { formatDate } from '@/lib/format';

interface BuildStepView { id: string; label: string; state: 'waiting' | 'running' | 'done' | 'failed'; count?: number; note?: string }
interface Version {
  number: number;
  publishedAt: string;
  note: string;
  author: { name: string | null };
  state: 'building' | 'ready' | 'failed';
  buildError: string | null;
  buildSteps: BuildStepView[];
}
interface Compare { summary: string[] }
type ShareLink = ShareLinkView;


function Card({ title, children, id }: { title: string; children: ReactNode; id: string }) {
  return (
    <section className="panel" aria-labelledby={id}>
      <h2 id={id} className="border-b border-rule px-6 py-4 text-lg font-bold">{title}</h2>
      <div className="px-6 py-5">{children}</div>
    </section>
  );
}

const FINDING_TITLES: Record<FindingCode, string> = {
  template_text: 'Template text left in',
  image_placeholder: 'Stand-in image',
  missing_alt: 'Missing alternative text',
  contrast_below_claim: 'Contrast below the claimed level',
  font_unlicensed: 'Font licence not confirmed',
  file_not_approved: 'File not approved',
  file_retired: 'Retired file',
};

/** The check before publishing, as a list the designer works through; each item leads to its block in the editor. */
function Preflight({ brandId, pending, error, findings }: { brandId: string; pending: boolean; error: string | null; findings: Finding[] }) {
  if (pending) return <p className="text-sm text-ink-soft" role="status">Checking the draft before publishing…</p>;
  if (error) return <p className="text-sm text-danger" role="alert">The check before publishing could not run: {error}</p>;
  if (findings.length === 0) return <p className="rounded-md bg-ok/10 px-3 py-2 text-sm text-ok" role="status">Checked: no template text, stand-in images, missing alt text, low contrast, unlicensed fonts or unapproved files.</p>;
  return (
    <section className="rounded-md border border-warn/40 bg-warn-wash px-4 py-3" aria-labelledby="preflight-title">
      <h3 id="preflight-title" className="text-sm font-semibold text-warn">{findings.length} thing{findings.length === 1 ? '' : 's'} to look at before publishing</h3>
      <ul className="mt-2 space-y-2 text-sm">
        {findings.map((f, i) => (
          <li key={i}>
            <span className="font-semibold text-ink">{FINDING_TITLES[f.code]}</span>
            <span className="text-ink-soft"> · {f.blockId ? <a className="underline" href={`/app/brands/${brandId}/guidelines#block-${f.blockId}`}>{f.where}</a> : f.code === 'font_unlicensed' ? <a className="underline" href={`/app/brands/${brandId}/identity#typefaces`}>{f.where}</a> : f.where}</span>
            <p className="text-ink">{f.message}</p>
          </li>
        ))}
      </ul>
    </section>
  );
}

function Publish({ brandId, canPublish, latest }: { brandId: string; canPublish: boolean; latest: number | null }) {
  const queryClient = useQueryClient();
  const [note, setNote] = useState('');
  const changes = useQuery({
    queryKey: ['compare', brandId, latest],
    enabled: latest !== null,
    queryFn: () => api<Compare>(`/api/brands/${brandId}/versions/compare?from=${latest}&to=draft`),
  });
  const [anyway, setAnyway] = useState(false);
  const check = useQuery({
    queryKey: ['preflight', brandId],
    enabled: canPublish,
    queryFn: () => api<{ findings: Finding[] }>(`/api/brands/${brandId}/versions/check`),
  });
  const findings = check.data?.findings ?? [];
  const publish = useMutation({
    mutationFn: () => api<{ version: Version }>(`/api/brands/${brandId}/versions`, { method: 'POST', body: { note } }),
    onSuccess: () => {
      setNote('');
      setAnyway(false);
      return queryClient.invalidateQueries();
    },
  });
  const blocked = findings.length > 0 && !anyway;
  return (
    <Card title="Publish a version" id="publish-title">
      <h3 className="text-sm font-semibold text-ink">{latest === null ? 'Nothing is published yet' : `Changes since version ${latest}`}</h3>
      {latest === null ? (
        <p className="mt-1 text-sm text-ink-soft">The first version makes the guideline site live for the client team and any share links.</p>
      ) : changes.isPending ? (
        <p className="mt-1 text-sm text-ink-soft" role="status">Comparing…</p>
      ) : changes.data && changes.data.summary.length > 0 ? (
        <ul className="mt-2 list-disc space-y-1 pl-5 text-sm">{changes.data.summary.map((s) => <li key={s}>{s}</li>)}</ul>
      ) : (
        <p className="mt-1 text-sm text-ink-soft">The draft matches version {latest}: there is nothing new to publish.</p>
      )}
      {canPublish ? (
        <form
          className="mt-5 space-y-3"
          onSubmit={(e) => {
            e.preventDefault();
            publish.mutate();
          }}
        >
          <div>
            <label htmlFor="version-note" className="label">What this version changes</label>
            <textarea id="version-note" className="field min-h-20" value={note} maxLength={2000} onChange={(e) => setNote(e.target.value)} placeholder="e.g. New secondary palette and a larger minimum size for the mark" />
            <p className="hint">Readers see this note beside the version; people who follow the brand get it by e-mail.</p>
          </div>
          <Preflight brandId={brandId} pending={check.isPending} error={check.isError ? check.error.message : null} findings={findings} />
          {findings.length > 0 && (
            <label className="flex items-start gap-2 text-sm">
              <input type="checkbox" className="mt-1" checked={anyway} onChange={(e) => setAnyway(e.target.checked)} />
              <span>I have looked at these and want to publish anyway. <span className="text-ink-soft">Say why in the note above; the audit trail keeps what was still open.</span></span>
            </label>
          )}
          {publish.isError && <p role="alert" className="rounded-md bg-danger-wash px-3 py-2 text-sm text-danger">{publish.error.message}</p>}
          {publish.isSuccess && <p role="status" className="text-sm text-ok">Version {publish.data.version.number} is saved and being built; readers see it once every page and file is ready (progress below).</p>}
          <button className="btn-primary" disabled={publish.isPending || note.trim() === '' || blocked}>{publish.isPending ? 'Publishing…' : findings.length > 0 ? 'Publish anyway' : 'Publish'}</button>
        </form>
      ) : (
        <p className="mt-4 text-sm text-ink-soft">Owners and editors publish versions.</p>
      )}
    </Card>
  );
}

/** The server cannot print PDFs (e.g. no browser installed): said once, above the PDF links. */
function PdfProblem({ message }: { message: string }) {
  return (
    <p role="alert" className="mb-4 rounded-md bg-danger-wash px-3 py-2 text-sm text-danger" data-testid="pdf-problem">
      {message}
    </p>
  );
}

const STEP_STATE: Record<BuildStepView['state'], string> = { waiting: 'Waiting', running: 'Working', done: 'Done', failed: 'Stopped' };

/** A version's build, step by step, while it runs or after it stopped; a retry for those who publish. */
function BuildProgress({ brandId, version, canPublish }: { brandId: string; version: Version; canPublish: boolean }) {
  const queryClient = useQueryClient();
  const retry = useMutation({
    mutationFn: () => api(`/api/brands/${brandId}/versions/${version.number}/build`, { method: 'POST' }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: ['versions', brandId] }),
  });
  const failed = version.state === 'failed';
  return (
    <div className={`mt-2 w-full rounded-md px-3 py-2 text-sm ${failed ? 'bg-danger-wash' : 'bg-plumb-wash'}`} data-testid={`build-${version.number}`}>
      <p className={`font-semibold ${failed ? 'text-danger' : 'text-plumb-deep'}`} role={failed ? 'alert' : 'status'}>
        {failed ? 'This version could not be built; readers still see the previous one.' : 'Building this version: readers see the previous one until it is ready.'}
      </p>
      {version.buildSteps.length > 0 && (
        <ol className="mt-2 space-y-1" aria-label={`Build of version ${version.number}`}>
          {version.buildSteps.map((step) => (
            <li key={step.id} className="flex gap-3">
              <span className={`w-16 shrink-0 ${step.state === 'done' ? 'text-ok' : step.state === 'failed' ? 'text-danger' : step.state === 'running' ? 'font-semibold text-ink' : 'text-ink-faint'}`}>{STEP_STATE[step.state]}</span>
              <span className="text-ink">{step.label}{step.count ? <span className="text-ink-soft"> · {step.count} file{step.count === 1 ? '' : 's'}</span> : null}{step.note ? <span className="block text-warn">{step.note}</span> : null}</span>
            </li>
          ))}
        </ol>
      )}
      {failed && <p className="mt-2 text-ink">{version.buildError ?? 'The reason was not recorded.'}</p>}
      {failed && canPublish && (
        <div className="mt-2 flex items-center gap-3">
          <button type="button" className="btn-quiet px-3 py-1" disabled={retry.isPending} onClick={() => retry.mutate()}>{retry.isPending ? 'Starting…' : 'Build it again'}</button>
          {retry.isError && <span role="alert" className="text-danger">{retry.error.message}</span>}
        </div>
      )}
    </div>
  );
}

function Versions({ brandId, slug, versions, pdfProblem, canPublish }: { brandId: string; slug: string; versions: Version[]; pdfProblem: string | null; canPublish: boolean }) {
  if (versions.length === 0) return <Card title="Versions" id="versions-title"><p className="text-ink-soft">No versions yet. Publish the draft to make the first one.</p></Card>;
  // The current version is the newest one that is built: a newer one still building is not served yet.
  const current = versions.find((v) => v.state === 'ready')?.number ?? null;
  return (
    <Card title="Versions" id="versions-title">
      {pdfProblem && <PdfProblem message={pdfProblem} />}
      <ol className="divide-y divide-rule">
        {versions.map((v) => (
          <li key={v.number} className="flex flex-wrap items-baseline gap-x-4 gap-y-1 py-3">
            {v.state === 'ready' ? <a className="font-semibold text-plumb hover:underline" href={`/b/${slug}/v/${v.number}`}>Version {v.number}</a> : <span className="font-semibold text-ink">Version {v.number}</span>}
            {v.number === current && <span className="rounded-full bg-plumb-wash px-2 py-0.5 text-xs font-semibold text-plumb-deep">current</span>}
            {v.state === 'building' && <span className="rounded-full bg-warn-wash px-2 py-0.5 text-xs font-semibold text-warn">building</span>}
            {v.state === 'failed' && <span className="rounded-full bg-danger-wash px-2 py-0.5 text-xs font-semibold text-danger">not built</span>}
            <span className="text-sm text-ink-soft"><When value={v.publishedAt} as="dateTime" />{v.author.name ? ` · ${v.author.name}` : ''}</span>
            {v.state === 'ready' && (
              <span className="ml-auto flex gap-3 text-sm">
                <a className="hover:underline" href={`/b/${slug}/v/${v.number}/guideline.pdf?size=a4`}>PDF A4</a>
                <a className="hover:underline" href={`/b/${slug}/v/${v.number}/guideline.pdf?size=letter`}>PDF Letter</a>
                <a className="hover:underline" href={`/b/${slug}/v/${v.number}/presentation`}>Presentation</a>
                <a className="hover:underline" href={`/b/${slug}/v/${v.number}/presentation.pdf`}>Slides PDF</a>
                <a className="hover:underline" href={`/b/${slug}/v/${v.number}/tokens?format=dtcg`}>Tokens</a>
              </span>
            )}
            <p className="w-full text-sm">{v.note}</p>
            {v.state !== 'ready' && <BuildProgress brandId={brandId} version={v} canPublish={canPublish} />}
            {v.state === 'ready' && v.buildSteps.filter((s) => s.note).map((s) => <p key={s.id} className="w-full text-sm text-warn">{s.note}</p>)}
          </li>
        ))}
      </ol>
    </Card>
  );
}

function ShareLinks({ brandId, versions }: { brandId: string; versions: Version[] }) {
  const queryClient = useQueryClient();
  const key = ['share-links', brandId];
  const links = useQuery({ queryKey: key, queryFn: () => api<{ shareLinks: ShareLink[] }>(`/api/brands/${brandId}/share-links`).then((r) => r.shareLinks) });
  const [form, setForm] = useState({ label: '', expires: '', password: '', allowDownloads: false, allowPresentation: false, version: '' });
  const [fresh, setFresh] = useState<ShareLink | null>(null);
  const create = useMutation({
    mutationFn: () =>
      api<{ shareLink: ShareLink }>(`/api/brands/${brandId}/share-links`, {
        method: 'POST',
        body: {
          ...(form.label ? { label: form.label } : {}),
          ...(form.expires ? { expiresAt: new Date(`${form.expires}T23:59:59`).toISOString() } : {}),
          ...(form.password ? { password: form.password } : {}),
          allowDownloads: form.allowDownloads,
          allowPresentation: form.allowPresentation,
          ...(form.version ? { version: Number(form.version) } : {}),
        },
      }),
    onSuccess: (r) => {
      setFresh(r.shareLink);
      setForm({ label: '', expires: '', password: '', allowDownloads: false, allowPresentation: false, version: '' });
      return queryClient.invalidateQueries({ queryKey: key });
    },
  });
  const present = useMutation({
    mutationFn: ({ id, allow }: { id: string; allow: boolean }) => api(`/api/brands/${brandId}/share-links/${id}`, { method: 'PATCH', body: { allowPresentation: allow } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: key }),
  });
  const revoke = useMutation({
    mutationFn: (id: string) => api(`/api/brands/${brandId}/share-links/${id}`, { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: key }),
  });
  return (
    <Card title="Share links" id="links-title">
      <p className="text-sm text-ink-soft">A link lets anyone who holds it read the published guidelines, without an account. It never opens the draft.</p>
      {versions.length === 0 && <p className="mt-2 text-sm text-warn">Publish a version first: a link opens published guidelines only.</p>}
      <form
        className="mt-4 grid gap-3 sm:grid-cols-2"
        onSubmit={(e) => {
          e.preventDefault();
          create.mutate();
        }}
      >
        <div><label htmlFor="sl-label" className="label">Who is it for?</label><input id="sl-label" className="field" value={form.label} maxLength={120} onChange={(e) => setForm({ ...form, label: e.target.value })} placeholder="e.g. Signage agency" /></div>
        <div><label htmlFor="sl-expires" className="label">Stops working after</label><input id="sl-expires" type="date" className="field" value={form.expires} onChange={(e) => setForm({ ...form, expires: e.target.value })} /></div>
        <div><label htmlFor="sl-password" className="label">Password (optional)</label><input id="sl-password" type="text" className="field" value={form.password} onChange={(e) => setForm({ ...form, password: e.target.value })} autoComplete="off" /></div>
        <div>
          <label htmlFor="sl-version" className="label">Opens</label>
          <select id="sl-version" className="field" value={form.version} onChange={(e) => setForm({ ...form, version: e.target.value })}>
            <option value="">Always the current version</option>
            {versions.map((v) => <option key={v.number} value={v.number}>Version {v.number} only</option>)}
          </select>
        </div>
        <label className="flex items-center gap-2 text-sm sm:col-span-2"><input type="checkbox" checked={form.allowDownloads} onChange={(e) => setForm({ ...form, allowDownloads: e.target.checked })} /> Allow downloads of approved assets</label>
        <label className="flex items-center gap-2 text-sm sm:col-span-2"><input type="checkbox" checked={form.allowPresentation} onChange={(e) => setForm({ ...form, allowPresentation: e.target.checked })} /> May open the presentation (the identity in slides, and its PDF)</label>
        {present.isError && <p role="alert" className="rounded-md bg-danger-wash px-3 py-2 text-sm text-danger sm:col-span-2">{present.error.message}</p>}
        {create.isError && <p role="alert" className="rounded-md bg-danger-wash px-3 py-2 text-sm text-danger sm:col-span-2">{create.error.message}</p>}
        <div className="sm:col-span-2"><button className="btn-primary" disabled={create.isPending || versions.length === 0}>{create.isPending ? 'Making…' : 'Make a link'}</button></div>
      </form>
      {fresh?.url && (
        <div role="status" className="mt-4 rounded-md border border-plumb/30 bg-plumb-wash p-4 text-sm">
          <p className="font-semibold text-plumb-deep">Copy this link now: it is shown only once.</p>
          <div className="mt-2 flex gap-2"><input readOnly className="field font-mono text-xs" value={fresh.url} aria-label="New share link" onFocus={(e) => e.target.select()} /><button type="button" className="btn-quiet" onClick={() => navigator.clipboard.writeText(fresh.url!)}>Copy</button></div>
        </div>
      )}
      <div className="mt-6">
        {links.isPending ? (
          <p className="text-sm text-ink-soft" role="status">Loading links…</p>
        ) : links.isError ? (
          <p role="alert" className="text-sm text-danger">{links.error.message}</p>
        ) : links.data.length === 0 ? (
          <p className="text-sm text-ink-soft">No links yet.</p>
        ) : (
          <table className="w-full text-left text-sm" aria-label="Share links">
            <thead className="text-xs uppercase tracking-wider text-ink-faint"><tr><th scope="col" className="py-2 pr-4">For</th><th scope="col" className="pr-4">Opens</th><th scope="col" className="pr-4">Last used</th><th scope="col" className="pr-4">State</th><th scope="col"><span className="sr-only">Actions</span></th></tr></thead>
            <tbody>
              {links.data.map((l) => (
                <tr key={l.id} className="border-t border-rule">
                  <td className="py-2.5 pr-4 align-top">{l.label ?? 'Unnamed link'}<div className="text-xs text-ink-soft">{[l.hasPassword && 'password', l.allowDownloads && 'downloads', l.allowPresentation && 'presentation', l.expiresAt && `until ${formatDate(l.expiresAt)}`].filter(Boolean).join(' · ')}</div></td>
                  <td className="pr-4 align-top py-2.5 whitespace-nowrap">{l.version ? `Version ${l.version}` : 'Current'}</td>
                  <td className="pr-4 align-top py-2.5">{l.lastUsedAt ? <><When value={l.lastUsedAt} as="dateTime" /> ({l.useCount}×)</> : 'Never'}</td>
                  <td className="pr-4 align-top py-2.5"><span className={l.state === 'active' ? 'font-semibold text-ok' : 'text-ink-soft'}>{l.state === 'active' ? 'Working' : l.state === 'expired' ? 'Expired' : 'Withdrawn'}</span></td>
                  <td className="py-2 text-right align-top">
                    {l.state === 'active' && (
                      <span className="flex flex-wrap justify-end gap-2">
                        <label className="flex items-center gap-1.5 whitespace-nowrap px-1 text-sm">
                          <input type="checkbox" checked={l.allowPresentation} disabled={present.isPending} aria-label={`${l.label ?? 'Unnamed link'}: may open the presentation`} onChange={(e) => present.mutate({ id: l.id, allow: e.target.checked })} /> Presentation
                        </label>
                        <button type="button" className="btn-danger px-3 py-1" onClick={() => revoke.mutate(l.id)}>Withdraw</button>
                      </span>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </div>
    </Card>
  );
}

interface PanelProps {
  brandId: string;
  slug: string;
  canPublish: boolean;
  canShare: boolean;
  /** Why the server cannot print PDFs right now, or null. */
  pdfProblem?: string | null;
}

function Panel({ brandId, slug, canPublish, canShare, pdfProblem = null }: PanelProps) {
  const versions = useQuery({
    queryKey: ['versions', brandId],
    queryFn: () => api<{ versions: Version[] }>(`/api/brands/${brandId}/versions`).then((r) => r.versions),
    // While a version builds, its steps are asked for again every second.
    refetchInterval: (query) => (query.state.data?.some((v) => v.state === 'building') ? 1000 : false),
  });
  if (versions.isPending) return <p className="panel px-6 py-8 text-ink-soft" role="status">Loading versions…</p>;
  if (versions.isError) return <p className="panel px-6 py-8 text-danger" role="alert">{versions.error.message}</p>;
  return (
    <div className="grid gap-8 lg:grid-cols-2">
      <div className="space-y-8">
        {canPublish && <Publish brandId={brandId} canPublish={canPublish} latest={versions.data[0]?.number ?? null} />}
        <Versions brandId={brandId} slug={slug} versions={versions.data} pdfProblem={pdfProblem} canPublish={canPublish} />
      </div>
      {canShare && <ShareLinks brandId={brandId} versions={versions.data} />}
    </div>
  );
}

export default function PublishingPanel(props: PanelProps) {
  return (
    <QueryRoot>
      <Panel {...props} />
    </QueryRoot>
  );
}
