import { describe, expect, it } from 'vitest'
import { fromPostgres } from './postgres.js'

describe('database errors for users', () => {
  it('maps unique, foreign-key, check and trigger errors', () => {
    expect(fromPostgres({ code: '23505', constraint: 'app_user_email_key' })).toMatchObject({
      status: 409,
      code: 'duplicate',
      details: { constraint: 'app_user_email_key' },
    })
    expect(fromPostgres({ code: '23503' })?.status).toBe(409)
    expect(fromPostgres({ code: '23514' })?.code).toBe('rule_violated')
    expect(fromPostgres({ code: 'P0001', message: 'Approved data sets are frozen.' })?.message).toBe(
      'Approved data sets are frozen.',
    )
  })
  it('leaves everything else to the generic handler', () => {
    expect(fromPostgres(new Error('boom'))).toBeNull()
    expect(fromPostgres({ code: 'ECONNREFUSED' })).toBeNull()
    expect(fromPostgres({ code: '08006' })).toBeNull()
  })
})
