// The handover invoice, pure: its schema (shared by the API and the form), its states, what it releases, and the
// rules that decide what a payment event does to it and which files stay held back until it is paid.
import { z } from 'zod';
import { PREVIEW_MAX_WIDTH } from '@/lib/assets/kinds';
import type { BrandRole } from '@/lib/auth/roles';

export const INVOICE_STATES = ['draft', 'sent', 'paid', 'failed', 'refunded'] as const;
export type InvoiceState = (typeof INVOICE_STATES)[number];

/** What an invoice releases on payment: the final-files zip and full-size logo files, the print files, or the whole shelf. */
export const RELEASES = ['final-files', 'print', 'shelf'] as const;
export type Releases = (typeof RELEASES)[number];

export const RELEASE_LABELS: Record<Releases, { label: string; says: string }> = {
  'final-files': { label: 'Final files', says: 'the zip of final files, the logo files at full size and the design tokens' },
  print: { label: 'Print files', says: 'the print files (CMYK TIFF, PDF and EPS) and the print-ready mock-up PDFs' },
  shelf: { label: 'Everything on the shelf', says: 'every file on the asset shelf at full size, the zip, the design tokens and the mock-ups' },
};

export const STATE_LABELS: Record<InvoiceState, string> = {
  draft: 'Not sent yet',
  sent: 'Waiting for payment',
  paid: 'Paid: files released',
  failed: 'Payment did not go through',
  refunded: 'Refunded: files held back again',
};

/**
 * ISO 4217 codes as the runtime's ICU data knows them (Intl.supportedValuesOf), less the funds, metals and testing
 * codes of the X block, which no client pays an invoice in (the X-coded currencies of real countries stay).
 */
export const CURRENCIES: readonly string[] = Intl.supportedValuesOf('currency').filter((c) => !c.startsWith('X') || ['XAF', 'XCD', 'XOF', 'XPF'].includes(c));

/** Digits after the decimal point of a currency's minor unit (ISO 4217 "minor unit" column, through ICU). */
export const minorDigits = (currency: string): number => new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;

/** An amount in minor units as people read it, e.g. 125000 EUR → "€1,250.00". */
export function formatAmount(amount: number, currency: string, locale = 'en-GB'): string {
  const digits = minorDigits(currency);
  return new Intl.NumberFormat(locale, { style: 'currency', currency, minimumFractionDigits: digits, maximumFractionDigits: digits }).format(amount / 10 ** digits);
}

const isoDay = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Give the due date as a calendar day (YYYY-MM-DD).').refine((d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && new Date(`${d}T00:00:00Z`).toISOString().startsWith(d), 'That day does not exist.');

/** The owner's invoice as the API and the form take it. The amount is in minor units (cents), never a fraction. */
export const invoiceInputSchema = z.strictObject({
  amount: z.number({ error: 'Give the amount as a whole number of the currency’s smallest unit (e.g. cents).' }).int('Give the amount in the currency’s smallest unit (e.g. cents), without a decimal point.').min(1, 'The amount must be more than nothing.').max(99_999_999, 'The amount can be at most 99,999,999 in the smallest unit (the payment provider’s own limit is of that order).'),
  currency: z.string().trim().toUpperCase().refine((c) => CURRENCIES.includes(c), 'Choose a currency from the ISO 4217 list (e.g. EUR, GBP, USD).'),
  dueOn: isoDay,
  releases: z.enum(RELEASES, { error: 'Choose what the payment releases: final files, print files or the whole shelf.' }),
  clientEmail: z.email({ error: 'Enter a valid e-mail address for the client contact.' }).max(320).transform((e) => e.toLowerCase()),
});
export type InvoiceInput = z.infer<typeof invoiceInputSchema>;

/** Roles that reach their own files whatever the invoice says: the studio side, who made them. */
const STUDIO_ROLES: readonly BrandRole[] = ['owner', 'editor'];

/** Whether a reader (a member's role, or null for a share-link visitor) waits for the invoice to be paid. */
export const waitsForPayment = (role: BrandRole | null): boolean => !role || !STUDIO_ROLES.includes(role);

