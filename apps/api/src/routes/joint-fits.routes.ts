import {
  jointFitRequestSchema,
  jointFitReturnSchema,
  jointFitSignatureSchema,
  jointFitSubmitSchema,
  recommendedCurveQuerySchema,
} from '@ebullio/schemas'
import { toPascal } from '@ebullio/thermo'
import { z } from 'zod'
import { ctx } from '../context.js'
import * as signing from '../services/joint-fit-signing.js'
import * as joint from '../services/joint-fits.service.js'
import { defineRoutes } from './define.js'
import { uuid } from './lab-schemas.js'
import { parseBody, parseParams, parseQuery } from './validate.js'

/** Roles that read lab work in progress (a joint fit names draft data sets). */
const LAB = ['analyst', 'lead_chemist', 'reviewer', 'admin'] as const
const systemParams = z.object({ id: uuid('system') })
const jointParams = z.object({ id: uuid('joint fit') })

/** Joint fits of a system (lab side) and the system's signed recommended parameter set (everyone signed in). */
export const jointFitRoutes = defineRoutes([
  {
    method: 'post',
    path: '/api/systems/:id/joint-fits',
    access: ['lead_chemist'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id } = parseParams(systemParams, req)
      res.status(201).json(await joint.runJointFit(db, user, id, parseBody(jointFitRequestSchema, req)))
    },
  },
  {
    method: 'get',
    path: '/api/systems/:id/joint-fits',
    access: LAB,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.json(await joint.listJointFits(db, user, parseParams(systemParams, req).id))
    },
  },
  {
    method: 'get',
    path: '/api/joint-fits/:id',
    access: LAB,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.json(await joint.jointFitDetail(db, user, parseParams(jointParams, req).id))
    },
  },
  {
    method: 'get',
    path: '/api/joint-fits/:id/plots',
    access: LAB,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.json(await joint.jointFitPlots(db, user, parseParams(jointParams, req).id))
    },
  },
  {
    method: 'delete',
    path: '/api/joint-fits/:id',
    access: ['lead_chemist'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.json(await joint.deleteJointFit(db, user, parseParams(jointParams, req).id))
    },
  },
  {
    method: 'post',
    path: '/api/joint-fits/:id/submit',
    access: ['lead_chemist'],
    handler: async (req, res) => {
      const { db, config, user } = ctx(req)
      const { id } = parseParams(jointParams, req)
      res.json(await joint.submitJointFit(db, config, user, id, parseBody(jointFitSubmitSchema, req).rowVersion))
    },
  },
  {
    method: 'post',
    path: '/api/joint-fits/:id/approve',
    access: ['lead_chemist'],
    handler: async (req, res) => {
      const { db, config, user } = ctx(req)
      const { id } = parseParams(jointParams, req)
      res.json(await signing.approveJointFit(db, config, user, id, parseBody(jointFitSignatureSchema, req)))
    },
  },
  {
    method: 'post',
    path: '/api/joint-fits/:id/return',
    access: ['lead_chemist'],
    handler: async (req, res) => {
      const { db, config, user } = ctx(req)
      const { id } = parseParams(jointParams, req)
      res.json(await signing.returnJointFit(db, config, user, id, parseBody(jointFitReturnSchema, req)))
    },
  },
  {
    method: 'get',
    path: '/api/joint-fits/:id/signatures/verify',
    access: LAB,
    handler: async (req, res) => {
      res.json(await signing.verifyJointFit(ctx(req).db, parseParams(jointParams, req).id))
    },
  },
  {
    method: 'get',
    path: '/api/systems/:id/recommended-parameters',
    access: 'authenticated',
    handler: async (req, res) => {
      res.json(await signing.recommendedSet(ctx(req).db, parseParams(systemParams, req).id))
    },
  },
  {
    method: 'get',
    path: '/api/systems/:id/recommended-parameters/curve',
    access: 'authenticated',
    handler: async (req, res) => {
      const { id } = parseParams(systemParams, req)
      const q = parseQuery(recommendedCurveQuerySchema, req)
      res.json(await signing.recommendedCurve(ctx(req).db, id, { P: toPascal(q.pressure, q.unit), points: q.points }))
    },
  },
])
