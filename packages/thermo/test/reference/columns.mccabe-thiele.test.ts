/**
 * McCabe–Thiele against a published example: Geankoplis, Transport Processes and Separation Process
 * Principles, 4th ed., Example 11.4-1 — benzene–toluene at 101.32 kPa, saturated-liquid feed xF = 0.45,
 * xD = 0.95, xW = 0.10, R = 4: about 7.6 theoretical steps including the reboiler, feed on step 5 from the top
 * (reference-values §6, tag M, graphical accuracy). The book reads its curve off a chart of measured data;
 * here the curve is Raoult's law with the Antoine constants of Smith, Van Ness & Abbott, Appendix B, Table B.2
 * (benzene S, toluene M), so agreement is to graphical accuracy: ±0.3 step.
 */
import { describe, expect, it } from 'vitest'
import { mccabeThiele, minimumReflux } from '../../src/columns/index.js'

const P = 101325
/** ln(P/kPa) = A − B/(t/°C + C) → Pa. */
const psat = (A: number, B: number, C: number, T: number) => Math.exp(A - B / (T - 273.15 + C)) * 1000
const benzene = (T: number) => psat(13.7819, 2726.81, 217.572, T)
const toluene = (T: number) => psat(13.932, 3056.96, 217.625, T)

/** Ideal bubble point by bisection (independent of the engine's solvers). */
function bubble(x: number): { x: number; y: number; T: number } {
  let lo = 300
  let hi = 420
  for (let i = 0; i < 100; i++) {
    const T = 0.5 * (lo + hi)
    if (x * benzene(T) + (1 - x) * toluene(T) > P) hi = T
    else lo = T
  }
  const T = 0.5 * (lo + hi)
  const p1 = x * benzene(T)
  return { x, y: p1 / (p1 + (1 - x) * toluene(T)), T }
}
const table = Array.from({ length: 101 }, (_, i) => bubble(i / 100))

describe('Geankoplis 4th ed. Example 11.4-1 (graphical accuracy)', () => {
  const r = mccabeThiele({ table }, { xF: 0.45, q: 1, xD: 0.95, xB: 0.1, R: 4 })
  it('about 7.6 theoretical steps including the reboiler', () => {
    expect(Math.abs(r.fractionalStages - 7.6)).toBeLessThan(0.3)
    expect(r.stages).toBe(8)
  })
  it('feed on step 5 from the top', () => {
    expect(r.feedStage).toBe(5)
  })
  it('stage temperatures run from near benzene to near toluene boiling points (SVNA tn 80.0 and 110.6 °C)', () => {
    const tTop = r.steps[0].T! - 273.15
    const tBottom = r.steps[r.steps.length - 1].T! - 273.15
    expect(tTop).toBeGreaterThan(80)
    expect(tTop).toBeLessThan(84)
    expect(tBottom).toBeGreaterThan(105)
    expect(tBottom).toBeLessThan(110.6)
  })
  it('equimolar mixture boils near 92 °C with ~71 % benzene in the vapour (reference-values §6, common practice, no source)', () => {
    expect(bubble(0.5).T - 273.15).toBeCloseTo(92, 0)
    expect(bubble(0.5).y).toBeGreaterThan(0.7)
    expect(bubble(0.5).y).toBeLessThan(0.75)
  })
  it('R = 4 is well above the minimum reflux (pinch at the feed for a near-ideal curve)', () => {
    const m = minimumReflux({ table }, { xF: 0.45, q: 1, xD: 0.95 })
    expect(m.governs).toBe('pinch')
    expect(m.Rmin).toBeGreaterThan(1)
    expect(m.Rmin).toBeLessThan(1.5)
  })
})
