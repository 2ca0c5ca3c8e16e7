import { ctx } from '../context.js'
import * as comments from '../services/comments.service.js'
import * as fits from '../services/fits.service.js'
import * as uncertainty from '../services/uncertainty.service.js'
import * as workflow from '../services/workflow.service.js'
import { pageWindow } from '../services/lab-access.js'
import { defineRoutes } from './define.js'
import {
  bandQuerySchema,
  commentSchema,
  consistencyRequestSchema,
  fitRequestSchema,
  nextCompositionsQuerySchema,
  pureComponentCheckQuerySchema,
  recommendedFitSchema,
  rowVersionSchema,
  signatureSchema,
} from '@ebullio/schemas'
import { toPascal } from '@ebullio/thermo'
import { z } from 'zod'
import { commentParams, idParams, myThreadsQuery, uuid } from './lab-schemas.js'
import { parseBody, parseParams, parseQuery } from './validate.js'

const AUTHORS = ['analyst', 'lead_chemist'] as const
const DISCUSSANTS = ['analyst', 'lead_chemist', 'reviewer'] as const
const LAB = ['analyst', 'lead_chemist', 'reviewer', 'admin'] as const
const fitParams = z.object({ id: uuid('data set'), fitId: uuid('fit') })
/** A query's pressure in Pa, or undefined for the data set's nominal pressure. */
const pascal = (q: { pressure?: number; unit: Parameters<typeof toPascal>[1] }) =>
  q.pressure === undefined ? undefined : toPascal(q.pressure, q.unit)

export const reviewRoutes = defineRoutes([
  {
    method: 'post',
    path: '/api/data-sets/:id/fits',
    access: AUTHORS,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res
        .status(201)
        .json(await fits.runFits(db, user, parseParams(idParams, req).id, parseBody(fitRequestSchema, req)))
    },
  },
  {
    method: 'get',
    path: '/api/data-sets/:id/fits',
    access: 'authenticated',
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.json(await fits.listFitsWithStale(db, user, parseParams(idParams, req).id))
    },
  },
  {
    method: 'delete',
    path: '/api/data-sets/:id/fits/:fitId',
    access: AUTHORS,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id, fitId } = parseParams(fitParams, req)
      res.json(await fits.deleteFit(db, user, id, fitId))
    },
  },
  {
    method: 'get',
    path: '/api/data-sets/:id/fits/:fitId/band',
    access: 'authenticated',
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id, fitId } = parseParams(fitParams, req)
      const q = parseQuery(bandQuerySchema, req)
      res.json(await uncertainty.fitBand(db, user, id, fitId, { P: pascal(q), points: q.points }))
    },
  },
  {
    method: 'get',
    path: '/api/data-sets/:id/fits/:fitId/next-compositions',
    access: LAB,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id, fitId } = parseParams(fitParams, req)
      const q = parseQuery(nextCompositionsQuerySchema, req)
      res.json(
        await uncertainty.nextCompositions(db, user, id, fitId, {
          P: pascal(q),
          count: q.count,
          criterion: q.criterion,
          range: [q.from, q.to],
          exclusion: q.exclusion,
        }),
      )
    },
  },
  {
    method: 'get',
    path: '/api/data-sets/:id/pure-component-check',
    access: 'authenticated',
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id } = parseParams(idParams, req)
      res.json(
        await uncertainty.dataSetPureComponentCheck(
          db,
          user,
          id,
          parseQuery(pureComponentCheckQuerySchema, req).toleranceK,
        ),
      )
    },
  },
  {
    method: 'post',
    path: '/api/data-sets/:id/recommended-fit',
    access: ['lead_chemist'],
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id } = parseParams(idParams, req)
      res.json(await fits.markRecommended(db, user, id, parseBody(recommendedFitSchema, req).fitId))
    },
  },
  {
    method: 'post',
    path: '/api/data-sets/:id/consistency',
    access: AUTHORS,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id } = parseParams(idParams, req)
      res.status(201).json(await fits.runConsistency(db, user, id, parseBody(consistencyRequestSchema, req).model))
    },
  },
  {
    method: 'post',
    path: '/api/data-sets/:id/comments',
    access: DISCUSSANTS,
    handler: async (req, res) => {
      const { db, config, user } = ctx(req)
      res
        .status(201)
        .json(await comments.addComment(db, config, user, parseParams(idParams, req).id, parseBody(commentSchema, req)))
    },
  },
  {
    method: 'post',
    path: '/api/data-sets/:id/comments/:commentId/resolve',
    access: DISCUSSANTS,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id, commentId } = parseParams(commentParams, req)
      res.json(await comments.setThreadResolved(db, user, id, commentId, true))
    },
  },
  {
    method: 'post',
    path: '/api/data-sets/:id/comments/:commentId/reopen',
    access: DISCUSSANTS,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { id, commentId } = parseParams(commentParams, req)
      res.json(await comments.setThreadResolved(db, user, id, commentId, false))
    },
  },
  {
    method: 'get',
    path: '/api/comments/mine',
    access: DISCUSSANTS,
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      const { page, pageSize } = parseQuery(myThreadsQuery, req)
      res.json({ ...(await comments.listOpenThreadsOf(db, user.id, pageWindow(page, pageSize))), page, pageSize })
    },
  },
  {
    method: 'post',
    path: '/api/data-sets/:id/submit',
    access: AUTHORS,
    handler: async (req, res) => {
      const { db, config, user } = ctx(req)
      const { id } = parseParams(idParams, req)
      res.json(await workflow.submit(db, config, user, id, parseBody(rowVersionSchema, req).rowVersion))
    },
  },
  {
    method: 'post',
    path: '/api/data-sets/:id/approve',
    access: ['lead_chemist'],
    handler: async (req, res) => {
      const { db, config, user } = ctx(req)
      const { id } = parseParams(idParams, req)
      res.json(await workflow.approve(db, config, user, id, parseBody(signatureSchema, req)))
    },
  },
  {
    method: 'post',
    path: '/api/data-sets/:id/return',
    access: ['lead_chemist'],
    handler: async (req, res) => {
      const { db, config, user } = ctx(req)
      const { id } = parseParams(idParams, req)
      res.json(await workflow.returnForRework(db, config, user, id, parseBody(signatureSchema, req)))
    },
  },
  {
    method: 'get',
    path: '/api/data-sets/:id/signatures/verify',
    access: 'authenticated',
    handler: async (req, res) => {
      const { db, user } = ctx(req)
      res.json(await workflow.verifySignatures(db, user, parseParams(idParams, req).id))
    },
  },
])
