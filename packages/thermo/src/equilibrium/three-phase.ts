/**
 * Vapour–liquid–liquid (three-phase) points of a binary under modified Raoult's law. Two liquids in
 * equilibrium have equal activities, so they share one bubble pressure and one vapour: P3 = Σ xi·γi·Pi_sat
 * of either liquid. Isothermal: the gap at T gives P3 directly. Isobaric: T3 solves ln P3(T) = ln P, a
 * safeguarded secant on T with the gap re-solved (warm-started) at every trial temperature.
 */
import { lnGammaT } from '../activity/kernel.js'
import { res, solveBubbleP, solveBubbleT, startTemperature } from './kernel.js'
import { gapContaining, liquidGaps, solveGap, type LiquidGap } from './lle.js'
import type { CompiledSystem } from './system.js'

/** A three-phase point: T in K, P in Pa, the two liquids xI < xII, the vapour y1, γ = [γ1, γ2] of each liquid. */
export interface ThreePhasePoint {
  T: number
  P: number
  xI: number
  xII: number
  y1: number
  gammaI: [number, number]
  gammaII: [number, number]
}

const g = new Float64Array(4)

export function threePhaseAtGap(c: CompiledSystem, T: number, gap: LiquidGap): ThreePhasePoint {
  solveBubbleP(c.act, c.vp1, c.vp2, T, gap.xI)
  const P = res[5]
  const y1 = res[1]
  const gammaI: [number, number] = [res[2], res[3]]
  lnGammaT(c.act, gap.xII, T, g)
  return { T, P, xI: gap.xI, xII: gap.xII, y1, gammaI, gammaII: [Math.exp(g[0]), Math.exp(g[1])] }
}

/** The three-phase point at T (K): the first gap's liquids and their common bubble pressure; null without a gap. */
export function threePhaseIsothermal(c: CompiledSystem, T: number): ThreePhasePoint | null {
  const gaps = c.stab.gaps(T)
  return gaps.length > 0 ? threePhaseAtGap(c, T, gaps[0]) : null
}

const logit = (x: number) => Math.log(x / (1 - x))

/** The gap at T continued from `near` (Newton from its compositions), else the nearest gap found afresh. */
function gapNear(c: CompiledSystem, T: number, near: LiquidGap): LiquidGap | null {
  const quick = solveGap(c.act, T, logit(near.xI), logit(near.xII))
  if (quick && Math.abs(quick.xI - near.xI) < 0.2 && Math.abs(quick.xII - near.xII) < 0.2) return quick
  const all = liquidGaps(c.act, T)
  let best: LiquidGap | null = null
  for (const gap of all) {
    if (
      !best ||
      Math.abs(gap.xI - near.xI) + Math.abs(gap.xII - near.xII) <
        Math.abs(best.xI - near.xI) + Math.abs(best.xII - near.xII)
    )
      best = gap
  }
  return best
}

/**
 * T3 at ln(P/Pa) = lnP, starting from a temperature T0 (K) at which `gap0` exists.
 * @returns the three-phase point, or null when the gap closes before its bubble pressure reaches P.
 */
export function solveThreePhaseT(c: CompiledSystem, P: number, T0: number, gap0: LiquidGap): ThreePhasePoint | null {
  const lnP = Math.log(P)
  let T = T0
  let gap = gap0
  let lo = -Infinity
  let hi = Infinity
  let loGap: LiquidGap | null = null
  let prev: { T: number; h: number } | null = null
  for (let it = 0; it < 100; it++) {
    const here = threePhaseAtGap(c, T, gap)
    const h = Math.log(here.P) - lnP
    if (Math.abs(h) < 1e-14) return here
    if (h < 0) [lo, loGap] = [T, gap]
    else hi = T
    // Slope: secant when there is a previous point, else the vapour-pressure slope weighted by the vapour.
    let slope: number
    if (prev && prev.T !== T) slope = (h - prev.h) / (T - prev.T)
    else {
      lnGammaT(c.act, gap.xI, T, g)
      const s1 = c.vp1.b / ((T + c.vp1.c) * (T + c.vp1.c)) + g[2]
      const s2 = c.vp2.b / ((T + c.vp2.c) * (T + c.vp2.c)) + g[3]
      slope = here.y1 * s1 + (1 - here.y1) * s2
    }
    prev = { T, h }
    let Tn = slope > 0 ? T - h / slope : NaN
    if (!(Math.abs(Tn - T) <= 30)) Tn = h < 0 ? T + 10 : T - 10
    if (Tn <= lo || Tn >= hi) Tn = Number.isFinite(lo) && Number.isFinite(hi) ? 0.5 * (lo + hi) : Tn
    if (Math.abs(Tn - T) < 1e-13 * T) return here
    let next = gapNear(c, Tn, gap)
    // Above the critical solution temperature the gap is gone: move back towards the last good temperature.
    for (let k = 0; k < 40 && !next; k++) {
      hi = Tn
      Tn = Number.isFinite(lo) ? 0.5 * (lo + Tn) : 0.5 * (T + Tn)
      next = gapNear(c, Tn, loGap ?? gap)
      prev = null
      if (Math.abs(Tn - (Number.isFinite(lo) ? lo : T)) < 1e-9) break
    }
    if (!next) return null
    T = Tn
    gap = next
  }
  return null
}

