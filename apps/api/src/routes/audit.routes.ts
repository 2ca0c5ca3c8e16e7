import { z } from 'zod'
import { ctx } from '../context.js'
import { listAudit } from '../services/audit.service.js'
import { pageWindow } from '../services/lab-access.js'
import { defineRoutes } from './define.js'
import { pageQuery } from './lab-schemas.js'
import { parseQuery } from './validate.js'

const auditQuery = z.object({
  entity: z.string().trim().max(60).optional(),
  entityId: z.string().trim().max(100).optional(),
  actorId: z.string().trim().max(100).optional(),
  action: z.string().trim().max(100).optional(),
  after: z.coerce.date().optional(),
  before: z.coerce.date().optional(),
  ...pageQuery,
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
})

/** The whole audit log for administrators (account changes, components, calibrations, data sets), newest first by default. */
export const auditRoutes = defineRoutes([
  {
    method: 'get',
    path: '/api/audit',
    access: ['admin'],
    handler: async (req, res) => {
      const { page, pageSize, ...q } = parseQuery(auditQuery, req)
      res.json({ ...(await listAudit(ctx(req).db, { ...q, ...pageWindow(page, pageSize) })), page, pageSize })
    },
  },
])
