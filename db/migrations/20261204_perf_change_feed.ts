import { type Kysely, sql } from 'kysely'

/**
 * Change notifications for the API's in-process caches (sessions, the access check of published curves), so every
 * replica on this database drops a cached answer as soon as what it was read from changes. The triggers, not the
 * application code, send them, so no code path (nor a manual fix in psql) can forget one. One channel,
 * `ebullio_change`; the payload is `session:<session id>`, `user:<user id>`, `curve` or `all`. A notification is
 * delivered when its transaction commits, and never when it rolls back.
 * - user_session: a session updated (renewed) or deleted (signed out, revoked, expired).
 * - app_user, user_role: anything about a user (deactivated, renamed, password changed, roles added or removed).
 * - data_set, fit, binary_system, component, vapor_pressure_set: what decides who may see a curve and what it is
 *   computed from (a version withdrawn or superseded, a recommended fit changed, a component renamed, a new
 *   preferred vapour-pressure set).
 * - TRUNCATE of any of them: everything.
 * Frozen in time: never import app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create function ebullio_notify_session() returns trigger language plpgsql as $$
    begin
      perform pg_notify('ebullio_change', 'session:' || old.id);
      return null;
    end $$`.execute(db)
  await sql`create function ebullio_notify_app_user() returns trigger language plpgsql as $$
    begin
      perform pg_notify('ebullio_change', 'user:' || coalesce(new.id, old.id));
      return null;
    end $$`.execute(db)
  await sql`create function ebullio_notify_user_role() returns trigger language plpgsql as $$
    begin
      if tg_op <> 'INSERT' then
        perform pg_notify('ebullio_change', 'user:' || old.user_id);
      end if;
      if tg_op <> 'DELETE' then
        perform pg_notify('ebullio_change', 'user:' || new.user_id);
      end if;
      return null;
    end $$`.execute(db)
  await sql`create function ebullio_notify_curve() returns trigger language plpgsql as $$
    begin
      perform pg_notify('ebullio_change', 'curve');
      return null;
    end $$`.execute(db)
  await sql`create function ebullio_notify_all() returns trigger language plpgsql as $$
    begin
      perform pg_notify('ebullio_change', 'all');
      return null;
    end $$`.execute(db)

  // A new session is in no cache yet: only updates and deletions matter.
  await sql`create trigger user_session_change after update or delete on user_session
    for each row execute function ebullio_notify_session()`.execute(db)
  await sql`create trigger app_user_change after update or delete on app_user
    for each row execute function ebullio_notify_app_user()`.execute(db)
  await sql`create trigger user_role_change after insert or update or delete on user_role
    for each row execute function ebullio_notify_user_role()`.execute(db)
  // data_set rows change often while a draft is edited: only the columns the access check and the curve read.
  await sql`create trigger data_set_change after update on data_set for each row
    when (old.state is distinct from new.state or old.recommended_fit_id is distinct from new.recommended_fit_id
      or old.system_id is distinct from new.system_id)
    execute function ebullio_notify_curve()`.execute(db)
  await sql`create trigger data_set_delete after delete on data_set
    for each row execute function ebullio_notify_curve()`.execute(db)
  for (const t of ['fit', 'binary_system', 'component', 'vapor_pressure_set'])
    await sql`create trigger ${sql.raw(`${t}_change`)} after insert or update or delete on ${sql.table(t)}
      for each row execute function ebullio_notify_curve()`.execute(db)
  for (const t of [
    'user_session',
    'app_user',
    'user_role',
    'data_set',
    'fit',
    'binary_system',
    'component',
    'vapor_pressure_set',
  ])
    await sql`create trigger ${sql.raw(`${t}_truncate`)} after truncate on ${sql.table(t)}
      for each statement execute function ebullio_notify_all()`.execute(db)
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of [
    'user_session',
    'app_user',
    'user_role',
    'data_set',
    'fit',
    'binary_system',
    'component',
    'vapor_pressure_set',
  ])
    await sql`drop trigger ${sql.raw(`${t}_truncate`)} on ${sql.table(t)}`.execute(db)
  for (const t of ['user_session', 'app_user', 'user_role', 'fit', 'binary_system', 'component', 'vapor_pressure_set'])
    await sql`drop trigger ${sql.raw(`${t}_change`)} on ${sql.table(t)}`.execute(db)
  await sql`drop trigger data_set_change on data_set`.execute(db)
  await sql`drop trigger data_set_delete on data_set`.execute(db)
  await sql`drop function ebullio_notify_session(), ebullio_notify_app_user(), ebullio_notify_user_role(),
    ebullio_notify_curve(), ebullio_notify_all()`.execute(db)
}
