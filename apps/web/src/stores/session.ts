import type { Role } from '@ebullio/schemas'
import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import { authApi, type Me } from '../api/auth'
import { ApiError } from '../api/client'

export const useSessionStore = defineStore('session', () => {
  const user = ref<Me | null>(null)
  const devMode = ref(false)
  /** the lab's name as the server is configured (LAB_NAME) */
  const labName = ref('')
  const loaded = ref(false)

  async function load(): Promise<Me | null> {
    try {
      const r = await authApi.me()
      user.value = r.user
      devMode.value = r.devMode
      labName.value = r.labName ?? ''
    } catch (e) {
      if (!(e instanceof ApiError) || e.status !== 401) throw e
      user.value = null
    } finally {
      loaded.value = true
    }
    return user.value
  }

  async function signIn(email: string, password: string) {
    await authApi.signIn(email, password)
    await load()
  }

  async function signOut() {
    try {
      await authApi.signOut()
    } finally {
      user.value = null
    }
  }

  const roles = computed<Role[]>(() => user.value?.roles ?? [])
  const can = (...wanted: Role[]) => wanted.some((r) => roles.value.includes(r))
  return { user, devMode, labName, loaded, roles, load, signIn, signOut, can }
})
