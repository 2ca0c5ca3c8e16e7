import { z } from 'zod'

const bool = z.enum(['true', 'false', '1', '0', 'yes', 'no']).transform((v) => v === 'true' || v === '1' || v === 'yes')

/** Every setting of the server, read once from the environment and checked. Defaults suit a local lab machine. */
const schema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  PUBLIC_URL: z.string().url().default('http://127.0.0.1:3000'),
  DATABASE_URL: z.string().url().default('postgres://postgres@127.0.0.1:54320/ebullio'),
  SMTP_URL: z.string().default('smtp://127.0.0.1:2526'),
  MAIL_FROM: z.string().default('Ebullio <ebullio@localhost>'),
  FAKE_SMTP: bool.default(true),
  FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2526),
  SESSION_IDLE_HOURS: z.coerce.number().positive().default(12),
  SESSION_ABSOLUTE_HOURS: z.coerce.number().positive().default(72),
  COOKIE_SECURE: z.enum(['auto', 'true', 'false']).default('auto'),
  DEMO_DATA: bool.default(true),
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

export interface Config {
  nodeEnv: 'development' | 'test' | 'production'
  host: string
  port: number
  publicUrl: string
  databaseUrl: string
  smtpUrl: string
  mailFrom: string
  fakeSmtp: boolean
  fakeSmtpPort: number
  sessionIdleHours: number
  sessionAbsoluteHours: number
  cookieSecure: 'auto' | 'true' | 'false'
  demoData: boolean
  uploadMaxBytes: number
  /** data rows one uploaded CSV file may hold (its header not counted) */
  uploadMaxRows: number
  jsonLimit: string
  serveWeb: boolean
  logLevel: string
  rateLimitSigninPerIp: number
  rateLimitSigninPerAccount: number
  inviteHours: number
  resetMinutes: number
  allowSelfApproval: boolean
  replicateRsdLimit: number
  /** printed at the head of every report */
  labName: string
  /** time zone (IANA) of the dates and times printed on reports */
  reportTimeZone: string
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = schema.safeParse(env)
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`)
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`)
  }
  const e = parsed.data
  return {
    nodeEnv: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    publicUrl: e.PUBLIC_URL.replace(/\/$/, ''),
    databaseUrl: e.DATABASE_URL,
    smtpUrl: e.SMTP_URL,
    mailFrom: e.MAIL_FROM,
    fakeSmtp: e.FAKE_SMTP,
    fakeSmtpPort: e.FAKE_SMTP_PORT,
    sessionIdleHours: e.SESSION_IDLE_HOURS,
    sessionAbsoluteHours: e.SESSION_ABSOLUTE_HOURS,
    cookieSecure: e.COOKIE_SECURE,
    demoData: e.DEMO_DATA,
    uploadMaxBytes: e.UPLOAD_MAX_BYTES,
    uploadMaxRows: e.UPLOAD_MAX_ROWS,
    jsonLimit: e.JSON_LIMIT,
    serveWeb: e.SERVE_WEB,
    logLevel: e.LOG_LEVEL,
    rateLimitSigninPerIp: e.RATE_LIMIT_SIGNIN_PER_IP,
    rateLimitSigninPerAccount: e.RATE_LIMIT_SIGNIN_PER_ACCOUNT,
    inviteHours: e.INVITE_HOURS,
    resetMinutes: e.RESET_MINUTES,
    allowSelfApproval: e.ALLOW_SELF_APPROVAL,
    replicateRsdLimit: e.REPLICATE_RSD_LIMIT,
    labName: e.LAB_NAME,
    reportTimeZone: e.REPORT_TIME_ZONE,
  }
}
