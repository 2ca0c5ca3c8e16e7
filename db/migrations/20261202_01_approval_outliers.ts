import { type Kysely } from 'kysely'

/**
 * A signature keeps the outlier flags the signer saw: which fit they were judged against and which points
 * lay beyond ±2σ of it. Flags are derived from a fit, so they change when another fit is recommended; the
 * record keeps them as signed. Null for signatures made before this column existed. Frozen in time: never
 * import app code here.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('approval').addColumn('outliers', 'jsonb').execute()
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('approval').dropColumn('outliers').execute()
}
