import { z } from 'zod'
import { ctx } from '../context.js'
import * as calibrations from '../services/calibrations.service.js'
import { gcMethodCheckStandards } from '../services/check-standards.service.js'
import { systemLiterature } from '../services/literature.service.js'
import { pageWindow } from '../services/lab-access.js'
import * as service from '../services/systems.service.js'
import { defineRoutes } from './define.js'
import { gcMethodSchema, systemSchema } from '@ebullio/schemas'
import {
  calibrationForm,
  calibrationQuery,
  checkStandardQuery,
  gcMethodQuery,
  systemQuery,
  uuid,
} from './lab-schemas.js'
import { csvUpload, receivedFile } from './upload-middleware.js'
import { readLimits } from '../uploads/csv-table.js'
import { parseBody, parseParams, parseQuery } from './validate.js'

/** Roles that work in the lab (engineers see approved results only). */
const LAB = ['analyst', 'lead_chemist', 'reviewer', 'admin'] as const
const systemParams = z.object({ id: uuid('system') })
const calibrationParams = z.object({ id: uuid('calibration') })
const gcMethodParams = z.object({ id: uuid('GC method') })

export const systemRoutes = defineRoutes([
  {
    method: 'get',
    path: '/api/systems',
    access: 'authenticated',
    handler: async (req, res) => {
      const q = parseQuery(systemQuery, req)
      res.json({
        ...(await service.listSystems(ctx(req).db, { q: q.q, ...pageWindow(q.page, q.pageSize) })),
        page: q.page,
        pageSize: q.pageSize,
      })
    },
  },
  {
    method: 'post',
    path: '/api/systems',
    access: ['analyst', 'lead_chemist', 'admin'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.status(201).json(await service.createSystem(db, user.id, parseBody(systemSchema, req)))
    },
  },
  {
    method: 'get',
    path: '/api/systems/:id',
    access: 'authenticated',
    handler: async (req, res) => {
      res.json(await service.getSystem(ctx(req).db, parseParams(systemParams, req).id))
    },
  },
  {
    method: 'get',
    path: '/api/systems/:id/literature',
    access: 'authenticated',
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.json(await systemLiterature(db, user, parseParams(systemParams, req).id))
    },
  },
  {
    method: 'get',
    path: '/api/gc-methods',
    access: LAB,
    handler: async (req, res) => {
      const { page, pageSize, ...q } = parseQuery(gcMethodQuery, req)
      res.json({
        ...(await calibrations.listGcMethodsPage(ctx(req).db, { ...q, ...pageWindow(page, pageSize) })),
        page,
        pageSize,
      })
    },
  },
  {
    method: 'post',
    path: '/api/gc-methods',
    access: ['analyst', 'lead_chemist', 'admin'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.status(201).json(await calibrations.createGcMethod(db, user.id, parseBody(gcMethodSchema, req)))
    },
  },
  {
    method: 'get',
    path: '/api/gc-methods/:id/check-standards',
    access: LAB,
    handler: async (req, res) => {
      const { id } = parseParams(gcMethodParams, req)
      res.json(await gcMethodCheckStandards(ctx(req).db, id, parseQuery(checkStandardQuery, req)))
    },
  },
  {
    method: 'post',
    path: '/api/gc-methods/:id/retire',
    access: ['lead_chemist', 'admin'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.json(await calibrations.retireGcMethod(db, user.id, parseParams(gcMethodParams, req).id))
    },
  },
  {
    method: 'get',
    path: '/api/calibrations',
    access: LAB,
    handler: async (req, res) => {
      const { page, pageSize, ...q } = parseQuery(calibrationQuery, req)
      res.json({
        ...(await calibrations.listCalibrationsPage(ctx(req).db, { ...q, ...pageWindow(page, pageSize) })),
        page,
        pageSize,
      })
    },
  },
  {
    method: 'get',
    path: '/api/calibrations/:id',
    access: LAB,
    handler: async (req, res) => {
      const { db, config } = ctx(req)
      const cal = await calibrations.getCalibration(db, parseParams(calibrationParams, req).id)
      // the lab's replicate limit, so the calibration review judges each standard's RSD against it
      res.json({ ...cal, replicateRsdLimit: config.replicateRsdLimit })
    },
  },
  {
    method: 'post',
    path: '/api/calibrations/preview',
    access: ['analyst', 'lead_chemist'],
    handler: [
      csvUpload,
      async (req, res) => {
        const file = receivedFile(req)
        const { gcMethodId, systemId, model, page, pageSize } = parseBody(calibrationForm, req)
        const { db, config } = ctx(req)
        const preview = await calibrations.previewCalibration(db, config, { gcMethodId, systemId, model }, file, {
          page,
          pageSize,
        })
        res.json({ ...preview, replicateRsdLimit: config.replicateRsdLimit })
      },
    ],
  },
  {
    method: 'post',
    path: '/api/calibrations',
    access: ['analyst', 'lead_chemist'],
    handler: [
      csvUpload,
      async (req, res) => {
        const { db, user, config } = ctx(req)
        const file = receivedFile(req)
        const { acceptWarnings, replaceActive, dataSetId, gcMethodId, systemId, model } = parseBody(
          calibrationForm,
          req,
        )
        res.status(201).json(
          await calibrations.commitCalibration(db, user.id, { gcMethodId, systemId, model }, file, acceptWarnings, {
            replaceActive,
            dataSetId,
            limits: readLimits(config),
          }),
        )
      },
    ],
  },
  {
    method: 'post',
    path: '/api/calibrations/:id/retire',
    access: ['lead_chemist', 'admin'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      await calibrations.retireCalibration(db, user.id, parseParams(calibrationParams, req).id)
      res.json({ ok: true })
    },
  },
])
