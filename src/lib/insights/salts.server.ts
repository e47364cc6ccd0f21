// The daily salts of the visitor keys: one random salt per UTC day, made by whichever process needs it first, kept in
// memory for that day and deleted from the database once the day is over (insightsCleanupJob).
import { randomBytes } from 'node:crypto';
import { Op } from 'sequelize';
import { InsightSalt } from '@db/models';

const known = new Map<string, string>();

/** The salt of UTC day `day` (YYYY-MM-DD), made if the day has none yet. */
export async function saltOf(day: string): Promise<string> {
  const kept = known.get(day);
  if (kept) return kept;
  await InsightSalt.sequelize!.query('INSERT INTO insight_salts (day, salt, created_at) VALUES (:day, :salt, now()) ON CONFLICT (day) DO NOTHING', {
    replacements: { day, salt: randomBytes(32).toString('hex') },
  });
  const row = await InsightSalt.findByPk(day);
  if (!row) throw new Error(`No salt for ${day}`);
  // Only today's (and at most yesterday's) are ever needed: forget the rest as days pass.
  for (const old of known.keys()) if (old < day) known.delete(old);
  known.set(day, row.salt);
  return row.salt;
}

/** Delete every salt of a day before `today`, in the database and in this process; returns how many rows went. */
export async function dropPastSalts(today: string): Promise<number> {
  for (const old of known.keys()) if (old < today) known.delete(old);
  return InsightSalt.destroy({ where: { day: { [Op.lt]: today } } });
}
