import { computed, ref, shallowRef, watch } from 'vue'
import { useRoute } from 'vue-router'
import type { CatalogueEntry, MeasuredData, ParametersExport } from '../api/catalogue'
import { designPressureOf, errorText, SYSTEM_SET_PREFIX } from '../components/design/design-model'
import { useCatalogueStore } from '../stores/catalogue'

/**
 * The approved system the address names and the basis chosen on it: version (`?v=` or the newest), fit (the
 * system's recommended parameter set, else the version's recommended fit) and pressure (the measured one first), with the parameters and measured points of that version.
 */
export function useApprovedSystem() {
  const route = useRoute()
  const store = useCatalogueStore()
  const entry = ref<CatalogueEntry | null>(null)
  const params = shallowRef<ParametersExport | null>(null)
  const loading = ref(true)
  const loadError = ref<string | null>(null)
  const versionId = ref<string | null>(null)
  const fitId = ref<string | null>(null)
  const pressurePa = ref(101325)
  const measured = shallowRef<MeasuredData | null>(null)

  async function loadEntry() {
    loading.value = true
    loadError.value = null
    try {
      entry.value = await store.entry(String(route.params.id))
      if (!entry.value || entry.value.approved.length === 0) {
        loadError.value =
          'This system has no approved data set you can use. It may have been superseded or not approved yet.'
        return
      }
      const wanted = String(route.query.v ?? '')
      versionId.value =
        entry.value.approved.find((v) => v.dataSetId === wanted)?.dataSetId ?? entry.value.approved[0].dataSetId
    } catch (e) {
      loadError.value = errorText(e)
    } finally {
      loading.value = false
    }
  }
  watch(() => route.params.id, loadEntry, { immediate: true })

  watch(versionId, async (id) => {
    if (!id) return
    params.value = null
    try {
      params.value = await store.parametersOf(id)
      // The system's signed recommended parameter set comes first: it holds over the pressures it was fitted on.
      const systemSet = params.value.systemRecommendedSet
      fitId.value = systemSet
        ? SYSTEM_SET_PREFIX + systemSet.id
        : (params.value.recommendedFitId ?? params.value.fits[0]?.id ?? null)
      // an isothermal version opens at the pressure its equimolar liquid boils at, at its temperature
      pressurePa.value = designPressureOf(params.value, fitId.value)
    } catch (e) {
      loadError.value = errorText(e)
    }
    measured.value = null
    // The measured points are a supplement: the diagrams work without them.
    store
      .measuredOf(id)
      .then((m) => (measured.value = m))
      .catch(() => (measured.value = null))
  })

  const version = computed(() => entry.value?.approved.find((v) => v.dataSetId === versionId.value) ?? null)
  const names = computed<[string, string]>(() =>
    entry.value ? [entry.value.system.component1.name, entry.value.system.component2.name] : ['1', '2'],
  )
  return { entry, params, loading, loadError, versionId, fitId, pressurePa, measured, version, names }
}
