// A fixed-window counter in PostgreSQL, so a limit holds across processes (share-link passwords).
import { QueryTypes } from 'sequelize';
import { sequelize } from '@/lib/db.server';

/** Count one attempt under `key`; false once `max` attempts fell in the current window. */
export async function consumeAttempt(key: string, max: number, windowSeconds: number): Promise<boolean> {
  const [row] = await sequelize.query<{ count: number }>(
    `INSERT INTO rate_counters (key, count, window_start) VALUES (:key, 1, now())
     ON CONFLICT (key) DO UPDATE SET
       count = CASE WHEN rate_counters.window_start < now() - make_interval(secs => :window) THEN 1 ELSE rate_counters.count + 1 END,
       window_start = CASE WHEN rate_counters.window_start < now() - make_interval(secs => :window) THEN now() ELSE rate_counters.window_start END
     RETURNING count`,
    { replacements: { key, window: windowSeconds }, type: QueryTypes.SELECT },
  );
  return row.count <= max;
}
