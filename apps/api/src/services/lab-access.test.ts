/**
 * Who may see a data set, in which states it may change, and how database and engine refusals reach the user.
 * Pure unit tests (no database): they pin the decisions the mutation run (stryker.config.mjs) found unguarded.
 * The roles and states are the product's own rules (docs/workflow.md); PostgreSQL's SQLSTATE codes 23505
 * (unique_violation), 23514 (check_violation), 23503 (foreign_key_violation) and P0002 (no_data_found, raised by
 * the schema's trigger on approved rows) are from the PostgreSQL 15 manual, appendix A "Error Codes".
 */
import type { Role } from '@ebullio/schemas'
import { ThermoError } from '@ebullio/thermo'
import { describe, expect, it } from 'vitest'
import type { SessionUser } from '../auth/index.js'
import { AppError } from '../errors/index.js'
import type { DataSetRecord } from '../repositories/datasets.repository.js'
import {
  EDITABLE_STATES,
  FITTABLE_STATES,
  pageWindow,
  PUBLISHED_STATES,
  readsEverything,
  requireState,
  staleWrite,
  thermo,
  translateDbError,
  visibleOrNotFound,
} from './lab-access.js'

const user = (...roles: Role[]): SessionUser => ({ id: 'u1', email: 'u1@lab.test', displayName: 'U One', roles })
const dataSet = (state: DataSetRecord['state']) => ({ id: 'd1', state }) as DataSetRecord
const ALL_STATES: DataSetRecord['state'][] = ['draft', 'submitted', 'returned', 'approved', 'superseded']

/** Whatever `fn` throws (fails the test when it throws nothing). */
function caught(fn: () => unknown): unknown {
  try {
    fn()
  } catch (err) {
    return err
  }
  throw new Error('expected a refusal, nothing was thrown')
}

/** The AppError `fn` throws (fails the test when it throws something else or nothing). */
function thrown(fn: () => unknown): AppError {
  const err = caught(fn)
  expect(err).toBeInstanceOf(AppError)
  return err as AppError
}

describe('who reads which data set', () => {
  it('analysts, lead chemists, reviewers and admins read everything; an engineer or a user without roles does not', () => {
    for (const r of ['analyst', 'lead_chemist', 'reviewer', 'admin'] as Role[])
      expect(readsEverything(user(r))).toBe(true)
    expect(readsEverything(user('engineer'))).toBe(false)
    expect(readsEverything(user())).toBe(false)
    expect(readsEverything(user('engineer', 'reviewer'))).toBe(true)
  })

  it('an engineer sees approved and superseded versions only; the others are "not found", not "forbidden"', () => {
    const visible = ALL_STATES.filter((s) => {
      try {
        return visibleOrNotFound(user('engineer'), dataSet(s)).state === s
      } catch (err) {
        expect(err).toMatchObject({ status: 404, code: 'not_found', message: 'There is no such data set.' })
        return false
      }
    })
    expect(visible).toEqual(['approved', 'superseded'])
    expect(PUBLISHED_STATES).toEqual(['approved', 'superseded'])
  })

  it('an analyst sees every state, and the same record comes back', () => {
    for (const s of ALL_STATES) {
      const d = dataSet(s)
      expect(visibleOrNotFound(user('analyst'), d)).toBe(d)
    }
  })

  it('a missing data set is 404 for everyone', () => {
    expect(thrown(() => visibleOrNotFound(user('admin'), undefined))).toMatchObject({ status: 404, code: 'not_found' })
  })
})

