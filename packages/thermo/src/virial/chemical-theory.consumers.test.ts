import { describe, expect, it } from 'vitest'
import { heringtonAreaTest, pointTest, redlichKisterAreaTest } from '../consistency/index.js'
import { phaseDiagram } from '../equilibrium/index.js'
import { fitBinary, predictionBand } from '../fitting/index.js'
import type { BinarySystem } from '../types.js'
import { acidWaterLiquid, acidWaterVapour } from './acid-water.fixture.js'
import { bubblePressureGammaPhi, bubbleTemperatureGammaPhi, vaporCorrectionSize } from './index.js'

// The acetic acid (1) + water (2) system of chemical-theory.test.ts (acid-water.fixture.ts; sources there).
const vapor = acidWaterVapour
const liquid = acidWaterLiquid
const system: BinarySystem = { ...liquid, vapor }
const points = [0.05, 0.15, 0.3, 0.5, 0.7, 0.85, 0.95].map((x1) => {
  const r = bubbleTemperatureGammaPhi(liquid, { P: 101325, x1 }, vapor)
  return { T: r.T, P: 101325, x1, y1: r.y1 }
})

describe('every consumer of φ goes through the chemical theory (acetic acid + water)', () => {
  it('the T–x–y diagram runs through the same bubble points and states the treatment', () => {
    const d = phaseDiagram(system, { P: 101325 }, { points: 11 })
    if (d.kind !== 'isobaric') throw new Error('expected a T–x–y diagram')
    const r = bubbleTemperatureGammaPhi(liquid, { P: 101325, x1: d.x1[3] }, vapor)
    expect(d.T[3]).toBeCloseTo(r.T, 8)
    expect(d.y1[3]).toBeCloseTo(r.y1, 9)
    expect(d.T[0]).toBeCloseTo(373.1477, 3) // pure water at its Antoine boiling point
    expect(d.T[10]).toBeCloseTo(391.0475, 3) // pure acid at its Antoine boiling point
    expect(d.warnings.some((w) => w.includes('chemical theory of dimerisation'))).toBe(true)
  })

  it('vaporCorrectionSize compares the ideal and the dimerising vapour: |Δy| up to 0.082, |ΔT| up to 2.5 K', () => {
    const s = vaporCorrectionSize(system, points)
    expect(s.compared).toBe(7)
    expect(s.maxAbsDy).toBeCloseTo(0.0816, 3)
    expect(s.maxAbsDT).toBeCloseTo(2.525, 2)
    expect(s.exceedsUncertainty).toBe(true)
  })

  it('an area test passes with the dimerising vapour and fails when the same data are reduced with an ideal one', () => {
    // Known effect (from memory, common practice): acid systems look inconsistent unless vapour association is
    // accounted for. Exact model points: D = 1.6 with the chemical theory, 40.6 with an ideal vapour.
    const chem = heringtonAreaTest(points, { vaporPressure: liquid.vaporPressure, vapor })
    const ideal = heringtonAreaTest(points, { vaporPressure: liquid.vaporPressure })
    expect(chem.D).toBeCloseTo(1.63, 1)
    expect(ideal.D).toBeCloseTo(40.6, 0)
    // the result states the treatment it ran under (as every other result does); an ideal reduction does not
    expect(chem.warnings.filter((w) => w.includes('chemical theory of dimerisation'))).toHaveLength(1)
    expect(ideal.warnings.some((w) => w.includes('chemical theory'))).toBe(false)
  })

  it('the point test and the isothermal area test state the chemical theory too', () => {
    const pt = pointTest(points, { vaporPressure: liquid.vaporPressure, model: 'nrtl', alpha: 0.3, vapor })
    expect(pt.warnings.filter((w) => w.includes('chemical theory of dimerisation'))).toHaveLength(1)
    // exact model points under the same vapour: the point test passes easily
    expect(pt.meanAbsDeltaY).toBeLessThan(0.002)
    const T = 370
    const iso = [0.1, 0.3, 0.5, 0.7, 0.9].map((x1) => {
      const r = bubblePressureGammaPhi(liquid, { T, x1 }, vapor)
      return { T, P: r.P, x1, y1: r.y1 }
    })
    const rk = redlichKisterAreaTest(iso, { vaporPressure: liquid.vaporPressure, vapor })
    expect(rk.warnings.filter((w) => w.includes('chemical theory of dimerisation'))).toHaveLength(1)
  })

  it('a prediction band of a fit under the dimerising vapour is centred on its bubble points', () => {
    const fit = fitBinary({
      model: 'nrtl',
      alpha: 0.3,
      vaporPressure: liquid.vaporPressure,
      vapor,
      points: points.map((p) => ({ ...p, T: p.T + 0.01 * Math.sin(17 * p.x1) })), // deterministic scatter
    })
    const band = predictionBand(fit, { P: 101325, points: 5 })
    const fitted = fit.parameters.map((p) => p.value)
    const own = bubbleTemperatureGammaPhi(
      { ...liquid, activity: { kind: 'nrtl', b12: fitted[0], b21: fitted[1], alpha: 0.3 } },
      { P: 101325, x1: band.x1[2] },
      vapor,
    )
    expect(fit.parameters.map((p) => p.name)).toEqual(['b12', 'b21'])
    expect(band.T[2]).toBeCloseTo(own.T, 8)
    expect(band.y1[2]).toBeCloseTo(own.y1, 9)
    expect(band.sigmaT[2]).toBeGreaterThan(0)
    expect(band.sigmaT[2]).toBeLessThan(0.02)
  })
})
