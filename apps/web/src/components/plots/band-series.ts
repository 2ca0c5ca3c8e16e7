/**
 * The ±2σ band of a fitted T–x–y curve and the "measure next" marks on the composition axis, as ECharts
 * custom series (ECharts has no band series that follows a curve in both directions).
 */
import { fmt, showT, tUnit } from './plot-style'
import type { TemperatureUnit, TxyBand, TxySuggestion } from './plot-types'

type Api = { coord: (v: number[]) => number[]; value: (i: number) => number }
type Params = { coordSys: { x: number; y: number; width: number; height: number } }

/** One closed polygon: along the lower edge, back along the upper one. */
function polygon(
  name: string,
  lower: [number, number][],
  upper: [number, number][],
  colour: string,
): Record<string, unknown> {
  return {
    type: 'custom',
    name,
    silent: true,
    z: 1,
    data: [lower[0]],
    encode: { x: 0, y: 1 },
    renderItem: (_p: unknown, api: Api) => ({
      type: 'polygon',
      shape: { points: [...lower, ...[...upper].reverse()].map((v) => api.coord(v)) },
      style: { fill: colour, opacity: 0.16, stroke: colour, lineWidth: 0.6 },
    }),
  }
}

/**
 * The bubble line's band spans T ± 2σT at each x1; the dew line's spans y1 ± 2σy at the bubble temperature.
 * @param unit temperatures are given in K and shown in `unit`.
 */
export function bandSeries(b: TxyBand, unit: TemperatureUnit, colour: string): Record<string, unknown>[] {
  const T = (t: number) => showT(t, unit)
  const ok = (i: number) => [b.Tlow[i], b.Thigh[i], b.ylow[i], b.yhigh[i], b.T[i]].every(Number.isFinite)
  const idx = b.x1.map((_, i) => i).filter(ok)
  if (idx.length < 2) return []
  return [
    polygon(
      b.name,
      idx.map((i) => [b.x1[i], T(b.Tlow[i])]),
      idx.map((i) => [b.x1[i], T(b.Thigh[i])]),
      colour,
    ),
    polygon(
      b.name,
      idx.map((i) => [b.ylow[i], T(b.T[i])]),
      idx.map((i) => [b.yhigh[i], T(b.T[i])]),
      colour,
    ),
  ]
}

const MARK = 7 // px, half the width of a "measure next" mark

/** Numbered marks standing on the composition axis at each suggested liquid composition, best first. */
export function suggestionSeries(
  items: TxySuggestion[],
  unit: TemperatureUnit,
  colour: string,
): Record<string, unknown> {
  const tU = tUnit(unit)
  return {
    // y is the bubble temperature, so the marks never stretch the temperature axis; they are drawn on the x axis.
    type: 'custom',
    name: 'Measure next',
    z: 7,
    encode: { x: 0, y: 1 },
    data: items.map((s, i) => [s.x1, showT(s.T, unit), i + 1, s.sigmaY]),
    tooltip: {
      formatter: (p: { value: number[] }) =>
        `Measure next (#${p.value[2]})<br>x₁ = ${fmt(p.value[0], 2)}<br>bubble T ≈ ${fmt(p.value[1], 2)} ${tU}<br>σ(y₁) now ${fmt(p.value[3], 4)}`,
    },
    renderItem: (params: Params, api: Api) => {
      const x = api.coord([api.value(0), 0])[0]
      const base = params.coordSys.y + params.coordSys.height
      return {
        type: 'group',
        children: [
          {
            type: 'polygon',
            shape: {
              points: [
                [x, base],
                [x - MARK, base - 2 * MARK],
                [x + MARK, base - 2 * MARK],
              ],
            },
            style: { fill: colour, stroke: '#ffffff', lineWidth: 1 },
          },
          {
            type: 'text',
            x,
            y: base - 2 * MARK - 2,
            style: {
              text: String(api.value(2)),
              fill: colour,
              font: '600 11px Inter, sans-serif',
              align: 'center',
              verticalAlign: 'bottom',
            },
          },
        ],
      }
    },
  }
}
