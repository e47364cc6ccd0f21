// What the review screens show: plain shapes shared by reviews.server.ts and the islands (no server code here).
import type { ReviewStatus } from '@db/models/collaboration';

export interface ReviewView {
  id: string;
  revision: number;
  message: string;
  status: ReviewStatus;
  requestedBy: string | null;
  requestedAt: string;
  decidedBy: string | null;
  decidedAt: string | null;
  decisionNote: string | null;
}

export interface CommentView {
  id: string;
  blockId: string;
  parentId: string | null;
  reviewId: string | null;
  revision: number;
  body: string;
  author: { id: string | null; name: string };
  createdAt: string;
  resolvedAt: string | null;
  resolvedBy: string | null;
  /** Whether the block is still in the current draft (false: its block was removed since). */
  blockPresent: boolean;
  /** A reader's name for the block ("Colour palette in “Colour”"), or null when the block was removed. */
  blockLabel: string | null;
}

export interface ReviewSummary {
  latest: ReviewView | null;
  openComments: number;
  draftRevision: number;
}
