/** Which virial vapour the vapour-correction check compares with (pure; no database). */
import { describe, expect, it } from 'vitest'
import type { PointRecord } from '../repositories/points.repository.js'
import { comparedVapour, correctionPoint } from './vapour-correction.js'

// Methanol's critical data and HOC parameters as the demo carries them (db/seeds/demo-properties.ts).
const full = { Tc: 513.38, Pc: 8215850, omega: 0.5625, Vc: 113.828, radiusOfGyration: 1.536, associationEta: 1.63 }
const pair = (p1: object | null, p2: object | null) => ({
  component1: { name: 'methanol', properties: p1 },
  component2: { name: 'water', properties: p2 },
})
const { omega: _omega, ...noOmega } = full
const { radiusOfGyration: _rd, ...noRD } = full

describe('comparedVapour', () => {
  it("keeps a data set's own virial choice (correlation and η12)", () => {
    const own = { kind: 'virial' as const, correlation: 'hayden-oconnell' as const, poynting: false, eta12: 1.2 }
    expect(comparedVapour(pair(full, full) as never, own)).toEqual(own)
  })
  it('for an ideal vapour takes Tsonopoulos when both components have its data', () => {
    expect(comparedVapour(pair(full, full) as never, { kind: 'ideal' })).toEqual({
      kind: 'virial',
      correlation: 'tsonopoulos',
      poynting: false,
    })
    expect(comparedVapour(pair(noRD, full) as never, { kind: 'ideal' })?.correlation).toBe('tsonopoulos')
  })
  it("else Hayden–O'Connell when both have the radius of gyration (ω missing), else nothing", () => {
    expect(comparedVapour(pair(noOmega, full) as never, { kind: 'ideal' })?.correlation).toBe('hayden-oconnell')
    expect(comparedVapour(pair(noOmega, noRD) as never, { kind: 'ideal' })).toBeNull()
    expect(comparedVapour(pair(null, full) as never, { kind: 'ideal' })).toBeNull()
  })
})

describe('correctionPoint', () => {
  const base = {
    id: 'p1',
    dataSetId: 'd1',
    seq: 1,
    sampleLabel: 'S',
    temperatureK: 351.2,
    pressurePa: 101325,
    x1: 0.25,
    x1Uncertainty: 0.002,
    y1: 0.41,
    y1Uncertainty: 0.0008,
    pressureUncertaintyPa: null,
    excluded: false,
    exclusionReason: null,
    uploadId: null,
    calibrationId: null,
    rowRefs: [],
  } as unknown as PointRecord
  it("judges a point against its own stored u(y₁) and σP, not the fits' generic defaults", () => {
    expect(correctionPoint(base)).toMatchObject({ T: 351.2, P: 101325, x1: 0.25, y1: 0.41, sigmaY: 0.0008 })
    expect(correctionPoint(base)).not.toHaveProperty('sigmaT')
    const iso = correctionPoint({ ...base, pressureUncertaintyPa: 150 } as PointRecord)
    expect(iso).toMatchObject({ sigmaP: 150, sigmaY: 0.0008 })
    // no stored u(y₁) (liquid-only point or none given): thermo's default applies
    expect(correctionPoint({ ...base, y1: null, y1Uncertainty: null } as PointRecord)).not.toHaveProperty('sigmaY')
  })
})
