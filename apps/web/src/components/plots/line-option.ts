/** ECharts option of the generic line plot (α against x, batch-still traces, ln γ1/γ2 ...). */
import { baseOption, CURVE_COLOURS, fmt, legendFor, valueAxis, MARK_PRECISION } from './plot-style'
import type { LineSeries } from './plot-types'

/** Inputs of `lineOption`; see LinePlot.vue. */
export interface LineOptionInput {
  title: string
  series: LineSeries[]
  xName: string
  yName: string
  y2Name?: string
  xMin?: number
  xMax?: number
  /** Fixed y range (e.g. 0–1 for compositions, so the axis never runs below zero) */
  yMin?: number
  yMax?: number
  /** A vertical cursor at this x (e.g. the animation's current time). */
  cursorX?: number | null
  /** A dotted horizontal reference line at this y (e.g. α = 1). */
  refY?: number | null
  digits: number
}

/** Build the whole option. */
export function lineOption(o: LineOptionInput): Record<string, unknown> {
  const base = baseOption(o.title)
  const hasRight = o.series.some((s) => s.rightAxis)
  const series: Record<string, unknown>[] = o.series.map((s, i) => {
    const colour = CURVE_COLOURS[i % CURVE_COLOURS.length]
    if (s.scatter)
      return {
        type: 'scatter',
        name: s.name,
        color: colour,
        yAxisIndex: s.rightAxis && hasRight ? 1 : 0,
        symbolSize: 8,
        data: s.x.map((x, j) => [x, s.y[j]]),
      }
    return {
      type: 'line',
      name: s.name,
      color: colour,
      yAxisIndex: s.rightAxis && hasRight ? 1 : 0,
      showSymbol: !!s.markers,
      symbolSize: 5,
      lineStyle: { color: colour, width: 2, type: s.dashed ? 'dashed' : 'solid' },
      data: s.x.map((x, j) => [x, s.y[j]]),
    }
  })
  if (o.cursorX !== undefined && o.cursorX !== null && series.length) {
    series[0].markLine = {
      precision: MARK_PRECISION,
      silent: true,
      symbol: 'none',
      label: { show: false },
      lineStyle: { color: '#c98a12', width: 1.5 },
      data: [{ xAxis: o.cursorX }],
    }
  }
  if (o.refY !== undefined && o.refY !== null) {
    series.push({
      type: 'line',
      name: 'reference',
      silent: true,
      showSymbol: false,
      data: [],
      yAxisIndex: 0,
      markLine: {
        precision: MARK_PRECISION,
        silent: true,
        symbol: 'none',
        label: {
          show: true,
          position: 'insideEndTop',
          formatter: `${o.yName} = ${o.refY}`,
          color: '#635e53',
          fontSize: 11,
        },
        lineStyle: { color: '#635e53', type: 'dotted', width: 1 },
        data: [{ yAxis: o.refY }],
      },
    })
  }
  const yAxis = [valueAxis(o.yName, { scale: o.yMin === undefined, nameGap: 48, min: o.yMin, max: o.yMax })]
  if (hasRight)
    yAxis.push(valueAxis(o.y2Name ?? '', { scale: true, nameGap: 48, position: 'right', splitLine: { show: false } }))
  const { legend, top } = legendFor(
    o.series.map((s) => s.name),
    Object.fromEntries(o.series.map((s) => [s.name, !s.hidden])),
  )
  return {
    ...base,
    legend,
    tooltip: { ...(base.tooltip as object), trigger: 'axis', valueFormatter: (v: number) => fmt(v, o.digits) },
    grid: { left: 70, right: hasRight ? 70 : 20, top, bottom: 52 },
    xAxis: valueAxis(o.xName, { min: o.xMin, max: o.xMax, scale: o.xMin === undefined }),
    yAxis,
    series,
  }
}
