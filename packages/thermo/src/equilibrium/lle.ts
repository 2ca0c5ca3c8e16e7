/**
 * Liquid–liquid equilibrium of a binary at fixed T, from the Gibbs energy of mixing
 * g(x) = ΔG_mix/RT = x·ln x + (1 − x)·ln(1 − x) + gE/RT.
 * A liquid of composition z is stable exactly when the tangent to g at z lies below g everywhere
 * (tangent-plane criterion: M. L. Michelsen, Fluid Phase Equilib. 9 (1982) 1; from memory); for a binary
 * that is the same as z lying on the lower convex hull of g. So: (1) g on a grid that is dense at both ends
 * (logit-spaced down to x = 1e-12) and uniform in the middle; (2) its lower convex hull; every hull edge that
 * skips grid nodes brackets a two-liquid gap; (3) Newton on the equal-activity equations
 * ln(xI·γ1I) = ln(xII·γ1II), ln(xI'·γ2I) = ln(xII'·γ2II) in logit variables u = ln(x/(1 − x)), where the
 * Jacobian is exact up to the thermodynamic factor Γ = 1 + x·∂ln γ1/∂x; (4) the converged pair is accepted
 * only when its common tangent lies below g on the whole grid (global stability of both liquids).
 */
import { lnGammaT } from '../activity/kernel.js'
import type { ActivityModel } from '../types.js'

/** A two-liquid gap at one temperature: xI < xII, the compositions (x1) of the two coexisting liquids. */
export interface LiquidGap {
  xI: number
  xII: number
}

const buf = new Float64Array(4)
/** Converged when both equal-activity residuals are below this (ln a). */
export const LLE_TOLERANCE = 1e-10

/** Composition grid: logit-spaced to 1e-12 at both ends, plus a uniform mesh of 0.005 in the middle. */
export const LLE_GRID: Float64Array = (() => {
  const set = new Set<number>()
  for (let i = 0; i <= 160; i++) {
    const u = -27.6 + (55.2 * i) / 160
    set.add(1 / (1 + Math.exp(-u)))
  }
  for (let i = 1; i < 200; i++) set.add(i / 200)
  return Float64Array.from([...set].sort((a, b) => a - b))
})()

function xOf(u: number): number {
  return 1 / (1 + Math.exp(-u))
}

/** ΔG_mix/RT at x1 (0 < x1 < 1). */
export function gibbsOfMixing(act: ActivityModel, x: number, T: number): number {
  lnGammaT(act, x, T, buf)
  return x * (Math.log(x) + buf[0]) + (1 - x) * (Math.log1p(-x) + buf[1])
}

/**
 * Tangent-plane distance at trial composition w of a liquid z: D(w) = g(w) − g(z) − g'(z)·(w − z), where
 * g'(z) = ln a1(z) − ln a2(z). A liquid z is stable when D ≥ 0 for every w.
 */
export function tangentPlaneDistance(act: ActivityModel, z: number, w: number, T: number): number {
  lnGammaT(act, z, T, buf)
  const la1 = Math.log(z) + buf[0]
  const la2 = Math.log1p(-z) + buf[1]
  lnGammaT(act, w, T, buf)
  return w * (Math.log(w) + buf[0] - la1) + (1 - w) * (Math.log1p(-w) + buf[1] - la2)
}

/** ln a1, ln a2 and Γ·(1 − x), −Γ·x (their derivatives in u) at logit u, into out[0..3]. */
function activities(act: ActivityModel, u: number, T: number, out: Float64Array): void {
  const x = xOf(u)
  const h = 1e-5
  lnGammaT(act, xOf(u + h), T, buf)
  const up = buf[0]
  lnGammaT(act, xOf(u - h), T, buf)
  const dn = buf[0]
  lnGammaT(act, x, T, buf)
  // ln x = −ln(1 + e^−u) and ln(1 − x) = −ln(1 + e^u) keep full precision for very dilute phases.
  out[0] = -Math.log1p(Math.exp(-u)) + buf[0]
  out[1] = -Math.log1p(Math.exp(u)) + buf[1]
  const gamma = 1 + (up - dn) / (2 * h) / (1 - x)
  out[2] = gamma * (1 - x)
  out[3] = -gamma * x
}

const A = new Float64Array(4)
const B = new Float64Array(4)

/**
 * Newton on the equal-activity equations from logit starts (ua, ub), damped by halving until the residual
 * norm falls. @returns the converged gap, or null (no convergence, or the trivial solution xI = xII).
 */
