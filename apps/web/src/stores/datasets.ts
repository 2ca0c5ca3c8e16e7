import { defineStore } from 'pinia'
import { ref } from 'vue'
import { datasetsApi, type DataSetListItem, type DataSetListQuery, type NewDataSet } from '../api/datasets'

/** One page of the data sets list, as the server paged, sorted and filtered it. */
export const useDatasetsStore = defineStore('datasets', () => {
  const items = ref<DataSetListItem[]>([])
  const total = ref(0)
  const loading = ref(false)
  const error = ref<string | null>(null)

  async function load(q: DataSetListQuery) {
    loading.value = true
    error.value = null
    try {
      const r = await datasetsApi.list(q)
      items.value = r.items
      total.value = r.total
    } catch (e) {
      error.value = (e as Error).message
      items.value = []
      total.value = 0
    } finally {
      loading.value = false
    }
  }

  const create = (body: NewDataSet) => datasetsApi.create(body)
  return { items, total, loading, error, load, create }
})
