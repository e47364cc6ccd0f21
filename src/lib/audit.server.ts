// The audit trail: who did what to which thing, and when.
import type { Transaction } from 'sequelize';
import { AuditEvent } from '@db/models';

export interface AuditEntry {
  actorId: string | null;
  action: string;
  targetType: string;
  targetId?: string | null;
  brandId?: string | null;
  studioId?: string | null;
  details?: Record<string, unknown>;
}

/** Record one audit row, inside the caller's transaction when given. */
export async function audit(entry: AuditEntry, transaction?: Transaction): Promise<void> {
  await AuditEvent.create(
    {
      actorId: entry.actorId,
      action: entry.action,
      targetType: entry.targetType,
      targetId: entry.targetId ?? null,
      brandId: entry.brandId ?? null,
      studioId: entry.studioId ?? null,
      details: entry.details ?? {},
    },
    { transaction },
  );
}
