/** ECharts option of a residual plot: residual against x1 with a ±2σ band per model. */
import {
  baseOption,
  CURVE_COLOURS,
  escapeHtml,
  fmt,
  fractionAxis,
  legendFor,
  MUTED,
  valueAxis,
  MARK_PRECISION,
} from './plot-style'
import type { ResidualSeries } from './plot-types'

/** Inputs of `residualOption`; see ResidualPlot.vue. */
export interface ResidualOptionInput {
  title: string
  series: ResidualSeries[]
  /** Axis name with unit, e.g. "ΔT / K" or "Δy₁". */
  quantity: string
  /** Decimals in the tooltip. */
  digits: number
  names: [string, string]
  /** width the legend may use, px (default: a half-width plot's) */
  legendWidthPx?: number
}

/** Grid top of a residual plot without a legend; extra legend rows are added to the plot's height. */
export const RESIDUAL_TOP_PX = 52

/** Build the whole option. */
export function residualOption(o: ResidualOptionInput): Record<string, unknown> {
  const base = baseOption(o.title)
  const band2 = Math.max(0, ...o.series.map((s) => (s.sigma && s.sigma > 0 ? 2 * s.sigma : 0)))
  const series = o.series.flatMap((s, i) => {
    const colour = CURVE_COLOURS[i % CURVE_COLOURS.length]
    const band =
      s.sigma && s.sigma > 0
        ? {
            silent: true,
            itemStyle: { color: colour, opacity: 0.08 },
            data: [[{ yAxis: -2 * s.sigma }, { yAxis: 2 * s.sigma }]],
          }
        : undefined
    return [
      {
        type: 'scatter',
        name: s.name,
        color: colour,
        symbolSize: 7,
        data: s.points.map((p) => ({
          value: [p.x1, p.residual],
          pointId: p.id,
          itemStyle: p.excluded ? { color: '#fff', borderColor: colour, borderWidth: 1.5 } : { color: colour },
        })),
        markArea: band,
        markLine: s.sigma
          ? {
              precision: MARK_PRECISION,
              silent: true,
              symbol: 'none',
              label: { show: false },
              lineStyle: { color: colour, type: 'dotted', width: 1 },
              data: [{ yAxis: -2 * s.sigma }, { yAxis: 2 * s.sigma }],
            }
          : undefined,
        tooltip: {
          formatter: (p: { value: number[]; seriesName: string }) =>
            `${escapeHtml(p.seriesName)}<br>x₁ = ${fmt(p.value[0])}<br>${o.quantity.split(' /')[0]} = ${fmt(p.value[1], o.digits)}${s.sigma ? `<br>2σ = ${fmt(2 * s.sigma, o.digits)}` : ''}`,
        },
      },
    ]
  })
  series.push({
    type: 'line',
    name: 'zero',
    silent: true,
    showSymbol: false,
    data: [
      [0, 0],
      [1, 0],
    ],
    lineStyle: { color: MUTED, width: 1 },
    color: MUTED,
  } as never)
  // Two invisible points at ±1.05 × the widest 2σ: ECharts sizes the axis by data (not by mark lines, which are not
  // drawn off the axis), and so still picks round ends and ticks.
  if (band2 > 0)
    series.push({
      type: 'scatter',
      name: 'band extent',
      silent: true,
      symbolSize: 0,
      tooltip: { show: false },
      data: [
        [0.5, -1.05 * band2],
        [0.5, 1.05 * band2],
      ],
    } as never)
  const selected = Object.fromEntries(o.series.map((s) => [s.name, !s.hidden]))
  // Every fit's entry shown at once (no paging arrows): the legend wraps and the grid starts below its rows;
  // ResidualPlot grows by the same amount so the plotting area keeps its height.
  const { legend, top } = legendFor(
    o.series.map((s) => s.name),
    selected,
    o.legendWidthPx,
  )
  return {
    ...base,
    legend,
    grid: { left: 70, right: 20, top: o.series.length ? top : 14, bottom: 52 },
    xAxis: fractionAxis(`x₁ (${o.names[0]})`),
    yAxis: valueAxis(o.quantity, { nameGap: 52, scale: false }),
    series,
  }
}
