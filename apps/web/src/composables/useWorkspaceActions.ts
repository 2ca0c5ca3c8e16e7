import { useConfirm } from 'primevue/useconfirm'
import { useToast } from 'primevue/usetoast'
import { ref, type Ref } from 'vue'
import { useRouter } from 'vue-router'
import { datasetsApi } from '../api/datasets'
import { labDayApi } from '../api/lab-day'
import { useWorkspaceStore } from '../stores/workspace'

/** What the lead chemists are told on submit, in words: nobody, an unknown number, or how many. */
export function submittedText(told: number | null): string {
  if (told === 0)
    return 'No other lead chemist is active in this lab, so nobody was told and another lead chemist must be added to approve it.'
  if (told === null) return 'Submitted for approval.'
  return `${told} lead chemist${told === 1 ? ' has' : 's have'} been told.`
}

/**
 * The workspace's confirmed actions (submit, revise, delete the draft) and the toasts after a dialog saved;
 * `busy` names the action under way.
 */
export function useWorkspaceActions(openThreads: Ref<number>) {
  const store = useWorkspaceStore()
  const router = useRouter()
  const toast = useToast()
  const confirm = useConfirm()
  const busy = ref<string | null>(null)

  async function working(name: string, action: () => Promise<void>) {
    busy.value = name
    try {
      await action()
    } finally {
      busy.value = null
    }
  }
  const counts = () => `${store.detail!.points.length} points and ${store.detail!.fits.length} fits`

  function submit() {
    const n = openThreads.value
    const open = n ? ` ${n} thread${n === 1 ? ' is' : 's are'} still open.` : ''
    confirm.require({
      header: 'Submit for approval',
      message: `Version ${store.ds!.version} with ${counts()} goes to the lead chemists; you cannot edit it while they review it.${open}`,
      acceptLabel: 'Submit',
      rejectLabel: 'Keep editing',
      rejectProps: { severity: 'secondary', outlined: true },
      accept: () =>
        working('submit', async () => {
          const told = await store.submit()
          // Said as it is: with no other active lead chemist nobody was told, and nobody else can approve.
          toast.add({
            severity: told === 0 ? 'warn' : 'success',
            summary: 'Submitted',
            detail: submittedText(told),
            life: 6000,
          })
        }),
    })
  }

  function deleteDraft() {
    const d = store.ds!
    confirm.require({
      header: 'Delete this draft',
      message: `“${d.title}” (version ${d.version}) and its ${counts()} will be deleted. The audit log keeps a line saying you deleted it. This cannot be undone.`,
      acceptLabel: 'Delete draft',
      rejectLabel: 'Keep it',
      acceptProps: { severity: 'danger' },
      rejectProps: { severity: 'secondary', outlined: true },
      accept: () =>
        working('delete', async () => {
          try {
            await labDayApi.deleteDraft(d.id)
            toast.add({ severity: 'success', summary: 'Draft deleted', life: 4000 })
            await router.push({ name: 'datasets' })
          } catch (e) {
            toast.add({ severity: 'error', summary: 'Not deleted', detail: (e as Error).message, life: 6000 })
          }
        }),
    })
  }

  function revise() {
    const v = store.ds!.version
    confirm.require({
      header: 'Revise as a new version',
      message: `Version ${v + 1} starts as a draft with this version's points and fits. Version ${v} stays approved, and engineers keep using it, until version ${v + 1} is approved; then version ${v} is superseded.`,
      acceptLabel: `Create version ${v + 1}`,
      rejectLabel: 'Cancel',
      rejectProps: { severity: 'secondary', outlined: true },
      accept: () =>
        working('revise', async () => {
          const d = await datasetsApi.revise(store.ds!.id)
          await router.push({ name: 'dataset', params: { id: d.id } })
        }),
    })
  }

  async function signed() {
    await store.reload()
    toast.add({
      severity: 'success',
      summary: 'Signature recorded',
      detail:
        store.ds?.state === 'approved'
          ? 'The data set is approved and locked.'
          : 'The data set went back to its author.',
      life: 5000,
    })
  }
  /** Reload after a dialog stored something, and say so. */
  const savedWith = (summary: string) => async () => {
    await store.reload()
    toast.add({ severity: 'success', summary, life: 3000 })
  }

  return {
    busy,
    submit,
    deleteDraft,
    revise,
    signed,
    metadataSaved: savedWith('Details saved'),
    pointsSaved: savedWith('Points stored'),
  }
}
