import { describe, expect, it } from 'vitest'
import { engineVaporLabel } from '@ebullio/schemas'
import type { ParametersExport } from '../../api/catalogue'
import { bubblePressure, bubbleTemperature, type BinarySystem } from '@ebullio/thermo'
import { designPressureOf, SYSTEM_SET_PREFIX, systemFromParameters, systemSetAsFit } from './design-model'

// A parameters export in the documented layout, trimmed to what the model choice reads (values invented).
const vp = (name: string, index: 1 | 2, A: number) => ({
  kind: 'antoine',
  A,
  B: 3000,
  C: 230,
  log: 'ln',
  pressureUnit: 'kPa',
  temperatureUnit: 'C',
  source: 'invented',
  component: { index, name, cas: null },
})
const base = {
  format: 'ebullio-parameters/1',
  dataSet: { id: 'd', title: 't', version: 1, state: 'approved', nominalPressurePa: 101325 },
  system: {
    component1: { name: 'one', cas: null, liquidMolarVolume: null },
    component2: { name: 'two', cas: null, liquidMolarVolume: null },
  },
  vaporPressure: [vp('one', 1, 16), vp('two', 2, 15)],
  recommendedFitId: 'f1',
  fits: [
    {
      id: 'f1',
      model: 'nrtl',
      label: 'NRTL',
      recommended: true,
      activity: { kind: 'nrtl', b12: 100, b21: 200, alpha: 0.3 },
      parameters: [],
      statistics: {},
      points: 10,
      runAt: '2026-12-03T10:00:00Z',
    },
  ],
  approval: null,
} as unknown as ParametersExport
const withSet = {
  ...base,
  systemRecommendedSet: {
    id: 'j1',
    systemId: 's',
    model: 'wilson',
    label: 'Wilson (joint, 2 data sets)',
    activity: { kind: 'wilson', a12: 900, a21: 1500, a12T: -13, a21T: 10, V1: 40.7, V2: 18.1 },
    parameters: [{ name: 'a12', value: 900, standardError: 100, unit: 'J/mol' }],
    range: { Tmin: 310, Tmax: 370, Pmin: 40000, Pmax: 101325 },
    approvedAt: '2026-12-03T11:00:00Z',
    signedBy: 'A',
    digest: 'x',
    dataSets: [
      { dataSetId: 'a', title: 'a', version: 1, nominalPressurePa: 101325, pointCount: 11 },
      { dataSetId: 'b', title: 'b', version: 1, nominalPressurePa: 40000, pointCount: 11 },
    ],
  },
} as unknown as ParametersExport

describe("the system's recommended parameter set as the engineer's model", () => {
  it('is offered as a fit named as on the lab screens, with the note merged into its parentheses', () => {
    expect(systemSetAsFit(base)).toBeNull()
    const f = systemSetAsFit(withSet)!
    expect(f).toMatchObject({ id: `${SYSTEM_SET_PREFIX}j1`, points: 22 })
    expect(f.label).toBe('Wilson (joint, 2 data sets; recommended for the system)')
  })
  it("computes with the set's temperature-dependent activity when chosen, and with the version's fit otherwise", () => {
    expect(systemFromParameters(withSet, `${SYSTEM_SET_PREFIX}j1`).system.activity).toEqual(
      withSet.systemRecommendedSet!.activity,
    )
    expect(systemFromParameters(withSet, 'f1').system.activity).toEqual(base.fits[0].activity)
    // a set id that is not the system's current one falls back to the version's recommended fit
    expect(systemFromParameters(base, `${SYSTEM_SET_PREFIX}j1`).fit.id).toBe('f1')
  })
})

// A virial vapour as a parameters export carries it: methanol and water critical data of chemicals 1.5.2 with the
// Tsonopoulos polar parameters of db/seeds/demo-properties.ts (copied here; the web does not import seeds).
const virial = {
  kind: 'virial',
  correlation: 'tsonopoulos',
  poynting: false,
  components: [
    { Tc: 513.38, Pc: 8215850, omega: 0.5625, Vc: 113.828, tsonopoulos: { a: 0.0878, b: 0.0525 } },
    { Tc: 647.096, Pc: 22064000, omega: 0.3443, Vc: 55.948, tsonopoulos: { a: -0.0109, b: 0 } },
  ],
}

describe("the engineer's calculations use the fit's own vapour model", () => {
  const virialFit = { ...base, fits: [{ ...base.fits[0], vapor: virial }] } as unknown as ParametersExport
  it("a fit made under a virial vapour computes γ–φ: the engine's own γ–φ bubble point, not the ideal one", () => {
    const { system, fit } = systemFromParameters(virialFit, 'f1')
    expect(system.vapor).toEqual(virial)
    const ideal = systemFromParameters(base, 'f1').system
    expect(ideal.vapor).toBeUndefined()
    const at = { P: 101325, x1: 0.4 }
    // the model's bubble point with the vapour handed to thermo directly (same equations, same inputs)
    const direct = bubbleTemperature({ ...ideal, vapor: virial as BinarySystem['vapor'] }, at)
    expect(bubbleTemperature(system, at).T).toBeCloseTo(direct.T, 9)
    // and the correction is real at 1 atm: the ideal vapour gives another bubble temperature
    expect(Math.abs(bubbleTemperature(ideal, at).T - direct.T)).toBeGreaterThan(1e-3)
    expect(engineVaporLabel(fit.vapor)).toBe('virial gas, Tsonopoulos second virial coefficients')
    expect(engineVaporLabel(base.fits[0].vapor)).toBe('ideal gas (modified Raoult’s law)')
  })
  it("the system's recommended set carries the vapour it was fitted under", () => {
    const set = {
      ...withSet,
      systemRecommendedSet: { ...withSet.systemRecommendedSet!, vapor: virial },
    } as unknown as ParametersExport
    const { system, fit } = systemFromParameters(set, `${SYSTEM_SET_PREFIX}j1`)
    expect(system.vapor).toEqual(virial)
    expect(engineVaporLabel(fit.vapor)).toBe('virial gas, Tsonopoulos second virial coefficients')
    expect(systemFromParameters(withSet, `${SYSTEM_SET_PREFIX}j1`).system.vapor).toBeUndefined()
  })
})

describe('the pressure the design screens open at', () => {
  it('is the nominal pressure of an isobaric version', () => {
    expect(designPressureOf(base)).toBe(101325)
  })
  it("is the model's bubble pressure of the equimolar liquid at an isothermal version's temperature", () => {
    const iso = {
      ...base,
      dataSet: { ...base.dataSet, nominalPressurePa: null, kind: 'isothermal', nominalTemperatureK: 333.15 },
    } as unknown as ParametersExport
    const P = bubblePressure(systemFromParameters(iso).system, { T: 333.15, x1: 0.5 }).P
    expect(P).toBeGreaterThan(1000)
    expect(designPressureOf(iso)).toBe(Math.round(P / 100) * 100)
    const none = { ...iso, dataSet: { ...iso.dataSet, nominalTemperatureK: null } } as unknown as ParametersExport
    expect(designPressureOf(none)).toBe(101325)
  })
})
