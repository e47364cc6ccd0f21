// The handover invoice's life: the owner sets and sends it, the client pays through the provider's checkout, and the
// provider's signed events move it to paid, failed or refunded. Every change is audited in its own transaction.
import type Stripe from 'stripe';
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import { Brand, HandoverInvoice, PaymentEvent } from '@db/models';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
import { hashToken, longDate, looksLikeToken, newToken } from '@/lib/invitations/tokens';
import { log } from '@/lib/log.server';
import { sendTemplate, siteLink, type MailOutcome } from '@/lib/mail/mail.server';
import { forgetGate } from './gate.server';
import { applyPaymentChange, formatAmount, RELEASE_LABELS, STATE_LABELS, type InvoiceInput, type InvoiceState } from './invoice';
import { invoiceEvent, payments, paymentsConfigured } from './payments.server';
import type { HandoverView, InvoiceView } from './views';

export type { HandoverView, InvoiceView } from './views';

export function invoiceView(i: HandoverInvoice): InvoiceView {
  return {
    id: i.id,
    amount: i.amount,
    currency: i.currency,
    amountText: formatAmount(i.amount, i.currency),
    dueOn: i.dueOn,
    releases: i.releases,
    clientEmail: i.clientEmail,
    state: i.state,
    stateReason: i.stateReason,
    sentAt: i.sentAt?.toISOString() ?? null,
    paidAt: i.paidAt?.toISOString() ?? null,
    updatedAt: i.updatedAt.toISOString(),
  };
}

const auditOf = (actorId: string | null, brand: Brand, action: string, invoiceId: string, details: Record<string, unknown> = {}) => ({
  actorId,
  action,
  targetType: 'handoverInvoice',
  targetId: invoiceId,
  brandId: brand.id,
  studioId: brand.studioId,
  details,
});

export async function handoverView(brand: Brand): Promise<HandoverView> {
  const invoice = await HandoverInvoice.findOne({ where: { brandId: brand.id } });
  return { invoice: invoice ? invoiceView(invoice) : null, paymentsReady: paymentsConfigured() };
}

/** 409 once the money has moved: a paid or refunded invoice is a record, not a draft. */
function refuseSettled(invoice: HandoverInvoice): void {
  if (invoice.state === 'paid' || invoice.state === 'refunded') {
    throw new ApiError(409, 'invoice_settled', invoice.state === 'paid' ? 'This invoice is paid; it can no longer be changed. Refund it first if it was wrong.' : 'This invoice was refunded; remove it and set a new one.');
  }
}

/** Set the brand's invoice (a new one starts as a draft; a sent one keeps its state, and its pay link asks the new amount). */
export async function saveInvoice(caller: Caller, brand: Brand, input: InvoiceInput): Promise<InvoiceView> {
  const saved = await sequelize.transaction(async (t) => {
    const existing = await HandoverInvoice.findOne({ where: { brandId: brand.id }, transaction: t, lock: t.LOCK.UPDATE });
    if (existing) {
      refuseSettled(existing);
      await existing.update({ ...input }, { transaction: t });
      await audit(auditOf(caller.id, brand, 'handover.invoice.update', existing.id, { ...input }), t);
      return existing;
    }
    const made = await HandoverInvoice.create({ brandId: brand.id, ...input, createdById: caller.id }, { transaction: t });
    await audit(auditOf(caller.id, brand, 'handover.invoice.create', made.id, { ...input }), t);
    return made;
  });
  forgetGate(brand.id);
  return invoiceView(saved);
}

/** Remove the invoice (the files it held back are released to everyone who may download). Never a paid one. */
export async function deleteInvoice(caller: Caller, brand: Brand): Promise<void> {
  await sequelize.transaction(async (t) => {
    const invoice = await HandoverInvoice.findOne({ where: { brandId: brand.id }, transaction: t, lock: t.LOCK.UPDATE });
    if (!invoice) throw new ApiError(404, 'not_found', 'This brand has no handover invoice.');
    if (invoice.state === 'paid') throw new ApiError(409, 'invoice_settled', 'A paid invoice stays as the record of the handover; refund it first if it was wrong.');
    await invoice.destroy({ transaction: t });
    await audit(auditOf(caller.id, brand, 'handover.invoice.delete', invoice.id, { amount: invoice.amount, currency: invoice.currency, state: invoice.state }), t);
  });
  forgetGate(brand.id);
}

async function invoiceOf(brand: Brand): Promise<HandoverInvoice> {
  const invoice = await HandoverInvoice.findOne({ where: { brandId: brand.id } });
  if (!invoice) throw new ApiError(404, 'not_found', 'This brand has no handover invoice yet.');
  return invoice;
}

