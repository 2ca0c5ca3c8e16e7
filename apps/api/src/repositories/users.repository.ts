import type { Role } from '@ebullio/schemas'
import type { Db } from '../db/index.js'

export interface UserRecord {
  id: string
  email: string
  displayName: string
  active: boolean
  notifyMail: boolean
  invitePending: boolean
  roles: Role[]
  createdAt: Date
}

export async function findUserByEmail(db: Db, email: string) {
  return db.selectFrom('app_user').selectAll().where('email', '=', email.toLowerCase()).executeTakeFirst()
}

export async function findUserById(db: Db, id: string) {
  return db.selectFrom('app_user').selectAll().where('id', '=', id).executeTakeFirst()
}

export async function listUsers(db: Db): Promise<UserRecord[]> {
  const users = await db.selectFrom('app_user').selectAll().orderBy('display_name').execute()
  const roles = await db.selectFrom('user_role').selectAll().execute()
  return users.map((u) => ({
    id: u.id,
    email: u.email,
    displayName: u.display_name,
    active: u.active,
    notifyMail: u.notify_mail,
    invitePending: u.password_hash === null,
    roles: roles.filter((r) => r.user_id === u.id).map((r) => r.role as Role),
    createdAt: u.created_at,
  }))
}

export async function setRoles(db: Db, userId: string, roles: Role[]): Promise<void> {
  await db.deleteFrom('user_role').where('user_id', '=', userId).execute()
  if (roles.length) await db.insertInto('user_role').values(roles.map((role) => ({ user_id: userId, role }))).execute()
}

export async function rolesOf(db: Db, userId: string): Promise<Role[]> {
  const rows = await db.selectFrom('user_role').select('role').where('user_id', '=', userId).execute()
  return rows.map((r) => r.role as Role)
}
