import { defineStore } from 'pinia'
import { ref } from 'vue'
import { reportsApi, type ReportVerification } from '../api/reports'

/** The check of one printed report against the stored record. */
export const useReportsStore = defineStore('reports', () => {
  const verification = ref<ReportVerification | null>(null)
  const loading = ref(false)
  const error = ref<string | null>(null)
  async function verify(id: string) {
    loading.value = true
    error.value = null
    verification.value = null
    try {
      verification.value = await reportsApi.verify(id)
    } catch (e) {
      error.value = (e as Error).message
    } finally {
      loading.value = false
    }
  }
  return { verification, loading, error, verify }
})
