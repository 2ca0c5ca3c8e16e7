import { defineStore } from 'pinia'
import { ref } from 'vue'
import { catalogueApi, type CatalogueEntry, type MeasuredData, type ParametersExport } from '../api/catalogue'

/** The engineers' catalogue of approved systems and the parameters of the versions opened. */
export const useCatalogueStore = defineStore('catalogue', () => {
  const items = ref<CatalogueEntry[]>([])
  const total = ref(0)
  const loading = ref(false)
  const error = ref<string | null>(null)
  const parameters = ref<Record<string, ParametersExport>>({})

  async function load(q = '') {
    loading.value = true
    error.value = null
    try {
      const r = await catalogueApi.list(q)
      items.value = r.items
      total.value = r.total
    } catch (e) {
      error.value = (e as Error).message
    } finally {
      loading.value = false
    }
  }

  /** The catalogue entry of a system, loading the catalogue when it is not there yet. */
  async function entry(systemId: string): Promise<CatalogueEntry | null> {
    if (!items.value.some((i) => i.system.id === systemId)) await load()
    return items.value.find((i) => i.system.id === systemId) ?? null
  }

  /** Vapour-pressure sets and fits of an approved version (kept: approved data never change). */
  async function parametersOf(dataSetId: string): Promise<ParametersExport> {
    const cached = parameters.value[dataSetId]
    if (cached) return cached
    const p = await catalogueApi.parameters(dataSetId)
    parameters.value[dataSetId] = p
    return p
  }
  const measured = ref<Record<string, MeasuredData>>({})
  /** Points and fit residuals of an approved version (kept, as above). */
  async function measuredOf(dataSetId: string): Promise<MeasuredData> {
    const cached = measured.value[dataSetId]
    if (cached) return cached
    const r = await catalogueApi.measured(dataSetId)
    const m = {
      points: r.points,
      fits: r.fits.map((f) => ({ id: f.id, pointIds: f.pointIds, residuals: f.residuals })),
      vapourCorrection: r.vapourCorrection ?? null,
    }
    measured.value[dataSetId] = m
    return m
  }
  return { items, total, loading, error, load, entry, parametersOf, measuredOf }
})
