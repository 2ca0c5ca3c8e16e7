/**
 * The report's plots, rendered on the server as SVG by ECharts' own server-side rendering (no browser):
 * T–x–y and x–y with the measured points and the recommended fit, and the recommended fit's residuals.
 * Colours follow the web app's plot look (liquid teal circles, vapour amber diamonds).
 */
import * as echarts from 'echarts'
import type { ReportModel } from './report-model.js'

const INK = '#221f1b'
const MUTED = '#635e53'
const LINE = '#e0ddd5'
const LIQUID = '#1a545c'
const VAPOUR = '#c98a12'
const CURVE = '#2c5d9e'
const FONT = 'Roboto, sans-serif'

/** Render one ECharts option to an SVG string. */
export function renderSvg(option: Record<string, unknown>, width: number, height: number): string {
  const chart = echarts.init(null, null, { renderer: 'svg', ssr: true, width, height })
  try {
    chart.setOption({ animation: false, textStyle: { fontFamily: FONT, color: INK }, ...option })
    return chart.renderToSVGString()
  } finally {
    chart.dispose()
  }
}

function axis(name: string, extra: Record<string, unknown> = {}) {
  return {
    type: 'value',
    name,
    nameLocation: 'middle',
    nameGap: 24,
    nameTextStyle: { color: INK, fontSize: 9 },
    axisLine: { show: true, lineStyle: { color: MUTED } },
    axisTick: { show: true },
    axisLabel: { color: MUTED, fontSize: 8, formatter: (v: number) => String(v).replace('-', '−') },
    splitLine: { lineStyle: { color: LINE, type: 'dashed' } },
    ...extra,
  }
}
const fraction = (name: string) => axis(name, { min: 0, max: 1, interval: 0.2 })
const legend = {
  top: 0,
  left: 'center',
  textStyle: { fontSize: 8, color: INK },
  itemWidth: 12,
  itemHeight: 7,
  itemGap: 6,
}
const grid = { left: 48, right: 12, top: 36, bottom: 36 }

const included = (m: ReportModel) => m.points.filter((p) => !p.excluded)
const excluded = (m: ReportModel) => m.points.filter((p) => p.excluded)
/** Isothermal data are drawn P–x–y (kPa), isobaric data T–x–y (K). */
const isothermal = (m: ReportModel) => m.dataSet.layout === 'pxy' || m.dataSet.layout === 'px'
/** [x, y] pairs, leaving out points without a value (a T–x point has no y1). */
const pairs = (rows: [number | null, number][]) => rows.filter((r): r is [number, number] => r[0] !== null)

/**
 * T–x–y at the nominal pressure (isobaric data) or P–x–y at the nominal temperature (isothermal data): bubble and
 * dew curves of the recommended fit, liquid and vapour points.
 */
export function txySvg(m: ReportModel, width = 310, height = 240): string {
  const iso = isothermal(m)
  const v = (p: ReportModel['points'][number]) => (iso ? p.pressurePa / 1000 : p.temperatureK)
  const series: Record<string, unknown>[] = [
    scatter(
      'liquid x₁',
      LIQUID,
      'circle',
      included(m).map((p) => [p.x1, v(p)]),
    ),
  ]
  if (included(m).some((p) => p.y1 !== null))
    series.push(scatter('vapour y₁', VAPOUR, 'diamond', pairs(included(m).map((p) => [p.y1, v(p)]))))
  if (excluded(m).length)
    series.push(
      scatter(
        'excluded',
        MUTED,
        'emptyCircle',
        pairs(
          excluded(m).flatMap((p): [number | null, number][] => [
            [p.x1, v(p)],
            [p.y1, v(p)],
          ]),
        ),
      ),
    )
  if (m.curve) {
    const c = m.curve
    const along = iso ? (c.P ?? []).map((P) => P / 1000) : c.T
    series.push(
      line(
        'bubble (fit)',
        CURVE,
        'solid',
        c.x1.map((x, i) => [x, along[i]]),
      ),
    )
    series.push(
      line(
        'dew (fit)',
        CURVE,
        'dashed',
        c.y1.map((y, i) => [y, along[i]]),
      ),
    )
  }
  return renderSvg(
    {
      legend,
      grid,
      xAxis: fraction('x₁, y₁ (mole fraction)'),
      yAxis: axis(iso ? 'P / kPa' : 'T / K', { scale: true, nameGap: 34 }),
      series,
    },
    width,
    height,
  )
}