/** E-mail the client the pay link (a new link each time; the earlier one stops working). */
export async function sendInvoice(caller: Caller, brand: Brand): Promise<{ invoice: InvoiceView; mail: MailOutcome }> {
  payments();
  const invoice = await invoiceOf(brand);
  refuseSettled(invoice);
  const { token, hash } = newToken();
  await sequelize.transaction(async (t) => {
    await invoice.update({ state: invoice.state === 'draft' ? 'sent' : invoice.state, payTokenHash: hash, sentAt: new Date() }, { transaction: t });
    await audit(auditOf(caller.id, brand, 'handover.invoice.send', invoice.id, { clientEmail: invoice.clientEmail, amount: invoice.amount, currency: invoice.currency }), t);
  });
  forgetGate(brand.id);
  const mail = await sendTemplate(
    invoice.clientEmail,
    'handover-invoice',
    {
      brandName: brand.name,
      senderName: caller.name || caller.email,
      amount: formatAmount(invoice.amount, invoice.currency),
      dueOn: longDate(new Date(`${invoice.dueOn}T00:00:00Z`)),
      releases: RELEASE_LABELS[invoice.releases].says,
      link: siteLink(`/pay/${token}`),
    },
    brand.id,
  );
  return { invoice: invoiceView(invoice), mail };
}

/** Ask the provider to refund the paid invoice; the refund's own event locks the files again. */
export async function refundInvoice(caller: Caller, brand: Brand): Promise<{ invoice: InvoiceView; refundId: string }> {
  const invoice = await invoiceOf(brand);
  if (invoice.state !== 'paid' || !invoice.paymentIntentId) throw new ApiError(409, 'not_paid', 'Only a paid invoice can be refunded.');
  const refund = await payments().refunds.create({ payment_intent: invoice.paymentIntentId, metadata: { invoice: invoice.id } }, { idempotencyKey: `refund-${invoice.id}-${invoice.paymentIntentId}` });
  await audit(auditOf(caller.id, brand, 'handover.refund.request', invoice.id, { refundId: refund.id, amount: refund.amount }));
  return { invoice: invoiceView(invoice), refundId: refund.id };
}

// ---------------------------------------------------------------- the client's side, by the pay link

/** What the pay page shows, or null for a link that names no invoice (an old link after a new send, too). */
export async function invoiceForPayLink(token: string): Promise<{ invoice: HandoverInvoice; brand: Brand } | null> {
  if (!looksLikeToken(token)) return null;
  const invoice = await HandoverInvoice.findOne({ where: { payTokenHash: hashToken(token) } });
  if (!invoice) return null;
  const brand = await Brand.findByPk(invoice.brandId);
  return brand ? { invoice, brand } : null;
}

/**
 * A checkout for the invoice behind a pay link: the amount, currency and description come from our database only
 * (nothing the browser sends is read), the invoice id travels as metadata on the session and on the payment.
 */
export async function checkoutFor(token: string): Promise<string> {
  const found = await invoiceForPayLink(token);
  if (!found) throw new ApiError(404, 'not_found', 'This pay link does not work any more. Ask the studio for the latest e-mail.');
  const { invoice, brand } = found;
  if (invoice.state === 'paid') throw new ApiError(409, 'already_paid', 'This invoice is paid already. Thank you.');
  if (invoice.state === 'refunded' || invoice.state === 'draft') throw new ApiError(409, 'not_payable', 'This invoice cannot be paid now. Ask the studio.');
  const back = siteLink(`/pay/${token}`);
  const session = await payments().checkout.sessions.create({
    mode: 'payment',
    customer_email: invoice.clientEmail,
    line_items: [{ quantity: 1, price_data: { currency: invoice.currency.toLowerCase(), unit_amount: invoice.amount, product_data: { name: `${brand.name}: handover of the final files` } } }],
    metadata: { invoice: invoice.id, brand: brand.id },
    payment_intent_data: { metadata: { invoice: invoice.id, brand: brand.id } },
    success_url: `${back}?checkout=done`,
    cancel_url: back,
  });
  await invoice.update({ checkoutSessionId: session.id });
  if (!session.url) throw new ApiError(502, 'checkout_unavailable', 'The payment service did not give a checkout page. Try again in a moment.');
  return session.url;
}

// ---------------------------------------------------------------- the provider's events

export type EventOutcome = 'applied' | 'duplicate' | 'stale' | 'ignored' | 'unknown-invoice' | 'amount-mismatch';

