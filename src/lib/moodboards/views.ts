// What the mood-board screens show: plain shapes shared by the server modules and the islands (no server code here).
import type { BoardItemKind, BoardStatus, Verdict } from '@db/models/collaboration';

export interface BoardItemView {
  id: string;
  kind: BoardItemKind;
  position: number;
  caption: string;
  image?: { width: number; height: number };
  swatch?: { name: string; value: string; hex: string };
  type?: { family: string; sample: string };
  verdict: Verdict | null;
  verdictComment: string | null;
}

export interface DecisionView {
  id: string;
  outcome: 'approved' | 'changes_requested';
  comment: string;
  decidedBy: string;
  decidedAt: string;
  kept: number;
  dropped: number;
}

export interface BoardView {
  id: string;
  title: string;
  intro: string;
  status: BoardStatus;
  contactName: string | null;
  contactEmail: string | null;
  sentAt: string | null;
  expiresAt: string | null;
  createdBy: string | null;
  items: BoardItemView[];
  decisions: DecisionView[];
}

export interface PublicBoard {
  brandName: string;
  title: string;
  intro: string;
  status: BoardStatus;
  contactName: string | null;
  items: BoardItemView[];
  decisions: DecisionView[];
}

export interface DirectionStatus {
  state: 'approved' | 'waiting';
  /** The words to show, e.g. "Waiting for direction: no mood board approved yet." */
  label: string;
  board: { id: string; title: string; decidedAt: string } | null;
}
