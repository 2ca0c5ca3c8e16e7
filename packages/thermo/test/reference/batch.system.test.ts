/**
 * Batch stills on a BinarySystem through part 1's bubble-point solver.
 * - Benzene–toluene, ideal, SVNA Appendix B Table B.2 Antoine constants (benzene S, toluene M): the first vapour of an
 *   equimolar charge holds roughly 70–75 % benzene and the pot starts near 92 °C (reference-values §6, common practice,
 *   no source); the pot temperature then rises towards toluene's 110.6 °C.
 * - 1-propanol–water, NRTL from SVNA 7th ed. Table 12.5 (S): with many stages the distillate tends to the azeotrope
 *   (x ≈ 0.43, 87.7 °C, CRC Handbook, reference-values §5, S) and cannot pass it.
 */
import { describe, expect, it } from 'vitest'
import { batchRectification, simpleBatchDistillation } from '../../src/batch/index.js'
import type { BinarySystem, VaporPressureModel } from '../../src/types.js'

const P = 101325
const antoine = (A: number, B: number, C: number): VaporPressureModel => ({
  kind: 'antoine',
  A,
  B,
  C,
  log: 'ln',
  pressureUnit: 'kPa',
  temperatureUnit: 'C',
})
const benzeneToluene: BinarySystem = {
  vaporPressure: [antoine(13.7819, 2726.81, 217.572), antoine(13.932, 3056.96, 217.625)],
  activity: { kind: 'ideal' },
}
const propanolWater: BinarySystem = {
  vaporPressure: [antoine(16.1154, 3483.67, 205.807), antoine(16.3872, 3885.7, 230.17)],
  activity: { kind: 'nrtl', b12: 500.4 * 4.184, b21: 1636.57 * 4.184, alpha: 0.5081 },
}

describe('benzene–toluene simple batch distillation', () => {
  const r = simpleBatchDistillation(
    { system: benzeneToluene, P },
    { charge: { moles: 100, x1: 0.5 }, until: { potX1: 0.05 }, frames: 50 },
  )
  it('starts near 92 °C with 70–75 % benzene in the first vapour', () => {
    expect(r.frames[0].potT! - 273.15).toBeCloseTo(92, 0)
    expect(r.frames[0].instantaneousDistillateY1).toBeGreaterThan(0.7)
    expect(r.frames[0].instantaneousDistillateY1).toBeLessThan(0.75)
  })
  it('the pot temperature rises towards toluene’s boiling point', () => {
    for (let i = 1; i < r.frames.length; i++) expect(r.frames[i].potT!).toBeGreaterThan(r.frames[i - 1].potT!)
    expect(r.end.potT! - 273.15).toBeLessThan(110.6)
    expect(r.end.potT! - 273.15).toBeGreaterThan(107)
  })
})

describe('1-propanol–water batch rectification', () => {
  const r = batchRectification(
    { system: propanolWater, P },
    { charge: { moles: 50, x1: 0.1 }, stages: 15, R: 8, until: { recovery1: 0.5 }, frames: 20 },
  )
  it('the distillate approaches but never passes the azeotrope (x ≈ 0.43, 87.7 °C)', () => {
    for (const f of r.frames) {
      expect(f.instantaneousDistillateY1).toBeLessThan(0.46)
      expect(f.stillHeadT!).toBeGreaterThan(273.15 + 86.5)
    }
    expect(r.frames[0].instantaneousDistillateY1).toBeGreaterThan(0.4)
    expect(Math.abs(r.frames[0].stillHeadT! - 273.15 - 87.7)).toBeLessThan(1.2)
  })
})
