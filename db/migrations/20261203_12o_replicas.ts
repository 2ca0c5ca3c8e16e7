import { Kysely, sql } from 'kysely'

/**
 * Several API replicas on one database: outbox messages are claimed by one worker at a time (a lease), a message
 * that cannot be delivered stops after bounded tries (failed_at), and rate-limit counters live in the database.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('mail_outbox')
    .addColumn('claimed_until', 'timestamptz')
    .addColumn('failed_at', 'timestamptz')
    .execute()
  await db.schema.dropIndex('mail_outbox_pending_idx').execute()
  await db.schema
    .createIndex('mail_outbox_pending_idx')
    .on('mail_outbox')
    .columns(['next_attempt_at', 'id'])
    .where(sql<boolean>`sent_at is null and failed_at is null`)
    .execute()

  await db.schema
    .createTable('rate_limit_hit')
    .addColumn('key', 'text', (c) => c.primaryKey())
    .addColumn('hits', 'integer', (c) => c.notNull())
    .addColumn('reset_at', 'timestamptz', (c) => c.notNull())
    .execute()
  await db.schema.createIndex('rate_limit_hit_reset_idx').on('rate_limit_hit').column('reset_at').execute()
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('rate_limit_hit').execute()
  await db.schema.dropIndex('mail_outbox_pending_idx').execute()
  await db.schema.alterTable('mail_outbox').dropColumn('claimed_until').dropColumn('failed_at').execute()
  await db.schema
    .createIndex('mail_outbox_pending_idx')
    .on('mail_outbox')
    .column('next_attempt_at')
    .where(sql.ref('sent_at'), 'is', null)
    .execute()
}
