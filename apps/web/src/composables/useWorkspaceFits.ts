import { shallowRef, ref, watch, type Ref } from 'vue'
import type { DataSetDetail } from '../api/datasets'
import type { FitCurve } from '../components/fits/fit-helpers'

export type WorkspaceCurves = {
  curves: FitCurve[]
  failed: { name: string; message: string }[]
  ideal: FitCurve | null
}

/** The fits' curves, computed once the engine has loaded (after the tables and plots are on screen). */
export function useFitCurves(detail: Ref<DataSetDetail | null>) {
  const curves = shallowRef<WorkspaceCurves>({ curves: [], failed: [], ideal: null })
  watch(
    detail,
    async (d) => {
      if (!d) return void (curves.value = { curves: [], failed: [], ideal: null })
      const { fitCurves } = await import('../components/fits/fit-curves')
      if (detail.value === d) curves.value = fitCurves(d)
    },
    { immediate: true },
  )
  return curves
}

/** Which fits are drawn: new fits are drawn as they arrive; fits the person switched off stay off. */
export function useVisibleFits(detail: Ref<DataSetDetail | null>) {
  const visible = ref<string[]>([])
  const seen = new Set<string>()
  watch(
    () => detail.value?.fits.map((f) => f.id) ?? [],
    (ids) => {
      const fresh = ids.filter((id) => !seen.has(id))
      fresh.forEach((id) => seen.add(id))
      visible.value = [...visible.value.filter((v) => ids.includes(v)), ...fresh]
    },
    { immediate: true },
  )
  return visible
}
