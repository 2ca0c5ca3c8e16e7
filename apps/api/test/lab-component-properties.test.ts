/** Components carry critical constants and structure parameters with their source (for a virial vapour, UNIQUAC). */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, createUser, resetDatabase, signedInAgent, type TestContext } from './helpers.js'
import type { Agent } from './lab-fixture.js'

let t: TestContext
let admin: Agent
let analyst: Agent
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  await createUser(t.db, { email: 'admin@lab.test', roles: ['admin'] })
  await createUser(t.db, { email: 'analyst@lab.test', roles: ['analyst'] })
  admin = await signedInAgent(t.app, 'admin@lab.test')
  analyst = await signedInAgent(t.app, 'analyst@lab.test')
})
afterAll(() => t.close())

// Water: Tc, Pc, ω, Vc as in the Python library chemicals 1.5.2; Tsonopoulos a from Tsonopoulos & Heidman (1990).
const water = {
  Tc: 647.096,
  Pc: 22064000,
  omega: 0.3443,
  Vc: 55.948,
  dipole: 1.85,
  tsonopoulosA: -0.0109,
  tsonopoulosB: 0,
  source: 'chemicals 1.5.2 <b>bold</b> =HYPERLINK("x")',
}

describe('component properties', () => {
  it('stores them as entered, returns them unchanged (markup stays text), and audits the change', async () => {
    const c = await admin
      .post('/api/components')
      .send({ name: 'water', casNumber: '7732-18-5', molarMass: 18.015, properties: water })
      .expect(201)
    expect(c.body.properties).toEqual(water)
    const read = await analyst.get(`/api/components/${c.body.id}`).expect(200)
    expect((read.body.component ?? read.body).properties).toEqual(water)
    const patched = await admin
      .patch(`/api/components/${c.body.id}`)
      .send({ rowVersion: 1, properties: { ...water, uniquacR: 0.92, uniquacQ: 1.4 } })
      .expect(200)
    expect(patched.body.properties.uniquacR).toBe(0.92)
    const audit = await t.db
      .selectFrom('audit_log')
      .select(['action', 'after'])
      .where('entity_id', '=', c.body.id)
      .orderBy('id')
      .execute()
    expect(audit.map((a) => a.action)).toEqual(['create', 'update'])
  })

  it('refuses a negative critical temperature or a missing source, naming the field, and stores nothing', async () => {
    const bad = await admin
      .post('/api/components')
      .send({ name: 'x', casNumber: null, molarMass: 10, properties: { Tc: -5 } })
    expect(bad.status).toBe(422)
    const paths = bad.body.error.details.map((d: { path: string }) => d.path)
    expect(paths).toContain('properties.Tc')
    expect(paths).toContain('properties.source')
    expect(bad.body.error.details).toContainEqual({
      path: 'properties.Tc',
      message: 'The critical temperature must be positive (K)',
    })
    const list = await admin.get('/api/components?q=x').expect(200)
    expect(JSON.stringify(list.body)).not.toContain('"name":"x"')
  })

  it('a component without properties says null', async () => {
    const c = await admin.post('/api/components').send({ name: 'benzene', casNumber: '71-43-2', molarMass: 78.11 })
    expect(c.status).toBe(201)
    expect(c.body.properties).toBeNull()
  })
})
