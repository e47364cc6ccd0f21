// What the publishing screen shows of a share link: plain shapes shared by share-links.server.ts and the islands.

export type LinkState = 'active' | 'expired' | 'revoked';

export interface ShareLinkView {
  id: string;
  label: string | null;
  url?: string;
  version: number | null;
  allowDownloads: boolean;
  /** The link also opens the reveal presentation. */
  allowPresentation: boolean;
  hasPassword: boolean;
  expiresAt: string | null;
  revokedAt: string | null;
  lastUsedAt: string | null;
  useCount: number;
  state: LinkState;
  createdAt: string;
}
