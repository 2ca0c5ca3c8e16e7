import { computed, shallowRef, type Ref } from 'vue'
import type { DataSetDetail } from '../api/datasets'
import { notComparableReason } from '../components/fits/fit-display'
import { fitLabel, labelWithNote, MODEL_LABELS, residualsOf } from '../components/fits/fit-helpers'

/**
 * The outlier flags of the workspace: which fit they are judged against, that fit in words, and the flagged points.
 * An approved version shows the flags kept with its signature.
 */
export function useWorkspaceOutliers(detail: Ref<DataSetDetail | null>, visible: Ref<string[]>) {
  /** The approval signature of this version, when it kept the outlier flags the signer saw. */
  const signedFlags = computed(
    () =>
      [...(detail.value?.approvals ?? [])].reverse().find((a) => a.meaning === 'approved' && a.outliers)?.outliers ??
      null,
  )
  /** The fit the outlier flags are judged against: the recommended one, else the first drawn. */
  const outlierFit = computed(() => {
    const d = detail.value
    if (!d) return null
    return (
      d.fits.find((f) => f.id === d.dataSet.recommendedFitId) ??
      d.fits.find((f) => visible.value.includes(f.id)) ??
      null
    )
  })
  /** "Wilson (recommended)": which fit the flags refer to, in words shown beside them. */
  const outlierBasis = computed(() => {
    const d = detail.value
    if (signedFlags.value && d?.dataSet.state !== 'draft') {
      const model = signedFlags.value.model
      return `${MODEL_LABELS[model as keyof typeof MODEL_LABELS] ?? model} (recommended), as signed`
    }
    const f = outlierFit.value
    if (!f || !d) return null
    if (f.stale) return `${fitLabel(f, d.fits)}: no flags, it was computed on other points (re-run it)`
    return labelWithNote(
      fitLabel(f, d.fits),
      f.id === d.dataSet.recommendedFitId ? 'recommended' : 'first fit shown; none recommended yet',
    )
  })
  /** thermo's outlier rule (loaded with the engine, after the tables are on screen). */
  const outlierRule = shallowRef<typeof import('@ebullio/thermo').outlierPointIds | null>(null)
  void import('@ebullio/thermo').then((m) => (outlierRule.value = m.outlierPointIds))
  /**
   * Points thermo's rule flags against that fit; an approved version shows the flags kept with its signature.
   * A fit computed on other points than the data set has now gives no flags: they would judge other data.
   */
  const outliers = computed(() => {
    const d = detail.value
    const out = new Set<string>()
    if (!d) return out
    if (signedFlags.value && d.dataSet.state !== 'draft') return new Set(signedFlags.value.pointIds)
    const lead = outlierFit.value
    if (!lead || lead.stale || !outlierRule.value) return out
    const excluded = new Set(d.points.filter((p) => p.excluded).map((p) => p.id))
    const r = residualsOf(lead).map((x) => ({ ...x, flagged: x.outlier, excluded: excluded.has(x.pointId) }))
    return new Set(outlierRule.value(r))
  })
  return { outliers, outlierBasis }
}

/** The model the point test fits to T–x: the recommended one, else the lowest-AIC fit, else the server's default. */
export function useConsistencyModel(detail: Ref<DataSetDetail | null>) {
  return computed(() => {
    const d = detail.value
    if (!d) return undefined
    const rec = d.fits.find((f) => f.id === d.dataSet.recommendedFitId)
    const best = [...d.fits]
      .filter((f) => !notComparableReason(f))
      .sort((a, b) => (a.statistics.aic ?? Infinity) - (b.statistics.aic ?? Infinity))[0]
    return (rec ?? best)?.model
  })
}
