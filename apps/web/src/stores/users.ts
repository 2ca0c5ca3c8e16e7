import type { Role } from '@ebullio/schemas'
import { defineStore } from 'pinia'
import { ref } from 'vue'
import { adminApi, type UserRow } from '../api/admin'

export const useUsersStore = defineStore('users', () => {
  const items = ref<UserRow[]>([])
  const loading = ref(false)
  const error = ref<string | null>(null)

  async function load() {
    loading.value = true
    error.value = null
    try {
      items.value = (await adminApi.users()).items
    } catch (e) {
      error.value = (e as Error).message
    } finally {
      loading.value = false
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
  return { items, loading, error, load, invite, setRoles, setActive }
})
