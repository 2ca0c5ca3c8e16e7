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
import { niceCeil, residualOption } from './residual-option'

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
  return { rows, pixel, dispose: () => chart.dispose() }
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
    const { rows, pixel, dispose } = horizontalRows(
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
    dispose()
  })
})

describe('niceCeil (residual axis ends)', () => {
  it.each([
    [0.00105, 0.0015],
    [0.001, 0.001],
    [0.83, 0.85],
    [3.2, 3.5],
    [0, 0],
    [-1, 0],
  ])('%s → %s', (x, nice) => expect(niceCeil(x)).toBe(nice))
})
