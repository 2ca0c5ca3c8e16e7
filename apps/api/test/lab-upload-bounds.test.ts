/**
 * Uploads that would have changed the record silently or held the server: the same file twice, a sample label
 * already in the data set, files larger than one answer should carry, files that cannot be read at all.
 */
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, resetDatabase, signedInAgent, type TestContext } from './helpers.js'
import { buildLab, csv, example, generatedRun, labCounts, type Lab } from './lab-fixture.js'

let t: TestContext
let lab: Lab
let dataSet: { id: string; rowVersion: number }
beforeAll(async () => {
  t = await createTestContext({ UPLOAD_MAX_ROWS: '1200' })
  await resetDatabase(t.db)
  lab = await buildLab(t)
  const d = await lab.analyst
    .post('/api/data-sets')
    .send({ systemId: lab.systemId, title: 'Bounds', nominalPressurePa: 101325 })
    .expect(201)
  dataSet = { id: d.body.id, rowVersion: d.body.rowVersion }
})
afterAll(() => t.close())

const preview = (file: Buffer | string, fields: Record<string, string> = {}) => {
  let r = csv(lab.analyst.post(`/api/data-sets/${dataSet.id}/uploads/preview`), file)
  for (const [k, v] of Object.entries(fields)) r = r.field(k, v)
  return r
}
const commit = (file: Buffer | string) =>
  csv(lab.analyst.post(`/api/data-sets/${dataSet.id}/uploads`), file)
    .field('rowVersion', String(dataSet.rowVersion))
    .field('acceptWarnings', 'true')

describe('the same file twice', () => {
  it('is refused with 409 duplicate_upload and nothing changes; the preview says so too', async () => {
    const file = example('run-acetone-methanol.csv')
    const first = await commit(file).expect(201)
    dataSet.rowVersion = first.body.rowVersion
    const before = await labCounts(t)
    const again = await commit(file)
    expect(again.status).toBe(409)
    expect(again.body.error.code).toBe('duplicate_upload')
    expect(again.body.error.message).toMatch(
      /^This file was already added to this data set \(as "run\.csv", \d{4}-\d\d-\d\d \d\d:\d\d UTC\); adding it again would count its samples twice\.$/,
    )
    expect(await labCounts(t)).toEqual(before)
    const detail = await lab.analyst.get(`/api/data-sets/${dataSet.id}`).expect(200)
    expect(detail.body.points).toHaveLength(first.body.pointCount)

    const p = await preview(file).expect(200)
    expect(p.body.problems[0]).toMatchObject({ row: null, severity: 'error', message: again.body.error.message })
  })

  it('a different file reusing a sample label is a problem at that row and column', async () => {
    // the same samples with one area changed: a new file (another SHA-256) whose labels are all taken
    const text = example('run-acetone-methanol.csv')
      .toString('utf8')
      .replace(/,(\d+)\.(\d)/, ',$1.$2' + '1')
    const p = await preview(text).expect(200)
    const labelProblems = p.body.problems.filter((x: { column: string }) => x.column === 'sample')
    expect(labelProblems[0]).toEqual({
      row: 2,
      column: 'sample',
      value: 'AM-01',
      severity: 'error',
      message: 'Sample AM-01 is already in this data set (point 1); give the new sample its own label.',
    })
    expect(labelProblems).toHaveLength(12)
    const before = await labCounts(t)
    expect((await commit(text)).status).toBe(422)
    expect(await labCounts(t)).toEqual(before)
  })
})

