import { describe, expect, it } from 'vitest'
import type { Fit, FitBand } from '../../api/datasets'
import { fitLabel, labelWithNote, plotBandOf } from './fit-helpers'

const fit = (
  id: string,
  model: Fit['model'],
  runAt: string,
  options: Record<string, unknown> = {},
  points = 12,
): Fit => ({
  id,
  dataSetId: 'd',
  model,
  options,
  activity: { kind: model },
  parameters: [],
  statistics: {},
  residuals: [],
  pointIds: Array.from({ length: points }, (_, i) => `p${i}`),
  runBy: 'u',
  runAt,
  pointSetDigest: 'ps',
  pointCount: points,
})

describe('fit labels', () => {
  it('numbers repeated fits of a model in run order and names the settings that differ', () => {
    const a = fit('a', 'nrtl', '2026-12-01T10:00:00Z', { objective: 'bubble-point', alpha: 0.3 })
    const b = fit('b', 'nrtl', '2026-12-01T10:05:00Z', { objective: 'bubble-point', alpha: 0.5081 })
    const w = fit('w', 'wilson', '2026-12-01T10:00:00Z')
    const all = [b, a, w]
    expect(fitLabel(a, all)).toBe('NRTL #1 (α = 0.3)')
    expect(fitLabel(b, all)).toBe('NRTL #2 (α = 0.5081)')
    expect(fitLabel(w, all)).toBe('Wilson')
    const c = fit('c', 'margules', '2026-12-01T10:00:00Z', {}, 12)
    const e = fit('e', 'margules', '2026-12-01T10:01:00Z', {}, 11)
    expect([fitLabel(c, [c, e]), fitLabel(e, [c, e])]).toEqual(['Margules #1 (12 points)', 'Margules #2 (11 points)'])
    const f = fit('f', 'margules', '2026-12-01T10:02:00Z', {}, 12)
    expect(fitLabel(f, [c, f])).toBe('Margules #2 (run 10:02 UTC)')
  })

  it('merges a note into a label’s own parentheses instead of doubling them', () => {
    expect(labelWithNote('Wilson', 'recommended')).toBe('Wilson (recommended)')
    expect(labelWithNote('Wilson #1 (run 08:14 PM)', 'recommended')).toBe('Wilson #1 (run 08:14 PM; recommended)')
  })
})

describe('plotBandOf', () => {
  const common = { fitId: 'f', model: 'wilson' as const, note: 'n', x1: [0, 1], y1: [0, 1], sigmaY: [0, 0] }
  it('puts a P–x–y band’s pressures (Pa) in the ordinate slots, and a T–x–y band’s temperatures', () => {
    const iso = {
      ...common,
      kind: 'isothermal',
      T: 328.15,
      P: [68000, 101000],
      sigmaP: [0, 0],
      Plow: [67900, 100900],
      Phigh: [68100, 101100],
      ylow: [0, 0.99],
      yhigh: [0.01, 1],
      warnings: [],
    } as FitBand
    expect(plotBandOf(iso, 'Wilson')).toEqual({
      name: 'Wilson',
      x1: [0, 1],
      T: [68000, 101000],
      Tlow: [67900, 100900],
      Thigh: [68100, 101100],
      ylow: [0, 0.99],
      yhigh: [0.01, 1],
    })
    const bar = {
      ...common,
      P: 101325,
      T: [373, 338],
      sigmaT: [0, 0],
      Tlow: [372.9, 337.9],
      Thigh: [373.1, 338.1],
      ylow: [0, 0.99],
      yhigh: [0.01, 1],
      warnings: [],
    } as FitBand
    expect(plotBandOf(bar, 'NRTL')).toMatchObject({ T: [373, 338], Tlow: [372.9, 337.9], Thigh: [373.1, 338.1] })
  })
})
