import { defineStore } from 'pinia'
import { ref } from 'vue'
import { commentsApi, type MyThread } from '../api/comments'

/** The signed-in person's open threads across all data sets. */
export const useThreadsStore = defineStore('threads', () => {
  const items = ref<MyThread[]>([])
  const loading = ref(false)
  const error = ref<string | null>(null)
  async function load() {
    loading.value = true
    error.value = null
    try {
      items.value = (await commentsApi.mine()).items
    } catch (e) {
      error.value = (e as Error).message
    } finally {
      loading.value = false
    }
  }
  return { items, loading, error, load }
})
