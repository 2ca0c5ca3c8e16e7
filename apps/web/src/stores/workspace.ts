import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import { commentsApi, type CommentItem } from '../api/comments'
import { datasetsApi, type DataSetDetail, type ModelName } from '../api/datasets'

/** The data set open in the workspace: its points, fits, consistency results, signatures and comments. */
export const useWorkspaceStore = defineStore('workspace', () => {
  const detail = ref<DataSetDetail | null>(null)
  const comments = ref<CommentItem[]>([])
  const loading = ref(false)
  const error = ref<string | null>(null)
  const status = ref<number | null>(null)

  async function load(id: string) {
    loading.value = true
    error.value = null
    status.value = null
    try {
      const [d, c] = await Promise.all([datasetsApi.get(id), commentsApi.list(id).catch(() => ({ items: [] as CommentItem[] }))])
      detail.value = d
      comments.value = c.items
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
  async function reloadComments() {
    if (detail.value) comments.value = (await commentsApi.list(detail.value.dataSet.id)).items
  }

  const ds = computed(() => detail.value?.dataSet ?? null)
  const editable = computed(() => ds.value?.state === 'draft' || ds.value?.state === 'returned')

  async function exclude(pointId: string, excluded: boolean, reason: string | null) {
    await datasetsApi.exclude(ds.value!.id, pointId, excluded, reason)
    await reload()
  }
  async function runFits(models: ModelName[]) {
    await datasetsApi.runFits(ds.value!.id, models)
    await reload()
  }
  async function recommend(fitId: string) {
    await datasetsApi.recommend(ds.value!.id, fitId)
    await reload()
  }
  async function runConsistency(fitId?: string) {
    await datasetsApi.runConsistency(ds.value!.id, fitId)
    await reload()
  }
  async function submit() {
    await datasetsApi.submit(ds.value!.id, ds.value!.rowVersion)
    await reload()
  }
  async function addComment(body: string, pointId: string | null, parentId: string | null = null) {
    await commentsApi.create(ds.value!.id, { body, pointId, parentId })
    await reloadComments()
  }
  async function setResolved(id: string, resolved: boolean) {
    await (resolved ? commentsApi.resolve(id) : commentsApi.reopen(id))
    await reloadComments()
  }
  return { detail, comments, loading, error, status, ds, editable, load, reload, reloadComments, exclude, runFits, recommend, runConsistency, submit, addComment, setResolved }
})
