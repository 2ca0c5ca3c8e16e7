/** Settings: one zod schema gives both the check and the type; `.env` files are read with Node's own loader. */
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { afterEach, describe, expect, expectTypeOf, it } from 'vitest'
import { loadConfig, loadEnvFile, type Config } from './config.js'

describe('loadConfig', () => {
  it('turns the environment into typed settings with the documented defaults', () => {
    const c = loadConfig({ PORT: '3210', ALLOW_SELF_APPROVAL: 'yes', METRICS_TOKEN: undefined })
    expect(c.port).toBe(3210)
    expect(c.publicUrl).toBe('http://127.0.0.1:3210')
    expect(c.allowSelfApproval).toBe(true)
    expect(c.metricsToken).toBeNull()
    expect(c.uploadMaxBytes).toBe(5 * 1024 * 1024)
    expect(c.reportTimeZone).toBe('UTC')
    expectTypeOf<Config['port']>().toEqualTypeOf<number>()
    expectTypeOf<Config['cookieSecure']>().toEqualTypeOf<'auto' | 'true' | 'false'>()
    expectTypeOf<Config['metricsToken']>().toEqualTypeOf<string | null>()
  })

  it('names every bad setting with its message', () => {
    expect(() => loadConfig({ PORT: 'eighty', REPORT_TIME_ZONE: 'Mars/Olympus' })).toThrow(
      /Invalid configuration:\n {2}PORT: .*\n {2}REPORT_TIME_ZONE: must be an IANA time zone/,
    )
  })

  it('in production needs the public URL and refuses the demo data, both named at once', () => {
    expect(() => loadConfig({ NODE_ENV: 'production', DEMO_DATA: 'true' })).toThrow(
      'Invalid configuration:\n  PUBLIC_URL: required in production (the address users type, e.g. https://ebullio.lab.example)\n' +
        '  DEMO_DATA: the invented demo scenario is refused in production; unset it or set DEMO_DATA=false',
    )
  })
})

describe('loadEnvFile', () => {
  const set: string[] = []
  afterEach(() => set.splice(0).forEach((k) => delete process.env[k]))

  it('reads a .env file, and variables already in the environment win over it', () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'ebullio-env-'))
    const file = path.join(dir, '.env')
    writeFileSync(file, 'EBULLIO_TEST_FROM_FILE=file\nEBULLIO_TEST_BOTH=file\n')
    set.push('EBULLIO_TEST_FROM_FILE', 'EBULLIO_TEST_BOTH')
    process.env.EBULLIO_TEST_BOTH = 'environment'
    expect(loadEnvFile(file)).toBe(true)
    expect(process.env.EBULLIO_TEST_FROM_FILE).toBe('file')
    expect(process.env.EBULLIO_TEST_BOTH).toBe('environment')
  })

  it('does nothing without a file', () => {
    expect(loadEnvFile(path.join(tmpdir(), 'no-such-folder-ebullio', '.env'))).toBe(false)
  })
})
