// The brand's handover invoice: set it, send the pay link to the client, follow its state, refund or remove it.
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useId, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { QueryRoot } from '@/components/app/QueryRoot';
import { rangeOf } from '@/lib/client/form';
import { CURRENCIES, formatAmount, invoiceInputSchema, RELEASE_LABELS, RELEASES, STATE_LABELS, type InvoiceInput, type InvoiceState } from '@/lib/handover/invoice';
import type { HandoverView } from '@/lib/handover/views';
import { useHandover, useRefundInvoice, useRemoveInvoice, useSaveInvoice, useSendInvoice } from './handover.queries';

type Notice = { kind: 'ok' | 'error'; text: string } | null;
const messageOf = (err: unknown, fallback: string) => (err instanceof Error && err.message ? err.message : fallback);

const STATE_TONE: Record<InvoiceState, string> = {
  draft: 'border-rule-strong text-ink-soft',
  sent: 'border-warn/50 text-warn',
  paid: 'border-ok/50 text-ok',
  failed: 'border-danger/50 text-danger',
  refunded: 'border-danger/50 text-danger',
};

const currencyName = (code: string) => {
  try {
    return new Intl.DisplayNames(['en'], { type: 'currency' }).of(code) ?? code;
  } catch {
    return code;
  }
};

export default function HandoverPanel(props: { brandId: string; initial: HandoverView; slug: string }) {
  // Drawn once mounted: currency names and amounts come from the browser's own Intl data, which the server's may not match.
  const [mounted, setMounted] = useState(false);
  useEffect(() => setMounted(true), []);
  return <QueryRoot>{mounted ? <Panel {...props} /> : <p className="py-8 text-ink-soft" role="status">Loading…</p>}</QueryRoot>;
}

