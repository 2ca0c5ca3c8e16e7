import { type Kysely, sql } from 'kysely'

/**
 * GC check standards: a mixture of known composition injected with a run, read with the run's calibration.
 * One row per check standard of a committed run file; the deviation x1 measured − x1 known is judged on a
 * control chart per GC method. A pure-component sample's injections show one peak only: the absent
 * component's area is 0 (point_injection areas ≥ 0, not both 0).
 * Frozen in time: never import app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('check_standard_result')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('gc_method_id', 'uuid', (c) => c.notNull().references('gc_method.id'))
    .addColumn('calibration_id', 'uuid', (c) => c.notNull().references('calibration.id'))
    .addColumn('upload_id', 'uuid', (c) => c.notNull().references('upload.id'))
    .addColumn('data_set_id', 'uuid', (c) => c.references('data_set.id').onDelete('set null'))
    .addColumn('label', 'text', (c) => c.notNull().check(sql`length(label) between 1 and 200`))
    .addColumn('known_x1', 'double precision', (c) => c.notNull().check(sql`known_x1 > 0 and known_x1 < 1`))
    .addColumn('measured_x1', 'double precision', (c) => c.notNull())
    .addColumn('x1_uncertainty', 'double precision', (c) => c.notNull().check(sql`x1_uncertainty >= 0`))
    .addColumn('replicate_rsd', 'double precision')
    .addColumn('injections', 'jsonb', (c) => c.notNull())
    .addColumn('row_refs', sql`integer[]`, (c) => c.notNull())
    .addColumn('measured_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('recorded_by', 'text', (c) => c.references('app_user.id'))
    .execute()
  await sql`create index check_standard_series on check_standard_result (gc_method_id, measured_at)`.execute(db)
  await sql`alter table point_injection
    drop constraint point_injection_area1_check,
    drop constraint point_injection_area2_check,
    add constraint point_injection_areas check (area1 >= 0 and area2 >= 0 and area1 + area2 > 0)`.execute(db)
}

export async function down(db: Kysely<any>): Promise<void> {
  // Pure-sample injections already stored keep their zero area (the old rules hold for new rows only).
  await sql`alter table point_injection drop constraint point_injection_areas,
    add constraint point_injection_area1_check check (area1 > 0) not valid,
    add constraint point_injection_area2_check check (area2 > 0) not valid`.execute(db)
  await db.schema.dropTable('check_standard_result').execute()
}
