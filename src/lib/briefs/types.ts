// What the brief routes answer: plain view types, shared by the server and the islands.

export type BriefStatus = 'sent' | 'in_progress' | 'submitted' | 'expired' | 'withdrawn';

export interface BriefView {
  id: string;
  title: string;
  template: string;
  contactName: string;
  contactEmail: string;
  status: BriefStatus;
  sentAt: string;
  sentBy: string | null;
  expiresAt: string;
  answeredAt: string | null;
  submittedAt: string | null;
  answered: number;
  questions: number;
}
