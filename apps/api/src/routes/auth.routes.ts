import {
  acceptInviteSchema,
  changePasswordSchema,
  forgotPasswordSchema,
  resetPasswordSchema,
  signInSchema,
} from '@ebullio/schemas'
import { z } from 'zod'
import { ctx } from '../context.js'
import * as service from '../services/users.service.js'
import { defineRoutes } from './define.js'
import { parseBody, parseParams } from './validate.js'

const preferencesSchema = z.object({ notifyMail: z.boolean() })

export const authRoutes = defineRoutes([
  {
    method: 'post',
    path: '/api/auth/sign-in',
    access: 'public',
    handler: async (req, res) => {
      const { email, password } = parseBody(signInSchema, req)
      const { db, sessions } = req.ctx
      const userId = await service.authenticate(db, email, password)
      res.append('Set-Cookie', await sessions.create(userId))
      res.json({ ok: true })
    },
  },
  {
    method: 'post',
    path: '/api/auth/sign-out',
    access: 'authenticated',
    handler: async (req, res) => {
      await req.ctx.sessions.end(req.headers.cookie)
      res.append('Set-Cookie', req.ctx.sessions.blankCookie())
      res.json({ ok: true })
    },
  },
  {
    method: 'get',
    path: '/api/auth/me',
    access: 'authenticated',
    handler: async (req, res) => {
      const { user, db } = ctx(req)
      // The session query already read the preference; a second query only for a user built elsewhere.
      const notifyMail = user.notifyMail ?? (await service.findUserById(db, user.id))?.notify_mail ?? true
      res.json({
        user: { ...user, notifyMail },
        devMode: req.ctx.config.mailViewer,
        // the lab's own name (LAB_NAME), shown in the app frame and printed on reports
        labName: req.ctx.config.labName,
      })
    },
  },
  {
    method: 'patch',
    path: '/api/auth/me/preferences',
    access: 'authenticated',
    handler: async (req, res) => {
      const { user, db } = ctx(req)
      const { notifyMail } = parseBody(preferencesSchema, req)
      await service.setNotifyMail(db, user.id, notifyMail)
      res.json({ ok: true })
    },
  },
  {
    method: 'post',
    path: '/api/auth/change-password',
    access: 'authenticated',
    handler: async (req, res) => {
      const { user, db, sessions } = ctx(req)
      const body = parseBody(changePasswordSchema, req)
      await service.changePassword(db, sessions, user.id, body.currentPassword, body.newPassword, req.headers.cookie)
      res.json({ ok: true })
    },
  },
  {
    method: 'post',
    path: '/api/auth/forgot-password',
    access: 'public',
    handler: async (req, res) => {
      const { email } = parseBody(forgotPasswordSchema, req)
      await service.requestPasswordReset(req.ctx.db, req.ctx.config, email)
      void req.ctx.mailer.deliverPending().catch(() => {})
      res.json({ ok: true, message: 'If this address belongs to an account, a reset link is on its way.' })
    },
  },
  {
    method: 'post',
    path: '/api/auth/reset-password',
    access: 'public',
    handler: async (req, res) => {
      const { token, password } = parseBody(resetPasswordSchema, req)
      await service.resetPassword(req.ctx.db, req.ctx.sessions, token, password)
      res.json({ ok: true })
    },
  },
  {
    method: 'get',
    path: '/api/auth/invites/:token',
    access: 'public',
    handler: async (req, res) => {
      const { token } = parseParams(z.object({ token: z.string().min(20).max(200) }), req)
      res.json(await service.peekInvite(req.ctx.db, token))
    },
  },
  {
    method: 'post',
    path: '/api/auth/accept-invite',
    access: 'public',
    handler: async (req, res) => {
      const { token, password } = parseBody(acceptInviteSchema, req)
      const userId = await service.acceptInvite(req.ctx.db, token, password)
      res.append('Set-Cookie', await req.ctx.sessions.create(userId))
      res.json({ ok: true })
    },
  },
])
