/**
 * What a partially miscible system adds to the plots: the three-phase line (vapour over two liquid layers), the
 * shaded region where two liquids coexist, the flat stretch of the x–y curve and the azeotrope marks with
 * their kind. ECharts series built from plain data, testable without a browser.
 */
import { fmt, INK, showT, tUnit } from './plot-style'
import type { AzeotropeMark, TemperatureUnit, ThreePhaseMark, TwoLiquidRegion } from './plot-types'

export const THREE_PHASE_NAME = 'Three-phase line'
export const TWO_LIQUID_NAME = 'Two liquid layers'
/** Our own colours: a dark plum line over a pale lilac region (none is a point or curve colour). */
export const THREE_PHASE_COLOUR = '#5a2a4a'
export const TWO_LIQUID_COLOUR = '#9a86c4'
const AZEOTROPE_FILL = '#f2b544'

type Api = { coord: (v: number[]) => number[] }

/** Words for an azeotrope's kind, as the lists and tooltips say it. */
export function azeotropeKindText(kind: AzeotropeMark['kind']): string {
  return kind === 'heterogeneous'
    ? 'heterogeneous (boils as two liquid layers)'
    : kind === 'maximum-boiling'
      ? 'maximum-boiling'
      : kind === 'minimum-boiling'
        ? 'minimum-boiling'
        : ''
}

/** The two-liquid region as one closed polygon: up the x1I side to the three-phase line, down the x1II side. */
export function twoLiquidSeries(
  region: TwoLiquidRegion,
  top: ThreePhaseMark | null,
  unit: TemperatureUnit,
): Record<string, unknown>[] {
  const ok = region.T.map((_, i) => i).filter((i) =>
    [region.T[i], region.x1I[i], region.x1II[i]].every(Number.isFinite),
  )
  if (ok.length < 2) return []
  const left = ok.map((i) => [region.x1I[i], showT(region.T[i], unit)])
  const right = ok.map((i) => [region.x1II[i], showT(region.T[i], unit)])
  if (top) {
    left.push([top.x1I, showT(top.T, unit)])
    right.push([top.x1II, showT(top.T, unit)])
  }
  const outline = [...left, ...[...right].reverse()]
  return [
    {
      type: 'custom',
      name: TWO_LIQUID_NAME,
      silent: true,
      z: 1,
      color: TWO_LIQUID_COLOUR,
      // every corner is data, so the temperature axis makes room for the whole region
      data: outline,
      encode: { x: 0, y: 1 },
      renderItem: (p: { dataIndex: number }, api: Api) =>
        p.dataIndex === 0
          ? {
              type: 'polygon',
              shape: { points: outline.map((v) => api.coord(v)) },
              style: { fill: TWO_LIQUID_COLOUR, opacity: 0.22, stroke: TWO_LIQUID_COLOUR, lineWidth: 1.2 },
            }
          : null,
    },
  ]
}

/** The three-phase line on the T–x–y plot, with the vapour on it marked. */
export function threePhaseTxySeries(t: ThreePhaseMark, unit: TemperatureUnit): Record<string, unknown>[] {
  const T = showT(t.T, unit)
  const tU = tUnit(unit)
  const tip = () =>
    `<b>${THREE_PHASE_NAME}</b> at ${fmt(T, 2)} ${tU}<br>liquid layers x₁ = ${fmt(t.x1I)} and ${fmt(t.x1II)}<br>vapour y₁ = ${fmt(t.y1)}`
  return [
    {
      type: 'line',
      name: THREE_PHASE_NAME,
      z: 3,
      color: THREE_PHASE_COLOUR,
      symbol: 'rect',
      symbolSize: 7,
      lineStyle: { color: THREE_PHASE_COLOUR, width: 3 },
      data: [
        [t.x1I, T],
        [t.y1, T],
        [t.x1II, T],
      ],
      tooltip: { formatter: tip },
    },
  ]
}

/** The flat stretch of the x–y curve: every overall liquid between the layers boils to the same vapour. */
export function threePhaseXySeries(t: ThreePhaseMark): Record<string, unknown>[] {
  return [
    {
      type: 'line',
      name: THREE_PHASE_NAME,
      z: 4,
      color: THREE_PHASE_COLOUR,
      showSymbol: true,
      symbol: 'rect',
      symbolSize: 6,
      lineStyle: { color: THREE_PHASE_COLOUR, width: 3 },
      data: [
        [t.x1I, t.y1],
        [t.x1II, t.y1],
      ],
      tooltip: {
        formatter: () =>
          `<b>${THREE_PHASE_NAME}</b><br>overall liquid x₁ from ${fmt(t.x1I)} to ${fmt(t.x1II)} (two layers)<br>vapour y₁ = ${fmt(t.y1)}`,
      },
    },
  ]
}

/** Azeotrope marks on the T–x–y plot (all with a temperature), each tooltip naming its kind. */
export function azeotropeTxySeries(list: AzeotropeMark[], unit: TemperatureUnit): Record<string, unknown>[] {
  const withT = list.filter((a) => a.T !== undefined)
  if (!withT.length) return []
  const tU = tUnit(unit)
  return [
    {
      type: 'scatter',
      name: 'Azeotrope',
      z: 6,
      symbol: 'triangle',
      symbolSize: 13,
      itemStyle: { color: AZEOTROPE_FILL, borderColor: INK, borderWidth: 1 },
      data: withT.map((a) => ({ value: [a.x1, showT(a.T!, unit)], az: a })),
      tooltip: {
        formatter: (p: { data: { az: AzeotropeMark } }) =>
          azeotropeTooltip(p.data.az, `${fmt(showT(p.data.az.T!, unit), 2)} ${tU}`),
      },
    },
  ]
}

/** Azeotrope marks on the x–y plot: a homogeneous one on the diagonal, a heterogeneous one where y₁ = its vapour. */
export function azeotropeXySeries(list: AzeotropeMark[]): Record<string, unknown>[] {
  if (!list.length) return []
  return [
    {
      type: 'scatter',
      name: 'Azeotrope',
      z: 7,
      symbol: 'triangle',
      symbolSize: 13,
      itemStyle: { color: AZEOTROPE_FILL, borderColor: INK, borderWidth: 1 },
      data: list.map((a) => ({ value: [a.x1, a.x1], az: a })),
      tooltip: { formatter: (p: { data: { az: AzeotropeMark } }) => azeotropeTooltip(p.data.az, null) },
    },
  ]
}

function azeotropeTooltip(a: AzeotropeMark, T: string | null): string {
  const kind = azeotropeKindText(a.kind)
  const lines = [`Azeotrope${kind ? `, ${kind}` : ''}`]
  if (a.kind === 'heterogeneous' && a.liquidPhases) {
    lines.push(`vapour y₁ = ${fmt(a.x1)}`, `liquid layers x₁ = ${fmt(a.liquidPhases[0])} and ${fmt(a.liquidPhases[1])}`)
  } else lines.push(`x₁ = y₁ = ${fmt(a.x1)}`)
  if (T) lines.push(`T = ${T}`)
  return lines.join('<br>')
}