/** x–y with the diagonal. */
export function xySvg(m: ReportModel, width = 190, height = 240): string {
  const series: Record<string, unknown>[] = [
    line('x = y', MUTED, 'dotted', [
      [0, 0],
      [1, 1],
    ]),
    scatter(
      'measured',
      LIQUID,
      'circle',
      pairs(included(m).map((p) => [p.y1, p.x1])).map(([y, x]) => [x, y]),
    ),
  ]
  if (excluded(m).length)
    series.push(
      scatter(
        'excluded',
        MUTED,
        'emptyCircle',
        pairs(excluded(m).map((p) => [p.y1, p.x1])).map(([y, x]) => [x, y]),
      ),
    )
  if (m.curve)
    series.push(
      line(
        'fit',
        CURVE,
        'solid',
        m.curve.x1.map((x, i) => [x, m.curve!.y1[i]]),
      ),
    )
  return renderSvg(
    { legend, grid: { ...grid, left: 44 }, xAxis: fraction('x₁'), yAxis: fraction('y₁'), series },
    width,
    height,
  )
}

/**
 * Residuals of the recommended fit against x1, as stored with the fit: ΔT (K) or, for a fit on pressures, ΔP (kPa)
 * on the left, Δy1 on the right.
 */
export function residualsSvg(m: ReportModel, width = 500, height = 170): string | null {
  const fit = m.fits.find((f) => f.id === m.dataSet.recommendedFitId)
  if (!fit) return null
  const byId = new Map(m.points.map((p) => [p.id, p]))
  const stored = fit.residuals as { pointId?: string; dT?: number; dP?: number; dy?: number | null }[]
  const onPressure = stored.some((r) => typeof r.dP === 'number')
  const rows = stored
    .map((r) => ({
      p: r.pointId ? byId.get(r.pointId) : undefined,
      d: onPressure ? (r.dP ?? NaN) / 1000 : r.dT,
      dy: r.dy ?? undefined,
    }))
    .filter((r) => r.p)
  const leftName = onPressure ? 'ΔP / kPa' : 'ΔT / K'
  const series: Record<string, unknown>[] = [
    {
      ...scatter(
        leftName,
        LIQUID,
        'circle',
        rows.filter((r) => Number.isFinite(r.d)).map((r) => [r.p!.x1, r.d!]),
      ),
      yAxisIndex: 0,
    },
    {
      ...scatter(
        'Δy₁',
        VAPOUR,
        'diamond',
        rows.filter((r) => Number.isFinite(r.dy)).map((r) => [r.p!.x1, r.dy!]),
      ),
      yAxisIndex: 1,
    },
  ]
  const zero = {
    silent: true,
    symbol: 'none',
    lineStyle: { color: INK, type: 'solid', width: 1 },
    data: [{ yAxis: 0 }],
    label: { show: false },
  }
  series[0] = { ...series[0], markLine: zero }
  return renderSvg(
    {
      legend,
      grid: { ...grid, top: 24, right: 60 },
      xAxis: fraction('x₁'),
      yAxis: [axis(leftName, { nameGap: 36 }), axis('Δy₁', { nameGap: 44, splitLine: { show: false } })],
      series,
    },
    width,
    height,
  )
}

function scatter(name: string, colour: string, symbol: string, data: number[][]) {
  return { name, type: 'scatter', symbol, symbolSize: 6, itemStyle: { color: colour }, data }
}

function line(name: string, colour: string, type: string, data: number[][]) {
  return {
    name,
    type: 'line',
    showSymbol: false,
    lineStyle: { color: colour, type, width: 1.5 },
    itemStyle: { color: colour },
    data,
  }
}
