import { inviteSchema, ROLES, setRolesSchema } from '@ebullio/schemas'
import { z } from 'zod'
import { ctx } from '../context.js'
import { notFound } from '../errors/index.js'
import { listCapturedMail } from '../services/captured-mail.service.js'
import { listUndeliveredMail, retryMail } from '../services/mail-outbox.service.js'
import * as service from '../services/users.service.js'
import { defineRoutes } from './define.js'
import { parseBody, parseParams, parseQuery } from './validate.js'

const idParams = z.object({ id: z.string().uuid('Not a user id') })

/** People list query; 100 a page by default so a caller that does not page still gets a lab's accounts. */
const userQuery = z.object({
  q: z.string().trim().max(100).optional(),
  role: z.enum(ROLES).optional(),
  status: z.enum(['active', 'invited', 'deactivated']).optional(),
  sort: z.enum(['name', 'email', 'created_at']).default('name'),
  order: z.enum(['asc', 'desc']).default('asc'),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(100),
})

export const adminRoutes = defineRoutes([
  {
    method: 'get',
    path: '/api/admin/users',
    access: ['admin'],
    handler: async (req, res) => {
      const { page, pageSize, ...f } = parseQuery(userQuery, req)
      res.json({
        ...(await service.listUsersPage(ctx(req).db, { ...f, limit: pageSize, offset: (page - 1) * pageSize })),
        page,
        pageSize,
      })
    },
  },
  {
    method: 'post',
    path: '/api/admin/users',
    access: ['admin'],
    handler: async (req, res) => {
      const { db, config, user, mailer } = ctx(req)
      const body = parseBody(inviteSchema, req)
      const id = await service.inviteUser(db, config, user.displayName, body, user.id)
      void mailer.deliverPending().catch(() => {})
      res.status(201).json({ id })
    },
  },
  {
    method: 'put',
    path: '/api/admin/users/:id/roles',
    access: ['admin'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id } = parseParams(idParams, req)
      await service.assignRoles(db, user.id, id, parseBody(setRolesSchema, req).roles)
      res.json({ ok: true })
    },
  },
  {
    method: 'post',
    path: '/api/admin/users/:id/deactivate',
    access: ['admin'],
    handler: async (req, res) => {
      const { db, user, sessions } = ctx(req)
      await service.setActive(db, sessions, user.id, parseParams(idParams, req).id, false)
      res.json({ ok: true })
    },
  },
  {
    method: 'post',
    path: '/api/admin/users/:id/activate',
    access: ['admin'],
    handler: async (req, res) => {
      const { db, user, sessions } = ctx(req)
      await service.setActive(db, sessions, user.id, parseParams(idParams, req).id, true)
      res.json({ ok: true })
    },
  },
  {
    method: 'get',
    path: '/api/dev/mail',
    access: ['admin'],
    handler: async (req, res) => {
      const { db, config, user } = ctx(req)
      if (!config.mailViewer)
        throw notFound('The captured-mail viewer is off (MAIL_VIEWER; off by default in production).')
      res.json({ items: await listCapturedMail(db, user) })
    },
  },
  {
    method: 'get',
    path: '/api/admin/mail-outbox',
    access: ['admin'],
    handler: async (req, res) => {
      // Mail that could not be delivered: given up (refused for good, or too many tries) or still failing.
      const { status } = parseQuery(z.object({ status: z.enum(['failed', 'retrying']).default('failed') }), req)
      res.json({ items: await listUndeliveredMail(ctx(req).db, status) })
    },
  },
  {
    method: 'post',
    path: '/api/admin/mail-outbox/:id/retry',
    access: ['admin'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id } = parseParams(z.object({ id: z.string().regex(/^\d{1,18}$/, 'Not a message id') }), req)
      res.json(await retryMail(db, user.id, id))
    },
  },
])
