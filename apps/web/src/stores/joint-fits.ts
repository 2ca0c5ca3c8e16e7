import type { JointFitRequest } from '@ebullio/schemas'
import { defineStore } from 'pinia'
import { ref } from 'vue'
import { jointFitsApi, type JointFit } from '../api/joint-fits'

/** The joint fits of the system open on the lab's system page. */
export const useJointFitsStore = defineStore('joint-fits', () => {
  const systemId = ref<string | null>(null)
  const items = ref<JointFit[]>([])
  const loading = ref(false)
  const error = ref<string | null>(null)

  async function load(id: string) {
    if (systemId.value !== id) items.value = []
    systemId.value = id
    loading.value = true
    error.value = null
    try {
      items.value = (await jointFitsApi.list(id)).items
    } catch (e) {
      error.value = (e as Error).message
    } finally {
      loading.value = false
    }
  }
  const reload = () => (systemId.value ? load(systemId.value) : Promise.resolve())

  /** Run a joint fit; the new one comes first in the list. */
  async function run(body: JointFitRequest): Promise<JointFit> {
    const fit = await jointFitsApi.run(systemId.value!, body)
    await reload()
    return fit
  }
  async function submit(fit: JointFit) {
    const r = await jointFitsApi.submit(fit.id, fit.rowVersion)
    await reload()
    return r
  }
  async function approve(fit: JointFit, password: string, reason: string) {
    const r = await jointFitsApi.approve(fit.id, { password, reason, rowVersion: fit.rowVersion })
    await reload()
    return r
  }
  async function returnForRework(fit: JointFit, password: string, reason: string) {
    const r = await jointFitsApi.returnForRework(fit.id, { password, reason, rowVersion: fit.rowVersion })
    await reload()
    return r
  }
  async function remove(fit: JointFit) {
    await jointFitsApi.remove(fit.id)
    await reload()
  }
  return { systemId, items, loading, error, load, run, submit, approve, returnForRework, remove }
})
