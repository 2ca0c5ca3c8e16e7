import { type Kysely } from 'kysely'

/**
 * Derived results are bound to the point set they were computed on: fits and consistency results keep the
 * SHA-256 of that point set (RFC 8785 canonical JSON of the points' values and exclusion state) and how many
 * points were included, so the API can tell a result computed on other points ("stale") at once. Rows made
 * before this migration have null (their point set is unknown; the API treats them as stale).
 * A signature keeps the algorithm its digest was made with (old signatures keep verifying with the old one),
 * the point-set digest it signed, and who changed what in the version it signs.
 * Frozen in time: never import app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  for (const table of ['fit', 'consistency_result']) {
    await db.schema
      .alterTable(table)
      .addColumn('point_set_digest', 'text')
      .addColumn('point_count', 'integer')
      .execute()
  }
  await db.schema
    .alterTable('approval')
    .addColumn('digest_algorithm', 'text', (c) => c.notNull().defaultTo('ebullio-signed-content/1'))
    .addColumn('point_set_digest', 'text')
    .addColumn('changes', 'jsonb')
    .execute()
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('approval')
    .dropColumn('digest_algorithm')
    .dropColumn('point_set_digest')
    .dropColumn('changes')
    .execute()
  for (const table of ['fit', 'consistency_result']) {
    await db.schema.alterTable(table).dropColumn('point_set_digest').dropColumn('point_count').execute()
  }
}
