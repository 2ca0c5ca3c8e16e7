import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, resetDatabase, type TestContext } from './helpers.js'
import { buildLab, csv, example, labCounts, type Lab } from './lab-fixture.js'

let t: TestContext
let lab: Lab
let dataSet: { id: string; rowVersion: number }
beforeAll(async () => {
  t = await createTestContext({ UPLOAD_MAX_BYTES: '200000' })
  await resetDatabase(t.db)
  lab = await buildLab(t)
  const d = await lab.analyst
    .post('/api/data-sets')
    .send({ systemId: lab.systemId, title: 'Upload checks', nominalPressurePa: 101325 })
    .expect(201)
  dataSet = { id: d.body.id, rowVersion: d.body.rowVersion }
})
afterAll(() => t.close())

const preview = (file: Buffer | string, name = 'run.csv', type = 'text/csv') =>
  csv(lab.analyst.post(`/api/data-sets/${dataSet.id}/uploads/preview`), file, name, type)
const commit = (file: Buffer | string, fields: Record<string, string> = {}, name = 'run.csv', type = 'text/csv') => {
  let r = csv(lab.analyst.post(`/api/data-sets/${dataSet.id}/uploads`), file, name, type)
  for (const [k, v] of Object.entries({ rowVersion: String(dataSet.rowVersion), acceptWarnings: 'true', ...fields }))
    r = r.field(k, v)
  return r
}

describe('calibration upload', () => {
  it('previews the fitted calibration with standards, mapping and no problems', async () => {
    const r = await csv(
      lab.analyst.post('/api/calibrations/preview'),
      example('calibration-acetone-methanol.csv'),
      'cal.csv',
    )
      .field('gcMethodId', lab.gcMethodId)
      .field('systemId', lab.systemId)
      .field('model', 'response-factor')
    expect(r.status).toBe(200)
    expect(r.body.standards).toHaveLength(8)
    expect(r.body.errorCount).toBe(0)
    // the generator simulated a relative response factor of 1.32 (demo-systems.ts); 8 standards × 3 injections recover it
    expect(r.body.calibration.coefficients[0]).toBeCloseTo(1.32, 1)
  })
})

describe('run upload preview', () => {
  it('returns parsed rows, the mapping, x and y per sample and nothing is stored', async () => {
    const before = await labCounts(t)
    const r = await preview(example('run-acetone-methanol.csv'))
    expect(r.status).toBe(200)
    expect(r.body.errorCount).toBe(0)
    expect(r.body.samples).toHaveLength(12)
    expect(r.body.mapping).toMatchObject({ sample: 'sample', area_1: 'area_1', t_boil: 't_boil' })
    for (const s of r.body.samples) {
      expect(s.x1).toBeGreaterThan(0)
      expect(s.y1).toBeLessThan(1)
      expect(s.x1Uncertainty).toBeGreaterThan(0)
    }
    expect(await labCounts(t)).toEqual(before)
  })

  it('flags every planted mistake of the spoiled example with row, column and value', async () => {
    const r = await preview(example('run-acetone-methanol-with-errors.csv'))
    expect(r.status).toBe(200)
    const errors = r.body.problems.filter((p: { severity: string }) => p.severity === 'error')
    expect(
      errors.map((p: { row: number; column: string; value: string; message: string }) => [
        p.row,
        p.column,
        p.value,
        p.message,
      ]),
    ).toEqual([
      [5, 'phase', '', 'Phase is missing; use liquid or vapour.'],
      [10, 'area_1', '130x365.0', 'Not a number.'],
      [15, 'area_1', '-147492.9', 'Peak area cannot be negative.'],
    ])
  })

  it('reads the European export (BOM, ;, decimal commas) to the same compositions', async () => {
    const plain = await preview(example('run-acetone-methanol.csv'))
    const euro = await preview(example('run-acetone-methanol-semicolon.csv'))
    expect(euro.body.format).toEqual({ delimiter: ';', decimalComma: true, byteOrderMark: true })
    expect(euro.body.samples.map((s: { x1: number }) => s.x1)).toEqual(
      plain.body.samples.map((s: { x1: number }) => s.x1),
    )
  })

  it('warns when replicate injections scatter above the configured RSD limit', async () => {
    const text = [
      'sample,phase,injection,area_1,area_2,t_boil,t_unit,p_baro,p_unit',
      'S1,liquid,1,100000,300000,60.5,C,101.3,kPa',
      'S1,liquid,2,110000,300000,,,,',
      'S1,vapour,1,150000,250000,,,,',
      'S1,vapour,2,150500,250000,,,,',
    ].join('\n')
    const r = await preview(text)
    expect(r.body.errorCount).toBe(0)
    expect(r.body.problems).toEqual([
      {
        row: 2,
        column: 'area_1',
        value: '6.73 %',
        severity: 'warning',
        message: 'Sample S1, liquid: replicate area ratios scatter by 6.7 % RSD, above the 2.0 % limit.',
      },
    ])
  })
})

