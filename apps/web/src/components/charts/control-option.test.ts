import { controlChart } from '@ebullio/thermo'
import { describe, expect, it } from 'vitest'
import { controlOption } from './control-option'

// Six GC check standards of one run share one time: numbered in order, the far one drawn red.
const values = [0.0005, -0.0005, 0.001, -0.001, 0, 0.02]
const points = values.map((value, i) => ({ id: `c${i}`, at: '2026-12-03T20:40:00Z', value, label: `CHK-${i + 1}` }))
const chart = controlChart({ values, baselineCount: 5 })

describe('controlOption', () => {
  it('numbers results in time order when several share a time, and marks the one beyond 3σ', () => {
    const o = controlOption({ title: 't', yName: 'Δx₁', points, chart, digits: 4, sequence: true })
    const data = (o.series as { data: { value: number[]; itemStyle: { color: string } }[] }[])[0].data
    expect(data.map((d) => d.value[0])).toEqual([1, 2, 3, 4, 5, 6])
    expect(chart.outOfControl).toEqual([5])
    expect(data[5].itemStyle.color).not.toBe(data[0].itemStyle.color)
    expect((o.xAxis as { type: string }).type).toBe('value')
  })

  it('keeps the time axis by default', () => {
    const o = controlOption({ title: 't', yName: 'Δx₁', points, chart, digits: 4 })
    expect((o.xAxis as { type: string }).type).toBe('time')
    const data = (o.series as { data: { value: number[] }[] }[])[0].data
    expect(data[0].value[0]).toBe(Date.parse('2026-12-03T20:40:00Z'))
  })
})
