// One set of palette routes: its state, the client's answer, every route with its contrast, and what to do next.
import { useState } from 'react';
import { PaletteRouteCard } from '@/components/app/client/PaletteRouteCard';
import type { RouteSetView } from '@/lib/palette-routes/views';
import { date, failed, type ClientCaps, type SetNote } from '../chrome';
import { useAdoptRoute, useDeleteSet } from './palettes.queries';
import { RouteSetForm } from './RouteSetForm';
import { SendRoutesForm } from './SendRoutesForm';

const SET_STATUS: Record<RouteSetView['status'], string> = { draft: 'Not sent yet', sent: 'With the client', chosen: 'Route chosen', comments: 'Comments back, no choice yet' };

export function RouteSet({ brandId, set, caps, onNote }: { brandId: string; set: RouteSetView; caps: ClientCaps; onNote: SetNote }) {
  const [editing, setEditing] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const adopt = useAdoptRoute(brandId, set.id, {
    onSuccess: () => {
      setConfirming(false);
      onNote({ kind: 'ok', text: 'The chosen route is now the brand’s palette. The previous colours are kept in the audit trail.' });
    },
    onError: failed(onNote),
  });
  const remove = useDeleteSet(brandId, set.id, { onError: failed(onNote) });
  const chosen = set.routes.find((r) => r.id === set.decision?.chosenRouteId);
  const editable = caps.edit && set.status !== 'chosen';
  return (
    <li id={`routes-${set.id}`} className="py-5">
      <div className="flex flex-wrap items-baseline gap-3">
        <h3 className="text-lg font-bold">{set.title}</h3>
        <span className={`rounded-full px-2.5 py-0.5 text-xs font-semibold ${set.status === 'chosen' ? 'bg-ok/10 text-ok' : set.status === 'comments' ? 'bg-warn-wash text-warn' : 'bg-paper text-ink-soft'}`}>{SET_STATUS[set.status]}</span>
        {set.sentAt && set.status === 'sent' && <span className="text-xs text-ink-soft">sent to {set.contactName} on {date(set.sentAt)}; the link works until {date(set.expiresAt)}</span>}
        {editable && <button type="button" className="ml-auto text-sm text-plumb" onClick={() => setEditing((x) => !x)}>{editing ? 'Close without saving' : 'Change the routes'}</button>}
        {caps.edit && <button type="button" className={`${editable ? '' : 'ml-auto '}text-sm text-ink-faint hover:text-danger`} disabled={remove.isPending} onClick={() => window.confirm(`Delete “${set.title}” and its routes?`) && remove.mutate()}>Delete</button>}
      </div>
      {set.intro && <p className="mt-1 text-sm text-ink-soft">{set.intro}</p>}
      {set.decision && (
        <div className="mt-3 rounded-md bg-plumb-wash px-4 py-3 text-sm text-plumb-deep" role="status">
          <p>{set.decision.by} {chosen ? <>chose <strong>“{chosen.name}”</strong></> : 'sent comments without choosing'} on {date(set.decision.at)}{set.decision.comment ? `: “${set.decision.comment}”` : '.'}</p>
          {chosen && set.appliedAt && <p className="mt-1">In use as the brand’s palette since {date(set.appliedAt)}.</p>}
          {chosen && caps.edit && (
            <div className="mt-2 flex flex-wrap items-center gap-3">
              {!confirming ? (
                <button type="button" className="btn-primary px-3 py-1.5" onClick={() => setConfirming(true)}>{set.appliedAt ? 'Use this route again' : 'Use this route'}</button>
              ) : (
                <>
                  <span>Replace the brand’s colours with the {chosen.colors.length} colours of “{chosen.name}”? The current palette is kept in the audit trail.</span>
                  <button type="button" className="btn-primary px-3 py-1.5" disabled={adopt.isPending} onClick={() => adopt.mutate()}>Replace the palette</button>
                  <button type="button" className="btn-quiet px-3 py-1.5" onClick={() => setConfirming(false)}>Keep the current palette</button>
                </>
              )}
            </div>
          )}
        </div>
      )}
      {editing ? <RouteSetForm brandId={brandId} set={set} onNote={onNote} onDone={() => setEditing(false)} /> : (
        <div className="mt-4 grid gap-4 lg:grid-cols-2">
          {set.routes.map((r, n) => <PaletteRouteCard key={r.id} route={r} label={`Route ${n + 1} of ${set.routes.length}`} chosen={r.id === set.decision?.chosenRouteId} />)}
        </div>
      )}
      {editable && !editing && <SendRoutesForm brandId={brandId} set={set} onNote={onNote} />}
    </li>
  );
}
