// The state of an account whose e-mail address is not yet proven: where the link went, and a limited resend.
import { useState } from 'react';
import { api, ApiClientError } from '@/lib/client/api';

interface Props {
  email: string;
  /** Where the new link lands once opened (a path on this site). */
  next: string;
  /** The server keeps mail in its local catcher instead of sending it. */
  catcher: boolean;
  /** What waits behind the link, e.g. "join Larchmere Coffee Roasters". */
  purpose?: string;
}

export default function AddressCheck({ email, next, catcher, purpose }: Props) {
  const [state, setState] = useState<{ kind: 'idle' | 'sending' | 'sent' | 'error'; text?: string }>({ kind: 'idle' });

  const resend = async () => {
    setState({ kind: 'sending' });
    try {
      await api('/api/account/verification', { method: 'POST', body: { next } });
      setState({ kind: 'sent', text: `A new link is on its way to ${email}. Links sent earlier still work until they expire.` });
    } catch (err) {
      if (err instanceof ApiClientError && err.code === 'already_verified') return location.reload();
      setState({ kind: 'error', text: err instanceof Error ? err.message : 'The link could not be sent. Try again in a minute.' });
    }
  };

  return (
    <section className="panel max-w-2xl px-8 py-7" aria-labelledby="address-check-title">
      <p className="eyebrow">One step left</p>
      <h2 id="address-check-title" className="mt-2 text-2xl font-bold">Check your inbox</h2>
      <p className="mt-3 text-ink-soft">
        We sent a link to <strong className="text-ink">{email}</strong>. Open it to confirm that the address is yours
        {purpose ? `, then ${purpose}` : ''}. Until then this account cannot join a brand, open one, or read mail sent to the address.
      </p>
      {catcher && (
        <p className="mt-3 rounded-md bg-warn-wash px-3 py-2 text-sm text-warn">
          This server keeps e-mail in a local catcher instead of sending it. The person who runs it finds the message in the terminal
          where Plumbline was started, and in its mail folder.
        </p>
      )}
      <div className="mt-5 flex flex-wrap items-center gap-3">
        <button type="button" className="btn-quiet" onClick={resend} disabled={state.kind === 'sending'}>
          {state.kind === 'sending' ? 'Sending…' : 'Send a new link'}
        </button>
        <span className="hint">No message after a few minutes? Look in the spam folder first.</span>
      </div>
      {state.text && (
        <p role={state.kind === 'error' ? 'alert' : 'status'} className={`mt-4 rounded-md px-3 py-2 text-sm ${state.kind === 'error' ? 'bg-danger-wash text-danger' : 'bg-plumb-wash text-plumb-deep'}`}>
          {state.text}
        </p>
      )}
    </section>
  );
}
