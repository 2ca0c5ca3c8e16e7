import type { Role } from '@ebullio/schemas'
import { defineStore } from 'pinia'
import { reactive, ref } from 'vue'
import { adminApi, type UserQuery, type UserRow } from '../api/admin'

/** The admin people list, one page at a time from the server (search, role and status filters, sort). */
export const useUsersStore = defineStore('users', () => {
  const items = ref<UserRow[]>([])
  const total = ref(0)
  const filter = reactive<
    Required<Pick<UserQuery, 'page' | 'pageSize' | 'sort' | 'order'>> &
      Omit<UserQuery, 'page' | 'pageSize' | 'sort' | 'order'>
  >({
    q: '',
    role: undefined,
    status: undefined,
    sort: 'name',
    order: 'asc',
    page: 1,
    pageSize: 20,
  })
  const loading = ref(false)
  const error = ref<string | null>(null)
  let asked = 0

  async function load() {
    loading.value = true
    error.value = null
    const mine = ++asked
    try {
      const r = await adminApi.users({ ...filter, q: filter.q?.trim() || undefined })
      if (mine !== asked) return // a later search has been sent; its answer wins
      items.value = r.items
      total.value = r.total
    } catch (e) {
      if (mine === asked) error.value = (e as Error).message
    } finally {
      if (mine === asked) loading.value = false
    }
  }
  async function invite(body: { email: string; displayName: string; roles: Role[] }) {
    await adminApi.invite(body)
    await load()
  }
  async function setRoles(id: string, roles: Role[]) {
    await adminApi.setRoles(id, roles)
    await load()
  }
  async function setActive(id: string, active: boolean) {
    await (active ? adminApi.activate(id) : adminApi.deactivate(id))
    await load()
  }
  return { items, total, filter, loading, error, load, invite, setRoles, setActive }
})
