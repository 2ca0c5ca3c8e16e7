/** The admin people list pages and searches in SQL and keeps its old answer shape (`items`, now with `total`). */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, createUser, resetDatabase, signedInAgent, type TestContext } from './helpers.js'

let t: TestContext
let admin: Awaited<ReturnType<typeof signedInAgent>>
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  await createUser(t.db, { email: 'ada@lab.test', roles: ['admin'], displayName: 'Ada Admin' })
  for (let i = 1; i <= 12; i++) {
    await createUser(t.db, {
      email: `analyst${String(i).padStart(2, '0')}@lab.test`,
      roles: ['analyst'],
      displayName: `Analyst ${String(i).padStart(2, '0')}`,
    })
  }
  await createUser(t.db, { email: 'lee@lab.test', roles: ['lead_chemist', 'reviewer'], displayName: 'Lee 100%_Lead' })
  admin = await signedInAgent(t.app, 'ada@lab.test')
})
afterAll(() => t.close())

const names = (b: { items: { displayName: string }[] }) => b.items.map((u) => u.displayName)

describe('GET /api/admin/users', () => {
  it('answers every account by name when not paged, with the total', async () => {
    const r = await admin.get('/api/admin/users').expect(200)
    expect(r.body).toMatchObject({ total: 14, page: 1, pageSize: 100 })
    expect(r.body.items).toHaveLength(14)
    expect(names(r.body).slice(0, 2)).toEqual(['Ada Admin', 'Analyst 01'])
    expect(r.body.items[0]).toMatchObject({
      email: 'ada@lab.test',
      roles: ['admin'],
      active: true,
      invitePending: false,
    })
  })

  it('pages in SQL: page 2 of 5 continues page 1, the total stays', async () => {
    const p1 = await admin.get('/api/admin/users').query({ page: 1, pageSize: 5 }).expect(200)
    const p2 = await admin.get('/api/admin/users').query({ page: 2, pageSize: 5 }).expect(200)
    expect([p1.body.total, p2.body.total]).toEqual([14, 14])
    expect(names(p2.body)).toEqual(['Analyst 05', 'Analyst 06', 'Analyst 07', 'Analyst 08', 'Analyst 09'])
  })

  it('searches name and e-mail, literally (% and _ are not wildcards), and filters by role and status', async () => {
    expect(names((await admin.get('/api/admin/users').query({ q: 'ANALYST1' }).expect(200)).body)).toEqual([
      'Analyst 10',
      'Analyst 11',
      'Analyst 12',
    ])
    expect(names((await admin.get('/api/admin/users').query({ q: '100%_' }).expect(200)).body)).toEqual([
      'Lee 100%_Lead',
    ])
    expect((await admin.get('/api/admin/users').query({ q: '%' }).expect(200)).body.total).toBe(1)
    const reviewers = await admin.get('/api/admin/users').query({ role: 'reviewer' }).expect(200)
    expect(reviewers.body.items).toEqual([
      expect.objectContaining({
        displayName: 'Lee 100%_Lead',
        roles: expect.arrayContaining(['lead_chemist', 'reviewer']),
      }),
    ])
    const lee = reviewers.body.items[0].id
    await admin.post(`/api/admin/users/${lee}/deactivate`).expect(200)
    expect(names((await admin.get('/api/admin/users').query({ status: 'deactivated' }).expect(200)).body)).toEqual([
      'Lee 100%_Lead',
    ])
    expect((await admin.get('/api/admin/users').query({ status: 'active' }).expect(200)).body.total).toBe(13)
    expect(
      (await admin.get('/api/admin/users').query({ sort: 'email', order: 'desc', pageSize: 1 }).expect(200)).body
        .items[0].email,
    ).toBe('lee@lab.test')
  })

  it('lists every bad query field', async () => {
    const r = await admin.get('/api/admin/users').query({ role: 'wizard', pageSize: 0 }).expect(422)
    expect(r.body.error.message).toBe('Some fields are not valid: role, pageSize.')
    expect(r.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['pageSize', 'role'])
  })
})
