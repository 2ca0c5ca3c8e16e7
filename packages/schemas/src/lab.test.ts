import { describe, expect, it } from 'vitest'
import {
  bandQuerySchema,
  dataSetSchema,
  exclusionSchema,
  fitRequestSchema,
  signatureSchema,
  temperatureWithUnitSchema,
} from './lab.js'

const issues = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  r.success ? [] : r.error!.issues.map((i) => [i.path.join('.'), i.message])

describe('lab request schemas (shared with the API, same messages)', () => {
  it('asks for a reason when a point is excluded, not when it is included again', () => {
    expect(issues(exclusionSchema.safeParse({ rowVersion: 3, excluded: true, reason: '  ' }))).toEqual([
      ['reason', 'Give a reason for excluding this point'],
    ])
    expect(exclusionSchema.safeParse({ rowVersion: 3, excluded: false }).success).toBe(true)
  })

  it('lists every bad field of a new data set', () => {
    expect(issues(dataSetSchema.safeParse({ systemId: 'x', title: ' ', nominalPressurePa: 0 }))).toEqual([
      ['systemId', 'Not a system id'],
      ['title', 'Enter a title'],
      ['nominalPressurePa', 'Pressure must be positive (Pa)'],
    ])
  })

  it('needs the password and a reason to sign, and at least one model to fit', () => {
    expect(issues(signatureSchema.safeParse({ password: '', reason: '', rowVersion: 1 }))).toEqual([
      ['password', 'Re-enter your password to sign'],
      ['reason', 'Give the reason for your signature'],
    ])
    expect(issues(fitRequestSchema.safeParse({ models: [] }))).toEqual([['models', 'Choose at least one model']])
  })

  it('keeps NRTL α within (0, 1], fixed or as the start of a fitted α', () => {
    expect(issues(fitRequestSchema.safeParse({ models: ['nrtl'], alpha: 0 }))).toEqual([
      ['alpha', 'NRTL α must be above 0 and at most 1'],
    ])
    expect(issues(fitRequestSchema.safeParse({ models: ['nrtl'], alpha: 1.2 }))).toEqual([
      ['alpha', 'NRTL α must be above 0 and at most 1'],
    ])
    expect(fitRequestSchema.parse({ models: ['nrtl'], alpha: 0.5081, fitAlpha: true })).toMatchObject({
      alpha: 0.5081,
      fitAlpha: true,
    })
  })

  it('checks a temperature against absolute zero in its own unit', () => {
    expect(temperatureWithUnitSchema.safeParse({ value: -10, unit: 'C' }).success).toBe(true)
    expect(issues(temperatureWithUnitSchema.safeParse({ value: -300, unit: 'C' }))).toEqual([
      ['value', 'Temperature must be above absolute zero'],
    ])
    expect(issues(temperatureWithUnitSchema.safeParse({ value: 0, unit: 'K' }))).toEqual([
      ['value', 'Temperature must be above absolute zero'],
    ])
  })

  it('reads a band query from the query string, pressure optional', () => {
    expect(bandQuerySchema.parse({})).toEqual({ unit: 'kPa', points: 51 })
    expect(bandQuerySchema.parse({ pressure: '50', unit: 'kPa', points: '11' })).toEqual({
      pressure: 50,
      unit: 'kPa',
      points: 11,
    })
  })
})
