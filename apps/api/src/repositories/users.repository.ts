import type { Role } from '@ebullio/schemas'
import { sql } from 'kysely'
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

/** Filters of the admin people list; `q` matches name or e-mail (case-insensitive). */
export interface UserListFilter {
  q?: string
  role?: Role
  /** `active` = can sign in (password set), `invited` = invitation not yet accepted, `deactivated`. */
  status?: 'active' | 'invited' | 'deactivated'
  sort: 'name' | 'email' | 'created_at'
  order: 'asc' | 'desc'
  limit: number
  offset: number
}

const USER_SORT = { name: 'display_name', email: 'email', created_at: 'created_at' } as const

/** One page of accounts with their roles, and how many match the filter in all. */
export async function listUsersPage(db: Db, f: UserListFilter): Promise<{ items: UserRecord[]; total: number }> {
  let q = db.selectFrom('app_user')
  if (f.q) {
    const like = `%${f.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`
    q = q.where((eb) => eb.or([eb('display_name', 'ilike', like), eb('email', 'ilike', like)]))
  }
  if (f.role) q = q.where('id', 'in', db.selectFrom('user_role').select('user_id').where('role', '=', f.role))
  if (f.status === 'deactivated') q = q.where('active', '=', false)
  if (f.status === 'invited') q = q.where('active', '=', true).where('password_hash', 'is', null)
  if (f.status === 'active') q = q.where('active', '=', true).where('password_hash', 'is not', null)
  const total = await q.select(sql<string>`count(*)`.as('n')).executeTakeFirstOrThrow()
  const users = await q
    .selectAll()
    .orderBy(USER_SORT[f.sort], f.order)
    .orderBy('display_name')
    .orderBy('id')
    .limit(f.limit)
    .offset(f.offset)
    .execute()
  const roles = users.length
    ? await db
        .selectFrom('user_role')
        .selectAll()
        .where(
          'user_id',
          'in',
          users.map((u) => u.id),
        )
        .execute()
    : []
  return {
    total: Number(total.n),
    items: users.map((u) => ({
      id: u.id,
      email: u.email,
      displayName: u.display_name,
      active: u.active,
      notifyMail: u.notify_mail,
      invitePending: u.password_hash === null,
      roles: roles.filter((r) => r.user_id === u.id).map((r) => r.role as Role),
      createdAt: u.created_at,
    })),
  }
}

export async function setRoles(db: Db, userId: string, roles: Role[]): Promise<void> {
  await db.deleteFrom('user_role').where('user_id', '=', userId).execute()
  if (roles.length)
    await db
      .insertInto('user_role')
      .values(roles.map((role) => ({ user_id: userId, role })))
      .execute()
}

export async function rolesOf(db: Db, userId: string): Promise<Role[]> {
  const rows = await db.selectFrom('user_role').select('role').where('user_id', '=', userId).execute()
  return rows.map((r) => r.role as Role)
}

/** Ids of the active lead chemists (who are told when a data set is submitted). */
export async function activeLeadChemistIds(db: Db): Promise<string[]> {
  const rows = await db
    .selectFrom('user_role')
    .innerJoin('app_user', 'app_user.id', 'user_role.user_id')
    .select('app_user.id')
    .where('user_role.role', '=', 'lead_chemist')
    .where('app_user.active', '=', true)
    .execute()
  return rows.map((r) => r.id)
}

/** The stored password hash of an account (null: none set, or no such account). */
export async function passwordHashOf(db: Db, userId: string): Promise<string | null> {
  const u = await db.selectFrom('app_user').select('password_hash').where('id', '=', userId).executeTakeFirst()
  return u?.password_hash ?? null
}

export async function insertUser(
  db: Db,
  u: { id: string; email: string; displayName: string; passwordHash: string | null },
): Promise<void> {
  await db
    .insertInto('app_user')
    .values({ id: u.id, email: u.email.toLowerCase(), display_name: u.displayName, password_hash: u.passwordHash })
    .execute()
}

export async function setPasswordHash(db: Db, userId: string, passwordHash: string): Promise<void> {
  await db
    .updateTable('app_user')
    .set({ password_hash: passwordHash, updated_at: new Date() })
    .where('id', '=', userId)
    .execute()
}

/** Activate or deactivate an account; answers whether the account exists. */
export async function setUserActive(db: Db, userId: string, active: boolean): Promise<boolean> {
  const r = await db
    .updateTable('app_user')
    .set({ active, updated_at: new Date() })
    .where('id', '=', userId)
    .executeTakeFirst()
  return Number(r.numUpdatedRows) > 0
}

export async function setNotifyMail(db: Db, userId: string, notifyMail: boolean): Promise<void> {
  await db
    .updateTable('app_user')
    .set({ notify_mail: notifyMail, updated_at: new Date() })
    .where('id', '=', userId)
    .execute()
}

/** The single-use token tables: invitations and password resets (only the token's SHA-256 is stored). */
export type TokenTable = 'invite' | 'password_reset'

export async function insertToken(
  db: Db,
  table: TokenTable,
  t: { tokenHash: string; userId: string; expiresAt: Date },
): Promise<void> {
  await db.insertInto(table).values({ token_hash: t.tokenHash, user_id: t.userId, expires_at: t.expiresAt }).execute()
}

/** Mark an unused, unexpired token used in one statement; answers its user, or undefined when there is none. */
export async function useToken(db: Db, table: TokenTable, tokenHash: string): Promise<string | undefined> {
  const row = await db
    .updateTable(table)
    .set({ used_at: new Date() })
    .where('token_hash', '=', tokenHash)
    .where('used_at', 'is', null)
    .where('expires_at', '>', new Date())
    .returning('user_id')
    .executeTakeFirst()
  return row?.user_id
}

/** Every outstanding (unused) password-reset token of a user stops working. */
export async function useAllResetTokens(db: Db, userId: string): Promise<void> {
  await db
    .updateTable('password_reset')
    .set({ used_at: new Date() })
    .where('user_id', '=', userId)
    .where('used_at', 'is', null)
    .execute()
}

/** The account an unused, unexpired invitation is for (undefined: no such invitation). */
export async function findOpenInvite(db: Db, tokenHash: string) {
  return db
    .selectFrom('invite')
    .innerJoin('app_user', 'app_user.id', 'invite.user_id')
    .select(['app_user.email', 'app_user.display_name'])
    .where('token_hash', '=', tokenHash)
    .where('used_at', 'is', null)
    .where('expires_at', '>', new Date())
    .executeTakeFirst()
}

/** Where notification mail for a user goes, and whether it may (active account that wants mail). */
export async function mailPreferenceOf(db: Db, userId: string) {
  return db
    .selectFrom('app_user')
    .select(['email', 'notify_mail', 'active'])
    .where('id', '=', userId)
    .executeTakeFirst()
}
