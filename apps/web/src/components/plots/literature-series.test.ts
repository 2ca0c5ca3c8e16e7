import { describe, expect, it } from 'vitest'
import { LITERATURE_SYMBOL, MEASURE_NEXT_NAME } from './literature-series'
import { txyOption } from './txy-option'
import { xyOption } from './xy-option'

type Series = { name: string; symbol?: string; data: unknown[]; tooltip?: { formatter: (p: unknown) => string } }
const names: [string, string] = ['acetone', 'methanol']
const evil = '<img src=x onerror=alert(1)> =SUM(A1)'
const literature = [
  {
    name: 'Author 1987',
    points: [
      { T: 330.15, x1: 0.8, y1: 0.85 },
      { T: 333.15, x1: 0.5, y1: null },
    ],
  },
  { name: evil, points: [{ T: 335.15, x1: 0.2, y1: 0.35 }] },
]

describe('literature data beside the lab’s own', () => {
  it('T–x–y: one legend entry and one triangle series per data set, liquid and vapour points at their T', () => {
    const o = txyOption({ title: 't', points: [], curves: [], unit: 'C', names, k: 1, literature })
    const legend = o.legend as { data: string[] }
    expect(legend.data).toEqual(['Author 1987', evil])
    const s = (o.series as Series[]).filter((x) => x.symbol === LITERATURE_SYMBOL)
    expect(s.map((x) => x.name)).toEqual(['Author 1987', evil])
    // 330.15 K = 57.00 °C; the point without y1 gives a liquid point only
    expect((s[0].data as { value: number[] }[]).map((d) => d.value)).toEqual([
      [0.8, expect.closeTo(57, 9)],
      [0.5, expect.closeTo(60, 9)],
      [0.85, expect.closeTo(57, 9)],
    ])
  })

  it('keeps a hostile citation name as text in the tooltip', () => {
    const o = xyOption({ title: 'x', curves: [], points: [], names, literature })
    const s = (o.series as Series[]).find((x) => x.name === evil)!
    const html = s.tooltip!.formatter({ value: [0.2, 0.35], seriesName: evil })
    expect(html).not.toContain('<img')
    expect(html).toContain('&lt;img src=x onerror=alert(1)&gt;')
    expect(s.data).toEqual([[0.2, 0.35]])
  })

  it('x–y: the suggestions sit at their predicted y1, numbered best first, with a legend entry', () => {
    const o = xyOption({
      title: 'x',
      curves: [],
      points: [],
      names,
      suggested: [
        { x1: 0.05, T: 337, sigmaY: 0.004, y1: 0.12 },
        { x1: 0.9, T: 330, sigmaY: 0.002, y1: 0.91 },
      ],
    })
    const s = (o.series as Series[]).find((x) => x.name === MEASURE_NEXT_NAME)!
    expect(s.data).toEqual([
      { value: [0.05, 0.12], rank: 1, sigmaY: 0.004 },
      { value: [0.9, 0.91], rank: 2, sigmaY: 0.002 },
    ])
    expect((o.legend as { data: string[] }).data).toContain(MEASURE_NEXT_NAME)
    const none = xyOption({ title: 'x', curves: [], points: [], names, suggested: [{ x1: 0.3, T: 330, sigmaY: 0 }] })
    expect((none.series as Series[]).some((x) => x.name === MEASURE_NEXT_NAME)).toBe(false)
  })
})
