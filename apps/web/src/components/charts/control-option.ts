/**
 * ECharts option of a control chart (individuals chart over time): results as points joined in time order,
 * the centre line, ±2σ (dashed) and ±3σ (solid) limits, and results that broke a run rule drawn red with the
 * rule in the tooltip. Limits and flags come from @ebullio/thermo's `controlChart`.
 */
import { CONTROL_RULE_TEXT, type ControlChartResult } from '@ebullio/thermo'
import { baseOption, fmt, INK, MUTED, valueAxis, WARN, MARK_PRECISION } from '../plots/plot-style'

/** One result on a control chart. */
export interface ControlPoint {
  id: string
  /** when it was measured (ISO text or Date) */
  at: string | Date
  /** the charted value (e.g. measured − reference, in K) */
  value: number
  /** tooltip heading, e.g. "Toluene, still B, thermometer T-3" */
  label?: string
}

export interface ControlOptionInput {
  title: string
  yName: string
  points: ControlPoint[]
  chart: ControlChartResult
  digits: number
  /** draw results by their number in time order rather than on a time axis (several results share one time) */
  sequence?: boolean
}

const LIMIT_COLOUR = '#7a3e8e'
const CENTRE_COLOUR = '#2c5d9e'
const POINT_COLOUR = '#1a545c'

function limitLine(name: string, y: number, dashed: boolean, colour: string) {
  return {
    yAxis: y,
    name,
    lineStyle: { color: colour, type: dashed ? 'dashed' : 'solid', width: 1.2 },
    label: { show: true, position: 'insideEndTop', formatter: name, color: colour, fontSize: 11 },
  }
}

/** Build the whole option. */
export function controlOption(o: ControlOptionInput): Record<string, unknown> {
  const base = baseOption(o.title)
  const { centre, limits } = o.chart
  const times = o.points.map((p, i) => (o.sequence ? i + 1 : new Date(p.at).getTime()))
  const data = o.points.map((p, i) => ({
    value: [times[i], p.value],
    id: p.id,
    itemStyle: o.chart.flags[i]?.length ? { color: WARN, borderColor: WARN } : { color: POINT_COLOUR },
    symbolSize: o.chart.flags[i]?.length ? 10 : 7,
    symbol: i < o.chart.baselineCount ? 'emptyCircle' : 'circle',
  }))
  const tooltip = (params: { dataIndex: number }) => {
    const i = params.dataIndex
    const p = o.points[i]
    const when = new Date(p.at).toISOString().slice(0, 16).replace('T', ' ')
    const rules = (o.chart.flags[i] ?? []).map((r) => `<br/><b style="color:${WARN}">${CONTROL_RULE_TEXT[r]}</b>`)
    const baseline = i < o.chart.baselineCount ? '<br/>(sets the limits)' : ''
    const head = p.label ? `${escapeHtml(p.label)}<br/>` : ''
    return `${head}${when} UTC<br/>${escapeHtml(o.yName)}: ${fmt(p.value, o.digits)}${baseline}${rules.join('')}`
  }
  const all = [...o.points.map((p) => p.value), limits.lower3, limits.upper3]
  const span = Math.max(...all) - Math.min(...all) || 1
  return {
    ...base,
    grid: { ...(base.grid as object), top: 24, right: 72 },
    tooltip: { ...(base.tooltip as object), trigger: 'item', formatter: tooltip },
    xAxis: o.sequence
      ? {
          type: 'value',
          name: 'result no. (time order)',
          nameLocation: 'middle',
          nameGap: 26,
          min: 0.5,
          max: o.points.length + 0.5,
          minInterval: 1,
          axisLine: { lineStyle: { color: MUTED } },
          axisLabel: {
            color: MUTED,
            fontSize: 11,
            formatter: (v: number) => (Number.isInteger(v) ? String(v) : ''),
          },
          splitLine: { show: false },
        }
      : {
          type: 'time',
          axisLine: { lineStyle: { color: MUTED } },
          axisLabel: { color: MUTED, fontSize: 11, hideOverlap: true },
        },
    yAxis: valueAxis(o.yName, {
      nameGap: 52,
      min: Math.min(...all) - span * 0.08,
      max: Math.max(...all) + span * 0.08,
      axisLabel: { color: MUTED, fontSize: 11, formatter: (v: number) => fmt(v, o.digits) },
    }),
    series: [
      {
        type: 'line',
        name: 'results',
        data,
        showSymbol: true,
        lineStyle: { color: INK, width: 1, opacity: 0.5 },
        markLine: {
          precision: MARK_PRECISION,
          silent: true,
          symbol: 'none',
          data: [
            limitLine('+3σ', limits.upper3, false, LIMIT_COLOUR),
            limitLine('+2σ', limits.upper2, true, LIMIT_COLOUR),
            limitLine('centre', centre, false, CENTRE_COLOUR),
            limitLine('−2σ', limits.lower2, true, LIMIT_COLOUR),
            limitLine('−3σ', limits.lower3, false, LIMIT_COLOUR),
          ],
        },
      },
    ],
  }
}

function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`)
}
