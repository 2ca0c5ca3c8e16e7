/** ECharts option of the T–x–y plot, built from plain data so it can be tested without a browser. */
import { bandSeries, suggestionSeries } from './band-series'
import { literatureTxySeries, type LiteratureSeries } from './literature-series'
import { errorBarSeries, type ErrorBarDatum } from './error-bars'
import {
  azeotropeTxySeries,
  THREE_PHASE_NAME,
  threePhaseTxySeries,
  TWO_LIQUID_NAME,
  twoLiquidSeries,
} from './heterogeneous-series'
import {
  baseOption,
  CURVE_COLOURS,
  escapeHtml,
  fmt,
  fractionAxis,
  INK,
  legendFor,
  LIQUID,
  showDT,
  showT,
  tLabel,
  tUnit,
  valueAxis,
  VAPOUR,
  WARN,
} from './plot-style'
import type {
  AzeotropeMark,
  PureBoiling,
  TemperatureUnit,
  ThreePhaseMark,
  TwoLiquidRegion,
  TxyBand,
  TxyCurve,
  TxyPoint,
  TxySuggestion,
} from './plot-types'

/** Inputs of `txyOption`; see TxyPlot.vue for what each means. */
export interface TxyOptionInput {
  title: string
  points: TxyPoint[]
  curves: TxyCurve[]
  pure?: PureBoiling | null
  azeotrope?: AzeotropeMark | null
  unit: TemperatureUnit
  names: [string, string]
  /** Error bars are ±k·u; k = 1 shows the standard uncertainty. */
  k: number
  /** ±2σ band of one fitted curve, drawn behind it */
  band?: TxyBand | null
  /** liquid compositions to measure next, marked on the composition axis (best first) */
  suggested?: TxySuggestion[] | null
  /** every azeotrope to mark (takes the place of `azeotrope` when given) */
  azeotropes?: AzeotropeMark[] | null
  /** the model's three-phase line and two-liquid region, for a partially miscible system */
  threePhase?: ThreePhaseMark | null
  twoLiquids?: TwoLiquidRegion | null
  /**
   * A P–x–y plot instead: the points' and curves' `T` carry the pressure already in the shown unit (never converted:
   * `unit` is ignored), named by `symbol` and `unit` in tooltips and by `axis` on the axis.
   */
  ordinate?: PxyOrdinate | null
  /** literature data sets of the system, each with its own legend entry */
  literature?: LiteratureSeries[] | null
}

/** How a P–x–y plot names its ordinate. */
export interface PxyOrdinate {
  axis: string
  symbol: string
  unit: string
  digits: number
}

export const LIQUID_NAME = 'Liquid x₁'
export const VAPOUR_NAME = 'Vapour y₁'

function pointItem(p: TxyPoint, phase: 'liquid' | 'vapour', unit: TemperatureUnit) {
  const look = phase === 'liquid' ? LIQUID : VAPOUR
  const x = phase === 'liquid' ? p.x1 : (p.y1 as number)
  return {
    value: [x, showT(p.T, unit)],
    pointId: p.id,
    phase,
    point: p,
    symbol: look.symbol,
    symbolSize: phase === 'liquid' ? 8 : 10,
    itemStyle: p.excluded
      ? { color: '#ffffff', borderColor: look.colour, borderWidth: 1.6 }
      : { color: look.colour, borderColor: '#ffffff', borderWidth: 0.6 },
  }
}

function pointTooltip(d: { point: TxyPoint; phase: string }, o: TxyOptionInput): string {
  const p = d.point
  const tU = tUnit(o.unit)
  const ord = o.ordinate
  const lines = [
    `<b>${p.note ? escapeHtml(p.note) : 'Point'}</b> · ${escapeHtml(d.phase)}`,
    ord
      ? `${ord.symbol} = ${fmt(p.T, ord.digits)} ${escapeHtml(ord.unit)}`
      : `T = ${fmt(showT(p.T, o.unit), 2)} ${tU}${p.uT ? ` ± ${fmt(showDT(p.uT, o.unit), 2)}` : ''}`,
    `x₁ = ${fmt(p.x1)}${p.ux1 ? ` ± ${fmt(p.ux1)}` : ''}`,
    `y₁ = ${fmt(p.y1)}${p.uy1 ? ` ± ${fmt(p.uy1)}` : ''}`,
  ]
  if (p.excluded) lines.push('<i>excluded from fits</i>')
  if (p.outlier) lines.push(`<span style="color:${WARN}">flagged as an outlier</span>`)
  return lines.join('<br>')
}

function measuredSeries(o: TxyOptionInput): Record<string, unknown>[] {
  const liquid = o.points.map((p) => pointItem(p, 'liquid', o.unit))
  const vapour = o.points.filter((p) => p.y1 !== null).map((p) => pointItem(p, 'vapour', o.unit))
  const barsL: ErrorBarDatum[] = o.points.map((p) => [
    p.x1,
    showT(p.T, o.unit),
    o.k * (p.ux1 ?? 0),
    o.k * showDT(p.uT ?? 0, o.unit),
  ])
  const barsV: ErrorBarDatum[] = o.points
    .filter((p) => p.y1 !== null)
    .map((p) => [p.y1 as number, showT(p.T, o.unit), o.k * (p.uy1 ?? 0), o.k * showDT(p.uT ?? 0, o.unit)])
  const flagged = o.points
    .filter((p) => p.outlier)
    .flatMap((p) => [[p.x1, showT(p.T, o.unit)], ...(p.y1 !== null ? [[p.y1, showT(p.T, o.unit)]] : [])])
  const out: Record<string, unknown>[] = [
    errorBarSeries(LIQUID_NAME, barsL, LIQUID.colour),
    errorBarSeries(VAPOUR_NAME, barsV, VAPOUR.colour),
    {
      type: 'scatter',
      name: LIQUID_NAME,
      data: liquid,
      z: 4,
      color: LIQUID.colour,
      itemStyle: { color: LIQUID.colour },
      symbol: LIQUID.symbol,
      cursor: 'pointer',
    },
    {
      type: 'scatter',
      name: VAPOUR_NAME,
      data: vapour,
      z: 4,
      color: VAPOUR.colour,
      itemStyle: { color: VAPOUR.colour },
      symbol: VAPOUR.symbol,
      cursor: 'pointer',
    },
  ]
  if (flagged.length) {
    out.push({
      type: 'scatter',
      name: 'Flagged outlier',
      data: flagged,
      silent: true,
      z: 3,
      symbol: 'circle',
      symbolSize: 18,
      itemStyle: { color: 'rgba(163,50,31,0.08)', borderColor: WARN, borderWidth: 1.6 },
    })
  }
  return out
}

