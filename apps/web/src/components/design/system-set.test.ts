import { describe, expect, it } from 'vitest'
import type { ParametersExport } from '../../api/catalogue'
import { SYSTEM_SET_PREFIX, systemFromParameters, systemSetAsFit } from './design-model'

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
