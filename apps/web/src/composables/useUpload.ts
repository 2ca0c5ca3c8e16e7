import { computed, ref, watch, type Ref } from 'vue'
import { ApiError } from '../api/client'
import type { DataSet } from '../api/datasets'
import { uploadsApi, type GcMethodOption, type UploadKind, type UploadPreview } from '../api/uploads'

export type UploadPhase = 'idle' | 'sending' | 'checking' | 'committing'

/** A rejected file whose details are row problems is shown as a preview that lists them (nothing else to show). */
function problemsPreview(e: unknown, kind: UploadKind): UploadPreview | null {
  if (!(e instanceof ApiError) || !Array.isArray(e.details) || !e.details.length) return null
  if ((e.details as { row?: unknown }[])[0].row === undefined) return null
  return { kind, header: [], rows: [], mapping: {}, extraColumns: [], problems: e.details as UploadPreview['problems'] }
}
const messageOf = (e: unknown, fallback: string) => (e instanceof ApiError ? e.message : fallback)

/** The toast after a commit: what was stored, from which file, and which calibration it retired. */
export function committedText(
  kind: UploadKind,
  fileName: string,
  pointCount: number | string,
  replaced: { createdAt: string | Date } | null,
): { summary: string; detail: string } {
  if (kind === 'run') return { summary: 'Run file stored', detail: `${pointCount} points added from ${fileName}.` }
  const retired = replaced
    ? `; the one of ${new Date(replaced.createdAt).toLocaleDateString(undefined, { dateStyle: 'medium' })} is retired`
    : ''
  return { summary: 'Calibration stored', detail: `${fileName} is now the active calibration${retired}.` }
}

/**
 * One upload of a calibration or run sheet: choose a file, send it for a preview (nothing stored), page through
 * the preview, acknowledge warnings and a replaced calibration, then commit (all or nothing).
 */
export function useUpload(
  dataSet: () => DataSet,
  initialKind: () => UploadKind | undefined,
  visible: Ref<boolean>,
  onCommitted: (kind: UploadKind, r: { pointCount?: number }) => void,
) {
  const kind = ref<UploadKind>(initialKind() ?? 'run')
  const methods = ref<GcMethodOption[]>([])
  const gcMethodId = ref<string | null>(null)
  const calModel = ref('response-factor')
  const file = ref<File | null>(null)
  const preview = ref<UploadPreview | null>(null)
  const progress = ref<number | null>(null)
  const phase = ref<UploadPhase>('idle')
  const error = ref<string | null>(null)
  const acknowledged = ref(false)
  /** the person accepts that the new calibration retires the active one of this method and system */
  const replaceAcknowledged = ref(false)
  const pagingBusy = ref(false)

  function reset() {
    file.value = null
    preview.value = null
    progress.value = null
    error.value = null
    acknowledged.value = false
    replaceAcknowledged.value = false
    phase.value = 'idle'
  }
  watch(
    visible,
    async (v) => {
      if (!v) return
      kind.value = initialKind() ?? kind.value
      reset()
      try {
        const [m, active] = await Promise.all([
          uploadsApi.gcMethods(),
          uploadsApi.calibrations(dataSet().systemId).catch(() => ({ items: [] })),
        ])
        methods.value = m.items
        // Default to the GC method this system is already calibrated on, so a new calibration replaces that one.
        gcMethodId.value ??= active.items[0]?.gcMethodId ?? methods.value[0]?.id ?? null
      } catch {
        methods.value = []
      }
    },
    { immediate: true },
  )
  watch(kind, reset)

  const fields = (extra: Record<string, string | undefined> = {}) =>
    kind.value === 'calibration'
      ? { gcMethodId: gcMethodId.value ?? undefined, systemId: dataSet().systemId, model: calModel.value, ...extra }
      : { rowVersion: String(dataSet().rowVersion), ...extra }

  async function onFile(f: File) {
    reset()
    file.value = f
    phase.value = 'sending'
    progress.value = 0
    try {
      preview.value = await uploadsApi.preview(dataSet().id, kind.value, f, fields(), (x) => {
        progress.value = Math.round(x * 100)
        if (x >= 1) phase.value = 'checking'
      })
    } catch (e) {
      error.value = messageOf(e, 'The file could not be read.')
      preview.value = problemsPreview(e, kind.value) ?? preview.value
    } finally {
      phase.value = 'idle'
    }
  }

  const errors = computed(
    () => preview.value?.errorCount ?? preview.value?.problems.filter((p) => p.severity === 'error').length ?? 0,
  )
  const warnings = computed(
    () => preview.value?.warningCount ?? preview.value?.problems.filter((p) => p.severity === 'warning').length ?? 0,
  )
  const paging = computed(() => preview.value?.paging ?? null)
  const rowCount = computed(() => paging.value?.rowCount ?? preview.value?.rows.length ?? 0)
  const sampleCount = computed(() => preview.value?.sampleCount ?? preview.value?.samples?.length ?? 0)
  const standardCount = computed(() => preview.value?.standardCount ?? preview.value?.standards?.length ?? 0)

  /** Another page of the same file: the server reads the file again and answers that page (nothing is stored). */
  async function goPage(page: number) {
    if (!file.value || !paging.value || page < 1 || page > paging.value.pages) return
    pagingBusy.value = true
    try {
      preview.value = await uploadsApi.preview(dataSet().id, kind.value, file.value, fields({ page: String(page) }))
    } catch (e) {
      error.value = messageOf(e, 'The page could not be read.')
    } finally {
      pagingBusy.value = false
    }
  }
  const replaces = computed(() => (kind.value === 'calibration' ? (preview.value?.replaces ?? null) : null))
  const canCommit = computed(
    () =>
      !!preview.value &&
      !!file.value &&
      errors.value === 0 &&
      (warnings.value === 0 || acknowledged.value) &&
      (!replaces.value || replaceAcknowledged.value) &&
      phase.value === 'idle',
  )
  const commitFields = () => {
    const acceptWarnings = warnings.value ? 'true' : 'false'
    if (kind.value === 'calibration')
      return { acceptWarnings, replaceActive: replaces.value ? 'true' : 'false', dataSetId: dataSet().id }
    return { acceptWarnings, ...(preview.value?.calibrationId && { calibrationId: preview.value.calibrationId }) }
  }

  async function commit() {
    if (!canCommit.value || !file.value) return
    phase.value = 'committing'
    progress.value = 0
    error.value = null
    try {
      const r = await uploadsApi.commit(
        dataSet().id,
        kind.value,
        file.value,
        fields(commitFields()),
        (x) => (progress.value = Math.round(x * 100)),
      )
      onCommitted(kind.value, r)
      if (kind.value === 'calibration') kind.value = 'run'
      else visible.value = false
    } catch (e) {
      error.value = messageOf(e, 'The file could not be stored.')
    } finally {
      phase.value = 'idle'
    }
  }

  return {
    kind,
    methods,
    gcMethodId,
    calModel,
    file,
    preview,
    progress,
    phase,
    error,
    acknowledged,
    replaceAcknowledged,
    pagingBusy,
    errors,
    warnings,
    paging,
    rowCount,
    sampleCount,
    standardCount,
    replaces,
    canCommit,
    reset,
    onFile,
    goPage,
    commit,
  }
}
