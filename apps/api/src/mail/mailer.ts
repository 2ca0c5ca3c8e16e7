import nodemailer, { type Transporter } from 'nodemailer'
import type { Kysely } from 'kysely'
import type { Logger } from 'pino'
import type { Database } from '../db/index.js'
import type { OutboxMail } from '../db/auth-tables.js'
import { claimDueMail, markMailFailed, markMailSent } from '../repositories/mail-outbox.repository.js'

export interface MailerOptions {
  /** Connection, greeting and socket timeout of one SMTP conversation (a hanging server costs at most this). */
  timeoutMs?: number
  /** A message the server refuses for good (5xx) is given up after this many tries. */
  maxRefusedAttempts?: number
  /** Any message is given up after this many tries (temporary failures wait 1, 2, 4 … 60 minutes between tries). */
  maxAttempts?: number
}

/**
 * The SMTP URL with connection, greeting and socket timeouts as query options (nodemailer reads options from the
 * URL's query; an explicit option in SMTP_URL wins).
 */
export function withTimeouts(smtpUrl: string, ms: number): string {
  const u = new URL(smtpUrl)
  for (const k of ['connectionTimeout', 'greetingTimeout', 'socketTimeout'])
    if (!u.searchParams.has(k)) u.searchParams.set(k, String(ms))
  return u.toString()
}

/** SMTP reply codes 5xx are permanent (RFC 5321 §4.2.1): trying again later will not help. */
function isPermanent(err: unknown): boolean {
  const code = Number((err as { responseCode?: unknown }).responseCode)
  return code >= 500 && code < 600
}

/**
 * Delivers the outbox through SMTP. Every replica may run one: a message is claimed (row lock with SKIP LOCKED,
 * then a lease in `claimed_until`) before it is sent, so each message goes out once however many workers run.
 * A failed message waits (1, 2, 4 … up to 60 minutes) and is tried again, up to a bound; then `failed_at` is set
 * and admins see it in the outbox list.
 */
export class Mailer {
  private transport: Transporter
  private timer: NodeJS.Timeout | null = null
  private running: Promise<number> | null = null
  private stopping = false
  private readonly timeoutMs: number
  private readonly maxRefused: number
  private readonly maxAttempts: number

  constructor(
    private readonly db: Kysely<Database>,
    smtpUrl: string,
    private readonly from: string,
    private readonly log?: Logger,
    options: MailerOptions = {},
  ) {
    this.timeoutMs = options.timeoutMs ?? 15_000
    this.maxRefused = options.maxRefusedAttempts ?? 3
    this.maxAttempts = options.maxAttempts ?? 12
    this.transport = nodemailer.createTransport(withTimeouts(smtpUrl, this.timeoutMs))
  }

  /** Send what is due now; returns how many were delivered. Safe to call concurrently, and from several replicas. */
  deliverPending(): Promise<number> {
    this.running ??= this.deliver().finally(() => (this.running = null))
    return this.running
  }

  /** Claim one due message for this worker; null when none is due or all due ones are held by other workers. */
  private async claim(): Promise<OutboxMail | null> {
    // A lease long enough for one SMTP conversation (three timeouts) plus a margin.
    const leaseMs = this.timeoutMs * 3 + 30_000
    return claimDueMail(this.db, leaseMs)
  }

  private async deliver(): Promise<number> {
    let sent = 0
    while (!this.stopping) {
      const m = await this.claim()
      if (!m) break
      try {
        await this.transport.sendMail({ from: this.from, to: m.to_address, subject: m.subject, text: m.body_text })
        await markMailSent(this.db, m.id)
        sent++
      } catch (err) {
        const permanent = isPermanent(err)
        const giveUp = m.attempts >= (permanent ? this.maxRefused : this.maxAttempts)
        const waitMinutes = Math.min(60, 2 ** (m.attempts - 1))
        const message = String((err as Error).message ?? err).slice(0, 500)
        this.log?.warn(
          { mailId: m.id, attempts: m.attempts, permanent, giveUp, error: message },
          giveUp ? 'mail delivery given up' : 'mail delivery failed; will retry',
        )
        await markMailFailed(this.db, m.id, {
          lastError: message,
          nextAttemptAt: new Date(Date.now() + waitMinutes * 60_000),
          failedAt: giveUp ? new Date() : null,
        })
      }
    }
    return sent
  }

  start(intervalMs = 2000): void {
    this.stopping = false
    this.timer ??= setInterval(
      () => void this.deliverPending().catch((err) => this.log?.error({ err }, 'outbox')),
      intervalMs,
    )
    this.timer.unref()
  }

  /** Stop after the message being sent now (if any); no new message is claimed. */
  async stop(): Promise<void> {
    this.stopping = true
    if (this.timer) clearInterval(this.timer)
    this.timer = null
    await this.running?.catch(() => {})
    this.transport.close()
  }
}
