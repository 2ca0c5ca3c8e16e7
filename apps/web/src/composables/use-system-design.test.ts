/** The engineer's ideal-vapour warnings: the version's own, or the recommended set's per member (server numbers). */
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import { ref } from 'vue'
import type { MeasuredData, ParametersExport } from '../api/catalogue'
import { SYSTEM_SET_PREFIX } from '../components/design/design-model'
import { useSystemDesign } from './useSystemDesign'

// Figures in the shape the server answers (apps/api/src/services/vapour-correction.ts); the values are invented.
const member = (title: string, exceedsUncertainty: boolean, maxAbsDT: number) => ({
  dataSetId: title,
  title,
  version: 1,
  kind: 'isobaric' as const,
  exceedsUncertainty,
  maxAbsDy: 0.0061,
  maxAbsDT,
  maxAbsDP: null,
})
const params = {
  systemRecommendedSet: {
    id: 'set-1',
    vapourCorrection: {
      exceeds: true,
      vapour: 'ideal',
      correlation: 'tsonopoulos',
      members: [member('at 1 atm', true, 0.214), member('at 40 kPa', false, 0.052)],
    },
  },
} as unknown as ParametersExport
const measured = {
  points: [],
  fits: [],
  vapourCorrection: {
    exceeds: true,
    exceedsUncertainty: true,
    vapour: 'ideal',
    correlation: 'tsonopoulos',
    kind: 'isobaric',
    maxAbsDy: 0.0058,
    maxAbsDT: 0.19,
    maxAbsDP: null,
    basis: 'the nrtl fit',
    message: 'x',
  },
} as MeasuredData

function design(fitId: string) {
  return useSystemDesign({
    params: ref(params),
    fitId: ref(fitId),
    pressurePa: ref(101325),
    measured: ref(measured),
    version: ref({ nominalPressurePa: 101325 }),
    names: ref<[string, string]>(['methanol', 'water']),
  })
}

describe('useSystemDesign vapour warnings', () => {
  beforeEach(() => setActivePinia(createPinia()))
  it('with the recommended set: only the members whose correction exceeds their uncertainty, not the version', () => {
    const d = design(SYSTEM_SET_PREFIX + 'set-1')
    expect(d.vapourWarning.value).toBeNull()
    expect(d.setVapourWarning.value).toEqual({ correlation: 'tsonopoulos', members: [member('at 1 atm', true, 0.214)] })
  })
  it("with the version's own fit: the version's warning, not the set's", () => {
    const d = design('fit-7')
    expect(d.setVapourWarning.value).toBeNull()
    expect(d.vapourWarning.value?.maxAbsDT).toBe(0.19)
  })
  it('no set warning when the set uses a virial vapour (exceeds false)', () => {
    const virial = structuredClone(params) as ParametersExport
    virial.systemRecommendedSet!.vapourCorrection!.exceeds = false
    const d = useSystemDesign({
      params: ref(virial),
      fitId: ref(SYSTEM_SET_PREFIX + 'set-1'),
      pressurePa: ref(101325),
      measured: ref(measured),
      version: ref({ nominalPressurePa: 101325 }),
      names: ref<[string, string]>(['methanol', 'water']),
    })
    expect(d.setVapourWarning.value).toBeNull()
  })
})
