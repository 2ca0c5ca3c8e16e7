import { defineStore } from 'pinia'
import { ref } from 'vue'
import { gcApi, type Calibration, type GcMethod, type GcMethodInput } from '../api/gc'

/** GC methods and their calibrations for the admin screen. */
export const useGcStore = defineStore('gc', () => {
  const methods = ref<GcMethod[]>([])
  const calibrations = ref<Calibration[]>([])
  const systemNames = ref<Record<string, string>>({})
  const loading = ref(false)
  const error = ref<string | null>(null)

  async function load() {
    loading.value = true
    error.value = null
    try {
      const [m, c, s] = await Promise.all([gcApi.methods(), gcApi.calibrations(), gcApi.systems()])
      methods.value = m.items
      calibrations.value = c.items
      systemNames.value = Object.fromEntries(s.items.map((x) => [x.id, x.name]))
    } catch (e) {
      error.value = (e as Error).message
    } finally {
      loading.value = false
    }
  }
  async function createMethod(body: GcMethodInput) {
    await gcApi.createMethod(body)
    await load()
  }
  async function retire(id: string) {
    await gcApi.retire(id)
    calibrations.value = (await gcApi.calibrations()).items
  }
  /** Retire a method; its calibrations are retired with it, so both lists are read again. */
  async function retireMethod(id: string) {
    await gcApi.retireMethod(id)
    await load()
  }
  return { methods, calibrations, systemNames, loading, error, load, createMethod, retire, retireMethod }
})