/** The gate as every process keeps it: what the brand's invoice releases and whether it is paid. */
export interface Gate {
  invoiceId: string;
  releases: Releases;
  state: InvoiceState;
  stateReason: string | null;
}

/** Locked: an invoice exists and is not paid (drafts lock too, so the studio decides before anyone downloads). */
export const isLocked = (gate: Gate | null): gate is Gate => !!gate && gate.state !== 'paid';

/**
 * Whether manifest path `path` of a published version is one of the files `releases` holds back (the guideline
 * pages, their images, the book PDF and the presentation stay readable: they are the guidelines, not the hand-over).
 */
export function releasesVersionPath(releases: Releases, path: string): boolean {
  const [name, query = ''] = path.split('?');
  const tokens = name === 'tokens';
  const mockup = name.startsWith('mockups/');
  const mockupPdf = mockup && new URLSearchParams(query).get('format') === 'pdf';
  if (releases === 'final-files') return tokens;
  if (releases === 'print') return mockupPdf;
  return tokens || mockup;
}

/** A shelf file request in the terms the gate decides on. */
export interface ShelfRequest {
  /** The asset's kind (logo, photo, pattern, …), or 'bundle' for the zip. */
  kind: string;
  format?: string;
  width?: number;
  preset?: string;
  colorSpace?: string;
}


const isPrint = (r: ShelfRequest) => r.preset === 'print' || r.colorSpace === 'cmyk' || r.format === 'pdf' || r.format === 'eps' || r.format === 'tiff';
const isPreview = (r: ShelfRequest) => r.kind !== 'bundle' && (r.format === 'png' || r.format === 'webp') && !r.preset && r.colorSpace !== 'cmyk' && r.width != null && r.width <= PREVIEW_MAX_WIDTH;

/** Whether a shelf request is one of the files `releases` holds back. Previews (small PNGs, as the shelf shows) never are. */
export function releasesShelfFile(releases: Releases, request: ShelfRequest): boolean {
  if (isPreview(request)) return false;
  // The zip carries originals, screen and print files alike, so every invoice holds it back.
  if (releases === 'shelf' || request.kind === 'bundle') return true;
  if (releases === 'print') return isPrint(request);
  return request.kind === 'logo';
}

/** The words a held-back reader sees (text; escaped by whoever renders it). */
export function heldBackWords(gate: Gate, brandName: string): { title: string; message: string } {
  const what = RELEASE_LABELS[gate.releases].says;
  const why =
    gate.state === 'refunded' ? `The handover payment was refunded${gate.stateReason ? ` (${gate.stateReason})` : ''}, so ${what} are held back again.`
    : gate.state === 'failed' ? `The handover payment did not go through${gate.stateReason ? ` (${gate.stateReason})` : ''}, so ${what} are still held back.`
    : `The ${brandName} team releases ${what} once the handover invoice is paid.`;
  return { title: 'Released once the handover invoice is paid', message: `${why} The guidelines themselves stay open to read. Ask the brand’s owner if you need a file sooner.` };
}

/** A payment event as the gate reads it, whatever the provider called it. */
export interface PaymentChange {
  kind: 'paid' | 'failed' | 'refunded';
  /** The provider's own time of the event. */
  at: Date;
  reason?: string;
}

/**
 * What a payment event does to an invoice in `state` whose last applied event happened at `lastAt`: the new state,
 * or null when it changes nothing. An event older than the last one applied is stale (deliveries arrive in any
 * order), and a refund is final: a late "paid" after it never unlocks. A draft was never sent, so it takes no payment.
 */
export function applyPaymentChange(state: InvoiceState, lastAt: Date | null, change: PaymentChange): InvoiceState | null {
  if (state === 'draft' || state === 'refunded') return null;
  if (lastAt && change.at.getTime() < lastAt.getTime()) return null;
  if (change.kind === 'refunded') return state === 'paid' ? 'refunded' : null;
  if (change.kind === 'paid') return state === 'paid' ? null : 'paid';
  return state === 'failed' ? null : 'failed';
}
