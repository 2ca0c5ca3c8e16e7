/**
 * Cheap answers to "can this liquid split at T?" for the solvers' hot path. A binary liquid can split at T
 * only where the thermodynamic factor Γ = 1 + x1·∂ln γ1/∂x1 is negative somewhere (a non-convex ΔG_mix has
 * a spinodal). Per activity model we remember, per 1 K band of temperature, whether the smallest Γ over x1
 * (grid plus a golden-section polish) stays above a margin at both edges of the band: then no liquid can
 * split there and the solvers skip every further check. Models that cannot split (ideal, Wilson) never pay;
 * Margules and Van Laar are temperature-independent here, so one answer serves every T.
 * The memory is keyed by the model object and re-checked against its numbers, so a model edited in place
 * is recomputed, not trusted.
 */
import { lnGammaT, nrtlDlnGamma1Dx1 } from '../activity/kernel.js'
import type { ActivityModel } from '../types.js'
import { LLE_GRID, liquidGaps, solveGap, type LiquidGap } from './lle.js'

/** Smallest Γ a band must keep to be declared single-liquid (dimensionless; a safety margin for the grid). */
const MARGIN = 0.02
const buf = new Float64Array(4)

function gammaFactor(act: ActivityModel, x: number, T: number): number {
  if (act.kind === 'nrtl') return 1 + x * nrtlDlnGamma1Dx1(act, x, T)
  const h = 1e-6 * Math.min(x, 1 - x, 1e-2) + 1e-12
  lnGammaT(act, x + h, T, buf)
  const up = buf[0]
  lnGammaT(act, x - h, T, buf)
  return 1 + (x * (up - buf[0])) / (2 * h)
}

/** Smallest thermodynamic factor over 0 < x1 < 1 at T (grid, then golden section around the lowest node). */
export function minimumThermodynamicFactor(act: ActivityModel, T: number): number {
  let best = Infinity
  let at = 0
  for (let i = 1; i < LLE_GRID.length - 1; i++) {
    const v = gammaFactor(act, LLE_GRID[i], T)
    if (v < best) [best, at] = [v, i]
  }
  let a = LLE_GRID[Math.max(0, at - 1)]
  let b = LLE_GRID[Math.min(LLE_GRID.length - 1, at + 1)]
  const r = (Math.sqrt(5) - 1) / 2
  for (let k = 0; k < 40 && b - a > 1e-9; k++) {
    const c = b - r * (b - a)
    const d = a + r * (b - a)
    if (gammaFactor(act, c, T) < gammaFactor(act, d, T)) b = d
    else a = c
  }
  return Math.min(best, gammaFactor(act, 0.5 * (a + b), T))
}

const COARSE = Array.from({ length: 63 }, (_, i) => 1 / (1 + Math.exp(-(-9 + (18 * (i + 1)) / 64))))

/** A quick lower look at Γ on 63 logit-spaced compositions (0.0001–0.9999): for screening only. */
export function coarseMinimumThermodynamicFactor(act: ActivityModel, T: number): number {
  let best = Infinity
  for (const x of COARSE) best = Math.min(best, gammaFactor(act, x, T))
  return best
}

/**
 * The smallest Γ on the coarse grid, polished by golden section between the lowest node's neighbours (in the logit
 * of x1): the exact local minimum there, so a value well above 0 proves that no liquid can split at T (a split needs
 * Γ < 0 somewhere) without the convex-hull search.
 */
export function polishedMinimumThermodynamicFactor(act: ActivityModel, T: number): number {
  let best = Infinity
  let at = 0
  for (let i = 0; i < COARSE.length; i++) {
    const v = gammaFactor(act, COARSE[i], T)
    if (v < best) [best, at] = [v, i]
  }
  const logit = (x: number) => Math.log(x / (1 - x))
  const f = (u: number) => gammaFactor(act, 1 / (1 + Math.exp(-u)), T)
  let a = logit(COARSE[Math.max(0, at - 1)])
  let b = logit(COARSE[Math.min(COARSE.length - 1, at + 1)])
  const r = (Math.sqrt(5) - 1) / 2
  let c = b - r * (b - a)
  let d = a + r * (b - a)
  let fc = f(c)
  let fd = f(d)
  for (let k = 0; k < 24; k++) {
    if (fc < fd) {
      b = d
      d = c
      fd = fc
      c = b - r * (b - a)
      fc = f(c)
    } else {
      a = c
      c = d
      fc = fd
      d = a + r * (b - a)
      fd = f(d)
    }
  }
  return Math.min(best, fc, fd)
}

