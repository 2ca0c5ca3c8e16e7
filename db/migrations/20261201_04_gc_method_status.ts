import { type Kysely, sql } from 'kysely'

/**
 * GC methods get a status: `active` or `retired` (with when and by whom). A retired method's calibrations
 * cannot be active, whatever the app does: a trigger refuses an active calibration row (new or updated)
 * whose method is retired, and refuses retiring a method that still has an active calibration (the app
 * retires them first, in the same transaction). Frozen in time: never import app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('gc_method')
    .addColumn('status', 'text', (c) =>
      c
        .notNull()
        .defaultTo('active')
        .check(sql`status in ('active', 'retired')`),
    )
    .addColumn('retired_at', 'timestamptz')
    .addColumn('retired_by', 'text', (c) => c.references('app_user.id'))
    .execute()
  await sql`
    create function lab_calibration_method_active() returns trigger language plpgsql as $$
    begin
      if new.status = 'active' and exists (select 1 from gc_method where id = new.gc_method_id and status = 'retired') then
        raise exception 'a calibration of a retired GC method cannot be active' using errcode = 'check_violation', constraint = 'calibration_method_retired';
      end if;
      return new;
    end $$`.execute(db)
  await sql`create trigger calibration_method_active before insert or update on calibration for each row execute function lab_calibration_method_active()`.execute(
    db,
  )
  await sql`
    create function lab_gc_method_retire_guard() returns trigger language plpgsql as $$
    begin
      if new.status = 'retired' and exists (select 1 from calibration where gc_method_id = new.id and status = 'active') then
        raise exception 'retire the active calibrations of a GC method before the method' using errcode = 'check_violation', constraint = 'gc_method_active_calibrations';
      end if;
      return new;
    end $$`.execute(db)
  await sql`create trigger gc_method_retire_guard before update of status on gc_method for each row execute function lab_gc_method_retire_guard()`.execute(
    db,
  )
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop trigger if exists gc_method_retire_guard on gc_method`.execute(db)
  await sql`drop function if exists lab_gc_method_retire_guard()`.execute(db)
  await sql`drop trigger if exists calibration_method_active on calibration`.execute(db)
  await sql`drop function if exists lab_calibration_method_active()`.execute(db)
  await db.schema
    .alterTable('gc_method')
    .dropColumn('retired_by')
    .dropColumn('retired_at')
    .dropColumn('status')
    .execute()
}
