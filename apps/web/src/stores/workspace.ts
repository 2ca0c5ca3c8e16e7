import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import { commentsApi, type CommentItem } from '../api/comments'
import {
  datasetsApi,
  type DataSetDetail,
  type FitRequest,
  type ModelName,
  type VaporPressureSet,
} from '../api/datasets'
import { systemsLabApi } from '../api/systems-lab'

/** The preferred (else newest) vapour-pressure set's model, as the server picks it for its own curves. */
function preferredModel(sets: VaporPressureSet[] | undefined): Record<string, unknown> | null {
  if (!sets?.length) return null
  return (sets.find((s) => s.preferred) ?? sets[0]).parameters
}

/** The data set open in the workspace: its points, fits, consistency results, signatures and comments. */
export const useWorkspaceStore = defineStore('workspace', () => {
  const detail = ref<DataSetDetail | null>(null)
  const loading = ref(false)
  const error = ref<string | null>(null)
  const status = ref<number | null>(null)
  /** vapour-pressure models by system id: they do not change while a data set is open */
  const vpCache = new Map<string, DataSetDetail['vaporPressure']>()

  async function vaporPressureFor(d: DataSetDetail): Promise<DataSetDetail['vaporPressure']> {
    if (vpCache.has(d.system.id)) return vpCache.get(d.system.id)
    try {
      const [c1, c2] = await Promise.all([
        systemsLabApi.component(d.system.component1.id),
        systemsLabApi.component(d.system.component2.id),
      ])
      const a = preferredModel(c1.vaporPressureSets)
      const b = preferredModel(c2.vaporPressureSets)
      const vp = a && b ? ([a, b] as [Record<string, unknown>, Record<string, unknown>]) : null
      vpCache.set(d.system.id, vp)
      return vp
    } catch {
      return null
    }
  }

  async function load(id: string) {
    loading.value = true
    error.value = null
    status.value = null
    try {
      const d = await datasetsApi.get(id)
      d.vaporPressure = await vaporPressureFor(d)
      detail.value = d
    } catch (e) {
      error.value = (e as Error).message
      status.value = (e as { status?: number }).status ?? null
      detail.value = null
    } finally {
      loading.value = false
    }
  }
  async function reload() {
    if (detail.value) await load(detail.value.dataSet.id)
  }

  const ds = computed(() => detail.value?.dataSet ?? null)
  const comments = computed<CommentItem[]>(() => detail.value?.comments ?? [])
  const editable = computed(() => ds.value?.state === 'draft' || ds.value?.state === 'returned')

  async function exclude(pointId: string, excluded: boolean, reason: string | null) {
    await datasetsApi.exclude(ds.value!.id, pointId, ds.value!.rowVersion, excluded, reason)
    await reload()
  }
  async function runFits(req: FitRequest) {
    await datasetsApi.runFits(ds.value!.id, req)
    await reload()
  }
  async function recommend(fitId: string) {
    await datasetsApi.recommend(ds.value!.id, fitId)
    await reload()
  }
  async function runConsistency(model?: ModelName) {
    await datasetsApi.runConsistency(ds.value!.id, model)
    await reload()
  }
  /** Submit; answers how many other lead chemists were told. */
  async function submit(): Promise<number | null> {
    const r = await datasetsApi.submit(ds.value!.id, ds.value!.rowVersion)
    await reload()
    return typeof r.notifiedLeadChemists === 'number' ? r.notifiedLeadChemists : null
  }
  async function deleteFit(fitId: string) {
    await datasetsApi.deleteFit(ds.value!.id, fitId)
    await reload()
  }
  async function addComment(body: string, pointId: string | null, parentId: string | null = null) {
    await commentsApi.create(ds.value!.id, { body, pointId, parentId })
    await reload()
  }
  async function setResolved(id: string, resolved: boolean) {
    await (resolved ? commentsApi.resolve(ds.value!.id, id) : commentsApi.reopen(ds.value!.id, id))
    await reload()
  }
  return {
    deleteFit,
    detail,
    comments,
    loading,
    error,
    status,
    ds,
    editable,
    load,
    reload,
    exclude,
    runFits,
    recommend,
    runConsistency,
    submit,
    addComment,
    setResolved,
  }
})
