// Invitations waiting: people invited by e-mail who have not joined yet; send the link again or withdraw it.
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api } from '@/lib/client/api';
import { useChange } from '@/lib/client/mutation';
import { date, failed, ListState, mailed, Notice, Panel, type Mailed, type Note } from './chrome';

interface Invitation { id: string; email: string; role: string; expiresAt: string; state: 'pending' | 'expired' }
const invitationsKey = (brandId: string) => ['invitations', brandId] as const;

export function Invitations({ brandId }: { brandId: string }) {
  const qc = useQueryClient();
  const [note, setNote] = useState<Note>(null);
  const q = useQuery({ queryKey: invitationsKey(brandId), queryFn: () => api<{ invitations: Invitation[] }>(`/api/brands/${brandId}/invitations`) });
  const refresh = () => qc.invalidateQueries({ queryKey: invitationsKey(brandId) });
  const resend = useChange((id: string) => api<Mailed>(`/api/brands/${brandId}/invitations/${id}/resend`, { method: 'POST', body: {} }), refresh, {
    onSuccess: (r) => setNote(mailed(r, 'A new link was sent; the old one no longer works.')),
    onError: failed(setNote),
  });
  const revoke = useChange((id: string) => api(`/api/brands/${brandId}/invitations/${id}`, { method: 'DELETE' }), refresh, {
    onSuccess: () => setNote({ kind: 'ok', text: 'Invitation withdrawn.' }),
    onError: failed(setNote),
  });
  return (
    <Panel id="invitations" title="Invitations waiting" intro="People invited by e-mail who have not joined yet. Add people on the overview page.">
      <Notice note={note} />
      {q.isPending || q.isError ? <ListState query={q} /> : q.data.invitations.length === 0 ? (
        <p className="mt-4 text-ink-soft">No one is waiting. Invite a client contact from the overview page by entering an address that has no account yet.</p>
      ) : (
        <table className="mt-4 w-full text-left text-sm" aria-label="Invitations waiting">
          <tbody>
            {q.data.invitations.map((i) => (
              <tr key={i.id} className="border-t border-rule">
                <td className="py-3 font-semibold">{i.email}</td>
                <td className="py-3 capitalize text-ink-soft">{i.role}</td>
                <td className="py-3 text-ink-soft">{i.state === 'expired' ? <span className="text-warn">Expired {date(i.expiresAt)}</span> : `Works until ${date(i.expiresAt)}`}</td>
                <td className="py-3 text-right">
                  <button type="button" className="btn-quiet px-3 py-1.5" onClick={() => resend.mutate(i.id)}>Send again</button>{' '}
                  <button type="button" className="btn-danger px-3 py-1.5" onClick={() => { if (confirm(`Withdraw the invitation to ${i.email}?`)) revoke.mutate(i.id); }}>Withdraw</button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </Panel>
  );
}
