import { checkTemperature } from '../errors.js'
import { lnGammaT } from '../activity/kernel.js'
import type { BinarySystem } from '../types.js'
import { compileSystem } from './system.js'

/** Two coexisting liquids at T: x1I < x1II (mole fractions of component 1) and [γ1, γ2] in each. */
export interface LiquidLiquidResult {
  x1I: number
  x1II: number
  gammaI: [number, number]
  gammaII: [number, number]
}

const g = new Float64Array(4)

/**
 * Liquid–liquid equilibrium of a binary at temperature T (K), from the activity model alone (the liquids are
 * taken as incompressible, so pressure does not enter). Method: lower convex hull of ΔG_mix/RT over x1 on a
 * grid dense at both ends (down to x1 = 1e-12), then Newton on the equal-activity equations
 * x1I·γ1I = x1II·γ1II and x2I·γ2I = x2II·γ2II, converged to 1e-10 in ln a; the common tangent is checked to lie
 * below ΔG_mix/RT everywhere (both liquids globally stable). See docs/methods.md.
 * @param at T in K.
 * @returns null when one liquid is stable at every composition at T; else x1I < x1II and the activity
 *   coefficients in each liquid. With more than one gap at T (rare), the widest.
 */
export function liquidLiquidEquilibrium(system: BinarySystem, at: { T: number }): LiquidLiquidResult | null {
  const c = compileSystem(system)
  checkTemperature(at?.T)
  const gaps = c.stab.gaps(at.T)
  if (gaps.length === 0) return null
  const gap = gaps.reduce((a, b) => (b.xII - b.xI > a.xII - a.xI ? b : a))
  lnGammaT(c.act, gap.xI, at.T, g)
  const gammaI: [number, number] = [Math.exp(g[0]), Math.exp(g[1])]
  lnGammaT(c.act, gap.xII, at.T, g)
  return { x1I: gap.xI, x1II: gap.xII, gammaI, gammaII: [Math.exp(g[0]), Math.exp(g[1])] }
}
