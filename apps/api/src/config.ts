import { existsSync } from 'node:fs'
import path from 'node:path'
import { z } from 'zod'

const bool = z.enum(['true', 'false', '1', '0', 'yes', 'no']).transform((v) => v === 'true' || v === '1' || v === 'yes')

/**
 * Every setting of the server, read once from the environment and checked. Defaults suit a local lab machine;
 * with NODE_ENV=production the defaults are the safe ones (no mail capture, no captured-mail viewer, no demo data,
 * Secure cookies) and PUBLIC_URL must be given.
 */
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  PUBLIC_URL: z.string().url().optional(),
  DATABASE_URL: z.string().url().default('postgres://postgres@127.0.0.1:54320/ebullio'),
  SMTP_URL: z.string().default('smtp://127.0.0.1:2526'),
  MAIL_FROM: z.string().default('Ebullio <ebullio@localhost>'),
  FAKE_SMTP: bool.optional(),
  MAIL_VIEWER: bool.optional(),
  SMTP_TIMEOUT_MS: z.coerce.number().int().positive().default(15_000),
  MAIL_POLL_MS: z.coerce.number().int().positive().default(2000),
  MAIL_MAX_ATTEMPTS: z.coerce.number().int().positive().default(12),
  MAIL_MAX_REFUSED_ATTEMPTS: z.coerce.number().int().positive().default(3),
  FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2526),
  SESSION_IDLE_HOURS: z.coerce.number().positive().default(12),
  SESSION_ABSOLUTE_HOURS: z.coerce.number().positive().default(72),
  COOKIE_SECURE: z.enum(['auto', 'true', 'false']).default('auto'),
  DEMO_DATA: bool.optional(),
  UPLOAD_MAX_BYTES: z.coerce
    .number()
    .int()
    .positive()
    .default(5 * 1024 * 1024),
  UPLOAD_MAX_ROWS: z.coerce.number().int().positive().default(20_000),
  JSON_LIMIT: z.string().default('1mb'),
  SERVE_WEB: bool.default(false),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  RATE_LIMIT_SIGNIN_PER_IP: z.coerce.number().int().positive().default(30),
  RATE_LIMIT_SIGNIN_PER_ACCOUNT: z.coerce.number().int().positive().default(8),
  RATE_LIMIT_FORGOT_PER_ADDRESS: z.coerce.number().int().positive().default(3),
  RATE_LIMIT_FORGOT_PER_IP: z.coerce.number().int().positive().default(20),
  RATE_LIMIT_PASSWORD_CHANGE: z.coerce.number().int().positive().default(8),
  SHUTDOWN_TIMEOUT_MS: z.coerce.number().int().positive().default(10_000),
  CACHE_TTL_MS: z.coerce.number().int().min(0).max(60_000).default(5000),
  METRICS_TOKEN: z.string().min(16).optional(),
  INVITE_HOURS: z.coerce.number().positive().default(72),
  RESET_MINUTES: z.coerce.number().positive().default(30),
  ALLOW_SELF_APPROVAL: bool.default(false),
  REPLICATE_RSD_LIMIT: z.coerce.number().positive().max(1).default(0.02),
  LAB_NAME: z.string().min(1).default('Ebullio laboratory'),
  REPORT_TIME_ZONE: z
    .string()
    .default('UTC')
    .refine((tz) => {
      try {
        new Intl.DateTimeFormat('en', { timeZone: tz })
        return true
      } catch {
        return false
      }
    }, 'must be an IANA time zone such as UTC or Europe/Berlin'),
})

