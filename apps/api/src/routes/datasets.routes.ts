import { ctx } from '../context.js'
import * as service from '../services/datasets.service.js'
import * as uploads from '../services/uploads.service.js'
import { defineRoutes } from './define.js'
import { dataSetCreateSchema, dataSetPatchSchema, exclusionSchema } from '@ebullio/schemas'
import { dataSetQuery, idParams, pointParams, runForm } from './lab-schemas.js'
import { csvUpload, receivedFile } from './upload-middleware.js'
import { parseBody, parseParams, parseQuery } from './validate.js'
import { badRequest } from '../errors/index.js'

const AUTHORS = ['analyst', 'lead_chemist'] as const
const LAB = ['analyst', 'lead_chemist', 'reviewer', 'admin'] as const

export const dataSetRoutes = defineRoutes([
  {
    method: 'get',
    path: '/api/data-sets',
    access: 'authenticated',
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.json(await service.listDataSets(db, user, parseQuery(dataSetQuery, req)))
    },
  },
  {
    method: 'post',
    path: '/api/data-sets',
    access: AUTHORS,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.status(201).json(await service.createDataSet(db, user.id, parseBody(dataSetCreateSchema, req)))
    },
  },
  {
    method: 'get',
    path: '/api/data-sets/:id',
    access: 'authenticated',
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.json(await service.getDataSetDetail(db, user, parseParams(idParams, req).id))
    },
  },
  {
    method: 'patch',
    path: '/api/data-sets/:id',
    access: AUTHORS,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id } = parseParams(idParams, req)
      const { rowVersion, ...patch } = parseBody(dataSetPatchSchema, req)
      res.json(await service.updateMetadata(db, user, id, rowVersion, patch))
    },
  },
  {
    method: 'delete',
    path: '/api/data-sets/:id',
    access: AUTHORS,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      await service.deleteDraft(db, user, parseParams(idParams, req).id)
      res.status(204).end()
    },
  },
  {
    method: 'post',
    path: '/api/data-sets/:id/revise',
    access: AUTHORS,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.status(201).json(await service.reviseDataSet(db, user, parseParams(idParams, req).id))
    },
  },
  {
    method: 'get',
    path: '/api/data-sets/:id/points/:pointId',
    access: 'authenticated',
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id, pointId } = parseParams(pointParams, req)
      res.json(await service.getPointDetail(db, user, id, pointId))
    },
  },
  {
    method: 'patch',
    path: '/api/data-sets/:id/points/:pointId',
    access: AUTHORS,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id, pointId } = parseParams(pointParams, req)
      const body = parseBody(exclusionSchema, req)
      res.json(await service.setPointExclusion(db, user, id, pointId, { ...body, reason: body.reason ?? null }))
    },
  },
  {
    method: 'get',
    path: '/api/data-sets/:id/audit',
    access: LAB,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.json({ items: await service.auditTrail(db, user, parseParams(idParams, req).id) })
    },
  },
  {
    method: 'post',
    path: '/api/data-sets/:id/uploads/preview',
    access: AUTHORS,
    handler: [
      csvUpload,
      async (req, res) => {
        const { db, config, user } = ctx(req)
        const file = receivedFile(req)
        const { id } = parseParams(idParams, req)
        const form = parseBody(runForm, req)
        const page = { page: form.page, pageSize: form.pageSize }
        res.json(await uploads.previewRun(db, config, user, id, file, form.calibrationId, page))
      },
    ],
  },
  {
    method: 'post',
    path: '/api/data-sets/:id/uploads',
    access: AUTHORS,
    handler: [
      csvUpload,
      async (req, res) => {
        const { db, config, user } = ctx(req)
        const file = receivedFile(req)
        const { id } = parseParams(idParams, req)
        const form = parseBody(runForm, req)
        if (form.rowVersion === undefined)
          throw badRequest("Send the data set's rowVersion with the file, so a stale upload can be refused.")
        res
          .status(201)
          .json(await uploads.commitRun(db, config, user, id, file, { ...form, rowVersion: form.rowVersion }))
      },
    ],
  },
])
