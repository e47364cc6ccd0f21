import type { QueryInterface } from 'sequelize';
import type { MigrationParams } from 'umzug';

// Every change that a process may hold in memory announces itself on one channel, from the database itself, so
// cascades (a deleted brand takes its links and members with it) and every code path are covered; PostgreSQL
// delivers a NOTIFY only when its transaction commits. The payload is small: the kind of row and its id.
// src/lib/live/notice.ts reads it (CHANGE_CHANNEL, changeNoticeSchema).
const WATCHED = [
  { table: 'share_links', kind: 'link', events: 'INSERT OR UPDATE OR DELETE' },
  { table: 'brand_members', kind: 'member', events: 'INSERT OR UPDATE OR DELETE' },
  { table: 'brands', kind: 'brand', events: 'INSERT OR UPDATE OR DELETE' },
  { table: 'guideline_versions', kind: 'version', events: 'INSERT OR DELETE' },
  // better-auth's own tables: a role needs an account with a proven address, and sessions are kept in memory too;
  // signing out, revoking sessions, changing the password with "sign out elsewhere" and deleting an account all
  // delete session rows (an account's go with it).
  { table: 'user', kind: 'user', events: 'UPDATE OR DELETE' },
  { table: 'session', kind: 'session', events: 'DELETE' },
] as const;

export async function up({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  const run = (sql: string) => qi.sequelize.query(sql);
  await run(`CREATE FUNCTION plumbline_change_notice() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM pg_notify('plumbline_changes', json_build_object(
        'kind', TG_ARGV[0],
        'id', (CASE WHEN TG_OP = 'DELETE' THEN to_jsonb(OLD) ELSE to_jsonb(NEW) END) ->> 'id')::text);
      RETURN NULL;
    END $$`);
  for (const { table, kind, events } of WATCHED) {
    await run(`CREATE TRIGGER plumbline_change_notice AFTER ${events} ON "${table}" FOR EACH ROW EXECUTE FUNCTION plumbline_change_notice('${kind}')`);
  }
  // A version turning ready (or failed) changes what "latest" means; its build progress does not.
  await run(`CREATE TRIGGER plumbline_change_notice_state AFTER UPDATE OF state ON guideline_versions FOR EACH ROW
    WHEN (OLD.state IS DISTINCT FROM NEW.state) EXECUTE FUNCTION plumbline_change_notice('version')`);
}

export async function down({ context: qi }: MigrationParams<QueryInterface>): Promise<void> {
  const run = (sql: string) => qi.sequelize.query(sql);
  await run('DROP TRIGGER IF EXISTS plumbline_change_notice_state ON guideline_versions');
  for (const { table } of WATCHED) await run(`DROP TRIGGER IF EXISTS plumbline_change_notice ON "${table}"`);
  await run('DROP FUNCTION IF EXISTS plumbline_change_notice()');
}
