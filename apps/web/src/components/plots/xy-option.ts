/** ECharts option of the x–y plot: diagonal, equilibrium curves, measured pairs, azeotrope, McCabe–Thiele construction. */
import { baseOption, CURVE_COLOURS, escapeHtml, fmt, fractionAxis, INK, legendFor, LIQUID, MUTED } from './plot-style'
import { azeotropeXySeries, THREE_PHASE_NAME, threePhaseXySeries } from './heterogeneous-series'
import { literatureXySeries, MEASURE_NEXT_NAME, suggestionXySeries, type LiteratureSeries } from './literature-series'
import type { AzeotropeMark, StageConstruction, ThreePhaseMark, TxySuggestion, XyCurve, XyPoint } from './plot-types'

/** Inputs of `xyOption`; see XyPlot.vue. */
export interface XyOptionInput {
  title: string
  curves: XyCurve[]
  points: XyPoint[]
  azeotrope?: AzeotropeMark | null
  stages?: StageConstruction | null
  /** Design targets to mark on the diagonal when no stage construction is drawn. */
  targets?: { xF?: number; xD?: number; xB?: number } | null
  names: [string, string]
  /** every azeotrope to mark (takes the place of `azeotrope` when given) */
  azeotropes?: AzeotropeMark[] | null
  /** the flat stretch where the liquid boils as two layers */
  threePhase?: ThreePhaseMark | null
  /** literature data sets of the system, each with its own legend entry */
  literature?: LiteratureSeries[] | null
  /** compositions to measure next, drawn at their predicted y1 and numbered best first */
  suggested?: TxySuggestion[] | null
  /** width the legend may use, px (default: a half-width plot's) */
  legendWidthPx?: number
}

const STEP = '#b0452b'
const OPERATING = '#0e3238'

function stageSeries(s: StageConstruction): Record<string, unknown>[] {
  const corner = s.intersection ?? { x: s.xF, y: s.rectifying.slope * s.xF + s.rectifying.intercept }
  const lineStyle = { color: OPERATING, width: 1.5 }
  // Stage numbers at each step's corner; with many stages only every k-th, so the labels stay legible.
  const corners = s.staircase.filter((_, i) => i % 2 === 1)
  const every = Math.max(1, Math.ceil(corners.length / 12))
  const labels = corners
    .map((p, i) => ({ value: [p.x, p.y], name: String(i + 1) }))
    .filter((_, i) => (i + 1) % every === 0 || i === 0 || i === corners.length - 1)
  return [
    {
      type: 'line',
      name: 'Operating lines',
      silent: true,
      showSymbol: false,
      data: [
        [s.xD, s.xD],
        [corner.x, corner.y],
      ],
      lineStyle,
      color: OPERATING,
    },
    {
      type: 'line',
      name: 'Operating lines',
      silent: true,
      showSymbol: false,
      data: [
        [corner.x, corner.y],
        [s.xB, s.xB],
      ],
      lineStyle,
      color: OPERATING,
    },
    {
      type: 'line',
      name: 'Operating lines',
      silent: true,
      showSymbol: false,
      data: [
        [s.xF, s.xF],
        [corner.x, corner.y],
      ],
      lineStyle: { ...lineStyle, type: 'dotted' },
      color: OPERATING,
    },
    {
      type: 'line',
      name: 'Theoretical stages',
      silent: true,
      showSymbol: false,
      z: 4,
      color: STEP,
      data: s.staircase.map((p) => [p.x, p.y]),
      lineStyle: { color: STEP, width: 1.4 },
    },
    {
      type: 'scatter',
      name: 'Theoretical stages',
      silent: true,
      symbolSize: 0,
      z: 5,
      data: labels,
      label: {
        show: true,
        position: 'left',
        distance: 3,
        fontSize: 10,
        color: STEP,
        formatter: (p: { name: string }) => p.name,
      },
    },
    {
      type: 'scatter',
      name: 'Targets',
      z: 6,
      symbol: 'circle',
      symbolSize: 7,
      itemStyle: { color: '#fff', borderColor: INK, borderWidth: 1.5 },
      data: [
        { value: [s.xD, s.xD], name: `x_D = ${fmt(s.xD, 3)}` },
        { value: [s.xF, s.xF], name: `x_F = ${fmt(s.xF, 3)}, q = ${fmt(s.q, 2)}` },
        { value: [s.xB, s.xB], name: `x_B = ${fmt(s.xB, 3)}` },
      ],
      tooltip: { formatter: (p: { name: string }) => escapeHtml(p.name) },
    },
  ]
}

