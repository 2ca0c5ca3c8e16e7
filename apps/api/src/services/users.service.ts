import { randomUUID } from 'node:crypto'
import { webLink, type Role } from '@ebullio/schemas'
import type { Kysely } from 'kysely'
import { dummyHash, hashPassword, verifyPassword, type Sessions } from '../auth/index.js'
import { hashToken, newToken } from '../auth/tokens.js'
import type { Config } from '../config.js'
import type { Database, Db } from '../db/index.js'
import { AppError, badRequest, conflict, notFound } from '../errors/index.js'
import { enqueueMail } from '../mail/outbox.js'
import { appendAudit } from '../repositories/audit.repository.js'
import * as users from '../repositories/users.repository.js'

/** Run fn in the caller's transaction, or in a new one, so an account change and its audit row commit together. */
function atomically<T>(db: Db, fn: (tx: Db) => Promise<T>): Promise<T> {
  return db.isTransaction ? fn(db) : db.transaction().execute(fn)
}

const BAD_SIGN_IN = 'The e-mail address or password is not correct, or the account is not active.'
const BAD_LINK = 'This link is not valid any more. It may have been used already or have expired; ask for a new one.'

/** Check a password; the same message and about the same time whether or not the e-mail exists. */
export async function authenticate(db: Db, email: string, password: string): Promise<string> {
  const u = await users.findUserByEmail(db, email)
  const ok = await verifyPassword(u?.password_hash ?? (await dummyHash()), password)
  if (!u || !ok || !u.active) throw new AppError(401, 'invalid_credentials', BAD_SIGN_IN)
  return u.id
}

export async function createUser(
  db: Db,
  o: { email: string; displayName: string; roles: Role[]; password?: string },
): Promise<string> {
  if (await users.findUserByEmail(db, o.email)) throw conflict('A user with this e-mail address already exists.')
  const id = randomUUID()
  const passwordHash = o.password ? await hashPassword(o.password) : null
  await users.insertUser(db, { id, email: o.email, displayName: o.displayName, passwordHash })
  await users.setRoles(db, id, o.roles)
  return id
}

async function issueToken(
  db: Db,
  table: 'invite' | 'password_reset',
  userId: string,
  minutes: number,
): Promise<string> {
  const { token, tokenHash } = newToken()
  await users.insertToken(db, table, { tokenHash, userId, expiresAt: new Date(Date.now() + minutes * 60_000) })
  return token
}

export async function inviteUser(
  db: Kysely<Database>,
  config: Config,
  invitedBy: string,
  o: { email: string; displayName: string; roles: Role[] },
  invitedById: string | null = null,
): Promise<string> {
  return db.transaction().execute(async (tx) => {
    const id = await createUser(tx, o)
    await appendAudit(tx, {
      actorId: invitedById,
      entity: 'app_user',
      entityId: id,
      action: 'invite user',
      after: { email: o.email.toLowerCase(), displayName: o.displayName, roles: o.roles, invitedBy },
    })
    const token = await issueToken(tx, 'invite', id, config.inviteHours * 60)
    await enqueueMail(tx, {
      to: o.email,
      subject: 'You are invited to Ebullio',
      text:
        `Hello ${o.displayName},\n\n${invitedBy} has given you an Ebullio account.\n` +
        `Choose your password here (the link works once, for ${config.inviteHours} hours):\n\n` +
        `${webLink(config.publicUrl, 'welcome', { token })}\n\nIf you did not expect this message, ignore it.\n`,
    })
    return id
  })
}

/** Consume a single-use token: returns its user, or throws the same message for unknown, used and expired links. */
async function consumeToken(db: Db, table: 'invite' | 'password_reset', token: string): Promise<string> {
  const userId = await users.useToken(db, table, hashToken(token))
  if (!userId) throw new AppError(400, 'invalid_link', BAD_LINK)
  return userId
}

export async function peekInvite(db: Db, token: string): Promise<{ email: string; displayName: string }> {
  const row = await users.findOpenInvite(db, hashToken(token))
  if (!row) throw new AppError(400, 'invalid_link', BAD_LINK)
  return { email: row.email, displayName: row.display_name }
}

export async function acceptInvite(db: Kysely<Database>, token: string, password: string): Promise<string> {
  const passwordHash = await hashPassword(password)
  return db.transaction().execute(async (tx) => {
    const userId = await consumeToken(tx, 'invite', token)
    await users.setPasswordHash(tx, userId, passwordHash)
    await appendAudit(tx, { actorId: userId, entity: 'app_user', entityId: userId, action: 'accept invite' })
    return userId
  })
}

