import { ROLES, type Role } from '@ebullio/schemas'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Access } from '../src/routes/define.js'
import { allRoutes } from '../src/routes/index.js'
import { agent, createTestContext, createUser, resetDatabase, signedInAgent, type TestContext } from './helpers.js'

/**
 * Who may call each route. Every route in `allRoutes` must be listed here: add new routes to this table.
 * 'public' = anyone; 'authenticated' = any signed-in user; a list = holders of at least one of those roles.
 */
const expected: Record<string, Access> = {
  'POST /api/auth/sign-in': 'public',
  'POST /api/auth/sign-out': 'authenticated',
  'GET /api/auth/me': 'authenticated',
  'PATCH /api/auth/me/preferences': 'authenticated',
  'POST /api/auth/change-password': 'authenticated',
  'POST /api/auth/forgot-password': 'public',
  'POST /api/auth/reset-password': 'public',
  'GET /api/auth/invites/:token': 'public',
  'POST /api/auth/accept-invite': 'public',
  'GET /api/admin/users': ['admin'],
  'POST /api/admin/users': ['admin'],
  'PUT /api/admin/users/:id/roles': ['admin'],
  'POST /api/admin/users/:id/deactivate': ['admin'],
  'POST /api/admin/users/:id/activate': ['admin'],
  'GET /api/dev/mail': ['admin'],
  'GET /api/admin/mail-outbox': ['admin'],
  'GET /api/health': 'public',
  'GET /api/ready': 'public',
  // lab workflow (issue 5)
  'GET /api/components': 'authenticated',
  'POST /api/components': ['admin', 'lead_chemist'],
  'GET /api/components/:id': 'authenticated',
  'PATCH /api/components/:id': ['admin', 'lead_chemist'],
  'DELETE /api/components/:id': ['admin'],
  'POST /api/components/:id/vapor-pressure-sets': ['admin', 'lead_chemist'],
  'POST /api/components/:id/pure-measurements': ['analyst', 'lead_chemist', 'admin'],
  'POST /api/components/:id/vapor-pressure-sets/fit': ['admin', 'lead_chemist'],
  'GET /api/systems': 'authenticated',
  'POST /api/systems': ['analyst', 'lead_chemist', 'admin'],
  'GET /api/systems/:id': 'authenticated',
  'GET /api/gc-methods': ['analyst', 'lead_chemist', 'reviewer', 'admin'],
  'POST /api/gc-methods': ['analyst', 'lead_chemist', 'admin'],
  'POST /api/gc-methods/:id/retire': ['lead_chemist', 'admin'],
  'GET /api/calibrations': ['analyst', 'lead_chemist', 'reviewer', 'admin'],
  'GET /api/calibrations/:id': ['analyst', 'lead_chemist', 'reviewer', 'admin'],
  'POST /api/calibrations/preview': ['analyst', 'lead_chemist'],
  'POST /api/calibrations': ['analyst', 'lead_chemist'],
  'POST /api/calibrations/:id/retire': ['lead_chemist', 'admin'],
  'GET /api/data-sets': 'authenticated',
  'POST /api/data-sets': ['analyst', 'lead_chemist'],
  'GET /api/data-sets/:id': 'authenticated',
  'PATCH /api/data-sets/:id': ['analyst', 'lead_chemist'],
  'DELETE /api/data-sets/:id': ['analyst', 'lead_chemist'],
  'POST /api/data-sets/:id/revise': ['analyst', 'lead_chemist'],
  'GET /api/data-sets/:id/points/:pointId': 'authenticated',
  'PATCH /api/data-sets/:id/points/:pointId': ['analyst', 'lead_chemist'],
  'GET /api/data-sets/:id/audit': ['analyst', 'lead_chemist', 'reviewer', 'admin'],
  'POST /api/data-sets/:id/uploads/preview': ['analyst', 'lead_chemist'],
  'POST /api/data-sets/:id/uploads': ['analyst', 'lead_chemist'],
  'POST /api/data-sets/:id/fits': ['analyst', 'lead_chemist'],
  'GET /api/data-sets/:id/fits': 'authenticated',
  'DELETE /api/data-sets/:id/fits/:fitId': ['analyst', 'lead_chemist'],
  'GET /api/data-sets/:id/fits/:fitId/band': 'authenticated',
  'GET /api/data-sets/:id/fits/:fitId/next-compositions': ['analyst', 'lead_chemist', 'reviewer', 'admin'],
  'GET /api/data-sets/:id/pure-component-check': 'authenticated',
  'POST /api/data-sets/:id/recommended-fit': ['lead_chemist'],
  'POST /api/data-sets/:id/consistency': ['analyst', 'lead_chemist'],
  'POST /api/data-sets/:id/comments': ['analyst', 'lead_chemist', 'reviewer'],
  'POST /api/data-sets/:id/comments/:commentId/resolve': ['analyst', 'lead_chemist', 'reviewer'],
  'POST /api/data-sets/:id/comments/:commentId/reopen': ['analyst', 'lead_chemist', 'reviewer'],
  'GET /api/comments/mine': ['analyst', 'lead_chemist', 'reviewer'],
  'POST /api/data-sets/:id/submit': ['analyst', 'lead_chemist'],
  'POST /api/data-sets/:id/approve': ['lead_chemist'],
  'POST /api/data-sets/:id/return': ['lead_chemist'],
  'GET /api/data-sets/:id/signatures/verify': 'authenticated',
  'GET /api/catalogue': 'authenticated',
  'GET /api/data-sets/:id/curve': 'authenticated',
  'GET /api/data-sets/:id/export/points.csv': 'authenticated',
  'GET /api/data-sets/:id/export/parameters.json': 'authenticated',
  'GET /api/data-sets/:id/export/parameters.csv': 'authenticated',
  'GET /api/uploads/:id/content': ['analyst', 'lead_chemist', 'reviewer', 'admin'],
  'GET /api/audit': ['admin'],
  // printed reports (issue 11): engineers get 404 for versions not approved or superseded
  'GET /api/data-sets/:id/report.pdf': 'authenticated',
  'GET /api/reports/:id/verify': 'authenticated',
  'POST /api/data-sets/:id/points': ['analyst', 'lead_chemist'],
  'POST /api/data-sets/:id/point-sheets/preview': ['analyst', 'lead_chemist'],
  'POST /api/data-sets/:id/point-sheets': ['analyst', 'lead_chemist'],
  'POST /api/data-sets/:id/own-measurement': ['lead_chemist'],
  'GET /api/check-measurements': ['analyst', 'lead_chemist', 'reviewer', 'admin'],
  'POST /api/check-measurements': ['analyst', 'lead_chemist'],
}

