import { z } from 'zod'
import { ctx } from '../context.js'
import * as reports from '../services/reports.service.js'
import { defineRoutes } from './define.js'
import { idParams, uuid } from './lab-schemas.js'
import { parseParams } from './validate.js'

/** The printed report of a data set version, and the verify page's check of a printed report. */
export const reportRoutes = defineRoutes([
  {
    method: 'get',
    path: '/api/data-sets/:id/report.pdf',
    access: 'authenticated',
    handler: async (req, res) => {
      const { db, config, user } = ctx(req)
      const r = await reports.generateReport(db, config, user, parseParams(idParams, req).id)
      res.set('X-Report-Id', r.reportId).type('application/pdf').attachment(r.name).send(r.pdf)
    },
  },
  {
    method: 'get',
    path: '/api/reports/:id/verify',
    access: 'authenticated',
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.json(await reports.verifyReport(db, user, parseParams(z.object({ id: uuid('report') }), req).id))
    },
  },
])
