import nodemailer, { type Transporter } from 'nodemailer'
import { sql, type Kysely } from 'kysely'
import type { Logger } from 'pino'
import type { Database } from '../db/index.js'

/** Delivers the outbox through SMTP; a failed message waits (1, 2, 4 … up to 60 minutes) and is tried again. */
export class Mailer {
  private transport: Transporter
  private timer: NodeJS.Timeout | null = null
  private running: Promise<number> | null = null

  constructor(
    private readonly db: Kysely<Database>,
    smtpUrl: string,
    private readonly from: string,
    private readonly log?: Logger,
  ) {
    this.transport = nodemailer.createTransport(smtpUrl)
  }

  /** Send what is due now; returns how many were delivered. Safe to call concurrently. */
  deliverPending(): Promise<number> {
    this.running ??= this.deliver().finally(() => (this.running = null))
    return this.running
  }

  private async deliver(): Promise<number> {
    let sent = 0
    for (;;) {
      const batch = await this.db
        .selectFrom('mail_outbox')
        .selectAll()
        .where('sent_at', 'is', null)
        .where('next_attempt_at', '<=', new Date())
        .orderBy('id')
        .limit(20)
        .execute()
      if (batch.length === 0) return sent
      for (const m of batch) {
        try {
          await this.transport.sendMail({ from: this.from, to: m.to_address, subject: m.subject, text: m.body_text })
          await this.db
            .updateTable('mail_outbox')
            .set({ sent_at: new Date(), attempts: sql`attempts + 1` })
            .where('id', '=', m.id)
            .execute()
          sent++
        } catch (err) {
          const waitMinutes = Math.min(60, 2 ** m.attempts)
          this.log?.warn({ err, mailId: m.id }, 'mail delivery failed; will retry')
          await this.db
            .updateTable('mail_outbox')
            .set({
              attempts: sql`attempts + 1`,
              last_error: String((err as Error).message ?? err).slice(0, 500),
              next_attempt_at: new Date(Date.now() + waitMinutes * 60_000),
            })
            .where('id', '=', m.id)
            .execute()
        }
      }
    }
  }

  start(intervalMs = 2000): void {
    this.timer ??= setInterval(
      () => void this.deliverPending().catch((err) => this.log?.error({ err }, 'outbox')),
      intervalMs,
    )
    this.timer.unref()
  }

  async stop(): Promise<void> {
    if (this.timer) clearInterval(this.timer)
    this.timer = null
    await this.running
    this.transport.close()
  }
}