const key = (r: { method: string; path: string }) => `${r.method.toUpperCase()} ${r.path}`
const concrete = (path: string) =>
  path.replace(/:(\w+)/g, (_m, name: string) =>
    name === 'token' ? 'x'.repeat(40) : '00000000-0000-4000-8000-000000000000',
  )

let t: TestContext
const agents: Partial<Record<Role, Awaited<ReturnType<typeof signedInAgent>>>> = {}
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  for (const role of ROLES) {
    await createUser(t.db, { email: `${role}@matrix.test`, roles: [role] })
    agents[role] = await signedInAgent(t.app, `${role}@matrix.test`)
  }
})
afterAll(() => t.close())

describe('authorization matrix', () => {
  it('lists every route', () => {
    const missing = allRoutes.map(key).filter((k) => !(k in expected))
    expect(missing, 'routes missing from the authorization matrix').toEqual([])
    const stale = Object.keys(expected).filter((k) => !allRoutes.some((r) => key(r) === k))
    expect(stale, 'matrix entries for routes that no longer exist').toEqual([])
  })

  for (const route of allRoutes) {
    const access = expected[key(route)]
    if (!access || key(route) === 'POST /api/auth/sign-out') continue
    it(`${key(route)} is ${Array.isArray(access) ? access.join('|') : access}`, async () => {
      const call = (a: ReturnType<typeof agent>) => a[route.method](concrete(route.path)).send({})
      const anon = await call(agent(t.app))
      if (access === 'public') expect([401, 403]).not.toContain(anon.status)
      else expect(anon.status).toBe(401)
      for (const role of ROLES) {
        const r = await call(agents[role]!)
        const allowed = access === 'public' || access === 'authenticated' || access.includes(role)
        if (allowed) expect([401, 403], `${role} should be allowed`).not.toContain(r.status)
        else expect(r.status, `${role} should be refused`).toBe(403)
      }
    })
  }
})