describe('bounded previews', () => {
  it('answers one page of rows and samples with counts for the whole file', async () => {
    const file = generatedRun(290) // 290 samples × 2 phases × 2 injections = 1,160 rows, under the cap of 1,200
    const first = await preview(file).expect(200)
    expect(first.body.paging).toEqual({ page: 1, pageSize: 200, pages: 6, rowCount: 1160, problemCount: 0 })
    expect(first.body.rows).toHaveLength(200)
    expect(first.body.rows[0].line).toBe(2)
    expect(first.body.samples).toHaveLength(200)
    expect(first.body.sampleCount).toBe(290)
    const third = await preview(file, { page: '3' }).expect(200)
    expect(third.body.rows[0].line).toBe(402)
    expect(third.body.samples).toEqual([])
    const wide = await preview(file, { page: '2', pageSize: '1000' }).expect(200)
    expect(wide.body.rows.map((r: { line: number }) => r.line)).toEqual(Array.from({ length: 160 }, (_, i) => 1002 + i))
    const tooWide = await preview(file, { pageSize: '5000' })
    expect(tooWide.status).toBe(422)
  })

  it('refuses a file above UPLOAD_MAX_ROWS with one clear problem', async () => {
    const r = await preview(generatedRun(301)).expect(200) // 1,204 rows
    expect(r.body.problems).toEqual([
      {
        row: null,
        column: null,
        value: null,
        severity: 'error',
        message:
          'The file has more than 1,200 data rows, the most one upload may hold on this server (setting UPLOAD_MAX_ROWS). Split it into several files.',
      },
    ])
    expect(r.body.rows).toEqual([])
  })

  it('says once why a 5 MB single-line file cannot be read, in a small answer', async () => {
    const big = await createTestContext({ UPLOAD_MAX_BYTES: String(6 * 1024 * 1024) })
    try {
      const analyst = await signedInAgent(big.app, 'analyst@lab.test')
      const line = 'sample,phase,injection,area_1,area_2,t_boil,t_unit,p_baro,p_unit,' + '1.5,'.repeat(1_300_000)
      const r = await csv(analyst.post(`/api/data-sets/${dataSet.id}/uploads/preview`), line).expect(200)
      expect(r.body.problems.map((p: { message: string }) => p.message)).toEqual([
        'Line 1 is longer than 65,536 characters; a run sheet has one short line per injection. Check that the file has line breaks.',
      ])
      expect(r.text.length).toBeLessThan(20_000)
    } finally {
      await big.close()
    }
  })

  it('keeps answering health checks while several large files are parsed', async () => {
    const file = generatedRun(295)
    const done: string[] = []
    const previews = [1, 2, 3].map((n) =>
      preview(file).then((r) => {
        done.push(`preview ${n}`)
        return r
      }),
    )
    const health = Array.from({ length: 6 }, (_, n) =>
      request(t.app)
        .get('/api/health')
        .then((r) => {
          done.push(`health ${n}`)
          return r
        }),
    )
    const results = await Promise.all([...previews, ...health])
    expect(results.map((r) => r.status)).toEqual(Array(9).fill(200))
    expect(done.filter((d) => d.startsWith('health'))).toHaveLength(6)
  })
})

describe('files that cannot be read', () => {
  const unreadable: [string, Buffer, RegExp][] = [
    ['an empty file', Buffer.alloc(0), /^The file is empty\.$/],
    [
      'binary content',
      Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0x08, 0x00, 0x01]),
      /^The file is not a text CSV file/,
    ],
    ['UTF-16 without a byte-order mark', Buffer.from('sample,phase\r\nA,liquid\r\n', 'utf16le'), /save|Save it/],
    ['Latin-1 text', Buffer.from('sample,phase\nÉ,liquid\n', 'latin1'), /^Line 2 holds bytes that are not UTF-8/],
    ['an unclosed quote', Buffer.from('sample,phase\n"A,liquid\n'), /^Line 2 opens a quoted cell/],
  ]
  for (const [what, bytes, message] of unreadable)
    it(`${what}: one problem, no missing-column noise`, async () => {
      const r = await preview(bytes).expect(200)
      expect(r.body.problems).toHaveLength(1)
      expect(r.body.problems[0].message).toMatch(message)
      expect(r.body.errorCount).toBe(1)
    })
})
