import { describe, expect, it } from 'vitest'
import { lineOption } from './line-option'
import { residualOption } from './residual-option'
import { txyOption } from './txy-option'
import { xyOption } from './xy-option'

type Series = {
  type: string
  name: string
  data: unknown[]
  lineStyle?: { type?: string }
  markArea?: { data: { yAxis: number }[][] }
}
const names: [string, string] = ['acetone', 'methanol']
// Invented shapes for the option builders; no chemistry is checked here.
const curve = { name: 'Wilson', x1: [0, 0.5, 1], y1: [0, 0.6, 1], T: [337.85, 330, 329.35] }

describe('txyOption', () => {
  const o = txyOption({
    title: 'T–x–y',
    names,
    unit: 'C',
    k: 2,
    curves: [curve],
    points: [
      { id: 'p1', T: 330.15, x1: 0.4, y1: 0.55, uT: 0.05, ux1: 0.002, uy1: 0.003 },
      { id: 'p2', T: 331.15, x1: 0.3, y1: null, excluded: true, outlier: true },
    ],
    pure: { T1: 329.35, T2: 337.85 },
  })
  const series = o.series as Series[]

  it('shows kelvin as degrees Celsius (t/°C = T/K − 273.15, SI Brochure 9th ed., 2.3.1)', () => {
    const liquid = series.find((s) => s.type === 'scatter' && s.name === 'Liquid x₁')!
    expect((liquid.data[0] as { value: number[] }).value[1]).toBeCloseTo(57, 10)
    expect((o.yAxis as { name: string }).name).toBe('T / °C')
  })

  it('gives a model’s bubble (solid) and dew (dashed) lines one name, so one legend entry toggles both', () => {
    const lines = series.filter((s) => s.type === 'line')
    expect(lines.map((s) => s.name)).toEqual(['Wilson', 'Wilson'])
    expect(lines[1].lineStyle?.type).toBe('dashed')
  })

  it('draws error bars of ±k·u, a hollow excluded point, no vapour for a liquid-only point, and rings the outlier', () => {
    const bars = series.find((s) => s.type === 'custom' && s.name === 'Liquid x₁')!
    expect(bars.data[0]).toEqual([0.4, expect.closeTo(57, 10), 0.004, 0.1])
    const liquid = series.find((s) => s.type === 'scatter' && s.name === 'Liquid x₁')!
    expect((liquid.data[1] as { itemStyle: { color: string } }).itemStyle.color).toBe('#ffffff')
    expect(series.find((s) => s.name === 'Vapour y₁' && s.type === 'scatter')!.data).toHaveLength(1)
    expect(series.find((s) => s.name === 'Flagged outlier')!.data).toHaveLength(1)
  })
})

describe('txyOption with a pressure ordinate (P–x–y)', () => {
  it('draws the pressures as given, whatever temperature unit the user chose', () => {
    // Invented numbers: a bubble pressure of 101.2 kPa must stay 101.2 under °C and °F alike (no 273.15 shift).
    for (const unit of ['C', 'F', 'K'] as const) {
      const o = txyOption({
        title: 'P–x–y',
        names,
        unit,
        k: 2,
        ordinate: { axis: 'P / kPa', symbol: 'P', unit: 'kPa', digits: 2 },
        curves: [{ name: 'Wilson', x1: [0, 0.5, 1], y1: [0, 0.6, 1], T: [68.7, 101.2, 98.1] }],
        points: [{ id: 'p1', T: 101.2, x1: 0.5, y1: 0.6 }],
      })
      const series = o.series as Series[]
      const liquid = series.find((s) => s.type === 'scatter' && s.name === 'Liquid x₁')!
      expect((liquid.data[0] as { value: number[] }).value[1]).toBe(101.2)
      const bubble = series.find((s) => s.type === 'line' && s.name === 'Wilson')!
      expect((bubble.data as number[][]).map((d) => d[1])).toEqual([68.7, 101.2, 98.1])
      expect((o.yAxis as { name: string }).name).toBe('P / kPa')
    }
  })
})

describe('txyOption tooltip', () => {
  it('shows a hovered point’s values with its uncertainties and flags', () => {
    const point = {
      id: 'p2',
      T: 331.15,
      x1: 0.3,
      y1: 0.45,
      uT: 0.05,
      ux1: 0.002,
      excluded: true,
      outlier: true,
      note: 'S-07',
    }
    const o = txyOption({ title: 'T–x–y', names, unit: 'C', k: 1, curves: [], points: [point] })
    const fmt = (o.tooltip as { formatter: (p: unknown) => string }).formatter
    const html = fmt({ data: { point, phase: 'liquid' }, seriesName: 'Liquid x₁' })
    expect(html).toBe(
      '<b>S-07</b> · liquid<br>T = 58.00 °C ± 0.05<br>x₁ = 0.3000 ± 0.0020<br>y₁ = 0.4500<br><i>excluded from fits</i><br><span style="color:#a3321f">flagged as an outlier</span>',
    )
  })
})

