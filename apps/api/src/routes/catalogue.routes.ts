import { toPascal } from '@ebullio/thermo'
import { z } from 'zod'
import { ctx } from '../context.js'
import * as catalogue from '../services/catalogue.service.js'
import * as exportsService from '../services/exports.service.js'
import { downloadUpload } from '../services/uploads.service.js'
import { defineRoutes } from './define.js'
import { curveQuerySchema as curveQuery } from '@ebullio/schemas'
import { catalogueQuery, idParams, uuid } from './lab-schemas.js'
import { parseParams, parseQuery } from './validate.js'

const LAB = ['analyst', 'lead_chemist', 'reviewer', 'admin'] as const

export const catalogueRoutes = defineRoutes([
  {
    method: 'get',
    path: '/api/catalogue',
    access: 'authenticated',
    handler: async (req, res) => void res.json(await catalogue.catalogue(ctx(req).db, parseQuery(catalogueQuery, req))),
  },
  {
    method: 'get',
    path: '/api/data-sets/:id/curve',
    access: 'authenticated',
    handler: async (req, res) => {
      const { db, user, changes } = ctx(req)
      const { id } = parseParams(idParams, req)
      const q = parseQuery(curveQuery, req)
      const P = toPascal(q.pressure, q.unit)
      const curve = await catalogue.curveAnswer(db, user, id, { P, points: q.points, fitId: q.fitId }, changes)
      res.type('application/json')
      // A draft's curve may change at any time: never stored. A published one is revalidated by its ETag on every
      // use (private: shared caches would skip the sign-in and access check that ran above).
      if (!curve.etag) return void res.set('Cache-Control', 'no-store').send(curve.body)
      res.set({ ETag: curve.etag, 'Cache-Control': 'private, no-cache' })
      if (req.fresh) return void res.status(304).end()
      res.send(curve.body)
    },
  },
  {
    method: 'get',
    path: '/api/data-sets/:id/export/points.csv',
    access: 'authenticated',
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { name, csv } = await exportsService.pointsCsv(db, user, parseParams(idParams, req).id)
      res.type('text/csv; charset=utf-8').attachment(name).send(csv)
    },
  },
  {
    method: 'get',
    path: '/api/data-sets/:id/export/parameters.json',
    access: 'authenticated',
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { name, body } = await exportsService.parametersJson(db, user, parseParams(idParams, req).id)
      res.attachment(name).json(body)
    },
  },
  {
    method: 'get',
    path: '/api/data-sets/:id/export/parameters.csv',
    access: 'authenticated',
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { name, csv } = await exportsService.parametersCsv(db, user, parseParams(idParams, req).id)
      res.type('text/csv; charset=utf-8').attachment(name).send(csv)
    },
  },
  {
    method: 'get',
    path: '/api/uploads/:id/content',
    access: LAB,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const f = await downloadUpload(db, user, parseParams(z.object({ id: uuid('file') }), req).id)
      res.set('X-Content-SHA256', f.sha256).type(f.contentType).attachment(f.name).send(f.content)
    },
  },
])
