import { sql, type Kysely } from 'kysely'

/**
 * Every printed report of a data set version is registered when it is generated: its id is printed on the
 * report and leads to the verify page, which compares the digest printed then with the stored record now.
 * Rows are append-only. Frozen in time: never import app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('lab_report')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('number', 'bigserial', (c) => c.notNull().unique())
    .addColumn('data_set_id', 'uuid', (c) => c.notNull().references('data_set.id').onDelete('cascade'))
    .addColumn('data_set_version', 'integer', (c) => c.notNull())
    .addColumn('data_set_state', 'text', (c) => c.notNull())
    .addColumn('content_digest', 'text', (c) => c.notNull().check(sql`content_digest ~ '^[0-9a-f]{64}$'`))
    .addColumn('approval_id', 'uuid', (c) => c.references('approval.id'))
    .addColumn('generated_by', 'text', (c) => c.notNull().references('app_user.id'))
    .addColumn('generated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute()
  await sql`create index lab_report_data_set on lab_report (data_set_id)`.execute(db)
  await sql`create trigger lab_report_append_only before update on lab_report
    for each row execute function lab_reject_change()`.execute(db)
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('lab_report').execute()
}