/** The designer who set the invoice, else the brand's owners: who gets the receipt on the studio side. */
async function studioRecipients(invoice: HandoverInvoice): Promise<string[]> {
  // better-auth owns "user": a plain query, never a model.
  const sql = invoice.createdById
    ? `SELECT u.email FROM "user" u WHERE u.id = :creator`
    : `SELECT u.email FROM brand_members m JOIN "user" u ON u.id = m.user_id WHERE m.brand_id = :brandId AND m.role = 'owner'`;
  const rows = await sequelize.query<{ email: string }>(sql, { replacements: { creator: invoice.createdById, brandId: invoice.brandId }, type: QueryTypes.SELECT });
  return rows.map((r) => r.email);
}

/**
 * Take one verified event: kept by id first (a second delivery of the same event changes nothing), then applied to
 * its invoice under a row lock when it is newer than the last applied one (applyPaymentChange). A paid event whose
 * amount or currency differs from the invoice's never unlocks.
 */
export async function takePaymentEvent(event: Stripe.Event): Promise<EventOutcome> {
  const meaning = invoiceEvent(event);
  const result = await sequelize.transaction(async (t) => {
    let invoice: HandoverInvoice | null = null;
    if (meaning?.invoiceId && /^[0-9a-f-]{36}$/i.test(meaning.invoiceId)) invoice = await HandoverInvoice.findByPk(meaning.invoiceId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!invoice && meaning?.paymentIntentId) invoice = await HandoverInvoice.findOne({ where: { paymentIntentId: meaning.paymentIntentId }, transaction: t, lock: t.LOCK.UPDATE });
    let outcome: EventOutcome = !meaning ? 'ignored' : !invoice ? 'unknown-invoice' : 'stale';
    let next: ReturnType<typeof applyPaymentChange> = null;
    if (meaning && invoice) {
      next = applyPaymentChange(invoice.state, invoice.paymentEventAt, meaning.change);
      if (next === 'paid' && meaning.paid && (meaning.paid.amount !== invoice.amount || meaning.paid.currency !== invoice.currency)) {
        outcome = 'amount-mismatch';
        next = null;
      } else if (next) outcome = 'applied';
    }
    try {
      await PaymentEvent.create({ id: event.id, type: event.type, invoiceId: invoice?.id ?? null, outcome, occurredAt: new Date(event.created * 1000), receivedAt: new Date() }, { transaction: t });
    } catch (err) {
      if (err instanceof UniqueConstraintError) return { outcome: 'duplicate' as const, invoice: null, next: null };
      throw err;
    }
    if (!invoice || !meaning) return { outcome, invoice: null, next: null };
    if (next) {
      await invoice.update(
        {
          state: next,
          stateReason: next === 'paid' ? null : meaning.change.reason ?? null,
          paymentEventAt: meaning.change.at,
          ...(next === 'paid' ? { paidAt: meaning.change.at, paymentIntentId: meaning.paymentIntentId ?? invoice.paymentIntentId } : {}),
        },
        { transaction: t },
      );
    }
    const brand = await Brand.findByPk(invoice.brandId, { transaction: t });
    if (brand) await audit(auditOf(null, brand, `handover.payment.${outcome === 'applied' ? next : outcome}`, invoice.id, { event: event.id, type: event.type, reason: meaning.change.reason ?? null }), t);
    return { outcome, invoice, next, brand };
  });
  if (result.outcome === 'duplicate') return 'duplicate';
  if (result.invoice) forgetGate(result.invoice.brandId);
  if (result.outcome === 'applied' && result.invoice && 'brand' in result && result.brand) await mailOutcome(result.invoice, result.brand, result.next!);
  log.info({ event: event.id, type: event.type, outcome: result.outcome }, 'payments: event taken');
  return result.outcome;
}

/** The receipt (paid) or the notice that files are held back again (refunded, failed), to the client and the studio. */
async function mailOutcome(invoice: HandoverInvoice, brand: Brand, state: InvoiceState): Promise<void> {
  const data = {
    brandName: brand.name,
    amount: formatAmount(invoice.amount, invoice.currency),
    releases: RELEASE_LABELS[invoice.releases].says,
    stateLabel: STATE_LABELS[state],
    reason: invoice.stateReason ?? '',
    paidOn: invoice.paidAt ? longDate(invoice.paidAt) : '',
    siteLink: siteLink(`/b/${brand.slug}/downloads`),
  };
  const template = state === 'paid' ? 'handover-receipt' : 'handover-held-back';
  const recipients = [invoice.clientEmail, ...(await studioRecipients(invoice))];
  for (const to of new Set(recipients)) await sendTemplate(to, template, { ...data, forStudio: to !== invoice.clientEmail }, brand.id);
}
