import { computed, type Ref } from 'vue'
import type { MeasuredData, ParametersExport } from '../api/catalogue'
import { extrapolationItems, pressureVerdict, type PressureVerdict } from '../components/design/design-limits'
import {
  diagramsAt,
  errorText,
  measuredForPlot,
  otherFitCurves,
  systemFromParameters,
  SYSTEM_SET_PREFIX,
  type DiagramsAt,
} from '../components/design/design-model'
import { engineVaporLabel, pressureAgainstRange } from '@ebullio/schemas'
import { proseP } from '../components/design/pressure-text'
import { usePreferencesStore } from '../stores/preferences'

interface Basis {
  params: Ref<ParametersExport | null>
  fitId: Ref<string | null>
  pressurePa: Ref<number>
  measured: Ref<MeasuredData | null>
  /** the version's nominal pressure (null for isothermal data) */
  version: Ref<{ nominalPressurePa: number | null } | null>
  names: Ref<[string, string]>
}

/**
 * What the engine makes of an approved version at the chosen fit and pressure: the model, its diagrams, the pure
 * boiling points against their ranges, and everything extrapolated there.
 */
export function useSystemDesign({ params, fitId, pressurePa, measured, version, names }: Basis) {
  const prefs = usePreferencesStore()
  const built = computed(() => {
    if (!params.value) return null
    try {
      return { ...systemFromParameters(params.value, fitId.value), error: null }
    } catch (e) {
      return { system: null, fit: null, error: errorText(e) }
    }
  })
  /** Pure boiling points at the chosen pressure against the vapour-pressure ranges; null when they cannot be computed. */
  const verdict = computed<PressureVerdict | null>(() => {
    const s = built.value?.system
    if (!s) return null
    try {
      return pressureVerdict(s, pressurePa.value, names.value)
    } catch {
      return null
    }
  })
  const lighterName = computed(() => (verdict.value ? names.value[verdict.value.lighter] : names.value[0]))
  const diagrams = computed<{ d: DiagramsAt | null; error: string | null }>(() => {
    const s = built.value?.system
    if (!s) return { d: null, error: null }
    try {
      return { d: diagramsAt(s, pressurePa.value), error: null }
    } catch (e) {
      return { d: null, error: errorText(e) }
    }
  })
  /** The page computes with the system's recommended parameter set rather than one version's fit. */
  const onSystemSet = computed(() => fitId.value?.startsWith(SYSTEM_SET_PREFIX) === true)
  /** The activity model is extrapolated in temperature when the pressure is more than 25 % from the measured one. */
  // With the system's recommended set the fitted pressure range says it instead (its own warning on the page).
  const farFrom = computed(() =>
    !onSystemSet.value &&
    version.value?.nominalPressurePa &&
    Math.abs(pressurePa.value / version.value.nominalPressurePa - 1) > 0.25
      ? proseP(prefs, version.value.nominalPressurePa)
      : null,
  )
  /** Everything extrapolated at this pressure, for the screen's one banner. */
  const extrapolated = computed(() => {
    const s = built.value?.system
    if (!s || !verdict.value) return []
    const d = diagrams.value.d
    return extrapolationItems(
      s,
      verdict.value,
      d ? { Tmin: Math.min(...d.T), Tmax: Math.max(...d.T) } : null,
      farFrom.value,
      prefs,
    )
  })
  const designBlocked = computed(() => verdict.value?.designBlocked ?? false)
  /** The fit's name exactly as the lab screens give it (sent by the server, one shared rule). */
  const modelLabel = computed(() => built.value?.fit?.label ?? '')
  /** Measured points are drawn only at (within 0.5 % of) the pressure they were measured at. */
  // An isothermal set's points lie at one temperature, not one pressure: never on a constant-pressure diagram.
  const atMeasuredPressure = computed(() => {
    const P = params.value?.dataSet.nominalPressurePa
    return !!P && params.value?.dataSet.kind !== 'isothermal' && Math.abs(pressurePa.value / P - 1) < 0.005
  })
  /** The vapour model every number on the page is computed with: the chosen fit's (or the system set's). */
  const vapourLabel = computed(() => (built.value?.fit ? engineVaporLabel(built.value.fit.vapor) : ''))
  /**
   * The version shown uses an ideal vapour although a virial one would move its bubble points by more than their
   * measurement uncertainty (the server's check, thermo's vaporCorrectionSize); null when that is not so, and when
   * the page computes with the system's recommended set (then {@link setVapourWarning} speaks for its members).
   */
  const vapourWarning = computed(() => {
    if (onSystemSet.value) return null
    const c = measured.value?.vapourCorrection
    return c?.exceeds ? c : null
  })
  /**
   * The system's recommended set is the model, it uses an ideal vapour, and at the points of some data set it rests
   * on a virial vapour would move the set's bubble points by more than that data set's measurement uncertainty: the
   * correlation compared and those members with their figures; null otherwise.
   */
  const setVapourWarning = computed(() => {
    if (!onSystemSet.value) return null
    const c = params.value?.systemRecommendedSet?.vapourCorrection
    if (!c?.exceeds) return null
    return { correlation: c.correlation, members: c.members.filter((m) => m.exceedsUncertainty) }
  })
  const plotPoints = computed(() =>
    measured.value && atMeasuredPressure.value ? measuredForPlot(measured.value, fitId.value) : [],
  )
  /** The version's other fits, switched off in the legend until wanted. */
  const others = computed(() =>
    params.value && diagrams.value.d ? otherFitCurves(params.value, fitId.value, pressurePa.value) : [],
  )
  /**
   * The system's recommended parameter set when it is the chosen model: its fitted range, and where the chosen
   * pressure lies against it (outside, the curves are an extrapolation).
   */
  const recommendedRange = computed(() => {
    const r = params.value?.systemRecommendedSet
    if (!r || !onSystemSet.value) return null
    return { ...r.range, where: pressureAgainstRange(pressurePa.value, r.range), set: r }
  })
  return {
    recommendedRange,
    built,
    lighterName,
    diagrams,
    extrapolated,
    designBlocked,
    modelLabel,
    atMeasuredPressure,
    plotPoints,
    others,
    vapourLabel,
    vapourWarning,
    setVapourWarning,
  }
}