export function solveGap(act: ActivityModel, T: number, ua: number, ub: number): LiquidGap | null {
  activities(act, ua, T, A)
  activities(act, ub, T, B)
  let f1 = A[0] - B[0]
  let f2 = A[1] - B[1]
  let norm = Math.abs(f1) + Math.abs(f2)
  // Iterate past the acceptance tolerance towards rounding level (one or two cheap extra steps of a quadratically
  // converging Newton), so that quantities derived from the gap (three-phase T, its parameter derivatives) are smooth.
  for (let it = 0; it < 100; it++) {
    if (Math.abs(f1) < 1e-14 && Math.abs(f2) < 1e-14) break
    // J = [[A2, −B2], [A3, −B3]]; solve J·d = −f.
    const det = -A[2] * B[3] + B[2] * A[3]
    if (!Number.isFinite(det) || det === 0) return null
    let da = (-f1 * -B[3] - -B[2] * -f2) / det
    let db = (A[2] * -f2 - A[3] * -f1) / det
    const big = Math.max(Math.abs(da), Math.abs(db))
    if (big > 3) {
      da *= 3 / big
      db *= 3 / big
    }
    let accepted = false
    for (let k = 0; k < 30; k++) {
      activities(act, ua + da, T, A)
      activities(act, ub + db, T, B)
      const n1 = A[0] - B[0]
      const n2 = A[1] - B[1]
      const n = Math.abs(n1) + Math.abs(n2)
      if (Number.isFinite(n) && n < norm) {
        ua += da
        ub += db
        f1 = n1
        f2 = n2
        norm = n
        accepted = true
        break
      }
      da *= 0.5
      db *= 0.5
    }
    if (!accepted) break
  }
  if (!(Math.abs(f1) < LLE_TOLERANCE && Math.abs(f2) < LLE_TOLERANCE)) return null
  if (Math.abs(ua - ub) < 1e-6) return null
  const xa = xOf(ua)
  const xb = xOf(ub)
  return xa < xb ? { xI: xa, xII: xb } : { xI: xb, xII: xa }
}

/** True when the common tangent through the gap lies below g (within 1e-9) at every grid node. */
function tangentIsSupporting(act: ActivityModel, gap: LiquidGap, T: number, gs: Float64Array): boolean {
  const x0 = gap.xI
  const g0 = gibbsOfMixing(act, x0, T)
  const slope = (gibbsOfMixing(act, gap.xII, T) - g0) / (gap.xII - x0)
  for (let i = 0; i < LLE_GRID.length; i++) {
    if (gs[i] - (g0 + slope * (LLE_GRID[i] - x0)) < -1e-9) return false
  }
  return true
}

/**
 * Every two-liquid gap of the model at T (K), ascending in x1; empty when one liquid is stable at every
 * composition. Gaps whose dilute end lies below x1 = 1e-12 are not resolved.
 */
export function liquidGaps(act: ActivityModel, T: number): LiquidGap[] {
  if (act.kind === 'ideal' || act.kind === 'wilson') return []
  const n = LLE_GRID.length
  const gs = new Float64Array(n)
  for (let i = 0; i < n; i++) gs[i] = gibbsOfMixing(act, LLE_GRID[i], T)
  // Lower convex hull (monotone chain) over the grid.
  const hull: number[] = []
  for (let i = 0; i < n; i++) {
    while (hull.length >= 2) {
      const a = hull[hull.length - 2]
      const b = hull[hull.length - 1]
      const cross = (LLE_GRID[b] - LLE_GRID[a]) * (gs[i] - gs[a]) - (gs[b] - gs[a]) * (LLE_GRID[i] - LLE_GRID[a])
      if (cross <= 0) hull.pop()
      else break
    }
    hull.push(i)
  }
  const gaps: LiquidGap[] = []
  for (let k = 0; k + 1 < hull.length; k++) {
    const i = hull[k]
    const j = hull[k + 1]
    if (j - i < 2) continue
    // How far the skipped nodes lie above the edge: rounding noise is not a gap.
    const slope = (gs[j] - gs[i]) / (LLE_GRID[j] - LLE_GRID[i])
    let depth = 0
    for (let m = i + 1; m < j; m++) depth = Math.max(depth, gs[m] - (gs[i] + slope * (LLE_GRID[m] - LLE_GRID[i])))
    if (depth < 1e-12) continue
    const u = (x: number) => Math.log(x / (1 - x))
    const gap = solveGap(act, T, u(LLE_GRID[i]), u(LLE_GRID[j]))
    if (gap && tangentIsSupporting(act, gap, T, gs) && gaps.every((g) => Math.abs(g.xI - gap.xI) > 1e-8)) {
      gaps.push(gap)
    }
  }
  return gaps.sort((a, b) => a.xI - b.xI)
}

/** The gap that strictly contains x1 (a liquid of that overall composition splits), or null. */
export function gapContaining(gaps: LiquidGap[], x1: number): LiquidGap | null {
  for (const g of gaps) if (x1 > g.xI && x1 < g.xII) return g
  return null
}
