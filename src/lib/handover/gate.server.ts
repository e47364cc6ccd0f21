// The payment gate on a brand's handover: which files of a published version are held back until the handover
// invoice is paid. Asked by every request path that sends a version's file (the fast path and Astro's routes).
import { Brand, HandoverInvoice } from '@db/models';
import type { BrandRole } from '@/lib/auth/roles';
import { ApiError } from '@/lib/http/api';
import { noticeBoard } from '@/lib/live/notices.server';
import type { SiteAccess } from '@/lib/publishing/site-access.server';
import { heldBackWords, isLocked, releasesShelfFile, releasesVersionPath, waitsForPayment, type Gate, type ShelfRequest } from './invoice';

/** A file held back, and the words the visitor reads instead (text, escaped by whoever renders it). */
export interface HeldBack {
  title: string;
  message: string;
}

interface KeptGate extends Gate {
  brandName: string;
}

/** Each brand's gate (null: no invoice), kept until a change notice says its invoice or the brand changed. */
const gates = noticeBoard.memory<KeptGate | null>('handover gates', ['handover', 'brand'], {
  concerns: (notice, value) => notice.kind === 'brand' || value === null || value.invoiceId === notice.id,
});

/** The brand's gate from memory, or from the database when notices are not current. */
export function brandGate(brandId: string): Promise<KeptGate | null> {
  return gates.remember(brandId, async () => {
    const invoice = await HandoverInvoice.findOne({ where: { brandId }, attributes: ['id', 'releases', 'state', 'stateReason'] });
    if (!invoice) return null;
    const brand = await Brand.findByPk(brandId, { attributes: ['name'] });
    return { invoiceId: invoice.id, releases: invoice.releases, state: invoice.state, stateReason: invoice.stateReason, brandName: brand?.name ?? 'brand' };
  });
}

/** This process at once, before the notice comes back (after a change it made itself). */
export const forgetGate = (brandId: string) => gates.drop(brandId);

/**
 * Whether manifest path `path` of a brand's published version is held back by an unpaid handover invoice, for this
 * visitor; null when it may be sent. Answered from memory kept current by change notices (a payment or refund is
 * honoured by every process within a second). Owners and editors always reach their own files.
 */
export async function heldBack(brandId: string, path: string, who: Pick<SiteAccess, 'role' | 'viaShareLink'>): Promise<HeldBack | null> {
  if (!waitsForPayment(who.role)) return null;
  const gate = await brandGate(brandId);
  if (!isLocked(gate) || !releasesVersionPath(gate.releases, path)) return null;
  return heldBackWords(gate, gate.brandName);
}

/** The same question for a shelf file or the zip, asked by the asset routes. */
export async function shelfHeldBack(brandId: string, role: BrandRole | null, request: ShelfRequest): Promise<HeldBack | null> {
  if (!waitsForPayment(role)) return null;
  const gate = await brandGate(brandId);
  if (!isLocked(gate) || !releasesShelfFile(gate.releases, request)) return null;
  return heldBackWords(gate, gate.brandName);
}

/** 402 `payment_required` with the readable note, for the API's shelf routes. */
export async function assertShelfReleased(brandId: string, role: BrandRole | null, request: ShelfRequest): Promise<void> {
  const held = await shelfHeldBack(brandId, role, request);
  if (held) throw new ApiError(402, 'payment_required', `${held.title}. ${held.message}`);
}

/** The gate when it holds something back from this reader (for pages that mark held files), else null. */
export async function gateFor(brandId: string, role: BrandRole | null): Promise<KeptGate | null> {
  if (!waitsForPayment(role)) return null;
  const gate = await brandGate(brandId);
  return isLocked(gate) ? gate : null;
}
