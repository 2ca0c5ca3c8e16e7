import type { NextFunction, Request, RequestHandler, Response } from 'express'
import { rateLimit } from 'express-rate-limit'
import type { AppServices } from '../context.js'
import { AppError } from '../errors/index.js'
import { PostgresRateLimitStore } from './rate-limit-store.js'

const WINDOW_MS = 15 * 60_000

const tooMany = (message: string) => (_req: Request, _res: Response, next: NextFunction) =>
  next(new AppError(429, 'too_many_attempts', message))

const emailOf = (req: Request) =>
  String(req.body?.email ?? '')
    .trim()
    .toLowerCase()

/**
 * Abuse limits, counted in PostgreSQL so every replica shares them (15-minute windows):
 * - sign-in: failures only, per address and per account; a successful sign-in clears the account's count, so a lab
 *   switching roles all day is never locked out, while guessing one account's password is;
 * - forgotten password: requests per address and per e-mail (each sends a mail);
 * - change password: failed attempts per signed-in user.
 */
export function createLimits(services: AppServices) {
  const { config, db } = services
  const store = (prefix: string) => new PostgresRateLimitStore(db, prefix)
  const common = { windowMs: WINDOW_MS, legacyHeaders: false, validate: { keyGeneratorIpFallback: false } } as const
  const accountStore = store('signin-account')

  const signIn: RequestHandler[] = [
    rateLimit({
      ...common,
      store: store('signin-ip'),
      limit: config.rateLimitSigninPerIp,
      skipSuccessfulRequests: true,
      standardHeaders: 'draft-8',
      handler: tooMany('Too many failed sign-in attempts from this address. Wait 15 minutes and try again.'),
    }),
    rateLimit({
      ...common,
      store: accountStore,
      limit: config.rateLimitSigninPerAccount,
      skipSuccessfulRequests: true,
      standardHeaders: false,
      keyGenerator: emailOf,
      handler: tooMany('Too many failed sign-in attempts for this account. Wait 15 minutes and try again.'),
    }),
    (req, res, next) => {
      res.on('finish', () => {
        if (res.statusCode < 400) void accountStore.resetKey(emailOf(req)).catch(() => {})
      })
      next()
    },
  ]

  const forgotPassword: RequestHandler[] = [
    rateLimit({
      ...common,
      store: store('forgot-ip'),
      limit: config.rateLimitForgotPerIp,
      standardHeaders: 'draft-8',
      handler: tooMany('Too many password-reset requests from this address. Wait 15 minutes and try again.'),
    }),
    rateLimit({
      ...common,
      store: store('forgot-account'),
      limit: config.rateLimitForgotPerAddress,
      standardHeaders: false,
      keyGenerator: emailOf,
      handler: tooMany(
        'A reset link was already sent to this address several times. Use the latest mail, or wait 15 minutes.',
      ),
    }),
  ]

  const changePassword: RequestHandler[] = [
    rateLimit({
      ...common,
      store: store('change-password'),
      limit: config.rateLimitPasswordChange,
      // Only a wrong current password (400) counts: a refused new password (422) guessed nothing.
      skipSuccessfulRequests: true,
      requestWasSuccessful: (_req, res) => res.statusCode !== 400,
      standardHeaders: 'draft-8',
      keyGenerator: (req) => req.ctx?.user?.id ?? `anonymous:${req.ip}`,
      handler: tooMany('Too many failed attempts to change the password. Wait 15 minutes and try again.'),
    }),
  ]

  // Expired counters are swept now and then.
  const sweeper = store('sweep')
  let last = 0
  const sweep: RequestHandler = (_req, _res, next) => {
    if (Date.now() - last > WINDOW_MS) {
      last = Date.now()
      void sweeper.sweep().catch(() => {})
    }
    next()
  }

  return { signIn, forgotPassword, changePassword, sweep }
}
