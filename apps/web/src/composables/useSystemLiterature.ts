/**
 * A system's literature data sets for its plots: loaded once per system, split by the plot's pressure into those
 * drawn beside the lab's own points and those only named (components/design/literature.ts). A failure to load
 * them leaves the plots as they are: literature is a comparison, not part of the design.
 */
import { computed, shallowRef, watch, type Ref } from 'vue'
import { catalogueApi, type LiteratureSet } from '../api/catalogue'
import { literatureAt } from '../components/design/literature'

/** @param excludeId a data set not to draw (the one whose own plot this is) */
export function useSystemLiterature(systemId: Ref<string>, pressurePa: Ref<number>, excludeId?: Ref<string | null>) {
  const sets = shallowRef<LiteratureSet[]>([])
  watch(
    systemId,
    async (id) => {
      sets.value = []
      if (!id) return
      try {
        sets.value = (await catalogueApi.literature(id)).items
      } catch {
        sets.value = []
      }
    },
    { immediate: true },
  )
  const split = computed(() =>
    literatureAt(
      sets.value.filter((s) => s.dataSetId !== excludeId?.value),
      pressurePa.value,
    ),
  )
  return { drawn: computed(() => split.value.drawn), notDrawn: computed(() => split.value.notDrawn) }
}
