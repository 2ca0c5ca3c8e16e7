/**
 * What an exported plot carries so it stands on its own: a title block (plot, system and pressure, data set
 * and version, approval state and signer, date of export) and only the curves shown on screen.
 * The views that know the data set provide the block (`providePlotTitleBlock`); every PlotFrame below uses it.
 */
import { inject, provide, type InjectionKey, type Ref } from 'vue'

export interface PlotTitleBlock {
  /** "acetone / methanol" */
  system: string
  /** the pressure the plot is drawn at, as the user reads it ("101.33 kPa") */
  pressure: string
  dataSet: string
  version: number
  /** draft, submitted, returned, approved, superseded */
  state: string
  /** who signed the approval, when approved or superseded */
  signer: string | null
  /** ISO date of that signature */
  signedAt: string | null
}

const KEY: InjectionKey<Ref<PlotTitleBlock | null>> = Symbol('plot-title-block')

export const providePlotTitleBlock = (block: Ref<PlotTitleBlock | null>) => provide(KEY, block)
export const usePlotTitleBlock = () => inject(KEY, null)

/** "2026-12-03 17:15 UTC+1": a date and time with its zone, as an exported file should say it. */
export function stampText(d: Date, timeZone?: string): string {
  const parts = new Intl.DateTimeFormat('en-GB', {
    timeZone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
    timeZoneName: 'shortOffset',
  }).formatToParts(d)
  const get = (t: string) => parts.find((p) => p.type === t)?.value ?? ''
  const zone =
    get('timeZoneName')
      .replace('GMT', 'UTC')
      .replace(/^UTC[+-]0$/, 'UTC') || 'UTC'
  return `${get('year')}-${get('month')}-${get('day')} ${get('hour')}:${get('minute')} ${zone}`
}

/** The title block's lines: heading, data set and approval, export stamp. */
export function titleBlockLines(plotTitle: string, b: PlotTitleBlock, now: Date, timeZone?: string): string[] {
  const approval =
    b.state === 'approved' || b.state === 'superseded'
      ? `${b.state}${b.signer ? `, signed by ${b.signer}` : ''}${b.signedAt ? ` on ${stampText(new Date(b.signedAt), timeZone).slice(0, 10)}` : ''}`
      : `${b.state}, not approved`
  return [
    `${b.system} · ${plotTitle}${plotTitle.includes(b.pressure) ? '' : ` at ${b.pressure}`}`,
    `Data set "${b.dataSet}" version ${b.version} · ${approval}`,
    `Exported from Ebullio ${stampText(now, timeZone)}`,
  ]
}

type Opt = Record<string, unknown>
const asArray = (v: unknown): Opt[] => (Array.isArray(v) ? (v as Opt[]) : v ? [v as Opt] : [])

/** Height in px the title block takes above the plot. */
export const TITLE_BLOCK_PX = 62

/**
 * The option of an exported plot: series hidden in the legend are left out (and their legend entries), and
 * with a title block, its lines sit above a grid and legend moved down by TITLE_BLOCK_PX.
 */
export function exportOption(option: Opt, lines: string[] | null): Opt {
  const legends = asArray(option.legend)
  const hidden = new Set<string>()
  for (const l of legends)
    for (const [name, on] of Object.entries((l.selected as Record<string, boolean>) ?? {}))
      if (on === false) hidden.add(name)
  const series = asArray(option.series).filter((s) => !(typeof s.name === 'string' && hidden.has(s.name)))
  const shift = lines ? TITLE_BLOCK_PX : 0
  const down = (v: unknown) => (typeof v === 'number' ? v + shift : v)
  const legend = legends.map((l) => ({
    ...l,
    top: down(l.top ?? 0),
    selected: {},
    data: Array.isArray(l.data)
      ? (l.data as unknown[]).filter((d) => !hidden.has(typeof d === 'string' ? d : String((d as Opt)?.name)))
      : l.data,
  }))
  const grid = asArray(option.grid).map((g) => ({ ...g, top: down(g.top ?? 60) }))
  const out: Opt = { ...option, series, legend, grid, animation: false, backgroundColor: '#ffffff' }
  if (lines) {
    out.title = [
      {
        text: lines[0],
        subtext: lines.slice(1).join('\n'),
        left: 12,
        top: 6,
        itemGap: 4,
        textStyle: { fontSize: 13, fontWeight: 600, color: '#221f1b' },
        subtextStyle: { fontSize: 11, color: '#635e53', lineHeight: 15 },
      },
    ]
    out.graphic = [
      ...asArray(option.graphic),
      { type: 'rect', left: 0, top: 0, shape: { width: 4, height: TITLE_BLOCK_PX - 10 }, style: { fill: '#c98a12' } },
    ]
  }
  return out
}
