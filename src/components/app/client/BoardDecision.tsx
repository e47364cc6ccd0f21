// The client's decision on a mood board: keep or drop each piece, then approve the direction or ask for changes.
import { useState } from 'react';
import { api, type ApiClientError } from '@/lib/client/api';
import type { PublicBoard } from '@/lib/moodboards/views';
import { BoardPiece } from './BoardPiece';
import { When } from '@/components/ui/When';

type Verdict = 'keep' | 'drop';

export default function BoardDecision({ token, initial }: { token: string; initial: PublicBoard }) {
  const [board, setBoard] = useState(initial);
  const [verdicts, setVerdicts] = useState<Record<string, Verdict>>(Object.fromEntries(initial.items.filter((i) => i.verdict).map((i) => [i.id, i.verdict!])));
  const [notes, setNotes] = useState<Record<string, string>>(Object.fromEntries(initial.items.filter((i) => i.verdictComment).map((i) => [i.id, i.verdictComment!])));
  const [name, setName] = useState(initial.contactName ?? '');
  const [comment, setComment] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const open = board.status === 'sent';
  const unmarked = board.items.filter((i) => !verdicts[i.id]).length;

  const decide = async (outcome: 'approved' | 'changes_requested') => {
    setError(null);
    if (!name.trim()) return setError('Tell us your name, so the designer knows who decided.');
    if (unmarked) return setError(`Mark every piece keep or drop first (${unmarked} still open).`);
    if (outcome === 'changes_requested' && !comment.trim()) return setError('Say what should change, so the designer knows where to go next.');
    setBusy(true);
    try {
      const r = await api<{ board: PublicBoard }>(`/api/moodboards/${token}/decision`, {
        method: 'POST',
        body: { name: name.trim(), outcome, comment, items: board.items.map((i) => ({ id: i.id, verdict: verdicts[i.id], comment: notes[i.id] ?? '' })) },
      });
      setBoard(r.board);
    } catch (err) {
      setError((err as ApiClientError).message);
    } finally {
      setBusy(false);
    }
  };

  const last = board.decisions[0];
  return (
    <div className="mt-10">
      <p className="eyebrow">{board.brandName} · mood board</p>
      <h1 className="mt-2 text-3xl font-bold">{board.title}</h1>
      {board.intro && <p className="mt-3 max-w-2xl whitespace-pre-line text-ink-soft">{board.intro}</p>}
      {!open && last && (
        <p className="mt-6 rounded-md bg-plumb-wash px-4 py-3 text-plumb-deep" role="status">
          {last.outcome === 'approved' ? 'Direction approved' : 'Changes asked for'} by {last.decidedBy} on <When value={last.decidedAt} as="long" />: {last.kept} kept, {last.dropped} dropped. Thank you.
        </p>
      )}
      <ul className="mt-8 grid gap-6 sm:grid-cols-2 lg:grid-cols-3" aria-label="Pieces on the board">
        {board.items.map((item, n) => (
          <li key={item.id} className="panel p-4">
            <BoardPiece item={item} imageUrl={`/api/moodboards/${token}/items/${item.id}`} />
            {item.kind !== 'note' && item.caption && <p className="mt-2 text-sm text-ink-soft">{item.caption}</p>}
            <fieldset className="mt-3" disabled={!open}>
              <legend className="sr-only">Piece {n + 1}: keep or drop</legend>
              <div className="flex gap-2">
                {(['keep', 'drop'] as const).map((v) => (
                  <label key={v} className={`flex-1 cursor-pointer rounded-md border px-3 py-1.5 text-center text-sm font-semibold ${verdicts[item.id] === v ? (v === 'keep' ? 'border-ok bg-ok/10 text-ok' : 'border-danger bg-danger-wash text-danger') : 'border-rule-strong text-ink-soft'}`}>
                    <input type="radio" className="sr-only" name={`verdict-${item.id}`} checked={verdicts[item.id] === v} onChange={() => setVerdicts((x) => ({ ...x, [item.id]: v }))} />
                    {v === 'keep' ? 'Keep' : 'Drop'}
                  </label>
                ))}
              </div>
              <label className="sr-only" htmlFor={`note-${item.id}`}>Comment on piece {n + 1}</label>
              <input id={`note-${item.id}`} className="field mt-2 text-sm" placeholder="A word on this piece (optional)" maxLength={1000} value={notes[item.id] ?? ''} onChange={(e) => setNotes((x) => ({ ...x, [item.id]: e.target.value }))} />
            </fieldset>
          </li>
        ))}
      </ul>
      {open && (
        <section className="panel mt-8 px-6 py-6" aria-labelledby="decide-title">
          <h2 id="decide-title" className="text-xl font-bold">Your decision</h2>
          <div className="mt-4 grid gap-4 sm:grid-cols-2">
            <div>
              <label htmlFor="decider" className="label">Your name</label>
              <input id="decider" className="field" value={name} maxLength={120} onChange={(e) => setName(e.target.value)} />
            </div>
          </div>
          <label htmlFor="board-comment" className="label mt-4">Comments on the direction as a whole</label>
          <textarea id="board-comment" className="field min-h-28" maxLength={4000} value={comment} onChange={(e) => setComment(e.target.value)} />
          {error && <p className="error-text" role="alert">{error}</p>}
          <div className="mt-5 flex flex-wrap gap-3">
            <button type="button" className="btn-primary" disabled={busy} onClick={() => void decide('approved')}>Approve this direction</button>
            <button type="button" className="btn-quiet" disabled={busy} onClick={() => void decide('changes_requested')}>Needs changes</button>
          </div>
        </section>
      )}
    </div>
  );
}
