/** Components and systems: CAS check digits, unordered pair uniqueness, stale component edits. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, createUser, resetDatabase, signedInAgent, type TestContext } from './helpers.js'
import { vaporPressure } from '@ebullio/thermo'
import type { Agent } from './lab-fixture.js'
import { demoVaporPressure } from '../../../db/seeds/demo-systems.js'

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

describe('components', () => {
  it('checks the CAS check digit (water 7732-18-5 is valid, 7732-18-4 is not)', async () => {
    // CAS Registry Number check digit: weighted digit sum modulo 10 (CAS, "Check Digit Verification of CAS Registry Numbers", from memory)
    await admin.post('/api/components').send({ name: 'water', casNumber: '7732-18-5', molarMass: 18.015 }).expect(201)
    const bad = await admin
      .post('/api/components')
      .send({ name: 'not water', casNumber: '7732-18-4', molarMass: 18.015 })
    expect(bad.status).toBe(409)
    expect(bad.body.error.message).toBe('The CAS number is not valid (its check digit does not match).')
    const shape = await admin.post('/api/components').send({ name: 'x', casNumber: '77321854', molarMass: 1 })
    expect(shape.status).toBe(422)
    expect(shape.body.error.details).toEqual([
      { path: 'casNumber', message: 'Write the CAS number as digits in three groups, e.g. 67-64-1' },
    ])
    const dup = await admin.post('/api/components').send({ name: 'water', casNumber: null, molarMass: 18 })
    expect(dup.body.error.message).toBe('A component with this name already exists.')
  })

  it('refuses a stale component edit', async () => {
    const c = await admin
      .post('/api/components')
      .send({ name: 'ethanol', casNumber: '64-17-5', molarMass: 46.07 })
      .expect(201)
    await admin.patch(`/api/components/${c.body.id}`).send({ rowVersion: 1, formula: 'C2H6O' }).expect(200)
    const stale = await admin.patch(`/api/components/${c.body.id}`).send({ rowVersion: 1, formula: 'C2H5OH' })
    expect(stale.status).toBe(409)
    expect(stale.body.error.message).toBe(
      'This component was changed by someone else (you had version 1, it is now 2). Reload it.',
    )
  })

  it('keeps a binary system unique whichever way round it is entered', async () => {
    const list = await analyst.get('/api/components?q=a').expect(200)
    const [ethanol, water] = ['ethanol', 'water'].map(
      (n) => list.body.items.find((c: { name: string }) => c.name === n).id,
    )
    const s = await analyst.post('/api/systems').send({ component1Id: ethanol, component2Id: water }).expect(201)
    expect(s.body.name).toBe('ethanol / water')
    const again = await analyst.post('/api/systems').send({ component1Id: water, component2Id: ethanol })
    expect(again.status).toBe(409)
    expect(again.body.error).toMatchObject({
      message: 'The system ethanol / water already exists.',
      details: { systemId: s.body.id },
    })
    const same = await analyst.post('/api/systems').send({ component1Id: water, component2Id: water })
    expect(same.body.error.message).toBe('A binary system needs two different components.')
    const inUse = await admin.delete(`/api/components/${water}`)
    expect(inUse.body.error.message).toBe('This component belongs to a binary system and cannot be deleted.')
  })

  it('fits an Antoine set to measured boiling points and stores it with its origin', async () => {
    const list = await analyst.get('/api/components?q=water').expect(200)
    const water = list.body.items[0].id
    // boiling points generated from SVNA 7th ed. Table B.2 water constants (ln kPa, °C): the fit must give them back
    const svna = demoVaporPressure('water')
    for (const tC of [30, 45, 60, 75, 90, 100]) {
      const T = tC + 273.15
      await analyst
        .post(`/api/components/${water}/pure-measurements`)
        .send({ temperatureK: T, pressurePa: vaporPressure(svna, T), note: null })
        .expect(201)
    }
    const r = await admin.post(`/api/components/${water}/vapor-pressure-sets/fit`).send({ preferred: false })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    expect(r.body.set.source).toBe('Fitted in Ebullio to 6 measured boiling points')
    expect(r.body.set.parameters.A).toBeCloseTo(16.3872, 2)
    expect(r.body.set.parameters.B).toBeCloseTo(3885.7, -1)
    const c = await analyst.get(`/api/components/${water}`).expect(200)
    expect(c.body.pureMeasurements).toHaveLength(6)
    expect(c.body.vaporPressureSets).toHaveLength(1)
  })
})