describe('xyOption', () => {
  it('always draws the diagonal and numbers the stages (every k-th when there are many)', () => {
    const staircase = Array.from({ length: 61 }, (_, i) => ({ x: 1 - i / 70, y: 1 - i / 70 }))
    const o = xyOption({
      title: 'x–y',
      names,
      curves: [curve],
      points: [],
      stages: {
        staircase,
        rectifying: { slope: 0.7, intercept: 0.27 },
        stripping: { slope: 1.3, intercept: -0.015 },
        intersection: { x: 0.5, y: 0.62 },
        xF: 0.5,
        xD: 0.9,
        xB: 0.05,
        q: 1,
        feedStage: 12,
      },
    })
    const series = o.series as Series[]
    expect(series[0].data).toEqual([
      [0, 0],
      [1, 1],
    ])
    const labels = series.find((s) => s.type === 'scatter' && s.name === 'Theoretical stages')!
    expect(labels.data.length).toBeLessThanOrEqual(14)
  })
})

describe('residualOption', () => {
  it('shades ±2σ around zero for each model', () => {
    const o = residualOption({
      title: 'ΔT',
      names,
      quantity: 'ΔT / K',
      digits: 3,
      series: [{ name: 'NRTL', sigma: 0.1, points: [{ id: 'a', x1: 0.2, residual: 0.05 }] }],
    })
    const s = (o.series as Series[])[0]
    expect(s.markArea?.data[0].map((d) => d.yAxis)).toEqual([-0.2, 0.2])
  })

  it('shows every fit in the legend at once (no paging), the grid starting below its rows', () => {
    const series = [
      'Van Laar',
      'Margules',
      'Wilson #1 (run 08:14 PM)',
      'NRTL #1 (α = 0.3)',
      'Wilson #2 (run 08:15 PM)',
      'NRTL #2 (α fitted from 0.3)',
    ].map((name) => ({ name, sigma: 0.1, points: [{ id: name, x1: 0.5, residual: 0.01 }] }))
    const o = residualOption({ title: 'ΔT', names, quantity: 'ΔT / K', digits: 3, series })
    const legend = o.legend as { type: string; data: string[] }
    expect(legend.type).toBe('plain')
    expect(legend.data).toEqual(series.map((s) => s.name))
    // six names of this length need three rows at 430 px (6.3 px a character + 44 px a swatch): top 30 + 3·22
    expect((o.grid as { top: number }).top).toBe(96)
    // eleven fits: still no scroll legend, and more rows
    const many = Array.from({ length: 11 }, (_, i) => ({ ...series[i % 6], name: `${series[i % 6].name} ${i}` }))
    const o11 = residualOption({ title: 'ΔT', names, quantity: 'ΔT / K', digits: 3, series: many })
    expect((o11.legend as { type: string }).type).toBe('plain')
    expect((o11.grid as { top: number }).top).toBeGreaterThan(96)
  })
})

describe('lineOption', () => {
  it('puts right-axis series on the second y axis and draws the cursor', () => {
    const o = lineOption({
      title: 't',
      xName: 'x',
      yName: 'y',
      y2Name: 'T / °C',
      digits: 2,
      cursorX: 0.3,
      series: [
        { name: 'a', x: [0, 1], y: [0, 1] },
        { name: 'b', x: [0, 1], y: [5, 6], rightAxis: true },
      ],
    })
    const series = o.series as (Series & { yAxisIndex: number; markLine?: { data: { xAxis: number }[] } })[]
    expect(series.map((s) => s.yAxisIndex)).toEqual([0, 1])
    expect(series[0].markLine?.data[0].xAxis).toBe(0.3)
    expect(o.yAxis as unknown[]).toHaveLength(2)
  })
})

describe('hostile text in tooltips', () => {
  const evil = '<img src=x onerror="window.__owned=1"><meta http-equiv="refresh" content="0;url=https://example.org">'
  type Tip = { formatter: (p: unknown) => string }

  it('escapes a sample label or exclusion reason and a curve name in the T–x–y tooltips', () => {
    const o = txyOption({
      title: 'T–x–y',
      names: [evil, 'methanol'],
      unit: 'K',
      k: 2,
      curves: [{ ...curve, name: evil }],
      points: [{ id: 'p1', T: 330.15, x1: 0.4, y1: 0.55, note: evil }],
      pure: { T1: 329.35, T2: 337.85 },
    })
    const tip = (o.tooltip as Tip).formatter
    const liquid = (o.series as Series[]).find((s) => s.type === 'scatter' && s.name === 'Liquid x₁')!
    const pointHtml = tip({ data: liquid.data[0], seriesName: 'Liquid x₁' })
    const curveHtml = tip({ data: {}, seriesName: evil })
    for (const html of [pointHtml, curveHtml]) {
      expect(html).not.toMatch(/<img|<meta/)
      expect(html).toContain('&lt;img src=x onerror=&quot;window.__owned=1&quot;&gt;')
    }
    const pure = (o.series as (Series & { tooltip?: Tip })[]).find((s) => s.tooltip && s.name !== 'Azeotrope')
    if (pure?.tooltip) expect(pure.tooltip.formatter({ name: evil, value: [0, 330] })).not.toMatch(/<img|<meta/)
  })

  it('escapes a fit name in the residual tooltip', () => {
    const o = residualOption({
      title: 'Residuals',
      quantity: 'ΔT / K',
      digits: 2,
      names: ['acetone', 'methanol'],
      series: [{ name: evil, points: [{ id: 'p1', x1: 0.3, residual: 0.1 }], sigma: 0.1 }],
    })
    const s = (o.series as (Series & { tooltip?: Tip })[]).find((x) => x.name === evil)!
    expect(s.tooltip!.formatter({ value: [0.3, 0.1], seriesName: evil })).not.toMatch(/<img|<meta/)
  })
})