function Panel({ brandId, initial, slug }: { brandId: string; initial: HandoverView; slug: string }) {
  const id = useId();
  const [notice, setNotice] = useState<Notice>(null);
  const { data } = useHandover(brandId, initial);
  const invoice = data.invoice;
  const settled = invoice?.state === 'paid' || invoice?.state === 'refunded';
  const { register, handleSubmit, control, formState: { errors, isDirty }, reset } = useForm<InvoiceInput>({
    resolver: zodResolver(invoiceInputSchema),
    defaultValues: invoice
      ? { amount: invoice.amount, currency: invoice.currency, dueOn: invoice.dueOn, releases: invoice.releases, clientEmail: invoice.clientEmail }
      : { amount: undefined as unknown as number, currency: 'EUR', dueOn: '', releases: 'final-files', clientEmail: '' },
  });
  const [amount, currency] = useWatch({ control, name: ['amount', 'currency'] });
  const preview = Number.isInteger(amount) && amount > 0 && CURRENCIES.includes(currency) ? formatAmount(amount, currency) : null;
  const save = useSaveInvoice(brandId, {
    onSuccess: (r, v) => {
      setNotice({ kind: 'ok', text: invoice ? 'Invoice saved.' : 'Invoice saved as a draft. The files it releases are held back from now on; send it when ready.' });
      reset(v);
      void r;
    },
    onError: (e) => setNotice({ kind: 'error', text: messageOf(e, 'The invoice could not be saved.') }),
  });
  const send = useSendInvoice(brandId, {
    onSuccess: (r) => setNotice(r.mail.sent ? { kind: 'ok', text: `Sent to ${r.invoice.clientEmail} with a pay link.` } : { kind: 'error', text: r.mail.problem ?? 'The e-mail was not sent.' }),
    onError: (e) => setNotice({ kind: 'error', text: messageOf(e, 'The invoice could not be sent.') }),
  });
  const refund = useRefundInvoice(brandId, {
    onSuccess: () => setNotice({ kind: 'ok', text: 'Refund asked for. The files are held back again once the payment service confirms it.' }),
    onError: (e) => setNotice({ kind: 'error', text: messageOf(e, 'The refund could not be asked for.') }),
  });
  const remove = useRemoveInvoice(brandId, {
    onSuccess: () => {
      setNotice({ kind: 'ok', text: 'Invoice removed. Nothing is held back any more.' });
      reset({ amount: undefined as unknown as number, currency: 'EUR', dueOn: '', releases: 'final-files', clientEmail: '' });
    },
    onError: (e) => setNotice({ kind: 'error', text: messageOf(e, 'The invoice could not be removed.') }),
  });
  const busy = save.isPending || send.isPending || refund.isPending || remove.isPending;

  return (
    <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_20rem]">
      <form onSubmit={handleSubmit((v) => save.mutate(v))} noValidate className="panel space-y-5 p-6" aria-labelledby={`${id}-title`}>
        <h2 id={`${id}-title`} className="text-xl font-bold">{invoice ? 'The handover invoice' : 'Set a handover invoice'}</h2>
        {settled && <p className="hint">A {invoice!.state} invoice is a record and cannot be changed.</p>}
        <fieldset disabled={settled || busy} className="space-y-5">
          <div className="grid gap-4 sm:grid-cols-[minmax(0,1fr)_14rem]">
            <div>
              <label htmlFor={`${id}-amount`} className="label">Amount, in the currency’s smallest unit</label>
              <input id={`${id}-amount`} type="number" step={1} inputMode="numeric" className="field font-mono" aria-invalid={!!errors.amount} aria-describedby={`${id}-amount-hint`} {...rangeOf(invoiceInputSchema.shape.amount)} {...register('amount', { valueAsNumber: true })} />
              {errors.amount ? <p className="error-text">{errors.amount.message}</p> : <p id={`${id}-amount-hint`} className="hint" aria-live="polite">{preview ? `The client pays ${preview}.` : 'Cents for euros and dollars, pence for pounds, whole yen for yen.'}</p>}
            </div>
            <div>
              <label htmlFor={`${id}-currency`} className="label">Currency (ISO 4217)</label>
              <select id={`${id}-currency`} className="field" aria-invalid={!!errors.currency} {...register('currency')}>
                {CURRENCIES.map((c) => <option key={c} value={c}>{c} · {currencyName(c)}</option>)}
              </select>
              {errors.currency && <p className="error-text">{errors.currency.message}</p>}
            </div>
          </div>
          <div className="grid gap-4 sm:grid-cols-2">
            <div>
              <label htmlFor={`${id}-due`} className="label">Due</label>
              <input id={`${id}-due`} type="date" className="field" aria-invalid={!!errors.dueOn} {...register('dueOn')} />
              {errors.dueOn && <p className="error-text">{errors.dueOn.message}</p>}
            </div>
            <div>
              <label htmlFor={`${id}-email`} className="label">Client contact’s e-mail</label>
              <input id={`${id}-email`} type="email" autoComplete="off" className="field" aria-invalid={!!errors.clientEmail} {...register('clientEmail')} />
              {errors.clientEmail && <p className="error-text">{errors.clientEmail.message}</p>}
            </div>
          </div>
          <fieldset>
            <legend className="label">What the payment releases</legend>
            <div className="mt-1 space-y-2">
              {RELEASES.map((r) => (
                <label key={r} className="flex items-start gap-3 rounded-md border border-rule px-3 py-2">
                  <input type="radio" value={r} className="mt-1" {...register('releases')} />
                  <span><span className="font-semibold">{RELEASE_LABELS[r].label}</span><br /><span className="text-sm text-ink-soft">{RELEASE_LABELS[r].says}</span></span>
                </label>
              ))}
            </div>
            {errors.releases && <p className="error-text">{errors.releases.message}</p>}
          </fieldset>
        </fieldset>
        {!settled && (
          <button type="submit" className="btn-primary" disabled={busy || (!!invoice && !isDirty)}>{save.isPending ? 'Saving…' : invoice ? (isDirty ? 'Save changes' : 'Saved') : 'Save as draft'}</button>
        )}
        <p className="hint">Until the invoice is paid, partners, viewers, reviewers and share-link visitors see these files as held back, with a note; you and your editors still reach them. The guideline pages stay open to everyone who may read them.</p>
      </form>

      <aside className="space-y-4" aria-label="Invoice state">
        {notice && <p role={notice.kind === 'error' ? 'alert' : 'status'} className={`rounded-md px-3 py-2 text-sm ${notice.kind === 'error' ? 'bg-danger-wash text-danger' : 'bg-plumb-wash text-plumb-deep'}`}>{notice.text}</p>}
        {invoice ? (
          <div className="panel space-y-3 p-5">
            <p className={`inline-block rounded-full border px-3 py-1 text-sm font-semibold ${STATE_TONE[invoice.state]}`} data-invoice-state={invoice.state}>{STATE_LABELS[invoice.state]}</p>
            {invoice.stateReason && <p className="text-sm text-ink-soft">Why: {invoice.stateReason}</p>}
            <p className="text-2xl font-bold">{invoice.amountText}</p>
            <p className="text-sm text-ink-soft">Due {invoice.dueOn} · to {invoice.clientEmail}</p>
            {!data.paymentsReady && <p className="rounded-md bg-warn-wash px-3 py-2 text-sm text-warn">Payments are not set up on this server, so no pay link can be sent. See the README.</p>}
            {(invoice.state === 'draft' || invoice.state === 'sent' || invoice.state === 'failed') && data.paymentsReady && (
              <button type="button" className="btn-primary w-full" disabled={busy || isDirty} onClick={() => send.mutate()}>{send.isPending ? 'Sending…' : invoice.state === 'draft' ? 'Send to the client' : 'Send the pay link again'}</button>
            )}
            {isDirty && invoice.state !== 'paid' && <p className="hint">Save your changes before sending.</p>}
            {invoice.state === 'paid' && (
              <button type="button" className="btn-danger w-full" disabled={busy} onClick={() => { if (window.confirm(`Refund ${invoice.amountText} to the client? The files are held back again.`)) refund.mutate(); }}>{refund.isPending ? 'Asking…' : 'Refund'}</button>
            )}
            {invoice.state !== 'paid' && (
              <button type="button" className="btn-quiet w-full" disabled={busy} onClick={() => { if (window.confirm('Remove this invoice? Everything it holds back is released.')) remove.mutate(); }}>Remove the invoice</button>
            )}
            <p className="hint">Partners see the lock on <a className="underline" href={`/b/${slug}/downloads`}>the downloads page</a>.</p>
          </div>
        ) : (
          <p className="panel p-5 text-sm text-ink-soft">No handover invoice: every approved file is available to those who may download it.</p>
        )}
        <p className="hint">Payments go through the payment provider; refunds, disputes and tax invoices follow its rules and your own bookkeeping, not Plumbline’s.</p>
      </aside>
    </div>
  );
}
