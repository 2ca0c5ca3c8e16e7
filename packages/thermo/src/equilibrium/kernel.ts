/**
 * Allocation-free bubble and dew solvers under modified Raoult's law, yi·P = xi·γi·Pi_sat
 * (ideal vapour, Poynting factor 1). Results go into the module buffer `res`:
 * res[0] T (K) · res[1] y1 or x1 · res[2] γ1 · res[3] γ2 · res[4] iterations · res[5] P (Pa)
 * · res[6] ∂ln(Σ xi γi Pi_sat)/∂T at the solution (1/K), used for implicit derivatives in fitting.
 */
import { lnGammaT } from '../activity/kernel.js'
import { lnPsatInverse, type LnPsat } from '../vapor-pressure/compiled.js'
import type { ActivityModel } from '../types.js'

export const res = new Float64Array(7)
const g = new Float64Array(4)
const MAX_NEWTON = 60

/** Starting temperature (K): saturation temperatures of the pure components at P, weighted by mole fraction. */
export function startTemperature(vp1: LnPsat, vp2: LnPsat, lnP: number, z1: number): number {
  const t1 = lnPsatInverse(vp1, lnP)
  const t2 = lnPsatInverse(vp2, lnP)
  const t = z1 * t1 + (1 - z1) * t2
  if (Number.isFinite(t)) return t
  return Number.isFinite(t1) ? t1 : Number.isFinite(t2) ? t2 : 300
}

/**
 * Bubble temperature at ln(P/Pa) = lnP and liquid x1, by Newton on ln(Σ xi γi Pi_sat) − ln P with
 * analytic ∂/∂T, kept inside a bracket that tightens as the sign of the residual is learned.
 * @returns false when it does not converge.
 */
export function solveBubbleT(
  act: ActivityModel,
  vp1: LnPsat,
  vp2: LnPsat,
  lnP: number,
  x1: number,
  T0: number,
): boolean {
  const x2 = 1 - x1
  let lo = Math.max(-vp1.c, -vp2.c, 0)
  let hi = Infinity
  let T = T0 > lo ? T0 : lo + 50
  let prevStep = Infinity
  const cm = 0.5 * (vp1.c + vp2.c)
  for (let it = 1; it <= MAX_NEWTON; it++) {
    lnGammaT(act, x1, T, g)
    const d1 = T + vp1.c
    const d2 = T + vp2.c
    const s1 = vp1.b / (d1 * d1)
    const s2 = vp2.b / (d2 * d2)
    const k1 = x1 > 0 ? x1 * Math.exp(g[0] + vp1.a - vp1.b / d1) : 0
    const k2 = x2 > 0 ? x2 * Math.exp(g[1] + vp2.a - vp2.b / d2) : 0
    const S = k1 + k2
    const f = Math.log(S) - lnP
    const e1 = g[2] + s1
    let fp = (k1 * e1 + k2 * (g[3] + s2)) / S
    // If γ falls faster than Pi_sat rises the slope can vanish; the Pi_sat slope alone still points uphill.
    if (!(fp > 0)) fp = (k1 * s1 + k2 * s2) / S
    if (f < 0) lo = T
    else hi = T
    const dT = -f / fp
    if (!Number.isFinite(dT)) return false
    const a = Math.abs(dT)
    // Newton's error after this step is about C·dT², with C estimated from the last two steps;
    // stop once that is below 1e-9 K (and y1, γ are carried to the new T to first order).
    // With no earlier step to estimate C from, only a step below 1e-6 K is accepted.
    const settled = prevStep === Infinity ? a < 1e-6 : a < 1e-3 && (a / (prevStep * prevStep)) * a * a < 1e-10
    if (a < 1e-9 || settled) {
      const y1 = (k1 / S) * (1 + (e1 - fp) * dT)
      res[0] = T + dT
      res[1] = y1 > 1 ? 1 : y1
      res[2] = Math.exp(g[0] + g[2] * dT)
      res[3] = Math.exp(g[1] + g[3] * dT)
      res[4] = it
      res[5] = Math.exp(lnP)
      res[6] = fp
      return true
    }
    prevStep = a
    // The step is taken in w = 1/(T + c̄), in which ln Pi_sat is nearly linear, so Newton lands closer.
    const dc = T + cm
    const w = 1 / dc + f / (fp * dc * dc)
    let Tn = w > 0 ? 1 / w - cm : NaN
    if (!(Math.abs(Tn - T) <= 100)) Tn = dT > 0 ? T + Math.min(dT, 100) : T + Math.max(dT, -100)
    if (Tn <= lo || Tn >= hi) Tn = hi === Infinity ? T + 100 : 0.5 * (lo + hi)
    if (hi - lo < 1e-9) return false
    T = Tn
  }
  return false
}

