/** ECharts options of the calibration review: the calibration with its ±2σ band, and the residual of each standard. */
import { baseOption, fmt, INK, LIQUID, MUTED, valueAxis, WARN, MARK_PRECISION } from '../plots/plot-style'
import type { CalibrationPlotData, StandardReview } from './calibration-review'

const LINE_COLOUR = '#2c5d9e'

export function calibrationOption(p: CalibrationPlotData, title: string): Record<string, unknown> {
  const xy = (pts: { x: number; y: number }[]) => pts.map((q) => [q.x, q.y])
  return {
    ...baseOption(title),
    grid: { left: 62, right: 20, top: 36, bottom: 50 },
    legend: {
      top: 4,
      left: 56,
      data: ['standards (mean of injections)', 'fitted', '±2σ band'],
      textStyle: { color: INK, fontSize: 12 },
    },
    // a response factor spans decades of mole ratio: log–log keeps every standard readable (the line stays straight)
    xAxis: p.logScale ? valueAxis(p.xName, { type: 'log', logBase: 10 }) : valueAxis(p.xName, { min: 0 }),
    yAxis: p.logScale
      ? valueAxis(p.yName, { type: 'log', logBase: 10, nameGap: 44 })
      : valueAxis(p.yName, { nameGap: 44 }),
    tooltip: {
      trigger: 'item',
      formatter: (o: { seriesName: string; data: [number, number]; dataIndex: number }) =>
        o.seriesName.startsWith('standards')
          ? `${p.standards[o.dataIndex].label}<br/>${p.xName}: ${fmt(o.data[0])}<br/>${p.yName}: ${fmt(o.data[1])}`
          : '',
    },
    series: [
      // the ±2σ limits of the fitted relation, dashed
      {
        name: '±2σ band',
        type: 'line',
        data: xy(p.lower),
        symbol: 'none',
        lineStyle: { color: LINE_COLOUR, type: 'dashed', width: 1 },
        itemStyle: { color: LINE_COLOUR },
        silent: true,
      },
      {
        name: '±2σ band',
        type: 'line',
        data: xy(p.upper),
        symbol: 'none',
        lineStyle: { color: LINE_COLOUR, type: 'dashed', width: 1 },
        itemStyle: { color: LINE_COLOUR },
        silent: true,
      },
      {
        name: 'fitted',
        type: 'line',
        data: xy(p.line),
        symbol: 'none',
        lineStyle: { color: LINE_COLOUR, width: 2 },
        itemStyle: { color: LINE_COLOUR },
      },
      {
        name: 'standards (mean of injections)',
        type: 'scatter',
        data: xy(p.standards),
        symbol: LIQUID.symbol,
        symbolSize: 9,
        itemStyle: { color: LIQUID.colour },
      },
    ],
  }
}

export function residualOption(rows: StandardReview[], title: string): Record<string, unknown> {
  const top = Math.max(...rows.map((r) => Math.abs(r.residual)), 1e-6) * 1.3
  return {
    ...baseOption(title),
    grid: { left: 70, right: 20, top: 20, bottom: 50 },
    xAxis: valueAxis('x₁ of the standard', { min: 0, max: 1, interval: 0.1 }),
    yAxis: valueAxis('x₁ read back − x₁ made up', {
      min: -top,
      max: top,
      nameGap: 56,
      axisLabel: { color: MUTED, fontSize: 11, formatter: (v: number) => v.toExponential(1).replace(/-/g, '−') },
    }),
    tooltip: {
      trigger: 'item',
      formatter: (o: { dataIndex: number }) => {
        const r = rows[o.dataIndex]
        return `${r.label}: x₁ ${fmt(r.x1)}, residual ${r.residual.toExponential(2)}`
      },
    },
    series: [
      {
        name: 'residual',
        type: 'scatter',
        data: rows.map((r) => [r.x1, r.residual]),
        symbolSize: 9,
        itemStyle: {
          color: (o: { dataIndex: number }) => (rows[o.dataIndex].withinLimit === false ? WARN : LIQUID.colour),
        },
        markLine: {
          precision: MARK_PRECISION,
          silent: true,
          symbol: 'none',
          lineStyle: { color: INK, type: 'solid' },
          label: { show: false },
          data: [{ yAxis: 0 }],
        },
      },
    ],
  }
}
