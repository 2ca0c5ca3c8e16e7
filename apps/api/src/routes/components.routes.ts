import { ctx } from '../context.js'
import * as service from '../services/components.service.js'
import { pageWindow } from '../services/lab-access.js'
import { defineRoutes } from './define.js'
import { componentPatchSchema, componentSchema, pureMeasurementSchema, vaporPressureSetSchema } from '@ebullio/schemas'
import { componentQuery, uuid } from './lab-schemas.js'
import { parseBody, parseParams, parseQuery } from './validate.js'
import { z } from 'zod'

const params = z.object({ id: uuid('component') })

export const componentRoutes = defineRoutes([
  {
    method: 'get',
    path: '/api/components',
    access: 'authenticated',
    handler: async (req, res) => {
      const q = parseQuery(componentQuery, req)
      const r = await service.listComponents(ctx(req).db, { ...q, ...pageWindow(q.page, q.pageSize) })
      res.json({ ...r, page: q.page, pageSize: q.pageSize })
    },
  },
  {
    method: 'post',
    path: '/api/components',
    access: ['admin', 'lead_chemist'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.status(201).json(await service.createComponent(db, user.id, parseBody(componentSchema, req)))
    },
  },
  {
    method: 'get',
    path: '/api/components/:id',
    access: 'authenticated',
    handler: async (req, res) => {
      res.json(await service.getComponent(ctx(req).db, parseParams(params, req).id))
    },
  },
  {
    method: 'patch',
    path: '/api/components/:id',
    access: ['admin', 'lead_chemist'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id } = parseParams(params, req)
      const { rowVersion, ...patch } = parseBody(componentPatchSchema, req)
      res.json(await service.updateComponent(db, user.id, id, rowVersion, patch))
    },
  },
  {
    method: 'delete',
    path: '/api/components/:id',
    access: ['admin'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      await service.deleteComponent(db, user.id, parseParams(params, req).id)
      res.status(204).end()
    },
  },
  {
    method: 'post',
    path: '/api/components/:id/vapor-pressure-sets',
    access: ['admin', 'lead_chemist'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id } = parseParams(params, req)
      res.status(201).json(await service.addVaporPressureSet(db, user.id, id, parseBody(vaporPressureSetSchema, req)))
    },
  },
  {
    method: 'post',
    path: '/api/components/:id/pure-measurements',
    access: ['analyst', 'lead_chemist', 'admin'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id } = parseParams(params, req)
      res.status(201).json(await service.addPureMeasurement(db, user.id, id, parseBody(pureMeasurementSchema, req)))
    },
  },
  {
    method: 'post',
    path: '/api/components/:id/vapor-pressure-sets/fit',
    access: ['admin', 'lead_chemist'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id } = parseParams(params, req)
      const { preferred } = parseBody(z.object({ preferred: z.boolean().default(false) }), req)
      res.status(201).json(await service.fitVaporPressureFromMeasurements(db, user.id, id, preferred))
    },
  },
])
