import { Kysely, sql } from 'kysely'

/**
 * Sessions now store the SHA-256 of the cookie's token as their id (before: the token itself). Sessions made the
 * old way cannot be matched any more, so they end here: everyone signs in once again.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.deleteFrom('user_session').execute()
  await sql`comment on column user_session.id is 'hex SHA-256 of the session token (the token is only in the cookie)'`.execute(
    db,
  )
  await db.schema.createIndex('user_session_expires_idx').on('user_session').column('expires_at').execute()
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex('user_session_expires_idx').execute()
  await db.deleteFrom('user_session').execute()
}
