import { Kysely, sql } from 'kysely'

/** Accounts, roles, sessions, invites, password resets and the mail outbox. */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('app_user')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('email', 'text', (c) => c.notNull().unique())
    .addColumn('display_name', 'text', (c) => c.notNull())
    .addColumn('password_hash', 'text')
    .addColumn('active', 'boolean', (c) => c.notNull().defaultTo(true))
    .addColumn('notify_mail', 'boolean', (c) => c.notNull().defaultTo(true))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute()

  await db.schema
    .createTable('user_role')
    .addColumn('user_id', 'text', (c) => c.notNull().references('app_user.id').onDelete('cascade'))
    .addColumn('role', 'text', (c) =>
      c.notNull().check(sql`role in ('analyst','lead_chemist','reviewer','engineer','admin')`),
    )
    .addPrimaryKeyConstraint('user_role_pk', ['user_id', 'role'])
    .execute()

  await db.schema
    .createTable('user_session')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('user_id', 'text', (c) => c.notNull().references('app_user.id').onDelete('cascade'))
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute()
  await db.schema.createIndex('user_session_user_idx').on('user_session').column('user_id').execute()

  for (const table of ['invite', 'password_reset']) {
    await db.schema
      .createTable(table)
      .addColumn('token_hash', 'text', (c) => c.primaryKey())
      .addColumn('user_id', 'text', (c) => c.notNull().references('app_user.id').onDelete('cascade'))
      .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
      .addColumn('used_at', 'timestamptz')
      .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
      .execute()
  }

  await db.schema
    .createTable('mail_outbox')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('to_address', 'text', (c) => c.notNull())
    .addColumn('subject', 'text', (c) => c.notNull())
    .addColumn('body_text', 'text', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('attempts', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('next_attempt_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('last_error', 'text')
    .addColumn('sent_at', 'timestamptz')
    .execute()
  await db.schema
    .createIndex('mail_outbox_pending_idx')
    .on('mail_outbox')
    .column('next_attempt_at')
    .where(sql.ref('sent_at'), 'is', null)
    .execute()

  await db.schema
    .createTable('captured_mail')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('received_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('envelope_from', 'text', (c) => c.notNull())
    .addColumn('envelope_to', 'text', (c) => c.notNull())
    .addColumn('subject', 'text', (c) => c.notNull())
    .addColumn('body_text', 'text', (c) => c.notNull())
    .execute()
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of [
    'captured_mail',
    'mail_outbox',
    'password_reset',
    'invite',
    'user_session',
    'user_role',
    'app_user',
  ]) {
    await db.schema.dropTable(t).ifExists().execute()
  }
}