/** Bubble pressure at T (K) and x1: direct. */
export function solveBubbleP(act: ActivityModel, vp1: LnPsat, vp2: LnPsat, T: number, x1: number): void {
  lnGammaT(act, x1, T, g)
  const k1 = x1 > 0 ? x1 * Math.exp(g[0] + vp1.a - vp1.b / (T + vp1.c)) : 0
  const k2 = x1 < 1 ? (1 - x1) * Math.exp(g[1] + vp2.a - vp2.b / (T + vp2.c)) : 0
  const P = k1 + k2
  res[0] = T
  res[1] = k1 / P
  res[2] = Math.exp(g[0])
  res[3] = Math.exp(g[1])
  res[4] = 0
  res[5] = P
}

/**
 * Dew temperature at ln(P/Pa) = lnP and vapour y1: Newton on T for ln Σ yi·P/(γi·Pi_sat) = 0 while the
 * liquid composition is updated by substitution. @returns false when it does not settle.
 */
export function solveDewT(act: ActivityModel, vp1: LnPsat, vp2: LnPsat, lnP: number, y1: number, T0: number): boolean {
  const y2 = 1 - y1
  const floor = Math.max(-vp1.c, -vp2.c, 0)
  let T = T0
  let x1 = y1
  for (let it = 1; it <= 300; it++) {
    lnGammaT(act, x1, T, g)
    const d1 = T + vp1.c
    const d2 = T + vp2.c
    const q1 = y1 > 0 ? y1 * Math.exp(lnP - g[0] - vp1.a + vp1.b / d1) : 0
    const q2 = y2 > 0 ? y2 * Math.exp(lnP - g[1] - vp2.a + vp2.b / d2) : 0
    const Q = q1 + q2
    const fp = -(q1 * (g[2] + vp1.b / (d1 * d1)) + q2 * (g[3] + vp2.b / (d2 * d2))) / Q
    let dT = -Math.log(Q) / (fp < 0 ? fp : -((q1 * vp1.b) / (d1 * d1) + (q2 * vp2.b) / (d2 * d2)) / Q)
    if (!Number.isFinite(dT)) return false
    dT = Math.max(-50, Math.min(50, dT))
    const xn = q1 / Q
    const dx = xn - x1
    x1 = xn
    T = T + dT > floor ? T + dT : 0.5 * (T + floor)
    if (Math.abs(dT) < 1e-7 && Math.abs(dx) < 1e-11) {
      lnGammaT(act, x1, T, g)
      res[0] = T
      res[1] = x1
      res[2] = Math.exp(g[0])
      res[3] = Math.exp(g[1])
      res[4] = it
      res[5] = Math.exp(lnP)
      return true
    }
  }
  return false
}

/** Dew pressure at T (K) and vapour y1, by substitution on the liquid composition. @returns false when it does not settle. */
export function solveDewP(act: ActivityModel, vp1: LnPsat, vp2: LnPsat, T: number, y1: number): boolean {
  const p1 = Math.exp(vp1.a - vp1.b / (T + vp1.c))
  const p2 = Math.exp(vp2.a - vp2.b / (T + vp2.c))
  const y2 = 1 - y1
  let x1 = y1
  let P = 0
  for (let it = 1; it <= 500; it++) {
    lnGammaT(act, x1, T, g)
    const q1 = y1 / (Math.exp(g[0]) * p1)
    const q2 = y2 / (Math.exp(g[1]) * p2)
    const Pn = 1 / (q1 + q2)
    const xn = q1 * Pn
    const done = Math.abs(xn - x1) < 1e-12 && Math.abs(Pn - P) < 1e-10 * Pn
    x1 = xn
    P = Pn
    if (done) {
      lnGammaT(act, x1, T, g)
      res[0] = T
      res[1] = x1
      res[2] = Math.exp(g[0])
      res[3] = Math.exp(g[1])
      res[4] = it
      res[5] = P
      return true
    }
    if (!Number.isFinite(P)) return false
  }
  return false
}
