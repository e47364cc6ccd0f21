// Whether guideline work has an approved direction yet: a warning shown beside the work, never a lock.
import { MoodBoard } from '@db/models/collaboration';
import type { DirectionStatus } from './views';

export type { DirectionStatus } from './views';

/** The brand's direction: the latest approved mood board, or "waiting for direction". */
export async function directionStatus(brandId: string): Promise<DirectionStatus> {
  const approved = await MoodBoard.findOne({ where: { brandId, status: 'approved' }, order: [['updatedAt', 'DESC']] });
  if (approved) {
    return { state: 'approved', label: `Direction approved: “${approved.title}”.`, board: { id: approved.id, title: approved.title, decidedAt: approved.updatedAt.toISOString() } };
  }
  const sent = await MoodBoard.count({ where: { brandId, status: 'sent' } });
  return {
    state: 'waiting',
    label: sent ? 'Waiting for direction: a mood board is with the client for a decision.' : 'Waiting for direction: no mood board has been approved yet.',
    board: null,
  };
}
