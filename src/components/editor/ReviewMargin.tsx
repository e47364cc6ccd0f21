// The editor's margin: open review comment threads grouped by the block id they are anchored to.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../lib/client/api';
import type { CommentView } from '../../lib/reviews/reviews.server';
import { QueryRoot } from '../app/QueryRoot';

function Margin({ brandId }: { brandId: string }) {
  const qc = useQueryClient();
  const key = ['comments', brandId, 'open'];
  const q = useQuery({ queryKey: key, queryFn: () => api<{ comments: CommentView[] }>(`/api/brands/${brandId}/comments?open=1`), refetchInterval: 60_000 });
  const resolve = useMutation({ mutationFn: (id: string) => api(`/api/brands/${brandId}/comments/${id}`, { method: 'PATCH', body: { resolved: true } }), onSuccess: () => qc.invalidateQueries({ queryKey: key }) });
  if (q.isPending) return <p className="text-sm text-ink-soft" role="status">Loading comments…</p>;
  if (q.isError) return <p className="text-sm text-danger" role="alert">Comments could not be loaded: {q.error.message}</p>;
  const byBlock = new Map<string, CommentView[]>();
  for (const c of q.data.comments) byBlock.set(c.blockId, [...(byBlock.get(c.blockId) ?? []), c]);
  if (!byBlock.size) return <p className="text-sm text-ink-soft">No open review comments.</p>;
  return (
    <section aria-label="Open review comments" className="space-y-3">
      {[...byBlock].map(([blockId, list]) => (
        <div key={blockId} data-block-id={blockId} className="rounded-lg border border-rule bg-card p-3">
          <p className="text-xs text-ink-faint">{list[0].blockPresent ? 'On this block' : 'On a block removed since'} <span className="font-mono">{blockId.slice(0, 8)}</span></p>
          {list.map((c) => (
            <div key={c.id} className={c.parentId ? 'ml-3 mt-1 border-l-2 border-rule pl-2' : 'mt-1'}>
              <p className="text-sm"><strong>{c.author.name}</strong> {c.body}</p>
              {!c.parentId && <button type="button" className="mt-1 text-xs font-semibold text-plumb hover:underline" onClick={() => resolve.mutate(c.id)}>Resolve</button>}
            </div>
          ))}
        </div>
      ))}
    </section>
  );
}

/** Open comments by block id (props: the brand); the editor places it beside the document. */
export default function ReviewMargin({ brandId }: { brandId: string }) {
  return (
    <QueryRoot>
      <Margin brandId={brandId} />
    </QueryRoot>
  );
}
