// Owners: who downloaded which file or bundle, when, and through which door (membership or share link).
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { api } from '@/lib/client/api';
import { When } from '@/components/ui/When';

interface Entry {
  id: string;
  at: string;
  kind: 'file' | 'bundle';
  asset: { id: string; name: string } | null;
  who: { type: 'member'; name: string; email: string } | { type: 'share-link'; linkId: string } | { type: 'unknown' };
  details: { filename?: string; entries?: number; assetIds?: string[] };
}

export function DownloadLog({ brandId }: { brandId: string }) {
  const [kind, setKind] = useState('');
  const [via, setVia] = useState('');
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const q = new URLSearchParams();
  if (kind) q.set('kind', kind);
  if (via) q.set('via', via);
  if (from) q.set('from', from);
  if (to) q.set('to', to);
  const log = useQuery({ queryKey: ['downloads', brandId, q.toString()], queryFn: () => api<{ downloads: Entry[] }>(`/api/brands/${brandId}/downloads?${q}`) });
  const csv = new URLSearchParams(q);
  csv.set('format', 'csv');

  return (
    <section className="panel" aria-labelledby="log-title">
      <div className="flex flex-wrap items-end gap-4 border-b border-rule px-6 py-5">
        <div className="mr-auto">
          <h2 id="log-title" className="text-xl font-bold">Download log</h2>
          <p className="mt-1 text-sm text-ink-soft">Every file and bundle handed out, newest first. Only owners see this.</p>
        </div>
        <div>
          <label className="label" htmlFor="log-kind">What</label>
          <select id="log-kind" className="field py-1.5 text-sm" value={kind} onChange={(e) => setKind(e.target.value)}>
            <option value="">Files and bundles</option>
            <option value="file">Single files</option>
            <option value="bundle">Bundles</option>
          </select>
        </div>
        <div>
          <label className="label" htmlFor="log-via">Through</label>
          <select id="log-via" className="field py-1.5 text-sm" value={via} onChange={(e) => setVia(e.target.value)}>
            <option value="">Anyone</option>
            <option value="member">Members</option>
            <option value="share-link">Share links</option>
          </select>
        </div>
        <div>
          <label className="label" htmlFor="log-from">From</label>
          <input id="log-from" type="date" className="field py-1.5 text-sm" value={from} onChange={(e) => setFrom(e.target.value)} />
        </div>
        <div>
          <label className="label" htmlFor="log-to">To</label>
          <input id="log-to" type="date" className="field py-1.5 text-sm" value={to} onChange={(e) => setTo(e.target.value)} />
        </div>
        <a className="btn-quiet" href={`/api/brands/${brandId}/downloads?${csv}`}>Export CSV</a>
      </div>
      {log.isPending && <p className="px-6 py-6 text-ink-soft" role="status">Loading the log…</p>}
      {log.isError && <p className="px-6 py-6 text-danger" role="alert">The log could not be loaded: {log.error.message}</p>}
      {log.isSuccess && log.data.downloads.length === 0 && (
        <p className="px-6 py-8 text-ink-soft">No downloads {q.toString() ? 'match these filters' : 'yet'}. When partners or share-link holders take files, they appear here.</p>
      )}
      {log.isSuccess && log.data.downloads.length > 0 && (
        <table className="w-full text-left text-sm" aria-label="Downloads">
          <thead className="border-b border-rule text-xs uppercase tracking-wider text-ink-faint">
            <tr>
              <th scope="col" className="px-6 py-3 font-semibold">When</th>
              <th scope="col" className="px-6 py-3 font-semibold">Who</th>
              <th scope="col" className="px-6 py-3 font-semibold">What</th>
            </tr>
          </thead>
          <tbody>
            {log.data.downloads.map((d) => (
              <tr key={d.id} className="border-b border-rule last:border-0">
                <td className="whitespace-nowrap px-6 py-3 text-ink-soft"><When value={d.at} as="dateTime" /></td>
                <td className="px-6 py-3">{d.who.type === 'member' ? <><span className="font-semibold">{d.who.name}</span> <span className="text-ink-soft">{d.who.email}</span></> : d.who.type === 'share-link' ? 'Share link' : 'Unknown'}</td>
                <td className="px-6 py-3">{d.kind === 'bundle' ? `Bundle of ${d.details.assetIds?.length ?? 0} assets (${d.details.entries ?? 0} files)` : <><span className="font-semibold">{d.asset?.name}</span> <span className="font-mono text-xs text-ink-soft">{d.details.filename}</span></>}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </section>
  );
}
