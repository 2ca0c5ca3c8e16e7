import { describe, expect, it } from 'vitest'
import { THREE_PHASE_NAME, TWO_LIQUID_NAME } from './heterogeneous-series'
import { txyOption } from './txy-option'
import { xyOption } from './xy-option'

// Shapes only (numbers invented for the drawing): the engine's values are checked against references in thermo.
const threePhase = { T: 366.12, x1I: 0.588, x1II: 0.982, y1: 0.764 }
const twoLiquids = { T: [316.12, 341.12, 366.12], x1I: [0.52, 0.55, 0.588], x1II: [0.985, 0.984, 0.982] }
type Series = { name?: string; type?: string; data?: unknown[] }

describe('three-phase line and two-liquid region on the plots', () => {
  it('draws the three-phase line at its temperature from layer to layer through the vapour, in °C', () => {
    const o = txyOption({
      title: 't',
      points: [],
      curves: [],
      unit: 'C',
      names: ['water', '1-butanol'],
      k: 1,
      threePhase,
      twoLiquids,
    })
    const line = (o.series as Series[]).find((s) => s.name === THREE_PHASE_NAME)!
    expect(line.data).toEqual([
      [0.588, 366.12 - 273.15],
      [0.764, 366.12 - 273.15],
      [0.982, 366.12 - 273.15],
    ])
    expect((o.legend as { data: string[] }).data).toEqual([THREE_PHASE_NAME, TWO_LIQUID_NAME])
  })

  it('closes the two-liquid region along the three-phase line (corners are data, so the axis makes room)', () => {
    const o = txyOption({
      title: 't',
      points: [],
      curves: [],
      unit: 'K',
      names: ['w', 'b'],
      k: 1,
      threePhase,
      twoLiquids,
    })
    const region = (o.series as Series[]).find((s) => s.name === TWO_LIQUID_NAME)!
    expect(region.type).toBe('custom')
    expect(region.data).toEqual([
      [0.52, 316.12],
      [0.55, 341.12],
      [0.588, 366.12],
      [0.588, 366.12],
      [0.982, 366.12],
      [0.982, 366.12],
      [0.984, 341.12],
      [0.985, 316.12],
    ])
  })

  it('marks the flat x–y stretch and each azeotrope where its vapour lies', () => {
    const o = xyOption({
      title: 'xy',
      curves: [],
      points: [],
      names: ['w', 'b'],
      threePhase,
      azeotropes: [{ x1: 0.764, T: 366.12, kind: 'heterogeneous', liquidPhases: [0.588, 0.982] }],
    })
    const s = o.series as Series[]
    expect(s.find((x) => x.name === THREE_PHASE_NAME)!.data).toEqual([
      [0.588, 0.764],
      [0.982, 0.764],
    ])
    expect(s.find((x) => x.name === 'Azeotrope')!.data).toEqual([
      { value: [0.764, 0.764], az: { x1: 0.764, T: 366.12, kind: 'heterogeneous', liquidPhases: [0.588, 0.982] } },
    ])
  })

  it('draws nothing extra for a system with one liquid', () => {
    const o = txyOption({ title: 't', points: [], curves: [], unit: 'C', names: ['a', 'b'], k: 1 })
    expect((o.series as Series[]).some((s) => s.name === THREE_PHASE_NAME || s.name === TWO_LIQUID_NAME)).toBe(false)
  })
})
