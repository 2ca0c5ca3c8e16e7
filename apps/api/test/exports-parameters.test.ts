/**
 * The parameters export labels each vapour-pressure set with its component, in JSON and CSV
 * (layout: docs/csv-formats.md). Over the demo scenario (invented measurements, published constants).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { seedLab } from '../../../db/seeds/lab.js'
import { DEMO_PASSWORD, seedUsers } from '../../../db/seeds/users.js'
import { createTestContext, resetDatabase, signedInAgent, type TestContext } from './helpers.js'

let t: TestContext
let engineer: Awaited<ReturnType<typeof signedInAgent>>
let dataSetId: string
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  await seedLab(t.db, await seedUsers(t.db))
  engineer = await signedInAgent(t.app, 'engineer@demo.ebullio.test', DEMO_PASSWORD)
  const cat = await engineer.get('/api/catalogue').query({ q: 'acetone' }).expect(200)
  dataSetId = cat.body.items[0].approved[0].dataSetId
})
afterAll(() => t.close())

/** A small RFC 4180 reader (quoted cells, doubled quotes, no line breaks inside cells), enough for the export. */
function parseCsv(text: string): string[][] {
  return text
    .trim()
    .split('\n')
    .map((l) => {
      const cells: string[] = []
      let cell = ''
      let quoted = false
      for (let i = 0; i < l.length; i++) {
        const ch = l[i]
        if (quoted && ch === '"' && l[i + 1] === '"') {
          cell += '"'
          i++
        } else if (ch === '"') quoted = !quoted
        else if (ch === ',' && !quoted) {
          cells.push(cell)
          cell = ''
        } else cell += ch
      }
      return [...cells, cell]
    })
}

describe('parameters export', () => {
  it('names the component of each vapour-pressure set in the JSON (1 = acetone, 2 = methanol)', async () => {
    const res = await engineer.get(`/api/data-sets/${dataSetId}/export/parameters.json`).expect(200)
    const p = JSON.parse(res.text)
    expect(p.format).toBe('ebullio-parameters/1')
    expect(p.vaporPressure.map((v: { component: unknown }) => v.component)).toEqual([
      { index: 1, name: 'acetone', cas: '67-64-1' },
      { index: 2, name: 'methanol', cas: '67-56-1' },
    ])
    // SVNA 7th ed. Table B.2: acetone A = 14.3145, B = 2756.22, C = 228.060 (ln, kPa, °C); methanol A = 16.5785
    expect(p.vaporPressure[0]).toMatchObject({
      kind: 'antoine',
      A: 14.3145,
      B: 2756.22,
      C: 228.06,
      log: 'ln',
      pressureUnit: 'kPa',
      temperatureUnit: 'C',
    })
    expect(p.vaporPressure[1]).toMatchObject({ kind: 'antoine', A: 16.5785 })
  })

  it('keeps the original seven CSV columns first and adds labelled vapour-pressure rows after the fit rows', async () => {
    const res = await engineer.get(`/api/data-sets/${dataSetId}/export/parameters.csv`).expect(200)
    const rows = parseCsv(res.text)
    expect(rows[0]).toEqual([
      'fit_id',
      'model',
      'recommended',
      'parameter',
      'value',
      'standard_error',
      'unit',
      'component',
      'component_name',
      'cas',
    ])
    expect(rows.every((r) => r.length === 10)).toBe(true)
    const body = rows.slice(1)
    const firstVp = body.findIndex((r) => r[1].startsWith('vapour-pressure/'))
    expect(firstVp).toBeGreaterThan(0)
    expect(body.slice(0, firstVp).every((r) => r[0] !== '' && r[7] === '' && r[8] === '' && r[9] === '')).toBe(true)
    const vp = body.filter((r) => r[1].startsWith('vapour-pressure/'))
    expect(body.slice(firstVp, firstVp + vp.length)).toEqual(vp)
    expect(vp.every((r) => r[1] === 'vapour-pressure/antoine' && r[0] === '' && r[2] === '')).toBe(true)
    const acetone = vp.filter((r) => r[7] === '1')
    expect(acetone.every((r) => r[8] === 'acetone' && r[9] === '67-64-1')).toBe(true)
    expect(Object.fromEntries(acetone.map((r) => [r[3], r[4]]))).toMatchObject({
      A: '14.3145',
      B: '2756.22',
      C: '228.06',
      log: 'ln',
      pressureUnit: 'kPa',
      temperatureUnit: 'C',
    })
    expect(acetone.at(-1)?.[3]).toBe('source')
    expect(acetone.at(-1)?.[4]).toContain('Table B.2')
    expect(vp.filter((r) => r[7] === '2').every((r) => r[8] === 'methanol' && r[9] === '67-56-1')).toBe(true)
  })
})