/** Mail a reset link when the address belongs to an active account; say nothing either way. */
export async function requestPasswordReset(db: Kysely<Database>, config: Config, email: string): Promise<void> {
  const u = await users.findUserByEmail(db, email)
  if (!u || !u.active || !u.password_hash) return
  await db.transaction().execute(async (tx) => {
    const token = await issueToken(tx, 'password_reset', u.id, config.resetMinutes)
    await enqueueMail(tx, {
      to: u.email,
      subject: 'Reset your Ebullio password',
      text:
        `Hello ${u.display_name},\n\nSomeone (we hope you) asked to reset your Ebullio password.\n` +
        `Choose a new one here (the link works once, for ${config.resetMinutes} minutes):\n\n` +
        `${webLink(config.publicUrl, 'resetPassword', { token })}\n\nIf it was not you, ignore this message: your password stays as it is.\n`,
    })
  })
}

export async function resetPassword(
  db: Kysely<Database>,
  sessions: Sessions,
  token: string,
  password: string,
): Promise<void> {
  const passwordHash = await hashPassword(password)
  await db.transaction().execute(async (tx) => {
    const id = await consumeToken(tx, 'password_reset', token)
    // Any other reset link of this user still outstanding stops working too.
    await users.useAllResetTokens(tx, id)
    await users.setPasswordHash(tx, id, passwordHash)
    await appendAudit(tx, { actorId: id, entity: 'app_user', entityId: id, action: 'reset password' })
    await sessions.endAllFor(id, undefined, tx)
  })
}

/** Change one's own password; every other session of the user ends (the one making the change stays). */
export async function changePassword(
  db: Db,
  sessions: Sessions,
  userId: string,
  current: string,
  next: string,
  currentCookieHeader?: string,
): Promise<void> {
  const u = await users.findUserById(db, userId)
  if (!u || !(await verifyPassword(u.password_hash, current))) throw badRequest('Your current password is not correct.')
  const passwordHash = await hashPassword(next)
  await atomically(db, async (tx) => {
    await users.setPasswordHash(tx, userId, passwordHash)
    await appendAudit(tx, { actorId: userId, entity: 'app_user', entityId: userId, action: 'change password' })
    await sessions.endAllFor(userId, currentCookieHeader, tx)
  })
}

export async function setActive(
  db: Db,
  sessions: Sessions,
  actorId: string,
  userId: string,
  active: boolean,
): Promise<void> {
  if (actorId === userId && !active) throw badRequest('You cannot deactivate your own account.')
  await atomically(db, async (tx) => {
    const before = await users.findUserById(tx, userId)
    if (!(await users.setUserActive(tx, userId, active))) throw notFound('No such user.')
    await appendAudit(tx, {
      actorId,
      entity: 'app_user',
      entityId: userId,
      action: active ? 'activate user' : 'deactivate user',
      before: { active: before?.active ?? null },
      after: { active },
    })
  })
  if (!active) await sessions.endAllFor(userId)
}

export async function assignRoles(db: Db, actorId: string, userId: string, roles: Role[]): Promise<void> {
  if (!(await users.findUserById(db, userId))) throw notFound('No such user.')
  if (actorId === userId && !roles.includes('admin')) throw badRequest('You cannot remove your own administrator role.')
  const next = [...new Set(roles)]
  await atomically(db, async (tx) => {
    const before = await users.rolesOf(tx, userId)
    await users.setRoles(tx, userId, next)
    await appendAudit(tx, {
      actorId,
      entity: 'app_user',
      entityId: userId,
      action: 'change roles',
      before: { roles: before },
      after: { roles: next },
    })
  })
}

/** The user's choice to receive notification mail (submissions, approvals, replies), audited. */
export async function setNotifyMail(db: Db, userId: string, notifyMail: boolean): Promise<void> {
  await atomically(db, async (tx) => {
    const before = await users.findUserById(tx, userId)
    if (!before) throw notFound('No such user.')
    await users.setNotifyMail(tx, userId, notifyMail)
    await appendAudit(tx, {
      actorId: userId,
      entity: 'app_user',
      entityId: userId,
      action: 'change notification preference',
      before: { notifyMail: before.notify_mail },
      after: { notifyMail },
    })
  })
}

/** Read-only listings the routes need, answered by the repository as they are (no rule applies). */
export { findUserById, listUsersPage } from '../repositories/users.repository.js'
