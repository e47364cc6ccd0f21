// What every section of the client page shares: the panel frame, its notice and the words for mail and dates.
import type { ReactNode } from 'react';
import { formatDate } from '@/lib/format';

/** What the viewer's role lets them do on this page. */
export interface ClientCaps {
  manageMembers: boolean;
  edit: boolean;
  comment: boolean;
  decide: boolean;
}

export type Note = { kind: 'ok' | 'error'; text: string } | null;
export type SetNote = (note: Note) => void;
/** What the routes that send mail answer beside their result. */
export interface Mailed { mailed?: boolean; mailProblem?: string }

export function Notice({ note }: { note: Note }) {
  if (!note) return null;
  return <p role={note.kind === 'error' ? 'alert' : 'status'} className={`mt-3 rounded-md px-3 py-2 text-sm ${note.kind === 'error' ? 'bg-danger-wash text-danger' : 'bg-plumb-wash text-plumb-deep'}`}>{note.text}</p>;
}

/** The note after a route that sends mail: the success words, or that it was saved but the mail did not go. */
export const mailed = (r: Mailed, ok: string): Note => (r.mailed === false ? { kind: 'error', text: `Saved, but ${r.mailProblem ?? 'the e-mail was not sent.'}` } : { kind: 'ok', text: ok });
export const date = (iso: string | null) => (iso ? formatDate(iso) : '');
export const failed = (setNote: SetNote) => (e: Error) => setNote({ kind: 'error', text: e.message });

export function Panel({ id, title, intro, children }: { id: string; title: string; intro: string; children: ReactNode }) {
  return (
    <section id={id} className="panel mt-8 px-6 py-5" aria-labelledby={`${id}-title`}>
      <h2 id={`${id}-title`} className="text-xl font-bold">{title}</h2>
      <p className="mt-1 text-sm text-ink-soft">{intro}</p>
      {children}
    </section>
  );
}

/** Loading and failure of a section's list, in the panel's own words. */
export function ListState({ query }: { query: { isPending: boolean; isError: boolean; error: Error | null } }) {
  if (query.isPending) return <p className="mt-4 text-ink-soft" role="status">Loading…</p>;
  if (query.isError) return <p className="mt-4 text-danger" role="alert">{query.error?.message}</p>;
  return null;
}