/** Build the whole option. */
export function xyOption(o: XyOptionInput): Record<string, unknown> {
  const base = baseOption(o.title)
  const series: Record<string, unknown>[] = [
    {
      type: 'line',
      name: 'y = x',
      silent: true,
      showSymbol: false,
      data: [
        [0, 0],
        [1, 1],
      ],
      lineStyle: { color: MUTED, width: 1, type: 'dashed' },
      color: MUTED,
    },
    ...o.curves.map((c, i) => {
      const colour = CURVE_COLOURS[i % CURVE_COLOURS.length]
      return {
        type: 'line',
        name: c.name,
        silent: true,
        showSymbol: false,
        z: 3,
        color: colour,
        lineStyle: { color: colour, width: 2 },
        data: c.x1.map((x, j) => [x, c.y1[j]]),
      }
    }),
  ]
  if (o.points.length) {
    series.push({
      type: 'scatter',
      name: 'Measured',
      z: 5,
      color: LIQUID.colour,
      symbol: LIQUID.symbol,
      symbolSize: 8,
      data: o.points.map((p) => ({
        value: [p.x1, p.y1],
        pointId: p.id,
        itemStyle: p.excluded
          ? { color: '#fff', borderColor: LIQUID.colour, borderWidth: 1.6 }
          : { color: LIQUID.colour },
      })),
      itemStyle: { color: LIQUID.colour },
      tooltip: { formatter: (p: { value: number[] }) => `x₁ = ${fmt(p.value[0])}<br>y₁ = ${fmt(p.value[1])}` },
    })
  }
  series.push(...literatureXySeries(o.literature ?? []))
  const suggested = (o.suggested ?? []).filter((s) => typeof s.y1 === 'number')
  if (suggested.length) series.push(suggestionXySeries(o.suggested!, '#c98a12'))
  if (o.threePhase) series.push(...threePhaseXySeries(o.threePhase))
  series.push(...azeotropeXySeries(o.azeotropes ?? (o.azeotrope ? [o.azeotrope] : [])))
  if (o.stages) series.push(...stageSeries(o.stages))
  else if (o.targets) {
    const t = o.targets
    // Labels as the screens write the symbols (x_D, x_F, x_B), not the engine's plain keys.
    const marks = (
      [
        ['x_D', t.xD],
        ['x_F', t.xF],
        ['x_B', t.xB],
      ] as const
    ).filter(([, v]) => v !== undefined)
    series.push({
      type: 'scatter',
      name: 'Targets',
      z: 6,
      symbolSize: 8,
      itemStyle: { color: '#fff', borderColor: INK, borderWidth: 1.5 },
      // xD sits near the top-right corner: its label goes to the left so it stays inside the plot.
      data: marks.map(([n, v]) => ({
        value: [v, v],
        name: `${n} = ${fmt(v as number, 3)}`,
        label: { position: n === 'x_D' ? 'left' : 'right' },
      })),
      label: { show: true, fontSize: 11, color: INK, formatter: (p: { name: string }) => p.name },
      tooltip: { formatter: (p: { name: string }) => escapeHtml(p.name) },
    })
  }
  const selected = Object.fromEntries(o.curves.map((c) => [c.name, !c.hidden]))
  const names = [
    ...o.curves.map((c) => c.name),
    ...(o.points.length ? ['Measured'] : []),
    ...(o.threePhase ? [THREE_PHASE_NAME] : []),
    ...(o.stages ? ['Operating lines', 'Theoretical stages'] : []),
    ...(o.literature ?? []).map((l) => l.name),
    ...(suggested.length ? [MEASURE_NEXT_NAME] : []),
  ]
  const { legend, top } = legendFor(names, selected, o.legendWidthPx)
  return {
    ...base,
    legend,
    grid: { left: 58, right: 20, top, bottom: 52 },
    xAxis: fractionAxis(`x₁ (liquid, ${o.names[0]})`),
    yAxis: fractionAxis(`y₁ (vapour, ${o.names[0]})`),
    series,
  }
}
