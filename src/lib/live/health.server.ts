// What GET /api/health answers: this process, its store, and whether the database answers.
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
import { log } from '@/lib/log.server';
import { storageKind } from '@/lib/storage/index.server';
import { noticesCurrent } from './notices.server';
import { processIdentity } from './process.server';

/** How long the database may take to answer `SELECT 1` before the process counts it unreachable. */
const DATABASE_WAIT_MS = 2000;

export interface Health {
  status: 'ok';
  process: { id: string; role: 'web' | 'worker' };
  storage: 'local' | 's3';
  /** Whether change notices reach this process now (memories answer only then). */
  notices: 'current' | 'reconnecting';
}

/** The health answer, or a 503 `database_unreachable` when the database does not answer in time. */
export async function health(): Promise<Health> {
  let timer: NodeJS.Timeout | undefined;
  const late = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`no answer within ${DATABASE_WAIT_MS} ms`)), DATABASE_WAIT_MS);
  });
  try {
    await Promise.race([sequelize.query('SELECT 1'), late]);
  } catch (err) {
    // The reason (addresses, ports) goes to the log only: this route is public.
    log.warn({ err }, 'health: the database did not answer');
    throw new ApiError(503, 'database_unreachable', 'The database cannot be reached from this process; it answers again as soon as the database does.');
  } finally {
    clearTimeout(timer);
  }
  return { status: 'ok', process: processIdentity, storage: storageKind, notices: noticesCurrent() ? 'current' : 'reconnecting' };
}
