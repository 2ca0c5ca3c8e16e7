/**
 * Series drawn beside the lab's own data: literature data sets of the same system (one legend entry each,
 * triangles — filled for the liquid, hollow for the vapour — in colours of their own), and on the x–y plot
 * the compositions suggested for the next measurement at their predicted y1.
 */
import { escapeHtml, fmt, showT, tUnit } from './plot-style'
import type { TemperatureUnit, TxySuggestion } from './plot-types'

/** One literature data set to draw: its legend name (citation short form) and its points (T in K). */
export interface LiteratureSeries {
  name: string
  points: { T: number; x1: number; y1: number | null }[]
}

/** Colours of literature series, apart from the lab's own liquid/vapour colours and the fitted curves'. */
export const LITERATURE_COLOURS = ['#8e3b6b', '#3b6e8e', '#6b6b1f', '#9b5a2a']
export const LITERATURE_SYMBOL = 'triangle'

const colourOf = (i: number) => LITERATURE_COLOURS[i % LITERATURE_COLOURS.length]

/** T–x–y: liquid points as filled triangles, vapour points as hollow ones, one series per data set. */
export function literatureTxySeries(sets: LiteratureSeries[], unit: TemperatureUnit): Record<string, unknown>[] {
  const tU = tUnit(unit)
  return sets.map((s, i) => {
    const colour = colourOf(i)
    const liquid = s.points.map((p) => ({
      value: [p.x1, showT(p.T, unit)],
      symbol: LITERATURE_SYMBOL,
      itemStyle: { color: colour },
      tip: `x₁ = ${fmt(p.x1, 3)}`,
    }))
    const vapour = s.points
      .filter((p) => p.y1 !== null)
      .map((p) => ({
        value: [p.y1 as number, showT(p.T, unit)],
        symbol: LITERATURE_SYMBOL,
        itemStyle: { color: '#ffffff', borderColor: colour, borderWidth: 1.5 },
        tip: `y₁ = ${fmt(p.y1 as number, 3)}`,
      }))
    return {
      type: 'scatter',
      name: s.name,
      z: 4,
      color: colour,
      symbol: LITERATURE_SYMBOL,
      symbolSize: 9,
      data: [...liquid, ...vapour],
      tooltip: {
        formatter: (p: { data: { tip: string; value: number[] }; seriesName: string }) =>
          `${escapeHtml(p.seriesName)}<br>${p.data.tip}<br>T = ${fmt(p.data.value[1], 2)} ${tU}`,
      },
    }
  })
}

/** x–y: one series of filled triangles per literature data set (points without y1 are left out). */
export function literatureXySeries(sets: LiteratureSeries[]): Record<string, unknown>[] {
  return sets.map((s, i) => ({
    type: 'scatter',
    name: s.name,
    z: 4,
    color: colourOf(i),
    symbol: LITERATURE_SYMBOL,
    symbolSize: 9,
    data: s.points.filter((p) => p.y1 !== null).map((p) => [p.x1, p.y1]),
    tooltip: {
      formatter: (p: { value: number[]; seriesName: string }) =>
        `${escapeHtml(p.seriesName)}<br>x₁ = ${fmt(p.value[0], 3)}<br>y₁ = ${fmt(p.value[1], 3)}`,
    },
  }))
}

export const MEASURE_NEXT_NAME = 'Measure next'

/** x–y: the suggested compositions at the fit's predicted y1, numbered best first (those without y1 are skipped). */
export function suggestionXySeries(items: TxySuggestion[], colour: string): Record<string, unknown> {
  return {
    type: 'scatter',
    name: MEASURE_NEXT_NAME,
    z: 7,
    symbol: 'diamond',
    symbolSize: 12,
    color: colour,
    itemStyle: { color: '#ffffff', borderColor: colour, borderWidth: 2 },
    data: items
      .map((s, i) => ({ s, i }))
      .filter(({ s }) => typeof s.y1 === 'number')
      .map(({ s, i }) => ({ value: [s.x1, s.y1 as number], rank: i + 1, sigmaY: s.sigmaY })),
    label: {
      show: true,
      position: 'top',
      distance: 4,
      fontSize: 11,
      fontWeight: 600,
      color: colour,
      formatter: (p: { data: { rank: number } }) => String(p.data.rank),
    },
    tooltip: {
      formatter: (p: { data: { rank: number; value: number[]; sigmaY: number } }) =>
        `Measure next (#${p.data.rank})<br>x₁ = ${fmt(p.data.value[0], 2)}<br>predicted y₁ ≈ ${fmt(p.data.value[1], 3)} ± ${fmt(p.data.sigmaY, 4)}`,
    },
  }
}
