import { describe, expect, it } from 'vitest'
import type { Fit } from '../../api/datasets'
import {
  atBound,
  bestComparableAic,
  boundNote,
  fitMethodText,
  notComparableReason,
  paramSymbol,
  paramValueText,
} from './fit-display'

const fit = (parameters: Fit['parameters'], statistics: Record<string, unknown> = { converged: true }): Fit => ({
  id: 'f',
  dataSetId: 'd',
  pointSetDigest: 'ps',
  pointCount: 12,
  model: 'nrtl',
  options: { alpha: 0.3, fitAlpha: true },
  activity: { kind: 'nrtl' },
  parameters,
  statistics,
  residuals: [],
  pointIds: ['p1', 'p2'],
  runBy: 'u',
  runAt: '2026-12-01T10:00:00Z',
})

describe('fit display', () => {
  it('shows α as a symbol and a parameter at its bound without ± (the 0.1–0.7 range of packages/thermo)', () => {
    expect(paramSymbol('alpha')).toBe('α')
    expect(paramSymbol('b12')).toBe('b12')
    const bounded = fit([
      { name: 'b12', value: 949.31, standardError: 71.5 },
      { name: 'alpha', value: 0.7, standardError: 0.2257 },
    ])
    expect(paramValueText(bounded, bounded.parameters[1])).toBe('0.7000 (at bound)')
    expect(paramValueText(bounded, bounded.parameters[0])).toBe('949.3 ± 71.5')
    expect(boundNote(bounded)).toBe('α reached its bound (0.7): not determinable from these data.')
    const legacy = fit([{ name: 'alpha', value: 1, standardError: 0.2257 }])
    expect(atBound(legacy, legacy.parameters[0])).toBe(true)
    const inside = fit([{ name: 'alpha', value: 0.45, standardError: 0.05 }])
    expect(paramValueText(inside, inside.parameters[0])).toBe('0.4500 ± 0.0500')
    expect(boundNote(inside)).toBeNull()
  })

  it('uses the fit’s own bound mark when it carries one', () => {
    const marked = fit([
      { name: 'alpha', value: 0.45, standardError: 0.05, atBound: true } as Fit['parameters'][number],
    ])
    expect(atBound(marked, marked.parameters[0])).toBe(true)
    const engine = fit([
      { name: 'b12', value: 949.31, standardError: 71.5 },
      { name: 'alpha', value: 0.7, standardError: null, atBound: true } as unknown as Fit['parameters'][number],
    ])
    expect(paramValueText(engine, engine.parameters[1])).toBe('0.7000 (at bound)')
    const noSe = fit([{ name: 'b12', value: 12.5, standardError: null } as unknown as Fit['parameters'][number]])
    expect(paramValueText(noSe, noSe.parameters[0])).toBe('12.5000')
    const listed = fit([{ name: 'b12', value: 10, standardError: 1 }], { converged: true, atBound: ['b12'] })
    expect(atBound(listed, listed.parameters[0])).toBe(true)
  })

  it('keeps an unconverged fit out of the AIC comparison and out of the recommendation', () => {
    const bad = fit([], { converged: false })
    const good = fit([], { converged: true })
    expect(notComparableReason(bad)).toBe(
      'The solver did not converge: these parameters are not a best fit, so it is not compared on AIC and cannot be recommended.',
    )
    expect(notComparableReason(good)).toBeNull()
    expect(
      bestComparableAic([
        { f: bad, aic: -28.3 },
        { f: good, aic: -27.4 },
      ]),
    ).toBe(-27.4)
  })
})

describe('fits on other points', () => {
  it('a stale fit is neither compared on AIC nor recommended', () => {
    const current = { ...fit([]), id: 'a', statistics: { converged: true, aic: -40 } } as Fit
    const stale = { ...fit([]), id: 'b', stale: true, statistics: { converged: true, aic: -90 } } as Fit
    expect(notComparableReason(stale)).toBe(
      'Computed on other points than the data set has now: run it again to compare it on AIC or recommend it.',
    )
    // The stale fit's lower AIC does not win: AIC compares fits on the same points only.
    expect(
      bestComparableAic([
        { f: current, aic: -40 },
        { f: stale, aic: -90 },
      ]),
    ).toBe(-40)
  })
})

describe('fitMethodText', () => {
  const comp = (eta: number) => ({ Tc: 591.95, Pc: 5.786e6, RD: 2.595, eta })
  const hoc = (eta1: number) => ({
    kind: 'virial',
    correlation: 'hayden-oconnell',
    components: [comp(eta1), comp(1.7)],
  })
  it('names the objective and the vapour, and the chemical theory when the vapour dimerises (η ≥ 4.5)', () => {
    expect(fitMethodText({ options: { objective: 'bubble-point' }, statistics: {} })).toBe(
      'on ΔT and Δy₁ · ideal vapour',
    )
    expect(fitMethodText({ options: { objective: 'bubble-point', vapor: hoc(4.5) }, statistics: {} })).toBe(
      'on ΔT and Δy₁ · virial vapour (Hayden–O’Connell), chemical theory of dimerisation',
    )
    expect(fitMethodText({ options: { objective: 'bubble-pressure', vapor: hoc(1.63) }, statistics: {} })).toBe(
      'on ΔP and Δy₁ · virial vapour (Hayden–O’Connell)',
    )
    expect(fitMethodText({ options: { objective: 'bubble-point' }, statistics: { method: 'barker' } })).toBe(
      "Barker's method (ΔT only) · ideal vapour",
    )
  })
})
