// Palette routes on the client page: candidate palettes offered together, the client's choice, and using it.
import { useState } from 'react';
import { CONTRAST_CAUTION } from '@/lib/cautions';
import { ListState, Notice, Panel, type ClientCaps, type Note } from '../chrome';
import { useRouteSets } from './palettes.queries';
import { RouteSet } from './RouteSet';
import { RouteSetForm } from './RouteSetForm';

export function PaletteRoutes({ brandId, caps }: { brandId: string; caps: ClientCaps }) {
  const [note, setNote] = useState<Note>(null);
  const [composing, setComposing] = useState(false);
  const q = useRouteSets(brandId);
  return (
    <Panel id="palette-routes" title="Palette routes" intro="Two to four candidate palettes, each with its contrast results, sent to the client by link. The route they choose can become the brand’s palette in one step.">
      <Notice note={note} />
      {q.isPending || q.isError ? <ListState query={q} /> : (
        <>
          {q.data.sets.length === 0 && <p className="mt-4 text-ink-soft">No palette routes yet. {caps.edit ? 'Prepare two to four routes below, check how text reads on them, then send them to the client.' : ''}</p>}
          <ul className="divide-y divide-rule">{q.data.sets.map((s) => <RouteSet key={s.id} brandId={brandId} set={s} caps={caps} onNote={setNote} />)}</ul>
          {q.data.sets.length > 0 && <p className="mt-2 text-xs text-ink-soft">{CONTRAST_CAUTION}</p>}
          {caps.edit && (
            <div className="mt-2 border-t border-rule pt-4">
              {composing ? <RouteSetForm brandId={brandId} onNote={setNote} onDone={() => setComposing(false)} /> : <button type="button" className="btn-quiet" onClick={() => setComposing(true)}>Prepare palette routes</button>}
            </div>
          )}
        </>
      )}
    </Panel>
  );
}