interface Remembered {
  a1: number
  b1: number
  c1: number
  a2: number
  b2: number
  c2: number
  point: ThreePhasePoint | null
}

/** Scan compositions: dense at the ends, 0.02 apart in the middle. */
const SCAN = [1e-4, 1e-3, 0.005, 0.01, ...Array.from({ length: 25 }, (_, i) => 0.02 * (i + 1))]
const SCAN_ALL = [...new Set([...SCAN, ...SCAN.map((x) => 1 - x)])].sort((a, b) => a - b)

/**
 * The isobaric three-phase point at P (Pa), or null. Found by walking the single-liquid bubble curve until a
 * liquid lies inside a gap at its own bubble temperature, then solving T3 from there; `hint` (a temperature and
 * gap already known) skips the walk. Remembered per pressure for the model.
 */
export function threePhaseIsobaric(
  c: CompiledSystem,
  P: number,
  hint?: { T: number; gap: LiquidGap },
): ThreePhasePoint | null {
  if (!c.stab.canSplit) return null
  const memo = c.stab.threePhaseByP
  let entries = memo.get(P) as Remembered[] | undefined
  const v1 = c.vp1
  const v2 = c.vp2
  const hit = entries?.find(
    (e) => e.a1 === v1.a && e.b1 === v1.b && e.c1 === v1.c && e.a2 === v2.a && e.b2 === v2.b && e.c2 === v2.c,
  )
  if (hit && (hit.point !== null || !hint)) return hit.point
  let start = hint ?? null
  if (!start) {
    const lnP = Math.log(P)
    for (const x of SCAN_ALL) {
      if (!solveBubbleT(c.act, c.vp1, c.vp2, lnP, x, startTemperature(c.vp1, c.vp2, lnP, x))) continue
      const T = res[0]
      if (!c.stab.maySplit(T)) continue
      const gap = gapContaining(c.stab.gaps(T), x)
      if (gap) {
        start = { T, gap }
        break
      }
    }
  }
  const found = start ? solveThreePhaseT(c, P, start.T, start.gap) : null
  if (memo.size > 64) memo.clear()
  if (!entries || entries.length > 8) memo.set(P, (entries = []))
  if (hit) hit.point = found
  else entries.push({ a1: v1.a, b1: v1.b, c1: v1.c, a2: v2.a, b2: v2.b, c2: v2.c, point: found })
  return found
}

/**
 * The binodal (liquid–liquid envelope) below an isobaric three-phase point: the two liquids' x1 at 41
 * temperatures from `fromT` (K) up to the three-phase temperature, T ascending. Where the gap cannot be
 * followed (it closes, or the solver loses it) the envelope starts above that temperature.
 */
export function binodalBelow(
  c: CompiledSystem,
  tp: ThreePhasePoint,
  fromT: number,
): { T: number[]; x1I: number[]; x1II: number[] } {
  const T: number[] = [tp.T]
  const x1I: number[] = [tp.xI]
  const x1II: number[] = [tp.xII]
  const low = Math.max(fromT, 1, -c.vp1.c, -c.vp2.c)
  let gap: LiquidGap = { xI: tp.xI, xII: tp.xII }
  for (let i = 1; i <= 40 && low < tp.T; i++) {
    const t = tp.T - ((tp.T - low) * i) / 40
    const next = gapNear(c, t, gap)
    if (!next) break
    gap = next
    T.unshift(t)
    x1I.unshift(gap.xI)
    x1II.unshift(gap.xII)
  }
  return { T, x1I, x1II }
}