/** The settings as the app uses them: derived from the environment's schema, so the type is never restated. */
const configSchema = envSchema
  // Production refuses what would be unsafe there (the invented demo data) and needs the address users type.
  .superRefine((e, ctx) => {
    const production = e.NODE_ENV === 'production'
    if (production && !e.PUBLIC_URL)
      ctx.addIssue({
        code: 'custom',
        path: ['PUBLIC_URL'],
        message: 'required in production (the address users type, e.g. https://ebullio.lab.example)',
      })
    if (production && e.DEMO_DATA === true)
      ctx.addIssue({
        code: 'custom',
        path: ['DEMO_DATA'],
        message: 'the invented demo scenario is refused in production; unset it or set DEMO_DATA=false',
      })
  })
  .transform((e) => {
    const production = e.NODE_ENV === 'production'
    return {
      nodeEnv: e.NODE_ENV,
      host: e.HOST,
      port: e.PORT,
      publicUrl: (e.PUBLIC_URL ?? `http://127.0.0.1:${e.PORT}`).replace(/\/$/, ''),
      databaseUrl: e.DATABASE_URL,
      smtpUrl: e.SMTP_URL,
      mailFrom: e.MAIL_FROM,
      fakeSmtp: e.FAKE_SMTP ?? !production,
      /** The admins' captured-mail screen (development and tests; off in production unless MAIL_VIEWER=true). */
      mailViewer: e.MAIL_VIEWER ?? !production,
      smtpTimeoutMs: e.SMTP_TIMEOUT_MS,
      mailPollMs: e.MAIL_POLL_MS,
      mailMaxAttempts: e.MAIL_MAX_ATTEMPTS,
      mailMaxRefusedAttempts: e.MAIL_MAX_REFUSED_ATTEMPTS,
      fakeSmtpPort: e.FAKE_SMTP_PORT,
      sessionIdleHours: e.SESSION_IDLE_HOURS,
      sessionAbsoluteHours: e.SESSION_ABSOLUTE_HOURS,
      cookieSecure: e.COOKIE_SECURE,
      demoData: e.DEMO_DATA ?? !production,
      uploadMaxBytes: e.UPLOAD_MAX_BYTES,
      /** data rows one uploaded CSV file may hold (its header not counted) */
      uploadMaxRows: e.UPLOAD_MAX_ROWS,
      jsonLimit: e.JSON_LIMIT,
      serveWeb: e.SERVE_WEB,
      logLevel: e.LOG_LEVEL,
      rateLimitSigninPerIp: e.RATE_LIMIT_SIGNIN_PER_IP,
      rateLimitSigninPerAccount: e.RATE_LIMIT_SIGNIN_PER_ACCOUNT,
      rateLimitForgotPerAddress: e.RATE_LIMIT_FORGOT_PER_ADDRESS,
      rateLimitForgotPerIp: e.RATE_LIMIT_FORGOT_PER_IP,
      rateLimitPasswordChange: e.RATE_LIMIT_PASSWORD_CHANGE,
      shutdownTimeoutMs: e.SHUTDOWN_TIMEOUT_MS,
      /** longest life of a cached session or curve source (invalidated earlier by the change feed); 0: no caching */
      cacheTtlMs: e.CACHE_TTL_MS,
      metricsToken: e.METRICS_TOKEN ?? null,
      inviteHours: e.INVITE_HOURS,
      resetMinutes: e.RESET_MINUTES,
      allowSelfApproval: e.ALLOW_SELF_APPROVAL,
      replicateRsdLimit: e.REPLICATE_RSD_LIMIT,
      /** printed at the head of every report */
      labName: e.LAB_NAME,
      /** time zone (IANA) of the dates and times printed on reports */
      reportTimeZone: e.REPORT_TIME_ZONE,
    }
  })

export type Config = z.output<typeof configSchema>

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = configSchema.safeParse(env)
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`)
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`)
  }
  return parsed.data
}

/**
 * Settings from a `.env` file in the working folder, when there is one, with Node's own loader (Node 20.12+).
 * Variables already set in the environment win over the file. Answers whether a file was read.
 */
export function loadEnvFile(file = path.resolve('.env')): boolean {
  if (!existsSync(file)) return false
  process.loadEnvFile(file)
  return true
}
