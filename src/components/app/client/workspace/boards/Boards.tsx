// Mood boards: the direction so far, each board, and starting a new one.
import { useState } from 'react';
import { ListState, Notice, Panel, type ClientCaps, type Note } from '../chrome';
import { Board } from './Board';
import { useBoards } from './boards.queries';
import { StartBoardForm } from './StartBoardForm';

export function Boards({ brandId, caps }: { brandId: string; caps: ClientCaps }) {
  const [note, setNote] = useState<Note>(null);
  const q = useBoards(brandId);
  return (
    <Panel id="boards" title="Mood boards" intro="Images, colours, type and notes sent to the client for a decision on direction. Design starts from an approved board.">
      {q.data && <p className={`mt-3 rounded-md px-3 py-2 text-sm ${q.data.direction.state === 'approved' ? 'bg-ok/10 text-ok' : 'bg-warn-wash text-warn'}`} role="status">{q.data.direction.label}</p>}
      <Notice note={note} />
      {q.isPending || q.isError ? <ListState query={q} /> : (
        <>
          {q.data.boards.length === 0 && <p className="mt-4 text-ink-soft">No mood board yet. {caps.edit ? 'Start one below, add pieces, then send it to the client.' : ''}</p>}
          <ul className="divide-y divide-rule">{q.data.boards.map((b) => <Board key={b.id} brandId={brandId} board={b} caps={caps} onNote={setNote} />)}</ul>
          {caps.edit && <StartBoardForm brandId={brandId} onNote={setNote} />}
        </>
      )}
    </Panel>
  );
}
