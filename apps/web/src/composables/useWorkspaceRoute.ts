import { ref, watch } from 'vue'
import { useRoute, useRouter } from 'vue-router'
import type { UploadKind } from '../api/uploads'
import { useWorkspaceStore } from '../stores/workspace'

/**
 * Loads the data set the address names and follows the address's hints once: `?point=` selects a point (a link
 * from "My open threads"), `?enter=points` opens the point entry and `?upload=` the upload dialog of a draft.
 */
export function useWorkspaceRoute() {
  const store = useWorkspaceStore()
  const route = useRoute()
  const router = useRouter()
  const pointId = ref<string | null>(null)
  const enterOpen = ref(false)
  const uploadOpen = ref(false)
  const uploadKind = ref<UploadKind>('run')

  watch(
    () => route.params.id as string,
    async (id) => {
      if (!id) return
      pointId.value = null
      await store.load(id)
      const point = route.query.point
      if (typeof point === 'string' && store.detail?.points.some((p) => p.id === point)) pointId.value = point
      if (route.query.enter === 'points' && store.editable) {
        enterOpen.value = true
        router.replace({ query: {} })
      }
      if (route.query.upload && store.editable) {
        uploadKind.value = route.query.upload === 'calibration' ? 'calibration' : 'run'
        uploadOpen.value = true
        router.replace({ query: {} })
      }
    },
    { immediate: true },
  )
  return { pointId, enterOpen, uploadOpen, uploadKind }
}
