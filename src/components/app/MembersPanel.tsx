// A brand's people: who holds which role, who is invited, and (for owners) the controls to change that.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { z } from 'zod';
import { BRAND_ROLES, ROLE_LABELS, type BrandRole } from '@/lib/auth/roles';
import { api } from '@/lib/client/api';
import { RoleBadge } from './BrandsDashboard';
import { QueryRoot } from './QueryRoot';

interface Member { id: string; userId: string; name: string; email: string; role: BrandRole; addedAt: string }
interface Invitation { id: string; email: string; role: BrandRole; expiresAt: string }
interface MembersData { members: Member[]; invitations: Invitation[] }

const emailSchema = z.email();

function Members({ brandId, canManage, selfId }: { brandId: string; canManage: boolean; selfId: string }) {
  const key = ['members', brandId];
  const queryClient = useQueryClient();
  const members = useQuery({ queryKey: key, queryFn: () => api<MembersData>(`/api/brands/${brandId}/members`) });
  const [notice, setNotice] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  const refresh = () => queryClient.invalidateQueries({ queryKey: key });
  const fail = (err: Error) => setNotice({ kind: 'error', text: err.message });

  const changeRole = useMutation({
    mutationFn: ({ id, role }: { id: string; role: BrandRole }) => api(`/api/brands/${brandId}/members/${id}`, { method: 'PATCH', body: { role } }),
    onSuccess: () => { setNotice({ kind: 'ok', text: 'Role changed.' }); return refresh(); },
    onError: (e) => { fail(e); return refresh(); },
  });
  const remove = useMutation({
    mutationFn: (id: string) => api(`/api/brands/${brandId}/members/${id}`, { method: 'DELETE' }),
    onSuccess: () => { setNotice({ kind: 'ok', text: 'Member removed.' }); return refresh(); },
    onError: fail,
  });

  if (members.isPending) return <p className="px-6 py-8 text-ink-soft" role="status">Loading members…</p>;
  if (members.isError) return <p className="px-6 py-8 text-danger" role="alert">Members could not be loaded: {members.error.message}</p>;

  return (
    <div>
      {notice && (
        <p role={notice.kind === 'error' ? 'alert' : 'status'} className={`mx-6 mt-4 rounded-md px-3 py-2 text-sm ${notice.kind === 'error' ? 'bg-danger-wash text-danger' : 'bg-plumb-wash text-plumb-deep'}`}>
          {notice.text}
        </p>
      )}
      <table className="mt-2 w-full text-left text-sm" aria-label="Members">
        <thead className="border-b border-rule text-xs uppercase tracking-wider text-ink-faint">
          <tr>
            <th scope="col" className="px-6 py-3 font-semibold">Person</th>
            <th scope="col" className="px-6 py-3 font-semibold">Role</th>
            {canManage && <th scope="col" className="px-6 py-3 font-semibold"><span className="sr-only">Actions</span></th>}
          </tr>
        </thead>
        <tbody>
          {members.data.members.map((m) => (
            <tr key={m.id} className="border-b border-rule last:border-0">
              <td className="px-6 py-3.5">
                <div className="font-semibold">{m.name}{m.userId === selfId && <span className="ml-2 text-xs font-normal text-ink-faint">(you)</span>}</div>
                <div className="text-ink-soft">{m.email}</div>
              </td>
              <td className="px-6 py-3.5">
                {canManage ? (
                  <select
                    className="field w-auto py-1.5 text-sm"
                    aria-label={`Role of ${m.name}`}
                    value={m.role}
                    onChange={(e) => changeRole.mutate({ id: m.id, role: e.target.value as BrandRole })}
                  >
                    {BRAND_ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r].label}</option>)}
                  </select>
                ) : (
                  <RoleBadge role={m.role} />
                )}
              </td>
              {canManage && (
                <td className="px-6 py-3.5 text-right">
                  <button
                    type="button"
                    className="btn-danger px-3 py-1.5"
                    onClick={() => { if (confirm(`Remove ${m.name} from this brand?`)) remove.mutate(m.id); }}
                  >
                    Remove
                  </button>
                </td>
              )}
            </tr>
          ))}
          {members.data.invitations.map((i) => (
            <tr key={i.id} className="border-b border-rule bg-paper/50 last:border-0">
              <td className="px-6 py-3.5">
                <div className="font-semibold">{i.email}</div>
                <div className="text-ink-soft">Invited · waiting to accept</div>
              </td>
              <td className="px-6 py-3.5"><RoleBadge role={i.role} /></td>
              {canManage && <td />}
            </tr>
          ))}
        </tbody>
      </table>
      {canManage && <AddMember brandId={brandId} onDone={(text) => { setNotice({ kind: 'ok', text }); return refresh(); }} />}
    </div>
  );
}

function AddMember({ brandId, onDone }: { brandId: string; onDone: (text: string) => void }) {
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<BrandRole>('viewer');
  const [error, setError] = useState<string | null>(null);
  const add = useMutation({
    mutationFn: () => api<{ invitation: Invitation; mailed: boolean; mailProblem?: string }>(`/api/brands/${brandId}/members`, { method: 'POST', body: { email, role } }),
    onSuccess: (r) => {
      setEmail('');
      // The same words whether or not the address has an account: the server does not say, and neither do we.
      const invited = `${r.invitation.email} is invited as ${ROLE_LABELS[r.invitation.role].label.toLowerCase()} and joins once they accept.`;
      onDone(r.mailProblem ? `${invited} ${r.mailProblem}` : `${invited} The invitation is on its way.`);
    },
    onError: (e) => setError(e.message),
  });
  const submit = (e: { preventDefault(): void }) => {
    e.preventDefault();
    setError(null);
    if (!emailSchema.safeParse(email.trim()).success) return setError('Enter a valid e-mail address.');
    add.mutate();
  };
  return (
    <form onSubmit={submit} noValidate className="border-t border-rule px-6 py-5" aria-label="Add a member">
      <div className="flex flex-wrap items-end gap-3">
        <div className="min-w-64 flex-1">
          <label htmlFor="member-email" className="label">Invite someone by e-mail</label>
          <input id="member-email" type="email" className="field" value={email} onChange={(e) => setEmail(e.target.value)} aria-invalid={!!error} aria-describedby="member-error" />
        </div>
        <div>
          <label htmlFor="member-role" className="label">Role</label>
          <select id="member-role" className="field" value={role} onChange={(e) => setRole(e.target.value as BrandRole)}>
            {BRAND_ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r].label}</option>)}
          </select>
        </div>
        <button className="btn-primary" disabled={add.isPending}>{add.isPending ? 'Inviting…' : 'Invite'}</button>
      </div>
      <p id="member-error" className={error ? 'error-text' : 'hint'}>{error ?? ROLE_LABELS[role].summary + '.'}</p>
    </form>
  );
}

export default function MembersPanel(props: { brandId: string; canManage: boolean; selfId: string }) {
  return (
    <QueryRoot>
      <Members {...props} />
    </QueryRoot>
  );
}
