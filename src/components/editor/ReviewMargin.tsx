// The editor's margin: open review comment threads grouped by the block id they are anchored to.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api } from '@/lib/client/api';
import { blockLabel } from '@/lib/guideline/block-label';
import type { CommentView } from '@/lib/reviews/views';
import { QueryRoot } from '@/components/app/QueryRoot';

interface DraftBlock {
  type: string;
  attrs?: { id?: string; title?: string };
  content?: { text?: string; content?: { text?: string }[] }[];
}

/** Start a thread on one block of the draft. */
function NewComment({ brandId, blocks, onDone }: { brandId: string; blocks: DraftBlock[]; onDone: () => void }) {
  const [blockId, setBlockId] = useState('');
  const [body, setBody] = useState('');
  const add = useMutation({
    mutationFn: () => api(`/api/brands/${brandId}/comments`, { method: 'POST', body: { blockId, body } }),
    onSuccess: () => {
      setBody('');
      onDone();
    },
  });
  const anchored = blocks.filter((b) => b.attrs?.id);
  return (
    <form
      className="space-y-2 rounded-lg border border-rule bg-card p-3"
      aria-label="Comment on a block"
      onSubmit={(e) => {
        e.preventDefault();
        add.mutate();
      }}
    >
      <label htmlFor="comment-block" className="label text-xs">Comment on</label>
      <select id="comment-block" className="field py-1.5 text-sm" value={blockId} onChange={(e) => setBlockId(e.target.value)} required>
        <option value="">Choose a block…</option>
        {anchored.map((b) => <option key={b.attrs!.id} value={b.attrs!.id}>{blockLabel(b)}</option>)}
      </select>
      <textarea aria-label="Comment" className="field min-h-16 text-sm" value={body} maxLength={4000} onChange={(e) => setBody(e.target.value)} placeholder="What should change, and why?" />
      {add.isError && <p role="alert" className="text-xs text-danger">{add.error.message}</p>}
      <button className="btn-quiet px-3 py-1.5" disabled={!blockId || !body.trim() || add.isPending}>{add.isPending ? 'Adding…' : 'Add comment'}</button>
    </form>
  );
}

function Margin({ brandId }: { brandId: string }) {
  const qc = useQueryClient();
  const key = ['comments', brandId, 'open'];
  const draft = useQuery({ queryKey: ['draft-blocks', brandId], queryFn: () => api<{ doc: { content: DraftBlock[] } }>(`/api/brands/${brandId}/guideline`).then((r) => r.doc.content), refetchInterval: 60_000 });
  const labels = new Map((draft.data ?? []).map((b) => [b.attrs?.id ?? '', blockLabel(b)]));
  const form = <NewComment brandId={brandId} blocks={draft.data ?? []} onDone={() => qc.invalidateQueries({ queryKey: key })} />;
  const q = useQuery({ queryKey: key, queryFn: () => api<{ comments: CommentView[] }>(`/api/brands/${brandId}/comments?open=1`), refetchInterval: 60_000 });
  const resolve = useMutation({ mutationFn: (id: string) => api(`/api/brands/${brandId}/comments/${id}`, { method: 'PATCH', body: { resolved: true } }), onSuccess: () => qc.invalidateQueries({ queryKey: key }) });
  if (q.isPending) return <p className="text-sm text-ink-soft" role="status">Loading comments…</p>;
  if (q.isError) return <p className="text-sm text-danger" role="alert">Comments could not be loaded: {q.error.message}</p>;
  const byBlock = new Map<string, CommentView[]>();
  for (const c of q.data.comments) byBlock.set(c.blockId, [...(byBlock.get(c.blockId) ?? []), c]);
  if (!byBlock.size)
    return (
      <div className="space-y-3">
        <p className="text-sm text-ink-soft">No open review comments.</p>
        {form}
      </div>
    );
  return (
    <section aria-label="Open review comments" className="space-y-3">
      {form}
      {[...byBlock].map(([blockId, list]) => (
        <div key={blockId} data-block-id={blockId} className="rounded-lg border border-rule bg-card p-3">
          <p className="text-xs text-ink-faint">{list[0].blockPresent ? `On ${labels.get(blockId) ?? 'a block'}` : 'On a block removed since'}</p>
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
