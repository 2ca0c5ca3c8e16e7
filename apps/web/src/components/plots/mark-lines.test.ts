/**
 * Lines at a value (control limits, ±2σ of residuals) are drawn where their value is, however small. ECharts rounds a
 * mark line's value to `precision` decimals, 2 unless told otherwise, so GC check-standard limits of ±0.0035 in x₁
 * and a Δy₁ band of ±0.001 were drawn on the zero line. The options are rendered here with ECharts' own SVG renderer
 * and the pixel row of every horizontal line is compared with the axis's pixel for the value.
 */
import { controlChart } from '@ebullio/thermo'
import * as echarts from 'echarts'
import { describe, expect, it } from 'vitest'
import { controlOption } from '../charts/control-option'
import { residualOption } from './residual-option'

/** The y pixel of every horizontal straight segment in the rendered SVG. */
function horizontalRows(option: Record<string, unknown>) {
  const chart = echarts.init(null, null, { renderer: 'svg', ssr: true, width: 600, height: 400 })
  chart.setOption({ ...option, animation: false })
  const svg = chart.renderToSVGString()
  const rows: number[] = []
  for (const m of svg.matchAll(/d="M([-\d.e]+) ([-\d.e]+)L([-\d.e]+) ([-\d.e]+)"/g)) {
    const [y1, y2] = [Number(m[2]), Number(m[4])]
    if (Math.abs(y1 - y2) < 0.01 && Math.abs(Number(m[1]) - Number(m[3])) > 50) rows.push(y1)
  }
  const pixel = (v: number) => chart.convertToPixel({ yAxisIndex: 0 }, v) as number
  // the y axis's ends and tick step as ECharts chose them
  const scale = (
    chart as unknown as {
      getModel: () => {
        getComponent: (t: string) => {
          axis: { scale: { getExtent: () => number[]; getTicks: () => { value: number }[] } }
        }
      }
    }
  )
    .getModel()
    .getComponent('yAxis').axis.scale
  return {
    rows,
    pixel,
    extent: scale.getExtent(),
    ticks: scale.getTicks().map((t) => t.value),
    dispose: () => chart.dispose(),
  }
}

const near = (rows: number[], y: number) => rows.some((r) => Math.abs(r - y) < 1)

describe('lines at a value are drawn at that value', () => {
  it('GC check-standard control limits a few thousandths of a mole fraction apart', () => {
    const values = [0.0009, -0.0013, 0.0011, 0.0004, -0.0008]
    const points = values.map((value, i) => ({ id: `c${i}`, at: '2026-12-03T20:40:00Z', value }))
    const chart = controlChart({ values, baselineCount: 5 })
    expect(chart.limits.upper3).toBeGreaterThan(0.002)
    const { rows, pixel, dispose } = horizontalRows(
      controlOption({ title: 't', yName: 'Δx₁', points, chart, digits: 4, sequence: true }),
    )
    for (const v of [chart.limits.upper3, chart.limits.upper2, chart.centre, chart.limits.lower2, chart.limits.lower3])
      expect(near(rows, pixel(v)), `line at ${v}`).toBe(true)
    // and none of them collapsed onto zero
    expect(Math.abs(pixel(chart.limits.upper3) - pixel(0))).toBeGreaterThan(20)
    dispose()
  })

  it('the ±2σ lines of vapour-composition residuals (σ = 0.0005)', () => {
    const sigma = 0.0005
    const { rows, pixel, extent, ticks, dispose } = horizontalRows(
      residualOption({
        title: 'Δy₁',
        quantity: 'Δy₁',
        digits: 4,
        names: ['a', 'b'],
        series: [
          {
            name: 'Wilson',
            sigma,
            points: [
              { id: 'p1', x1: 0.2, residual: 0.0008, excluded: false },
              { id: 'p2', x1: 0.5, residual: -0.0006, excluded: false },
              { id: 'p3', x1: 0.8, residual: 0.0002, excluded: false },
            ],
          },
        ],
      }),
    )
    expect(near(rows, pixel(2 * sigma))).toBe(true)
    expect(near(rows, pixel(-2 * sigma))).toBe(true)
    expect(Math.abs(pixel(2 * sigma) - pixel(0))).toBeGreaterThan(20)
    // the axis reaches the band and still ends on round ticks (no crowded odd end label)
    expect(extent[0]).toBeLessThanOrEqual(-2 * sigma)
    expect(extent[1]).toBeGreaterThanOrEqual(2 * sigma)
    expect(ticks[0]).toBeCloseTo(extent[0], 12)
    expect(ticks[ticks.length - 1]).toBeCloseTo(extent[1], 12)
    const steps = ticks.slice(1).map((t, i) => t - ticks[i])
    for (const d of steps) expect(d).toBeCloseTo(steps[0], 12)
    dispose()
  })
})