function curveSeries(o: TxyOptionInput): Record<string, unknown>[] {
  return o.curves.flatMap((c, i) => {
    const colour = CURVE_COLOURS[i % CURVE_COLOURS.length]
    const T = c.T.map((t) => showT(t, o.unit))
    const line = { type: 'line', name: c.name, showSymbol: false, silent: true, z: 2, color: colour }
    return [
      { ...line, data: c.x1.map((x, j) => [x, T[j]]), lineStyle: { color: colour, width: 2 } },
      { ...line, data: c.y1.map((y, j) => [y, T[j]]), lineStyle: { color: colour, width: 2, type: 'dashed' } },
    ]
  })
}

function markerSeries(o: TxyOptionInput): Record<string, unknown>[] {
  const out: Record<string, unknown>[] = []
  if (o.pure) {
    const tU = tUnit(o.unit)
    const data = [
      // Labels sit just inside the plot, on a light backing so a curve passing behind them does not hide them.
      { value: [1, showT(o.pure.T1, o.unit)], label: { position: 'left', offset: [-2, -12] }, name: o.names[0] },
      { value: [0, showT(o.pure.T2, o.unit)], label: { position: 'right', offset: [2, -12] }, name: o.names[1] },
    ]
    out.push({
      type: 'scatter',
      name: 'Pure-component boiling point',
      data,
      symbol: 'rect',
      symbolSize: 9,
      z: 5,
      itemStyle: { color: INK },
      label: {
        show: true,
        fontSize: 11,
        color: INK,
        backgroundColor: 'rgba(255,255,255,0.85)',
        padding: [1, 3],
        borderRadius: 2,
        formatter: (p: { name: string; value: number[] }) => `${p.name} ${fmt(p.value[1], 1)} ${tU}`,
      },
      tooltip: {
        formatter: (p: { name: string; value: number[] }) =>
          `Pure ${escapeHtml(p.name)}: boils at ${fmt(p.value[1], 2)} ${tU}`,
      },
    })
  }
  out.push(...azeotropeTxySeries(o.azeotropes ?? (o.azeotrope ? [o.azeotrope] : []), o.unit))
  return out
}

/** The band takes the colour of its curve when that curve is drawn; the marks are amber like the azeotrope. */
function extraSeries(o: TxyOptionInput): Record<string, unknown>[] {
  const out: Record<string, unknown>[] = []
  if (o.band) {
    const i = o.curves.findIndex((c) => c.name === o.band!.name)
    out.push(...bandSeries(o.band, o.unit, CURVE_COLOURS[(i < 0 ? 0 : i) % CURVE_COLOURS.length]))
  }
  if (o.suggested?.length) out.push(suggestionSeries(o.suggested, o.unit, '#c98a12'))
  if (o.twoLiquids) out.push(...twoLiquidSeries(o.twoLiquids, o.threePhase ?? null, o.unit))
  if (o.threePhase) out.push(...threePhaseTxySeries(o.threePhase, o.unit))
  return out
}

/** Build the whole option. */
export function txyOption(input: TxyOptionInput): Record<string, unknown> {
  // A pressure ordinate is never a temperature: no kelvin → °C shift (a P–x–y plot once showed −172 "kPa").
  const o: TxyOptionInput = input.ordinate ? { ...input, unit: 'K' } : input
  const base = baseOption(o.title)
  const selected = Object.fromEntries(o.curves.map((c) => [c.name, !c.hidden]))
  const names = [
    ...(o.points.length ? [LIQUID_NAME, VAPOUR_NAME] : []),
    ...o.curves.map((c) => c.name),
    ...(o.threePhase ? [THREE_PHASE_NAME] : []),
    ...(o.twoLiquids ? [TWO_LIQUID_NAME] : []),
    ...(o.literature ?? []).map((l) => l.name),
  ]
  const { legend, top } = legendFor(names, selected)
  return {
    ...base,
    legend,
    grid: { left: 62, right: 24, top, bottom: 52 },
    tooltip: {
      ...(base.tooltip as object),
      formatter: (p: { data: { point?: TxyPoint; phase?: string }; seriesName: string }) =>
        p.data?.point ? pointTooltip(p.data as { point: TxyPoint; phase: string }, o) : escapeHtml(p.seriesName),
    },
    xAxis: fractionAxis(`x₁, y₁ (mole fraction ${o.names[0]})`),
    yAxis: valueAxis(o.ordinate ? o.ordinate.axis : tLabel(o.unit), { scale: true, nameGap: 44 }),
    series: [
      ...extraSeries(o),
      ...curveSeries(o),
      ...literatureTxySeries(o.literature ?? [], o.unit),
      ...measuredSeries(o),
      ...markerSeries(o),
    ],
  }
}