describe('which states allow which change', () => {
  it('points and metadata change in draft and returned only; fits also while submitted', () => {
    expect(ALL_STATES.filter((s) => EDITABLE_STATES.includes(s))).toEqual(['draft', 'returned'])
    expect(ALL_STATES.filter((s) => FITTABLE_STATES.includes(s))).toEqual(['draft', 'submitted', 'returned'])
  })

  it('requireState passes in an allowed state and refuses in any other, naming the state and the allowed ones', () => {
    expect(() => requireState(dataSet('returned'), EDITABLE_STATES, 'editing points')).not.toThrow()
    const e = thrown(() => requireState(dataSet('approved'), EDITABLE_STATES, 'editing points'))
    expect(e.status).toBe(409)
    expect(e.code).toBe('conflict')
    expect(e.message).toBe('This data set is approved; editing points is possible only when it is draft or returned.')
    expect(e.details).toEqual({ state: 'approved' })
  })

  it('a stale write names both row versions', () => {
    const e = staleWrite(4, 6)
    expect(e.status).toBe(409)
    expect(e.code).toBe('stale_write')
    expect(e.message).toContain('you had version 4, it is now 6')
    expect(e.details).toEqual({ expectedRowVersion: 4, currentRowVersion: 6 })
  })

  it('pages are 1-based windows', () => {
    expect(pageWindow(1, 50)).toEqual({ limit: 50, offset: 0 })
    expect(pageWindow(3, 20)).toEqual({ limit: 20, offset: 40 })
  })
})

describe('database refusals become user-facing conflicts', () => {
  const messages = { data_sets_title_key: 'A data set of that title exists.', '23503': 'It refers to something gone.' }

  it('a known constraint gives its own message, for unique, check and foreign-key violations alike', () => {
    for (const code of ['23505', '23514', '23503']) {
      const e = thrown(() => translateDbError({ code, constraint: 'data_sets_title_key' }, messages))
      expect(e).toMatchObject({ status: 409, code: 'conflict', message: 'A data set of that title exists.' })
      expect(e.details).toEqual({ constraint: 'data_sets_title_key' })
    }
  })

  it('an unknown constraint falls back to the message for the SQLSTATE; without a constraint it says null', () => {
    const e = thrown(() => translateDbError({ code: '23503', constraint: 'points_upload_fk' }, messages))
    expect(e.message).toBe('It refers to something gone.')
    expect(e.details).toEqual({ constraint: 'points_upload_fk' })
    expect(thrown(() => translateDbError({ code: '23503' }, messages)).details).toEqual({ constraint: null })
  })

  it('a violation without any message, or another SQLSTATE, is rethrown unchanged', () => {
    const unnamed = { code: '23505', constraint: 'other_key' }
    expect(caught(() => translateDbError(unnamed, messages))).toBe(unnamed)
    const tooLong = { code: '22001', constraint: 'data_sets_title_key' }
    expect(caught(() => translateDbError(tooLong, { ...messages, '22001': 'never used' }))).toBe(tooLong)
  })

  it('the approved-row trigger (P0002) says approved data cannot be changed', () => {
    const e = thrown(() => translateDbError({ code: 'P0002' }, messages))
    expect(e).toMatchObject({ status: 409, code: 'conflict' })
    expect(e.message).toBe('Approved data cannot be changed; revise it to create a new version.')
  })
})

describe('engine refusals', () => {
  it('passes the result through when the engine answers', () => {
    expect(thermo('Fitting', () => 42)).toBe(42)
  })

  it("a ThermoError becomes 422 computation_refused with the engine's words and code", () => {
    const e = thrown(() =>
      thermo('Fitting wilson', () => {
        throw new ThermoError('no_convergence', 'the bubble point did not converge')
      }),
    )
    expect(e.status).toBe(422)
    expect(e.code).toBe('computation_refused')
    expect(e.message).toBe('Fitting wilson: the bubble point did not converge')
    expect(e.details).toEqual({ thermoCode: 'no_convergence' })
    const noCode = Object.assign(new Error('no code'), { name: 'ThermoError' })
    const e2 = thrown(() =>
      thermo('Band', () => {
        throw noCode
      }),
    )
    expect(e2.details).toEqual({ thermoCode: null })
  })

  it('any other error is rethrown as it is', () => {
    const bug = new TypeError('x is undefined')
    expect(
      caught(() =>
        thermo('Fitting', () => {
          throw bug
        }),
      ),
    ).toBe(bug)
  })
})
