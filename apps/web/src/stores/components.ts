import { defineStore } from 'pinia'
import { ref } from 'vue'
import {
  componentsApi,
  type Component,
  type ComponentDetail,
  type ComponentInput,
  type VaporPressureInput,
} from '../api/components'

/** Pure components for the admin screen: one page of the list and the component opened. */
export const useComponentsStore = defineStore('components', () => {
  const items = ref<Component[]>([])
  const total = ref(0)
  const loading = ref(false)
  const error = ref<string | null>(null)
  const current = ref<ComponentDetail | null>(null)
  const currentLoading = ref(false)
  const query = ref({
    q: '',
    page: 1,
    pageSize: 25,
    sort: 'name' as 'name' | 'created_at' | 'molar_mass',
    order: 'asc' as 'asc' | 'desc',
  })

  async function load() {
    loading.value = true
    error.value = null
    try {
      const r = await componentsApi.list(query.value)
      items.value = r.items
      total.value = r.total
    } catch (e) {
      error.value = (e as Error).message
    } finally {
      loading.value = false
    }
  }
  async function open(id: string) {
    currentLoading.value = true
    try {
      current.value = await componentsApi.get(id)
    } finally {
      currentLoading.value = false
    }
  }
  async function create(body: ComponentInput) {
    const c = await componentsApi.create(body)
    await load()
    return c
  }
  async function update(id: string, rowVersion: number, patch: Partial<ComponentInput>) {
    await componentsApi.update(id, rowVersion, patch)
    await Promise.all([load(), open(id)])
  }
  async function remove(id: string) {
    await componentsApi.remove(id)
    if (current.value?.id === id) current.value = null
    await load()
  }
  async function addVaporPressureSet(id: string, body: VaporPressureInput) {
    await componentsApi.addVaporPressureSet(id, body)
    await open(id)
  }
  return {
    items,
    total,
    loading,
    error,
    current,
    currentLoading,
    query,
    load,
    open,
    create,
    update,
    remove,
    addVaporPressureSet,
  }
})
