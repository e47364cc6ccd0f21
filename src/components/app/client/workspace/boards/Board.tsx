// One mood board: its state, the client's last decision, its pieces, and (while not approved) adding and sending.
import type { BoardView } from '@/lib/moodboards/views';
import { BoardPiece } from '@/components/app/client/BoardPiece';
import { date, failed, type ClientCaps, type SetNote } from '../chrome';
import { AddPieceForm } from './AddPieceForm';
import { useAdoptSwatches, useRemovePiece } from './boards.queries';
import { SendBoardForm } from './SendBoardForm';

const BOARD_STATUS: Record<BoardView['status'], string> = { draft: 'Not sent yet', sent: 'With the client', approved: 'Direction approved', changes_requested: 'Changes asked for' };

export function Board({ brandId, board, caps, onNote }: { brandId: string; board: BoardView; caps: ClientCaps; onNote: SetNote }) {
  const remove = useRemovePiece(brandId, board.id, { onError: failed(onNote) });
  const adopt = useAdoptSwatches(brandId, board.id, {
    onSuccess: (r) => onNote({ kind: 'ok', text: `${r.added.length} colour${r.added.length === 1 ? '' : 's'} added to the identity${r.skipped.length ? `; ${r.skipped.length} already there` : ''}.` }),
    onError: failed(onNote),
  });
  const editable = caps.edit && board.status !== 'approved';
  const last = board.decisions[0];
  return (
    <li id={`board-${board.id}`} className="py-5">
      <div className="flex flex-wrap items-baseline gap-3">
        <h3 className="text-lg font-bold">{board.title}</h3>
        <span className={`rounded-full px-2.5 py-0.5 text-xs font-semibold ${board.status === 'approved' ? 'bg-ok/10 text-ok' : board.status === 'changes_requested' ? 'bg-warn-wash text-warn' : 'bg-paper text-ink-soft'}`}>{BOARD_STATUS[board.status]}</span>
        {caps.edit && board.status === 'approved' && board.items.some((i) => i.kind === 'swatch') && (
          <button type="button" className="btn-primary ml-auto px-3 py-1.5" disabled={adopt.isPending} onClick={() => adopt.mutate()}>Add kept swatches to the identity</button>
        )}
      </div>
      {board.intro && <p className="mt-1 text-sm text-ink-soft">{board.intro}</p>}
      {last && <p className="mt-2 text-sm">{last.decidedBy} {last.outcome === 'approved' ? 'approved' : 'asked for changes'} on {date(last.decidedAt)} ({last.kept} kept, {last.dropped} dropped){last.comment ? `: “${last.comment}”` : '.'}</p>}
      {board.items.length === 0 ? <p className="mt-3 text-sm text-ink-soft">This board is empty. Add images, swatches, type samples or notes below.</p> : (
        <ul className="mt-3 grid grid-cols-2 gap-4 md:grid-cols-4" aria-label={`Pieces of ${board.title}`}>
          {board.items.map((item) => (
            // A dropped piece greys its picture, not its words, so the verdict stays readable (WCAG 2.2 SC 1.4.3).
            <li key={item.id} className={`rounded-lg border p-2 ${item.verdict === 'drop' ? 'border-dashed border-danger/40 bg-paper [&_img]:opacity-50 [&_img]:grayscale' : 'border-rule'}`}>
              <BoardPiece item={item} imageUrl={`/api/brands/${brandId}/moodboards/${board.id}/items/${item.id}/image`} />
              <div className="mt-1 flex items-center gap-2 text-xs">
                {item.verdict && <span className={item.verdict === 'keep' ? 'font-semibold text-ok' : 'font-semibold text-danger'}>{item.verdict === 'keep' ? 'Kept' : 'Dropped'}</span>}
                {item.verdictComment && <span className="text-ink-soft">“{item.verdictComment}”</span>}
                {editable && <button type="button" className="ml-auto text-ink-faint hover:text-danger" aria-label="Remove this piece" onClick={() => remove.mutate(item.id)}>Remove</button>}
              </div>
            </li>
          ))}
        </ul>
      )}
      {editable && (
        <div className="mt-4 grid gap-4 rounded-lg bg-paper p-4 lg:grid-cols-2">
          <AddPieceForm brandId={brandId} board={board} onNote={onNote} />
          <SendBoardForm brandId={brandId} board={board} onNote={onNote} />
        </div>
      )}
    </li>
  );
}
