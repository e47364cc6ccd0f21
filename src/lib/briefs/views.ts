// What the brief screens show: plain shapes shared by briefs.server.ts and the islands (no server code here).
import type { BriefAnswers } from '@db/models/collaboration';
import type { Questionnaire } from './questionnaire';

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

export interface PublicBrief {
  brandName: string;
  title: string;
  contactName: string;
  status: BriefStatus;
  expiresAt: string;
  submittedAt: string | null;
  savedAt: string | null;
  questionnaire: Questionnaire;
  answers: BriefAnswers;
}
