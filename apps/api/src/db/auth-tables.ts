import type { ColumnType, Generated, Insertable, Selectable, Updateable } from 'kysely'

type Timestamp = ColumnType<Date, Date | string, Date | string>
type GeneratedTimestamp = ColumnType<Date, Date | string | undefined, Date | string>

export interface AppUserTable {
  id: string
  email: string
  display_name: string
  password_hash: string | null
  active: Generated<boolean>
  notify_mail: Generated<boolean>
  created_at: GeneratedTimestamp
  updated_at: GeneratedTimestamp
}

export interface UserRoleTable {
  user_id: string
  role: string
}

export interface UserSessionTable {
  id: string
  user_id: string
  expires_at: Timestamp
  created_at: GeneratedTimestamp
}

export interface TokenTable {
  token_hash: string
  user_id: string
  expires_at: Timestamp
  used_at: Timestamp | null
  created_at: GeneratedTimestamp
}

export interface MailOutboxTable {
  id: Generated<string>
  to_address: string
  subject: string
  body_text: string
  created_at: GeneratedTimestamp
  attempts: Generated<number>
  next_attempt_at: GeneratedTimestamp
  last_error: string | null
  sent_at: Timestamp | null
  /** A worker holds the message until then (several replicas never send one message twice). */
  claimed_until: Timestamp | null
  /** Given up: refused for good (5xx) or too many tries; listed for admins. */
  failed_at: Timestamp | null
}

export interface RateLimitHitTable {
  key: string
  hits: number
  reset_at: Timestamp
}

export interface CapturedMailTable {
  id: Generated<string>
  received_at: GeneratedTimestamp
  envelope_from: string
  envelope_to: string
  subject: string
  body_text: string
}

export interface AuthTables {
  app_user: AppUserTable
  user_role: UserRoleTable
  user_session: UserSessionTable
  invite: TokenTable
  password_reset: TokenTable
  mail_outbox: MailOutboxTable
  captured_mail: CapturedMailTable
  rate_limit_hit: RateLimitHitTable
}

export type AppUser = Selectable<AppUserTable>
export type NewAppUser = Insertable<AppUserTable>
export type AppUserUpdate = Updateable<AppUserTable>
export type OutboxMail = Selectable<MailOutboxTable>
export type CapturedMail = Selectable<CapturedMailTable>