describe('rejected uploads leave the database unchanged', () => {
  const cases: [string, () => ReturnType<typeof commit>, number, string][] = [
    ['a file with errors', () => commit(example('run-acetone-methanol-with-errors.csv')), 422, 'upload_rejected'],
    [
      'warnings not acknowledged',
      () =>
        commit(
          [
            'sample,phase,injection,area_1,area_2,t_boil,t_unit,p_baro,p_unit',
            'S1,liquid,1,100000,300000,60.5,C,101.3,kPa',
            'S1,liquid,2,110000,300000,,,,',
            'S1,vapour,1,150000,250000,,,,',
            'S1,vapour,2,150500,250000,,,,',
          ].join('\n'),
          { acceptWarnings: 'false' },
        ),
      422,
      'warnings_not_accepted',
    ],
    [
      'a stale row version',
      () => commit(example('run-acetone-methanol.csv'), { rowVersion: '999' }),
      409,
      'stale_write',
    ],
    [
      'a file that is not .csv',
      () =>
        commit(
          example('run-acetone-methanol.csv'),
          {},
          'run.xlsx',
          'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
        ),
      415,
      'unsupported_file',
    ],
    ['a file over the size limit', () => commit('sample,phase\n' + 'x'.repeat(250_000)), 413, 'file_too_large'],
    [
      'no file at all',
      () => lab.analyst.post(`/api/data-sets/${dataSet.id}/uploads`).field('rowVersion', '1'),
      400,
      'bad_request',
    ],
    ['an empty file', () => commit(''), 422, 'upload_rejected'],
    [
      'a sample with liquid but no vapour',
      () => commit('sample,phase,injection,area_1,area_2,t_boil,t_unit,p_baro,p_unit\nS1,liquid,1,1,1,60,C,101,kPa\n'),
      422,
      'upload_rejected',
    ],
    [
      'an implausible temperature',
      () =>
        commit(
          'sample,phase,injection,area_1,area_2,t_boil,t_unit,p_baro,p_unit\nS1,liquid,1,1,1,60,K,101,kPa\nS1,vapour,1,1,1,,,,\n',
        ),
      422,
      'upload_rejected',
    ],
  ]
  for (const [what, send, status, code] of cases) {
    it(what, async () => {
      const before = await labCounts(t)
      const r = await send()
      expect(r.status).toBe(status)
      expect(r.body.error.code).toBe(code)
      expect(await labCounts(t)).toEqual(before)
    })
  }

  it('reports every problem of a rejected commit in the error details', async () => {
    const r = await commit(example('run-acetone-methanol-with-errors.csv'))
    expect(r.body.error.message).toBe('The file has 3 problems; nothing was stored. Fix the file and upload it again.')
    expect(r.body.error.details).toHaveLength(3)
  })
})

describe('run upload commit', () => {
  it('stores the file, the points with injections and calibration link in one go, and the original can be downloaded', async () => {
    const r = await commit(example('run-acetone-methanol.csv'))
    expect(r.status).toBe(201)
    expect(r.body.pointCount).toBe(12)
    dataSet.rowVersion = r.body.rowVersion
    const detail = await lab.reviewer.get(`/api/data-sets/${dataSet.id}`).expect(200)
    expect(detail.body.points).toHaveLength(12)
    expect(detail.body.points[0]).toMatchObject({
      seq: 1,
      sampleLabel: 'AM-01',
      calibrationId: lab.calibrationId,
      rowRefs: [2, 3, 4, 5],
    })
    const p = await lab.reviewer.get(`/api/data-sets/${dataSet.id}/points/${detail.body.points[0].id}`).expect(200)
    expect(p.body.injections).toHaveLength(4)
    const file = await lab.reviewer
      .get(`/api/uploads/${r.body.uploadId}/content`)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = []
        res.on('data', (c: Buffer) => chunks.push(c))
        res.on('end', () => cb(null, Buffer.concat(chunks)))
      })
    expect(file.status).toBe(200)
    expect(Buffer.compare(file.body, example('run-acetone-methanol.csv'))).toBe(0)
    expect(file.headers['x-content-sha256']).toBe(r.body.sha256)
  })
})
