import { type Kysely, sql } from 'kysely'

/**
 * Data that did not come through the GC path, and check measurements.
 * - data_set.origin: 'gc' (measured here, compositions by GC), 'other-method' (measured here another way,
 *   described in origin_method), 'literature' (with a citation). A literature set counts as the lab's own
 *   measurement only when a lead chemist marks it so (counts_as_own_*).
 * - data_set.layout: 'txy' (isobaric T–x–y), 'tx' (isobaric T–x, no vapour analysed), 'pxy' (isothermal P–x–y).
 *   A T–x point has no y1: y1 and its uncertainty are both null or both set.
 * - upload.kind 'points' (a directly entered point sheet).
 * - pure_measurement gains thermometer, still, date, and the run upload / data set it came from.
 * - check_measurement: thermometer and barometer checks (a reference liquid boiled at the day's pressure).
 * Frozen in time: never import app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table data_set
    add column origin text not null default 'gc' check (origin in ('gc', 'other-method', 'literature')),
    add column origin_method text,
    add column citation jsonb,
    add column counts_as_own boolean not null default false,
    add column counts_as_own_by text references app_user(id),
    add column counts_as_own_reason text,
    add column layout text not null default 'txy' check (layout in ('txy', 'tx', 'pxy')),
    add constraint data_set_literature_citation check (origin <> 'literature' or citation is not null),
    add constraint data_set_counts_as_own check (not counts_as_own or counts_as_own_by is not null)`.execute(db)
  await sql`alter table point
    alter column y1 drop not null,
    alter column y1_uncertainty drop not null,
    add constraint point_y1_pair check ((y1 is null) = (y1_uncertainty is null))`.execute(db)
  await sql`alter table upload drop constraint upload_kind_check`.execute(db)
  await sql`alter table upload add constraint upload_kind_check check (kind in ('calibration', 'run', 'points'))`.execute(
    db,
  )
  await sql`alter table pure_measurement
    add column thermometer text,
    add column still text,
    add column measured_on date,
    add column upload_id uuid references upload(id) on delete set null,
    add column data_set_id uuid references data_set(id) on delete set null,
    add column row_ref integer`.execute(db)
  await db.schema
    .createTable('check_measurement')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('thermometer', 'barometer')`))
    .addColumn('instrument', 'text', (c) => c.notNull().check(sql`length(trim(instrument)) > 0`))
    .addColumn('component_id', 'uuid', (c) => c.notNull().references('component.id'))
    .addColumn('temperature_k', 'double precision', (c) => c.notNull().check(sql`temperature_k > 0`))
    .addColumn('pressure_pa', 'double precision', (c) => c.notNull().check(sql`pressure_pa > 0`))
    .addColumn('measured_at', 'timestamptz', (c) => c.notNull())
    .addColumn('note', 'text')
    .addColumn('measured_by', 'text', (c) => c.references('app_user.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute()
  await sql`create index check_measurement_series on check_measurement (kind, instrument, measured_at)`.execute(db)
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('check_measurement').execute()
  await sql`alter table pure_measurement drop column thermometer, drop column still, drop column measured_on,
    drop column upload_id, drop column data_set_id, drop column row_ref`.execute(db)
  await sql`alter table upload drop constraint upload_kind_check`.execute(db)
  await sql`alter table upload add constraint upload_kind_check check (kind in ('calibration', 'run'))`.execute(db)
  await sql`alter table point drop constraint point_y1_pair`.execute(db)
  await sql`alter table data_set drop constraint data_set_literature_citation, drop constraint data_set_counts_as_own,
    drop column origin, drop column origin_method, drop column citation, drop column counts_as_own,
    drop column counts_as_own_by, drop column counts_as_own_reason, drop column layout`.execute(db)
}