function snapshot(act: ActivityModel): number[] {
  switch (act.kind) {
    case 'ideal':
      return []
    case 'margules':
    case 'van-laar':
      return [act.A12, act.A21]
    case 'wilson':
      return [act.a12, act.a21, act.V1, act.V2]
    case 'nrtl':
      return [act.b12, act.b21, act.alpha, act.b12T ?? 0, act.b21T ?? 0]
    case 'uniquac':
      return [act.a12, act.a21, act.r1, act.r2, act.q1, act.q2, act.a12T ?? 0, act.a21T ?? 0]
  }
}

/** Whether the model still has the numbers remembered (no allocation: this runs on every solver call). */
function same(act: ActivityModel, kind: string, v: number[]): boolean {
  if (act.kind !== kind) return false
  switch (act.kind) {
    case 'margules':
    case 'van-laar':
      return act.A12 === v[0] && act.A21 === v[1]
    case 'nrtl':
      return (
        act.b12 === v[0] &&
        act.b21 === v[1] &&
        act.alpha === v[2] &&
        (act.b12T ?? 0) === v[3] &&
        (act.b21T ?? 0) === v[4]
      )
    case 'uniquac':
      return (
        act.a12 === v[0] &&
        act.a21 === v[1] &&
        act.r1 === v[2] &&
        act.r2 === v[3] &&
        act.q1 === v[4] &&
        act.q2 === v[5] &&
        (act.a12T ?? 0) === v[6] &&
        (act.a21T ?? 0) === v[7]
      )
    default:
      return true
  }
}

/** What is remembered about one activity model. */
export class LiquidStability {
  readonly kind: string
  readonly values: number[]
  /** false: the model can never split (ideal, Wilson). */
  readonly canSplit: boolean
  /** The model's Γ does not depend on T (Margules, Van Laar). */
  readonly isothermalModel: boolean
  private readonly bands = new Map<number, boolean>()
  private lastT = NaN
  private lastGaps: LiquidGap[] = []
  /** Three-phase points already found, by pressure (Pa); see three-phase.ts. */
  readonly threePhaseByP = new Map<number, unknown>()

  constructor(readonly act: ActivityModel) {
    this.kind = act.kind
    this.values = snapshot(act)
    this.canSplit = act.kind !== 'ideal' && act.kind !== 'wilson'
    this.isothermalModel = act.kind === 'margules' || act.kind === 'van-laar'
  }

  /** False when no liquid can split at T (K): the caller may skip the stability check. */
  maySplit(T: number): boolean {
    if (!this.canSplit) return false
    const band = this.isothermalModel ? 0 : Math.floor(T)
    let unsafe = this.bands.get(band)
    if (unsafe === undefined) {
      const t0 = this.isothermalModel ? 300 : band
      unsafe =
        minimumThermodynamicFactor(this.act, t0) < MARGIN ||
        (!this.isothermalModel && minimumThermodynamicFactor(this.act, t0 + 1) < MARGIN)
      if (this.bands.size > 4096) this.bands.clear()
      this.bands.set(band, unsafe)
    }
    return unsafe
  }

  /**
   * Every two-liquid gap at T (K), remembered for the last temperature asked (and forever for Margules/Van Laar).
   * Within 2 K of a temperature where the full search found exactly one gap, that gap is continued by Newton
   * from its compositions instead of searched afresh (the grid and hull cost ~20× more); a second gap appearing
   * within those 2 K is assumed absent.
   */
  gaps(T: number): LiquidGap[] {
    if (!this.canSplit) return []
    const key = this.isothermalModel ? 0 : T
    if (key === this.lastT) return this.lastGaps
    let gaps: LiquidGap[] | null = null
    if (!this.maySplit(T)) gaps = []
    else if (!this.isothermalModel && this.anchorGaps.length === 1 && Math.abs(T - this.anchorT) <= 2) {
      const a = this.anchorGaps[0]
      const g = solveGap(this.act, T, Math.log(a.xI / (1 - a.xI)), Math.log(a.xII / (1 - a.xII)))
      if (g && Math.abs(g.xI - a.xI) < 0.05 && Math.abs(g.xII - a.xII) < 0.05) gaps = [g]
    }
    if (!gaps) {
      gaps = liquidGaps(this.act, this.isothermalModel ? 300 : T)
      this.anchorT = T
      this.anchorGaps = gaps
    }
    this.lastT = key
    this.lastGaps = gaps
    return gaps
  }
  private anchorT = NaN
  private anchorGaps: LiquidGap[] = []
}

const memory = new WeakMap<object, LiquidStability>()

/** Ideal and Wilson liquids never split: one shared answer, no memory needed. */
const NEVER = new LiquidStability({ kind: 'ideal' })

/** The remembered stability facts of an activity model (created on first use). */
export function stabilityOf(act: ActivityModel): LiquidStability {
  if (act.kind === 'ideal' || act.kind === 'wilson') return NEVER
  const known = memory.get(act)
  if (known && same(act, known.kind, known.values)) return known
  const fresh = new LiquidStability(act)
  memory.set(act, fresh)
  return fresh
}
