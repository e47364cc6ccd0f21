// Publishing: what changed since the last version, the publish form, the versions, and (for owners) share links.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { api } from '../../../lib/client/api';
import type { ShareLinkView } from '../../../lib/publishing/share-links.server';
import { QueryRoot } from '../QueryRoot';

interface Version { number: number; publishedAt: string; note: string; author: { name: string | null } }
interface Compare { summary: string[] }
type ShareLink = ShareLinkView;

const when = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });

function Card({ title, children, id }: { title: string; children: ReactNode; id: string }) {
  return (
    <section className="panel" aria-labelledby={id}>
      <h2 id={id} className="border-b border-rule px-6 py-4 text-lg font-bold">{title}</h2>
      <div className="px-6 py-5">{children}</div>
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
  const publish = useMutation({
    mutationFn: () => api<{ version: Version }>(`/api/brands/${brandId}/versions`, { method: 'POST', body: { note } }),
    onSuccess: () => {
      setNote('');
      return queryClient.invalidateQueries();
    },
  });
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
          {publish.isError && <p role="alert" className="rounded-md bg-danger-wash px-3 py-2 text-sm text-danger">{publish.error.message}</p>}
          {publish.isSuccess && <p role="status" className="text-sm text-ok">Version {publish.data.version.number} is live.</p>}
          <button className="btn-primary" disabled={publish.isPending || note.trim() === ''}>{publish.isPending ? 'Publishing…' : 'Publish'}</button>
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

function Versions({ slug, versions, pdfProblem }: { slug: string; versions: Version[]; pdfProblem: string | null }) {
  if (versions.length === 0) return <Card title="Versions" id="versions-title"><p className="text-ink-soft">No versions yet. Publish the draft to make the first one.</p></Card>;
  return (
    <Card title="Versions" id="versions-title">
      {pdfProblem && <PdfProblem message={pdfProblem} />}
      <ol className="divide-y divide-rule">
        {versions.map((v, i) => (
          <li key={v.number} className="flex flex-wrap items-baseline gap-x-4 gap-y-1 py-3">
            <a className="font-semibold text-plumb hover:underline" href={`/b/${slug}/v/${v.number}`}>Version {v.number}</a>
            {i === 0 && <span className="rounded-full bg-plumb-wash px-2 py-0.5 text-xs font-semibold text-plumb-deep">current</span>}
            <span className="text-sm text-ink-soft">{when.format(new Date(v.publishedAt))}{v.author.name ? ` · ${v.author.name}` : ''}</span>
            <span className="ml-auto flex gap-3 text-sm">
              <a className="hover:underline" href={`/b/${slug}/v/${v.number}/guideline.pdf?size=a4`}>PDF A4</a>
              <a className="hover:underline" href={`/b/${slug}/v/${v.number}/guideline.pdf?size=letter`}>PDF Letter</a>
            </span>
            <p className="w-full text-sm">{v.note}</p>
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
  const [form, setForm] = useState({ label: '', expires: '', password: '', allowDownloads: false, version: '' });
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
          ...(form.version ? { version: Number(form.version) } : {}),
        },
      }),
    onSuccess: (r) => {
      setFresh(r.shareLink);
      setForm({ label: '', expires: '', password: '', allowDownloads: false, version: '' });
      return queryClient.invalidateQueries({ queryKey: key });
    },
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
            <thead className="text-xs uppercase tracking-wider text-ink-faint"><tr><th className="py-2">For</th><th>Opens</th><th>Last used</th><th>State</th><th><span className="sr-only">Actions</span></th></tr></thead>
            <tbody>
              {links.data.map((l) => (
                <tr key={l.id} className="border-t border-rule">
                  <td className="py-2.5">{l.label ?? 'Unnamed link'}<div className="text-xs text-ink-soft">{[l.hasPassword && 'password', l.allowDownloads && 'downloads', l.expiresAt && `until ${when.format(new Date(l.expiresAt))}`].filter(Boolean).join(' · ')}</div></td>
                  <td>{l.version ? `Version ${l.version}` : 'Current'}</td>
                  <td>{l.lastUsedAt ? `${when.format(new Date(l.lastUsedAt))} (${l.useCount}×)` : 'Never'}</td>
                  <td><span className={l.state === 'active' ? 'font-semibold text-ok' : 'text-ink-soft'}>{l.state === 'active' ? 'Working' : l.state === 'expired' ? 'Expired' : 'Withdrawn'}</span></td>
                  <td className="text-right">{l.state === 'active' && <button type="button" className="btn-danger px-3 py-1" onClick={() => revoke.mutate(l.id)}>Withdraw</button>}</td>
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
  const versions = useQuery({ queryKey: ['versions', brandId], queryFn: () => api<{ versions: Version[] }>(`/api/brands/${brandId}/versions`).then((r) => r.versions) });
  if (versions.isPending) return <p className="panel px-6 py-8 text-ink-soft" role="status">Loading versions…</p>;
  if (versions.isError) return <p className="panel px-6 py-8 text-danger" role="alert">{versions.error.message}</p>;
  return (
    <div className="grid gap-8 lg:grid-cols-2">
      <div className="space-y-8">
        {canPublish && <Publish brandId={brandId} canPublish={canPublish} latest={versions.data[0]?.number ?? null} />}
        <Versions slug={slug} versions={versions.data} pdfProblem={pdfProblem} />
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
