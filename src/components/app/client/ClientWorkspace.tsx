// The brand's client page: follow, invitations, briefs, mood boards and reviews, each with what to do next.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { api } from '@/lib/client/api';
import type { BriefView } from '@/lib/briefs/views';
import type { BoardView, DirectionStatus } from '@/lib/moodboards/views';
import type { CommentView, ReviewSummary, ReviewView } from '@/lib/reviews/views';
import { QueryRoot } from '@/components/app/QueryRoot';
import { BoardPiece } from './BoardPiece';
import { formatDate } from '@/lib/format';

export interface ClientCaps {
  manageMembers: boolean;
  edit: boolean;
  comment: boolean;
  decide: boolean;
}
type Note = { kind: 'ok' | 'error'; text: string } | null;

function Notice({ note }: { note: Note }) {
  if (!note) return null;
  return <p role={note.kind === 'error' ? 'alert' : 'status'} className={`mt-3 rounded-md px-3 py-2 text-sm ${note.kind === 'error' ? 'bg-danger-wash text-danger' : 'bg-plumb-wash text-plumb-deep'}`}>{note.text}</p>;
}
const mailed = (r: { mailed?: boolean; mailProblem?: string }, ok: string): Note => (r.mailed === false ? { kind: 'error', text: `Saved, but ${r.mailProblem ?? 'the e-mail was not sent.'}` } : { kind: 'ok', text: ok });
const date = (iso: string | null) => (iso ? formatDate(iso) : '');

function Panel({ id, title, intro, children }: { id: string; title: string; intro: string; children: ReactNode }) {
  return (
    <section id={id} className="panel mt-8 px-6 py-5" aria-labelledby={`${id}-title`}>
      <h2 id={`${id}-title`} className="text-xl font-bold">{title}</h2>
      <p className="mt-1 text-sm text-ink-soft">{intro}</p>
      {children}
    </section>
  );
}

function Follow({ brandId }: { brandId: string }) {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: ['follow', brandId], queryFn: () => api<{ following: boolean }>(`/api/brands/${brandId}/follow`) });
  const m = useMutation({
    mutationFn: (follow: boolean) => api(`/api/brands/${brandId}/follow`, { method: follow ? 'PUT' : 'DELETE' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['follow', brandId] }),
  });
  const on = q.data?.following ?? false;
  return (
    <div id="follow" className="flex flex-wrap items-center gap-3 rounded-lg border border-rule bg-card px-4 py-3">
      <p className="text-sm text-ink-soft">{on ? 'You follow this brand: each newly published version reaches you by e-mail.' : 'Follow this brand to get an e-mail with the note and the changes whenever a version is published.'}</p>
      <button type="button" className="btn-quiet ml-auto px-3 py-1.5" aria-pressed={on} disabled={q.isPending || m.isPending} onClick={() => m.mutate(!on)}>{on ? 'Stop following' : 'Follow'}</button>
    </div>
  );
}

