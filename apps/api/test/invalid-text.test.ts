/**
 * A NUL byte (or a lone surrogate) anywhere a client can put text is a 400 naming the field, on every route:
 * path parameters, query strings, JSON bodies and multipart forms; multipart oddities are 4xx with a message.
 */
import { ROLES } from '@ebullio/schemas'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { allRoutes } from '../src/routes/index.js'
import { createTestContext, createUser, resetDatabase, signedInAgent, type TestContext } from './helpers.js'
import { buildLab, csv, example, labCounts, type Lab } from './lab-fixture.js'

let t: TestContext
let lab: Lab
let everyone: Awaited<ReturnType<typeof signedInAgent>>
let dataSetId: string
beforeAll(async () => {
  t = await createTestContext()
  await resetDatabase(t.db)
  lab = await buildLab(t)
  await createUser(t.db, { email: 'all-roles@lab.test', roles: [...ROLES] })
  everyone = await signedInAgent(t.app, 'all-roles@lab.test')
  const d = await lab.analyst
    .post('/api/data-sets')
    .send({ systemId: lab.systemId, title: 'NUL checks', nominalPressurePa: 101325 })
    .expect(201)
  dataSetId = d.body.id
})
afterAll(() => t.close())

const routes = allRoutes.filter((r) => !(r.method === 'post' && r.path === '/api/auth/sign-out'))
const withParams = routes.filter((r) => r.path.includes(':'))
const bodyRoutes = routes.filter((r) => r.method !== 'get' && r.method !== 'delete')

describe('NUL in a path parameter', () => {
  for (const r of withParams)
    it(`${r.method.toUpperCase()} ${r.path}`, async () => {
      const url = r.path.replace(/:(\w+)/g, 'abc%00def')
      const first = r.path.match(/:(\w+)/)![1]
      const res = await everyone[r.method](url).send({})
      expect(res.status, JSON.stringify(res.body)).toBe(400)
      expect(res.body.error.code).toBe('invalid_text')
      expect(res.body.error.message).toMatch(new RegExp(`^Not valid text: path\\.${first}\\b`))
    })
})

describe('NUL in the query string', () => {
  for (const r of routes.filter((x) => x.method === 'get'))
    it(`GET ${r.path}`, async () => {
      const url = r.path.replace(/:(\w+)/g, '00000000-0000-4000-8000-000000000000')
      const res = await everyone.get(`${url}?q=acetone%00&state=draft`)
      expect(res.status, JSON.stringify(res.body)).toBe(400)
      expect(res.body.error).toMatchObject({
        code: 'invalid_text',
        message: 'Not valid text: query.q. It holds a NUL character (byte 0), which text may not contain.',
      })
    })
})

describe('NUL in a JSON body', () => {
  for (const r of bodyRoutes)
    it(`${r.method.toUpperCase()} ${r.path}`, async () => {
      const url = r.path.replace(/:(\w+)/g, '00000000-0000-4000-8000-000000000000')
      const res = await everyone[r.method](url).send({ title: 'Series\u0000 1', nested: { reason: ['ok', 'b\u0000'] } })
      expect(res.status, JSON.stringify(res.body)).toBe(400)
      expect(res.body.error.code).toBe('invalid_text')
      expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual([
        'body.title',
        'body.nested.reason.1',
      ])
    })

  it('a lone surrogate is refused the same way', async () => {
    const res = await lab.analyst
      .post('/api/data-sets')
      .set('content-type', 'application/json')
      .send('{"systemId":"x","title":"bad \\ud800 text","nominalPressurePa":101325}')
    expect(res.status).toBe(400)
    expect(res.body.error.message).toBe(
      'Not valid text: body.title. It holds a lone surrogate, which is not valid Unicode text.',
    )
  })
})

describe('multipart oddities', () => {
  const url = () => `/api/data-sets/${dataSetId}/uploads/preview`
  it.each([
    [
      'a NUL in a form field',
      () => csv(lab.analyst.post(url()), example('run-acetone-methanol.csv')).field('calibrationId', 'a\u0000b'),
      400,
      'invalid_text',
      'Not valid text: body.calibrationId. It holds a NUL character (byte 0), which text may not contain.',
    ],
    [
      'two files',
      () =>
        csv(lab.analyst.post(url()), example('run-acetone-methanol.csv')).attach(
          'file',
          example('run-acetone-methanol.csv'),
          { filename: 'b.csv', contentType: 'text/csv' },
        ),
      400,
      'too_many_files',
      'Send exactly one file, in the form field "file".',
    ],
    [
      'too many fields',
      () => {
        let r = csv(lab.analyst.post(url()), example('run-acetone-methanol.csv'))
        for (let i = 0; i < 30; i++) r = r.field(`f${i}`, 'x')
        return r
      },
      400,
      'too_many_fields',
      null,
    ],
    [
      'a huge file name',
      () => csv(lab.analyst.post(url()), example('run-acetone-methanol.csv'), 'r'.repeat(5000) + '.csv'),
      400,
      'bad_upload',
      'The file name is longer than 255 characters; rename the file.',
    ],
    [
      'a huge field name',
      () => csv(lab.analyst.post(url()), example('run-acetone-methanol.csv')).field('n'.repeat(500), 'x'),
      400,
      'bad_upload',
      'A form field name is longer than 100 characters.',
    ],
    [
      'a huge field value',
      () => csv(lab.analyst.post(url()), example('run-acetone-methanol.csv')).field('calibrationId', 'v'.repeat(5000)),
      400,
      'bad_upload',
      'A form field value is longer than 1000 characters.',
    ],
    [
      'a file in another field',
      () =>
        lab.analyst
          .post(url())
          .attach('data', example('run-acetone-methanol.csv'), { filename: 'a.csv', contentType: 'text/csv' }),
      400,
      'unexpected_file',
      'Send one file in the form field "file".',
    ],
    [
      'a form cut short',
      () =>
        lab.analyst
          .post(url())
          .set('content-type', 'multipart/form-data; boundary=xyz')
          .send(
            '--xyz\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\nContent-Type: text/csv\r\n\r\nsample',
          ),
      400,
      'bad_upload',
      null,
    ],
  ] as const)('%s', async (_what, send, status, code, message) => {
    const before = await labCounts(t)
    const r = await send()
    expect(r.status, JSON.stringify(r.body)).toBe(status)
    expect(r.body.error.code).toBe(code)
    if (message) expect(r.body.error.message).toBe(message)
    expect(await labCounts(t)).toEqual(before)
  })
})
