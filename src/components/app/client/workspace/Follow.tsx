// Following a brand: an e-mail with the note and the changes whenever a version is published.
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/client/api';
import { useChange } from '@/lib/client/mutation';

const followKey = (brandId: string) => ['follow', brandId] as const;

export function Follow({ brandId }: { brandId: string }) {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: followKey(brandId), queryFn: () => api<{ following: boolean }>(`/api/brands/${brandId}/follow`) });
  const m = useChange((follow: boolean) => api(`/api/brands/${brandId}/follow`, { method: follow ? 'PUT' : 'DELETE' }), () => qc.invalidateQueries({ queryKey: followKey(brandId) }));
  const on = q.data?.following ?? false;
  return (
    <div id="follow" className="flex flex-wrap items-center gap-3 rounded-lg border border-rule bg-card px-4 py-3">
      <p className="text-sm text-ink-soft">{on ? 'You follow this brand: each newly published version reaches you by e-mail.' : 'Follow this brand to get an e-mail with the note and the changes whenever a version is published.'}</p>
      <button type="button" className="btn-quiet ml-auto px-3 py-1.5" aria-pressed={on} disabled={q.isPending || m.isPending} onClick={() => m.mutate(!on)}>{on ? 'Stop following' : 'Follow'}</button>
    </div>
  );
}