interface Invitation { id: string; email: string; role: string; expiresAt: string; state: 'pending' | 'expired' }
function Invitations({ brandId }: { brandId: string }) {
  const qc = useQueryClient();
  const [note, setNote] = useState<Note>(null);
  const q = useQuery({ queryKey: ['invitations', brandId], queryFn: () => api<{ invitations: Invitation[] }>(`/api/brands/${brandId}/invitations`) });
  const refresh = () => qc.invalidateQueries({ queryKey: ['invitations', brandId] });
  const resend = useMutation({ mutationFn: (id: string) => api<{ mailed: boolean; mailProblem?: string }>(`/api/brands/${brandId}/invitations/${id}/resend`, { method: 'POST', body: {} }), onSuccess: (r) => { setNote(mailed(r, 'A new link was sent; the old one no longer works.')); return refresh(); }, onError: (e) => setNote({ kind: 'error', text: e.message }) });
  const revoke = useMutation({ mutationFn: (id: string) => api(`/api/brands/${brandId}/invitations/${id}`, { method: 'DELETE' }), onSuccess: () => { setNote({ kind: 'ok', text: 'Invitation withdrawn.' }); return refresh(); }, onError: (e) => setNote({ kind: 'error', text: e.message }) });
  return (
    <Panel id="invitations" title="Invitations waiting" intro="People invited by e-mail who have not joined yet. Add people on the overview page.">
      <Notice note={note} />
      {q.isPending ? <p className="mt-4 text-ink-soft" role="status">Loading…</p> : q.isError ? <p className="mt-4 text-danger" role="alert">{q.error.message}</p> : q.data.invitations.length === 0 ? (
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

const BRIEF_STATUS: Record<BriefView['status'], string> = { sent: 'Sent, not opened yet', in_progress: 'Being answered', submitted: 'Answered', expired: 'Link expired', withdrawn: 'Withdrawn' };
interface BriefsData { briefs: BriefView[]; templates: { id: string; title: string; intro: string; questions: number }[] }
interface BriefDetail { questionnaire: { sections: { title: string; questions: { id: string; label: string }[] }[] }; answers: Record<string, string | string[]> }

function BriefAnswers({ brandId, briefId }: { brandId: string; briefId: string }) {
  const q = useQuery({ queryKey: ['brief', briefId], queryFn: () => api<BriefDetail>(`/api/brands/${brandId}/briefs/${briefId}`) });
  if (q.isPending) return <p className="text-ink-soft" role="status">Loading answers…</p>;
  if (q.isError) return <p className="text-danger" role="alert">{q.error.message}</p>;
  return (
    <div className="mt-3 space-y-4">
      {q.data.questionnaire.sections.map((s) => (
        <div key={s.title}>
          <h4 className="eyebrow">{s.title}</h4>
          <dl className="mt-2 space-y-2">
            {s.questions.map((x) => {
              const v = q.data.answers[x.id];
              const text = Array.isArray(v) ? v.filter((l) => l.trim()).join(' · ') : v;
              return (
                <div key={x.id}>
                  <dt className="text-sm font-semibold">{x.label}</dt>
                  <dd className="whitespace-pre-line text-sm text-ink-soft">{text?.trim() ? text : <em>No answer yet</em>}</dd>
                </div>
              );
            })}
          </dl>
        </div>
      ))}
    </div>
  );
}

function Briefs({ brandId, caps }: { brandId: string; caps: ClientCaps }) {
  const qc = useQueryClient();
  const [note, setNote] = useState<Note>(null);
  const [form, setForm] = useState({ template: '', contactName: '', contactEmail: '', message: '' });
  const [openId, setOpenId] = useState<string | null>(null);
  const q = useQuery({ queryKey: ['briefs', brandId], queryFn: () => api<BriefsData>(`/api/brands/${brandId}/briefs`) });
  const send = useMutation({
    mutationFn: () => api<{ mailed: boolean; mailProblem?: string }>(`/api/brands/${brandId}/briefs`, { method: 'POST', body: { ...form, template: form.template || q.data!.templates[0].id } }),
    onSuccess: (r) => { setNote(mailed(r, `The questionnaire is on its way to ${form.contactEmail}.`)); setForm({ template: form.template, contactName: '', contactEmail: '', message: '' }); return qc.invalidateQueries({ queryKey: ['briefs', brandId] }); },
    onError: (e) => setNote({ kind: 'error', text: e.message }),
  });
  return (
    <Panel id="briefs" title="Brief" intro="A questionnaire your client answers through a link, without an account. Answers are kept with the brand.">
      <Notice note={note} />
      {q.isPending ? <p className="mt-4 text-ink-soft" role="status">Loading…</p> : q.isError ? <p className="mt-4 text-danger" role="alert">{q.error.message}</p> : (
        <>
          {q.data.briefs.length === 0 && <p className="mt-4 text-ink-soft">No brief yet. {caps.edit ? 'Send one to the client’s contact below to start onboarding.' : 'The designer has not sent one yet.'}</p>}
          <ul className="mt-4 divide-y divide-rule">
            {q.data.briefs.map((b) => (
              <li key={b.id} id={`brief-${b.id}`} className="py-3">
                <div className="flex flex-wrap items-center gap-3">
                  <div>
                    <p className="font-semibold">{b.title} <span className="font-normal text-ink-soft">· {b.contactName} &lt;{b.contactEmail}&gt;</span></p>
                    <p className="text-sm text-ink-soft">{BRIEF_STATUS[b.status]} · {b.answered} of {b.questions} answered · sent {date(b.sentAt)}{b.submittedAt ? ` · submitted ${date(b.submittedAt)}` : ''}</p>
                  </div>
                  <div className="ml-auto flex gap-2">
                    <button type="button" className="btn-quiet px-3 py-1.5" aria-expanded={openId === b.id} onClick={() => setOpenId(openId === b.id ? null : b.id)}>{openId === b.id ? 'Hide answers' : 'Read answers'}</button>
                    <a className="btn-quiet px-3 py-1.5" href={`/api/brands/${brandId}/briefs/${b.id}/export?format=md`}>Markdown</a>
                    <a className="btn-quiet px-3 py-1.5" href={`/api/brands/${brandId}/briefs/${b.id}/export?format=csv`}>CSV</a>
                  </div>
                </div>
                {openId === b.id && <BriefAnswers brandId={brandId} briefId={b.id} />}
              </li>
            ))}
          </ul>
          {caps.edit && (
            <form className="mt-4 grid gap-3 border-t border-rule pt-4 sm:grid-cols-2" aria-label="Send a brief" onSubmit={(e) => { e.preventDefault(); setNote(null); send.mutate(); }}>
              <div>
                <label className="label" htmlFor="brief-template">Questionnaire</label>
                <select id="brief-template" className="field" value={form.template || q.data.templates[0]?.id} onChange={(e) => setForm({ ...form, template: e.target.value })}>
                  {q.data.templates.map((t) => <option key={t.id} value={t.id}>{t.title} ({t.questions} questions)</option>)}
                </select>
              </div>
              <div>
                <label className="label" htmlFor="brief-name">Contact name</label>
                <input id="brief-name" className="field" value={form.contactName} onChange={(e) => setForm({ ...form, contactName: e.target.value })} />
              </div>
              <div>
                <label className="label" htmlFor="brief-email">Contact e-mail</label>
                <input id="brief-email" type="email" className="field" value={form.contactEmail} onChange={(e) => setForm({ ...form, contactEmail: e.target.value })} />
              </div>
              <div>
                <label className="label" htmlFor="brief-message">A line from you (optional)</label>
                <input id="brief-message" className="field" value={form.message} maxLength={2000} onChange={(e) => setForm({ ...form, message: e.target.value })} />
              </div>
              <div><button className="btn-primary" disabled={send.isPending}>{send.isPending ? 'Sending…' : 'Send the questionnaire'}</button></div>
            </form>
          )}
        </>
      )}
    </Panel>
  );
}

const BOARD_STATUS: Record<BoardView['status'], string> = { draft: 'Not sent yet', sent: 'With the client', approved: 'Direction approved', changes_requested: 'Changes asked for' };

function Board({ brandId, board, caps, onNote }: { brandId: string; board: BoardView; caps: ClientCaps; onNote: (n: Note) => void }) {
  const qc = useQueryClient();
  const refresh = () => qc.invalidateQueries({ queryKey: ['boards', brandId] });
  const [piece, setPiece] = useState({ kind: 'swatch', name: '', value: '', family: '', sample: '', caption: '' });
  const [contact, setContact] = useState({ contactName: board.contactName ?? '', contactEmail: board.contactEmail ?? '' });
  const fail = (e: Error) => onNote({ kind: 'error', text: e.message });
  const add = useMutation({
    mutationFn: () => api(`/api/brands/${brandId}/moodboards/${board.id}/items`, { method: 'POST', body: piece.kind === 'swatch' ? { kind: 'swatch', name: piece.name, value: piece.value } : piece.kind === 'type' ? { kind: 'type', family: piece.family, sample: piece.sample } : { kind: 'note', caption: piece.caption } }),
    onSuccess: () => { setPiece({ ...piece, name: '', value: '', family: '', sample: '', caption: '' }); return refresh(); },
    onError: fail,
  });
  const upload = async (file: File) => {
    const form = new FormData();
    form.set('file', file);
    const r = await fetch(`/api/brands/${brandId}/moodboards/${board.id}/items`, { method: 'POST', body: form });
    if (!r.ok) onNote({ kind: 'error', text: ((await r.json().catch(() => null)) as { error?: { message?: string } } | null)?.error?.message ?? 'The image could not be added.' });
    await refresh();
  };
  const remove = useMutation({ mutationFn: (id: string) => api(`/api/brands/${brandId}/moodboards/${board.id}/items/${id}`, { method: 'DELETE' }), onSuccess: refresh, onError: fail });
  const send = useMutation({ mutationFn: () => api<{ mailed: boolean; mailProblem?: string }>(`/api/brands/${brandId}/moodboards/${board.id}/send`, { method: 'POST', body: contact }), onSuccess: (r) => { onNote(mailed(r, `“${board.title}” was sent to ${contact.contactEmail}.`)); return refresh(); }, onError: fail });
  const adopt = useMutation({ mutationFn: () => api<{ added: unknown[]; skipped: string[] }>(`/api/brands/${brandId}/moodboards/${board.id}/adopt-swatches`, { method: 'POST', body: {} }), onSuccess: (r) => onNote({ kind: 'ok', text: `${r.added.length} colour${r.added.length === 1 ? '' : 's'} added to the identity${r.skipped.length ? `; ${r.skipped.length} already there` : ''}.` }), onError: fail });
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
          <form aria-label={`Add a piece to ${board.title}`} onSubmit={(e) => { e.preventDefault(); onNote(null); add.mutate(); }} className="flex flex-wrap items-end gap-2">
            <div>
              <label className="label" htmlFor={`kind-${board.id}`}>Add</label>
              <select id={`kind-${board.id}`} className="field" value={piece.kind} onChange={(e) => setPiece({ ...piece, kind: e.target.value })}>
                <option value="swatch">Colour swatch</option><option value="type">Type sample</option><option value="note">Note</option>
              </select>
            </div>
            {piece.kind === 'swatch' && <>
              <div><label className="label" htmlFor={`sn-${board.id}`}>Name</label><input id={`sn-${board.id}`} className="field w-32" value={piece.name} onChange={(e) => setPiece({ ...piece, name: e.target.value })} /></div>
              <div><label className="label" htmlFor={`sv-${board.id}`}>Colour</label><input id={`sv-${board.id}`} className="field w-36 font-mono" placeholder="#6b4226" value={piece.value} onChange={(e) => setPiece({ ...piece, value: e.target.value })} /></div>
            </>}
            {piece.kind === 'type' && <>
              <div><label className="label" htmlFor={`tf-${board.id}`}>Typeface</label><input id={`tf-${board.id}`} className="field w-36" value={piece.family} onChange={(e) => setPiece({ ...piece, family: e.target.value })} /></div>
              <div><label className="label" htmlFor={`ts-${board.id}`}>Sample text</label><input id={`ts-${board.id}`} className="field w-44" value={piece.sample} onChange={(e) => setPiece({ ...piece, sample: e.target.value })} /></div>
            </>}
            {piece.kind === 'note' && <div className="flex-1"><label className="label" htmlFor={`nt-${board.id}`}>Note</label><input id={`nt-${board.id}`} className="field" value={piece.caption} onChange={(e) => setPiece({ ...piece, caption: e.target.value })} /></div>}
            <button className="btn-quiet" disabled={add.isPending}>Add</button>
            <label className="btn-quiet cursor-pointer">Upload an image<input type="file" accept="image/jpeg,image/png,image/webp,image/gif,image/avif" className="sr-only" onChange={(e) => { const f = e.target.files?.[0]; if (f) void upload(f); e.target.value = ''; }} /></label>
          </form>
          <form aria-label={`Send ${board.title}`} onSubmit={(e) => { e.preventDefault(); onNote(null); send.mutate(); }} className="flex flex-wrap items-end gap-2">
            <div><label className="label" htmlFor={`cn-${board.id}`}>Client contact</label><input id={`cn-${board.id}`} className="field w-36" value={contact.contactName} onChange={(e) => setContact({ ...contact, contactName: e.target.value })} /></div>
            <div><label className="label" htmlFor={`ce-${board.id}`}>E-mail</label><input id={`ce-${board.id}`} type="email" className="field w-52" value={contact.contactEmail} onChange={(e) => setContact({ ...contact, contactEmail: e.target.value })} /></div>
            <button className="btn-primary" disabled={send.isPending}>{board.status === 'draft' ? 'Send for a decision' : 'Send again'}</button>
          </form>
        </div>
      )}
    </li>
  );
}

function Boards({ brandId, caps }: { brandId: string; caps: ClientCaps }) {
  const qc = useQueryClient();
  const [note, setNote] = useState<Note>(null);
  const [title, setTitle] = useState('');
  const q = useQuery({ queryKey: ['boards', brandId], queryFn: () => api<{ boards: BoardView[]; direction: DirectionStatus }>(`/api/brands/${brandId}/moodboards`) });
  const create = useMutation({ mutationFn: () => api(`/api/brands/${brandId}/moodboards`, { method: 'POST', body: { title } }), onSuccess: () => { setTitle(''); return qc.invalidateQueries({ queryKey: ['boards', brandId] }); }, onError: (e) => setNote({ kind: 'error', text: e.message }) });
  return (
    <Panel id="boards" title="Mood boards" intro="Images, colours, type and notes sent to the client for a decision on direction. Design starts from an approved board.">
      {q.data && <p className={`mt-3 rounded-md px-3 py-2 text-sm ${q.data.direction.state === 'approved' ? 'bg-ok/10 text-ok' : 'bg-warn-wash text-warn'}`} role="status">{q.data.direction.label}</p>}
      <Notice note={note} />
      {q.isPending ? <p className="mt-4 text-ink-soft" role="status">Loading…</p> : q.isError ? <p className="mt-4 text-danger" role="alert">{q.error.message}</p> : (
        <>
          {q.data.boards.length === 0 && <p className="mt-4 text-ink-soft">No mood board yet. {caps.edit ? 'Start one below, add pieces, then send it to the client.' : ''}</p>}
          <ul className="divide-y divide-rule">{q.data.boards.map((b) => <Board key={b.id} brandId={brandId} board={b} caps={caps} onNote={setNote} />)}</ul>
          {caps.edit && (
            <form className="mt-2 flex flex-wrap items-end gap-3 border-t border-rule pt-4" aria-label="Start a mood board" onSubmit={(e) => { e.preventDefault(); setNote(null); create.mutate(); }}>
              <div className="min-w-64 flex-1"><label className="label" htmlFor="board-title">New board title</label><input id="board-title" className="field" value={title} maxLength={160} onChange={(e) => setTitle(e.target.value)} /></div>
              <button className="btn-quiet" disabled={create.isPending}>Start a board</button>
            </form>
          )}
        </>
      )}
    </Panel>
  );
}

const REVIEW_STATUS: Record<ReviewView['status'], string> = { open: 'Waiting for a decision', approved: 'Approved', changes_requested: 'Changes requested' };

function Reviews({ brandId, caps }: { brandId: string; caps: ClientCaps }) {
  const qc = useQueryClient();
  const [note, setNote] = useState<Note>(null);
  const [message, setMessage] = useState('');
  const [decision, setDecision] = useState<Record<string, string>>({});
  const [reply, setReply] = useState<Record<string, string>>({});
  const reviews = useQuery({ queryKey: ['reviews', brandId], queryFn: () => api<{ reviews: ReviewView[] } & ReviewSummary>(`/api/brands/${brandId}/reviews`) });
  const comments = useQuery({ queryKey: ['comments', brandId], queryFn: () => api<{ comments: CommentView[] }>(`/api/brands/${brandId}/comments`) });
  const refresh = () => Promise.all([qc.invalidateQueries({ queryKey: ['reviews', brandId] }), qc.invalidateQueries({ queryKey: ['comments', brandId] })]);
  const fail = (e: Error) => setNote({ kind: 'error', text: e.message });
  const request = useMutation({ mutationFn: () => api<{ notified: string[]; problems: string[] }>(`/api/brands/${brandId}/reviews`, { method: 'POST', body: { message } }), onSuccess: (r) => { setMessage(''); setNote(r.problems.length ? { kind: 'error', text: `Saved, but some e-mails failed: ${r.problems.join('; ')}` } : { kind: 'ok', text: `Review requested from ${r.notified.join(', ')}.` }); return refresh(); }, onError: fail });
  const decide = useMutation({ mutationFn: (v: { id: string; outcome: string }) => api(`/api/brands/${brandId}/reviews/${v.id}/decision`, { method: 'POST', body: { outcome: v.outcome, note: decision[v.id] ?? '' } }), onSuccess: () => { setNote({ kind: 'ok', text: 'Decision recorded.' }); return refresh(); }, onError: fail });
  const answer = useMutation({ mutationFn: (parentId: string) => api(`/api/brands/${brandId}/comments`, { method: 'POST', body: { parentId, body: reply[parentId] ?? '' } }), onSuccess: (_r, id) => { setReply({ ...reply, [id]: '' }); return refresh(); }, onError: fail });
  const resolve = useMutation({ mutationFn: (v: { id: string; resolved: boolean }) => api(`/api/brands/${brandId}/comments/${v.id}`, { method: 'PATCH', body: { resolved: v.resolved } }), onSuccess: refresh, onError: fail });
  const threads = (comments.data?.comments ?? []).filter((c) => !c.parentId);
  return (
    <Panel id="reviews" title="Reviews" intro="Reviewers read the working draft, comment on its blocks, and approve it or ask for changes.">
      <Notice note={note} />
      {reviews.data && <p className="mt-3 text-sm text-ink-soft">{reviews.data.openComments} open comment thread{reviews.data.openComments === 1 ? '' : 's'}</p>}
      {reviews.isError && <p className="mt-4 text-danger" role="alert">{reviews.error.message}</p>}
      {reviews.data?.reviews.length === 0 && <p className="mt-4 text-ink-soft">No review yet. {caps.edit ? 'When the draft is ready, ask the brand’s reviewers below.' : ''}</p>}
      <ul className="mt-2 divide-y divide-rule">
        {reviews.data?.reviews.map((r) => (
          <li key={r.id} id={`review-${r.id}`} className="py-3">
            <p className="font-semibold">Review of the draft as of {date(r.requestedAt)} · <span className={r.status === 'approved' ? 'text-ok' : r.status === 'changes_requested' ? 'text-warn' : 'text-ink-soft'}>{REVIEW_STATUS[r.status]}</span></p>
            <p className="text-sm text-ink-soft">Asked by {r.requestedBy ?? 'a former member'} on {date(r.requestedAt)}{r.message ? `: “${r.message}”` : ''}</p>
            {r.decidedAt && <p className="text-sm">{r.decidedBy} decided on {date(r.decidedAt)}{r.decisionNote ? `: “${r.decisionNote}”` : ''}</p>}
            {caps.decide && r.status === 'open' && (
              <div className="mt-2 flex flex-wrap items-end gap-2">
                <div className="min-w-64 flex-1"><label className="label" htmlFor={`dn-${r.id}`}>Your note (needed when asking for changes)</label><input id={`dn-${r.id}`} className="field" value={decision[r.id] ?? ''} onChange={(e) => setDecision({ ...decision, [r.id]: e.target.value })} /></div>
                <button type="button" className="btn-primary" onClick={() => decide.mutate({ id: r.id, outcome: 'approved' })}>Approve the draft</button>
                <button type="button" className="btn-quiet" onClick={() => decide.mutate({ id: r.id, outcome: 'changes_requested' })}>Request changes</button>
              </div>
            )}
          </li>
        ))}
      </ul>
      {caps.edit && (
        <form className="mt-2 flex flex-wrap items-end gap-3 border-t border-rule pt-4" aria-label="Request a review" onSubmit={(e) => { e.preventDefault(); setNote(null); request.mutate(); }}>
          <div className="min-w-64 flex-1"><label className="label" htmlFor="review-message">A line for the reviewers (optional)</label><input id="review-message" className="field" value={message} maxLength={2000} onChange={(e) => setMessage(e.target.value)} /></div>
          <button className="btn-primary" disabled={request.isPending}>Request a review of the draft</button>
        </form>
      )}
      <h3 className="mt-6 text-lg font-bold">Comments on the draft</h3>
      {threads.length === 0 ? <p className="mt-2 text-sm text-ink-soft">No comments yet. Reviewers comment on a block from the guidelines editor’s margin.</p> : (
        <ul className="mt-2 space-y-3">
          {threads.map((t) => (
            <li key={t.id} className={`rounded-lg border border-rule p-3 ${t.resolvedAt ? 'bg-paper' : ''}`}>
              <p className="text-xs text-ink-soft">{t.blockPresent ? `On ${t.blockLabel ?? 'a block'}` : 'On a block removed since'} · {date(t.createdAt)}{t.resolvedAt ? ` · resolved by ${t.resolvedBy}` : ''}</p>
              {[t, ...(comments.data?.comments ?? []).filter((c) => c.parentId === t.id)].map((c) => (
                <p key={c.id} className={`mt-1 text-sm ${c.parentId ? 'ml-4 border-l-2 border-rule pl-3' : ''}`}><strong>{c.author.name}</strong> {c.body}</p>
              ))}
              {caps.comment && (
                <div className="mt-2 flex flex-wrap gap-2">
                  {!t.resolvedAt && <><label className="sr-only" htmlFor={`rp-${t.id}`}>Reply</label><input id={`rp-${t.id}`} className="field flex-1 py-1.5 text-sm" placeholder="Reply…" value={reply[t.id] ?? ''} onChange={(e) => setReply({ ...reply, [t.id]: e.target.value })} />
                  <button type="button" className="btn-quiet px-3 py-1.5" onClick={() => answer.mutate(t.id)}>Reply</button></>}
                  <button type="button" className="btn-quiet px-3 py-1.5" onClick={() => resolve.mutate({ id: t.id, resolved: !t.resolvedAt })}>{t.resolvedAt ? 'Open again' : 'Resolve'}</button>
                </div>
              )}
            </li>
          ))}
        </ul>
      )}
    </Panel>
  );
}

export default function ClientWorkspace({ brandId, caps }: { brandId: string; caps: ClientCaps }) {
  return (
    <QueryRoot>
      <Follow brandId={brandId} />
      {caps.manageMembers && <Invitations brandId={brandId} />}
      <Briefs brandId={brandId} caps={caps} />
      <Boards brandId={brandId} caps={caps} />
      <Reviews brandId={brandId} caps={caps} />
    </QueryRoot>
  );
}
