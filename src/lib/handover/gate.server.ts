// The payment gate on a brand's handover: which files of a published version are held back until the handover
// invoice is paid. Asked by every request path that sends a version's file (the fast path and Astro's routes).
import type { SiteAccess } from '@/lib/publishing/site-access.server';

/** A file held back, and the words the visitor reads instead (text, escaped by whoever renders it). */
export interface HeldBack {
  title: string;
  message: string;
}

/**
 * Whether manifest path `path` of a brand's published version is held back by an unpaid handover invoice, for this
 * visitor; null when it may be sent. Answered from memory kept current by change notices (a payment or refund is
 * honoured by every process within a second). (Stub until the handover gate lands: nothing is held back.)
 */
export async function heldBack(brandId: string, path: string, who: Pick<SiteAccess, 'role' | 'viaShareLink'>): Promise<HeldBack | null> {
  void brandId;
  void path;
  void who;
  return null;
}
