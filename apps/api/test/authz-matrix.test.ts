import { ROLES, type Role } from '@ebullio/schemas'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Access } from '../src/routes/define.js'
import { allRoutes } from '../src/routes/index.js'
import { agent, createTestContext, createUser, resetDatabase, signedInAgent, type TestContext } from './helpers.js'
import { buildLab, draftWithPoints } from './lab-fixture.js'

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
  'POST /api/admin/mail-outbox/:id/retry': ['admin'],
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
  'GET /api/systems/:id/literature': 'authenticated',
  'GET /api/gc-methods': ['analyst', 'lead_chemist', 'reviewer', 'admin'],
  'POST /api/gc-methods': ['analyst', 'lead_chemist', 'admin'],
  'POST /api/gc-methods/:id/retire': ['lead_chemist', 'admin'],
  'GET /api/gc-methods/:id/check-standards': ['analyst', 'lead_chemist', 'reviewer', 'admin'],
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
  // joint fits and the system's recommended parameter set (issue 13)
  'POST /api/systems/:id/joint-fits': ['lead_chemist'],
  'GET /api/systems/:id/joint-fits': ['analyst', 'lead_chemist', 'reviewer', 'admin'],
  'GET /api/joint-fits/:id': ['analyst', 'lead_chemist', 'reviewer', 'admin'],
  'GET /api/joint-fits/:id/plots': ['analyst', 'lead_chemist', 'reviewer', 'admin'],
  'DELETE /api/joint-fits/:id': ['lead_chemist'],
  'POST /api/joint-fits/:id/submit': ['lead_chemist'],
  'POST /api/joint-fits/:id/approve': ['lead_chemist'],
  'POST /api/joint-fits/:id/return': ['lead_chemist'],
  'GET /api/joint-fits/:id/signatures/verify': ['analyst', 'lead_chemist', 'reviewer', 'admin'],
  'GET /api/systems/:id/recommended-parameters': 'authenticated',
  'GET /api/systems/:id/recommended-parameters/curve': 'authenticated',
}

const key = (r: { method: string; path: string }) => `${r.method.toUpperCase()} ${r.path}`
const INVENTED = '00000000-0000-4000-8000-000000000000'
const concrete = (path: string, ids: (name: string, path: string) => string = () => INVENTED) =>
  path.replace(/:(\w+)/g, (_m, name: string) => (name === 'token' ? 'x'.repeat(40) : ids(name, path)))

let t: TestContext
const agents: Partial<Record<Role, Awaited<ReturnType<typeof signedInAgent>>>> = {}
/** Real objects of other people (a lab built by other users): the matrix users own none of them. */
const real: Record<string, string> = {}
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  for (const role of ROLES) {
    await createUser(t.db, { email: `${role}@matrix.test`, roles: [role] })
    agents[role] = await signedInAgent(t.app, `${role}@matrix.test`)
  }
  const lab = await buildLab(t)
  const d = await draftWithPoints(t, lab, 'Someone else’s series')
  await lab.analyst
    .post(`/api/data-sets/${d.id}/fits`)
    .send({ models: ['wilson'] })
    .expect(201)
  const d2 = await draftWithPoints(t, lab, 'Someone else’s second series')
  const joint = await lab.lead
    .post(`/api/systems/${lab.systemId}/joint-fits`)
    .send({ dataSetIds: [d.id, d2.id], model: 'wilson' })
    .expect(201)
  const comment = await lab.reviewer.post(`/api/data-sets/${d.id}/comments`).send({ body: 'A question.' }).expect(201)
  const first = async (table: 'point' | 'fit' | 'upload' | 'component') =>
    (await t.db.selectFrom(table).select('id').orderBy('id').executeTakeFirstOrThrow()).id
  Object.assign(real, {
    'data-sets': d.id,
    users: lab.ids.analyst2,
    calibrations: lab.calibrationId,
    'gc-methods': lab.gcMethodId,
    systems: lab.systemId,
    components: await first('component'),
    uploads: await first('upload'),
    pointId: await first('point'),
    fitId: await first('fit'),
    commentId: comment.body.id,
    'joint-fits': joint.body.id,
  })
})
afterAll(() => t.close())

/** The real id for a parameter: by its name (`pointId`), or for `:id` by the resource before it (`/api/systems/:id`). */
function realId(name: string, path: string): string {
  if (name !== 'id') return real[name] ?? INVENTED
  const resource = path.match(/\/api\/(?:admin\/)?([\w-]+)\/:id/)?.[1] ?? ''
  return real[resource] ?? INVENTED
}

describe('authorization matrix', () => {
  it('lists every route', () => {
    const missing = allRoutes.map(key).filter((k) => !(k in expected))
    expect(missing, 'routes missing from the authorization matrix').toEqual([])
    const stale = Object.keys(expected).filter((k) => !allRoutes.some((r) => key(r) === k))
    expect(stale, 'matrix entries for routes that no longer exist').toEqual([])
  })

  // Destructive routes run last, so the real objects exist for every other route.
  const destructive = (r: { method: string; path: string }) =>
    r.method === 'delete' || /\/(deactivate|retire|approve|return|submit|revise)$/.test(r.path)
  const ordered = [...allRoutes.filter((r) => !destructive(r)), ...allRoutes.filter(destructive)]
  for (const route of ordered) {
    const access = expected[key(route)]
    if (!access || key(route) === 'POST /api/auth/sign-out') continue
    for (const which of ['invented', 'real'] as const) {
      if (which === 'real' && !route.path.includes('/:')) continue
      it(`${key(route)} is ${Array.isArray(access) ? access.join('|') : access} (${which} ids)`, async () => {
        const url = which === 'real' ? concrete(route.path, realId) : concrete(route.path)
        const call = (a: ReturnType<typeof agent>) => a[route.method](url).send({})
        const anon = await call(agent(t.app))
        expect(anon.status, `anonymous: ${JSON.stringify(anon.body)}`).toBeLessThan(500)
        if (access === 'public') expect([401, 403]).not.toContain(anon.status)
        else expect(anon.status).toBe(401)
        for (const role of ROLES) {
          const r = await call(agents[role]!)
          // a 500 is a failure whoever calls: the server must answer every request it can parse
          expect(r.status, `${role}: ${JSON.stringify(r.body)}`).toBeLessThan(500)
          const allowed = access === 'public' || access === 'authenticated' || access.includes(role)
          if (!allowed) expect(r.status, `${role} should be refused`).toBe(403)
          // with real ids an allowed role may still be refused by ownership (someone else's draft): 403 or 404 then
          else if (which === 'invented') expect([401, 403], `${role} should be allowed`).not.toContain(r.status)
          else expect(r.status, `${role} should be allowed past the role check`).not.toBe(401)
        }
      })
    }
  }
})
