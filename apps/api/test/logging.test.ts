import { Writable } from 'node:stream'
import { pino } from 'pino'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { agent, createTestContext, createUser, PASSWORD, resetDatabase, type TestContext } from './helpers.js'

const lines: string[] = []
const sink = new Writable({
  write(chunk, _enc, done) {
    lines.push(String(chunk))
    done()
  },
})

let t: TestContext
beforeAll(async () => {
  t = await createTestContext({}, pino({ level: 'info' }, sink))
  await resetDatabase(t.db)
  await createUser(t.db, { email: 'logged@lab.test', roles: ['analyst'] })
})
afterAll(() => t.close())

describe('request logging', () => {
  it('logs requests without passwords, cookies or bodies', async () => {
    const a = agent(t.app)
    await a.post('/api/auth/sign-in').send({ email: 'logged@lab.test', password: PASSWORD }).expect(200)
    await a.get('/api/auth/me').expect(200)
    const log = lines.join('')
    expect(log).toContain('/api/auth/sign-in')
    expect(log).toContain('/api/auth/me')
    expect(log).not.toContain(PASSWORD)
    expect(log).not.toContain('ebullio_session=')
  })
})
