/**
 * Invented equilibrium tables for unit tests only (not reference data): a symmetric two-suffix Margules
 * liquid with a constant vapour-pressure ratio, which bends like an alcohol–water curve or forms an azeotrope.
 */
import type { EquilibriumTableRow } from './equilibrium-curve.js'

/** y(x) for γ = exp(A·(1 − x)²) etc. and P1sat/P2sat = ratio, on `n` + 1 evenly spaced rows. */
export function margulesTable(A: number, ratio: number, n = 200): EquilibriumTableRow[] {
  return Array.from({ length: n + 1 }, (_, i) => {
    const x = i / n
    const p1 = x * Math.exp(A * (1 - x) ** 2) * ratio
    const p2 = (1 - x) * Math.exp(A * x * x)
    return { x, y: p1 / (p1 + p2) }
  })
}

/** A curve that hugs the diagonal at low x and opens up above (stripping-section pinch shape). */
export function huggingTable(n = 200): EquilibriumTableRow[] {
  return Array.from({ length: n + 1 }, (_, i) => {
    const x = i / n
    return { x, y: x + 0.6 * x * (1 - x) * ((x * x) / (x * x + 0.05)) }
  })
}
