// Share grants resolved from cookies (by token), kept until a change notice about a share link or a brand: revoking
// or changing a link is honoured by every process within a second (src/lib/live).
import { noticeBoard } from '@/lib/live/notices.server';

/** A link's grant (null: no active link) and when it expires (ms since epoch), since expiry sends no notice. */
export interface KeptGrant {
  grant: App.Locals['shareGrant'];
  expiresAt: number | null;
}

export const shareGrants = noticeBoard.memory<KeptGrant>('share grants', ['link', 'brand']);
