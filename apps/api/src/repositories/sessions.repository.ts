import type { Role } from '@ebullio/schemas'
import { sql } from 'kysely'
import type { Db } from '../db/index.js'

/** Sessions: only the SHA-256 of the cookie's token is stored, as the row's id. */
export async function insertSession(db: Db, s: { id: string; userId: string; expiresAt: Date }): Promise<void> {
  await db.insertInto('user_session').values({ id: s.id, user_id: s.userId, expires_at: s.expiresAt }).execute()
}

/** A session with its user (active flag, mail preference and roles, sorted), or undefined when there is no such session. */
export async function findSessionWithUser(db: Db, id: string) {
  return db
    .selectFrom('user_session as s')
    .innerJoin('app_user as u', 'u.id', 's.user_id')
    .select([
      's.expires_at',
      's.created_at',
      'u.id',
      'u.email',
      'u.display_name',
      'u.active',
      'u.notify_mail',
      sql<
        Role[]
      >`coalesce((select array_agg(r.role order by r.role) from user_role r where r.user_id = u.id), '{}')`.as('roles'),
    ])
    .where('s.id', '=', id)
    .executeTakeFirst()
}

export async function extendSession(db: Db, id: string, expiresAt: Date): Promise<void> {
  await db.updateTable('user_session').set({ expires_at: expiresAt }).where('id', '=', id).execute()
}

export async function deleteSession(db: Db, id: string): Promise<void> {
  await db.deleteFrom('user_session').where('id', '=', id).execute()
}

/** Delete every session of a user, except (optionally) one. */
export async function deleteSessionsOf(db: Db, userId: string, keepId: string | null): Promise<void> {
  let q = db.deleteFrom('user_session').where('user_id', '=', userId)
  if (keepId) q = q.where('id', '<>', keepId)
  await q.execute()
}
