/**
 * How Ebullio names a fit, in one place for the lab screens, the engineer's view and the exports: the model,
 * numbered in run order when the same model was fitted more than once on the data set, with the settings that
 * differ between those fits (or the run time, in UTC, when none does). The API computes the label from all fits of
 * the data set and sends it; the web computes it the same way from the same list.
 */

/** Display names of the activity models, as chemists write them. */
export const FIT_MODEL_LABELS: Readonly<Record<string, string>> = {
  ideal: 'Ideal (Raoult)',
  margules: 'Margules',
  'van-laar': 'Van Laar',
  wilson: 'Wilson',
  nrtl: 'NRTL',
  uniquac: 'UNIQUAC',
}

/** What naming a fit needs: its id, model, run time (ISO text or Date), settings and point count. */
export interface FitLabelInput {
  id: string
  model: string
  runAt: string | Date
  options?: Record<string, unknown> | null
  /** the ids of the points it used (the lab screens have them) … */
  pointIds?: readonly string[]
  /** … or only their number (exports) */
  pointCount?: number | null
}

const iso = (d: string | Date) => (typeof d === 'string' ? d : d.toISOString())
const pointsOf = (f: FitLabelInput) => f.pointIds?.length ?? f.pointCount ?? 0

/** One setting of a fit in words: objective, NRTL α (held or fitted), number of points used. */
function settingWords(f: FitLabelInput): Record<string, string> {
  const o = f.options ?? {}
  const out: Record<string, string> = { points: `${pointsOf(f)} points` }
  if (typeof o.objective === 'string')
    out.objective =
      o.objective === 'activity'
        ? 'activity objective'
        : o.objective === 'bubble-pressure'
          ? 'bubble-pressure objective'
          : 'bubble-point objective'
  if (typeof o.alpha === 'number') out.alpha = `${o.fitAlpha === true ? 'α fitted from' : 'α ='} ${o.alpha}`
  return out
}

/** "run 14:05 UTC" (the same text on every screen and in every file, whatever the reader's time zone). */
function runText(runAt: string | Date): string {
  const d = new Date(iso(runAt))
  return Number.isNaN(d.getTime()) ? 'run time unknown' : `run ${d.toISOString().slice(11, 16)} UTC`
}

/** The name of fit `f` among `all` the fits of its data set (`f` included). */
export function fitLabel(f: FitLabelInput, all: readonly FitLabelInput[]): string {
  const base = FIT_MODEL_LABELS[f.model] ?? f.model
  const same = all
    .filter((g) => g.model === f.model)
    .sort((a, b) => iso(a.runAt).localeCompare(iso(b.runAt)) || a.id.localeCompare(b.id))
  if (same.length < 2) return base
  const mine = settingWords(f)
  const differ = Object.keys(mine).filter((k) => same.some((g) => settingWords(g)[k] !== mine[k]))
  const note = differ.length ? differ.map((k) => mine[k]).join(', ') : runText(f.runAt)
  return `${base} #${same.findIndex((g) => g.id === f.id) + 1} (${note})`
}

/**
 * A fit's label with a note in parentheses, merged into the label's own parentheses when it has them:
 * "Wilson (recommended)", "Wilson #1 (run 20:14 UTC; recommended)", never "(…) (…)".
 */
export function labelWithNote(label: string, note: string): string {
  return label.endsWith(')') ? `${label.slice(0, -1)}; ${note})` : `${label} (${note})`
}
