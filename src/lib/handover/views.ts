// What the handover screen shows of an invoice (plain types: the island imports them).
import type { InvoiceState, Releases } from './invoice';

export interface InvoiceView {
  id: string;
  amount: number;
  currency: string;
  /** The amount as people read it, e.g. "€1,250.00". */
  amountText: string;
  dueOn: string;
  releases: Releases;
  clientEmail: string;
  state: InvoiceState;
  stateReason: string | null;
  sentAt: string | null;
  paidAt: string | null;
  updatedAt: string;
}

export interface HandoverView {
  invoice: InvoiceView | null;
  /** False when the server has no payment keys: the screen says so and offers no sending. */
  paymentsReady: boolean;
}
