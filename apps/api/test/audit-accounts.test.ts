/** Account changes leave an audit trail: invites, accepted invites, role changes, (de)activation, password changes and resets. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import {
  agent,
  createTestContext,
  createUser,
  linkIn,
  PASSWORD,
  resetDatabase,
  signedInAgent,
  type TestContext,
} from './helpers.js'

let t: TestContext
let adminId: string
let anaId: string
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  adminId = await createUser(t.db, { email: 'ada@lab.test', roles: ['admin'], displayName: 'Ada Admin' })
  anaId = await createUser(t.db, { email: 'ana@lab.test', roles: ['analyst'], displayName: 'Ana Analyst' })
})
afterAll(() => t.close())

const trail = async (entityId: string) => {
  const admin = await signedInAgent(t.app, 'ada@lab.test')
  const r = await admin.get('/api/audit').query({ entity: 'app_user', entityId, order: 'asc' })
  expect(r.status, JSON.stringify(r.body)).toBe(200)
  return r.body.items as {
    action: string
    actorId: string | null
    actorName: string | null
    before: unknown
    after: unknown
  }[]
}

describe('audit of account changes', () => {
  it('records an invite with the inviting admin, and its acceptance by the new user', async () => {
    const admin = await signedInAgent(t.app, 'ada@lab.test')
    const created = await admin
      .post('/api/admin/users')
      .send({ email: 'Rui@Lab.test', displayName: 'Rui Reviewer', roles: ['reviewer'] })
      .expect(201)
    const token = linkIn((await t.mail())[0].body_text, '/welcome/').split('/welcome/')[1]
    await agent(t.app).post('/api/auth/accept-invite').send({ token, password: 'a-new-long-password' }).expect(200)
    const rows = await trail(created.body.id)
    expect(rows.map((r) => r.action)).toEqual(['invite user', 'accept invite'])
    expect(rows[0]).toMatchObject({
      actorId: adminId,
      actorName: 'Ada Admin',
      after: { email: 'rui@lab.test', displayName: 'Rui Reviewer', roles: ['reviewer'], invitedBy: 'Ada Admin' },
    })
    expect(rows[1].actorId).toBe(created.body.id)
  })

  it('records role changes with the roles before and after, and (de)activation', async () => {
    const admin = await signedInAgent(t.app, 'ada@lab.test')
    await admin
      .put(`/api/admin/users/${anaId}/roles`)
      .send({ roles: ['analyst', 'reviewer', 'analyst'] })
      .expect(200)
    await admin.post(`/api/admin/users/${anaId}/deactivate`).expect(200)
    await admin.post(`/api/admin/users/${anaId}/activate`).expect(200)
    const rows = await trail(anaId)
    expect(rows.map((r) => [r.action, r.actorId, r.before, r.after])).toEqual([
      ['change roles', adminId, { roles: ['analyst'] }, { roles: ['analyst', 'reviewer'] }],
      ['deactivate user', adminId, { active: true }, { active: false }],
      ['activate user', adminId, { active: false }, { active: true }],
    ])
  })

  it('records nothing when the change is refused', async () => {
    const admin = await signedInAgent(t.app, 'ada@lab.test')
    const before = (await trail(adminId)).length
    const self = await admin.post(`/api/admin/users/${adminId}/deactivate`)
    expect(self.body.error.message).toBe('You cannot deactivate your own account.')
    const ghost = await admin.post('/api/admin/users/00000000-0000-4000-8000-000000000000/deactivate')
    expect(ghost.status).toBe(404)
    expect(ghost.body.error.message).toBe('No such user.')
    const roles = await admin.put(`/api/admin/users/${adminId}/roles`).send({ roles: ['analyst'] })
    expect(roles.body.error.message).toBe('You cannot remove your own administrator role.')
    expect(await trail(adminId)).toHaveLength(before)
    expect(await trail('00000000-0000-4000-8000-000000000000')).toHaveLength(0)
  })

  it('records password changes and resets without any secret', async () => {
    const ana = await signedInAgent(t.app, 'ana@lab.test')
    await ana
      .post('/api/auth/change-password')
      .send({ currentPassword: PASSWORD, newPassword: 'long-enough-password' })
      .expect(200)
    await agent(t.app).post('/api/auth/forgot-password').send({ email: 'ana@lab.test' }).expect(200)
    const token = linkIn((await t.mail())[0].body_text, '/reset-password/').split('/reset-password/')[1]
    await agent(t.app).post('/api/auth/reset-password').send({ token, password: 'brand-new-password' }).expect(200)
    const rows = (await trail(anaId)).filter((r) => r.action.includes('password'))
    expect(rows.map((r) => [r.action, r.actorId, r.before, r.after])).toEqual([
      ['change password', anaId, null, null],
      ['reset password', anaId, null, null],
    ])
  })

  it('pages and filters the whole log, for administrators only', async () => {
    const admin = await signedInAgent(t.app, 'ada@lab.test')
    const page = await admin.get('/api/audit').query({ entity: 'app_user', pageSize: 2 })
    expect(page.body.items).toHaveLength(2)
    expect(page.body.total).toBe(7)
    expect(page.body.items[0].action).toBe('reset password') // newest first by default
    const byActor = await admin.get('/api/audit').query({ actorId: adminId, action: 'change roles' })
    expect(byActor.body.total).toBe(1)
    const ana = await signedInAgent(t.app, 'ana@lab.test', 'brand-new-password')
    expect((await ana.get('/api/audit')).status).toBe(403)
  })
})
