/** Points entered directly (grid or point sheet), the origin mark of literature data, and check measurements. */
import { checkMeasurementSchema, directPointsSchema, ownMeasurementSchema } from '@ebullio/schemas'
import { z } from 'zod'
import { ctx } from '../context.js'
import { badRequest } from '../errors/index.js'
import * as checks from '../services/checks.service.js'
import * as datasets from '../services/datasets.service.js'
import * as direct from '../services/direct-points.service.js'
import { defineRoutes } from './define.js'
import { idParams } from './lab-schemas.js'
import { csvUpload, receivedFile } from './upload-middleware.js'
import { parseBody, parseParams, parseQuery } from './validate.js'

const AUTHORS = ['analyst', 'lead_chemist'] as const
const LAB = ['analyst', 'lead_chemist', 'reviewer', 'admin'] as const
const sheetForm = z.object({ rowVersion: z.coerce.number().int().min(1).optional() })
const checkQuery = z.object({
  kind: z.enum(['thermometer', 'barometer']).optional(),
  instrument: z.string().trim().max(120).optional(),
})

export const directDataRoutes = defineRoutes([
  {
    method: 'post',
    path: '/api/data-sets/:id/points',
    access: AUTHORS,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const body = parseBody(directPointsSchema, req)
      res.status(201).json(await direct.addTypedPoints(db, user, parseParams(idParams, req).id, body))
    },
  },
  {
    method: 'post',
    path: '/api/data-sets/:id/point-sheets/preview',
    access: AUTHORS,
    handler: [
      csvUpload,
      async (req, res) => {
        const { db, user } = ctx(req)
        res.json(await direct.previewPointSheet(db, user, parseParams(idParams, req).id, receivedFile(req)))
      },
    ],
  },
  {
    method: 'post',
    path: '/api/data-sets/:id/point-sheets',
    access: AUTHORS,
    handler: [
      csvUpload,
      async (req, res) => {
        const { db, user } = ctx(req)
        const file = receivedFile(req)
        const { rowVersion } = parseBody(sheetForm, req)
        if (rowVersion === undefined)
          throw badRequest("Send the data set's rowVersion with the file, so a stale upload can be refused.")
        res.status(201).json(await direct.commitPointSheet(db, user, parseParams(idParams, req).id, file, rowVersion))
      },
    ],
  },
  {
    method: 'post',
    path: '/api/data-sets/:id/own-measurement',
    access: ['lead_chemist'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const body = parseBody(ownMeasurementSchema, req)
      res.json(await datasets.setOwnMeasurement(db, user, parseParams(idParams, req).id, body))
    },
  },
  {
    method: 'get',
    path: '/api/check-measurements',
    access: LAB,
    handler: async (req, res) => {
      res.json({ items: await checks.listChecks(ctx(req).db, parseQuery(checkQuery, req)) })
    },
  },
  {
    method: 'post',
    path: '/api/check-measurements',
    access: ['analyst', 'lead_chemist'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.status(201).json(await checks.addCheck(db, user.id, parseBody(checkMeasurementSchema, req)))
    },
  },
])
