/**
 * The model's counterpart of one measured point in any of the four cases a fit can meet: isobaric (bubble
 * temperature at the point's x1 and P) or isothermal (bubble pressure at its x1 and T), under an ideal vapour or a
 * virial vapour (γ–φ). Parameter sensitivities by the implicit-function theorem on the two equilibrium equations
 * Hi = yi·Φi(T, P, y)·P − xi·γi(T; θ)·Pi_sat(T) = 0 in the unknowns (u, y1), u = T (isobaric) or ln P (isothermal):
 * divided by P·Φi they read [yi·ai, ±1 + yi·bi]·[du, dy1] = yi·∂ln γi/∂θ, with ai = ∂ln Φi/∂T − ∂ln γi/∂T −
 * d ln Pi_sat/dT (isobaric) or 1 + ∂ln Φi/∂ln P (isothermal) and bi = ∂ln Φi/∂y1 (0 for an ideal vapour, where this
 * reduces to the usual dT/dθ = −Σ yi·∂ln γi/∂θ / Σ yi·(∂ln γi/∂T + d ln Pi_sat/dT)).
 */
import { lnGammaT } from '../activity/kernel.js'
import { res, solveBubbleP, solveBubbleT } from '../equilibrium/kernel.js'
import type { ActivityModel } from '../types.js'
import type { LnPsat } from '../vapor-pressure/compiled.js'
import { lnGammaSensitivities, type Perturbed } from './gamma-gradient.js'
import { lnPhiDerivatives, solveBubblePGammaPhi, solveBubbleTGammaPhi, type CompiledVirial } from '../virial/kernel.js'

/** What a model point needs: the vapour pressures, the compiled virial vapour (null: ideal) and the kind of data. */
export interface PointContext {
  vp1: LnPsat
  vp2: LnPsat
  gv: CompiledVirial | null
  isothermal: boolean
}

/** The last solved model point: calc (T in K isobaric, P in Pa isothermal), y1, T, P. */
export const point = new Float64Array(4)

const phiBuf = new Float64Array(5)
const dphi = new Float64Array(6)
const g = new Float64Array(4)
let dlng = new Float64Array(8)

/**
 * Solve the model at liquid x1 and the point's fixed condition (lnP isobaric, T isothermal); T0 warm-starts an
 * isobaric solve. Writes {@link point}. @returns false when there is no solution.
 */
export function solvePoint(
  act: ActivityModel,
  ctx: PointContext,
  x1: number,
  T: number,
  lnP: number,
  T0: number,
): boolean {
  const { vp1, vp2, gv } = ctx
  let ok: boolean
  if (ctx.isothermal) {
    if (gv) ok = solveBubblePGammaPhi({ act, vp1, vp2 }, gv, T, x1, phiBuf)
    else {
      solveBubbleP(act, vp1, vp2, T, x1)
      ok = Number.isFinite(res[5]) && res[5] > 0
    }
    if (!ok) return false
    point[0] = res[5]
  } else {
    ok = gv
      ? solveBubbleTGammaPhi({ act, vp1, vp2 }, gv, lnP, x1, phiBuf, T0)
      : solveBubbleT(act, vp1, vp2, lnP, x1, T0)
    if (!ok) return false
    point[0] = res[0]
  }
  point[1] = res[1]
  point[2] = res[0]
  point[3] = res[5]
  return true
}

/**
 * d(calc)/dθj and dy1/dθj at the point just solved ({@link point}), into dCalc[j], dy[j]: calc in K (isobaric) or
 * Pa (isothermal). `pm` holds the models at θ + h·e_j.
 */
export function pointSensitivities(
  act: ActivityModel,
  ctx: PointContext,
  x1: number,
  pm: Perturbed,
  dCalc: Float64Array,
  dy: Float64Array,
): void {
  const T = point[2]
  const P = point[3]
  const y1 = point[1]
  const y2 = 1 - y1
  lnGammaT(act, x1, T, g)
  const base1 = g[0]
  const base2 = g[1]
  let a1: number
  let a2: number
  let b1 = 0
  let b2 = 0
  if (ctx.gv) lnPhiDerivatives(ctx, ctx.gv, T, P, y1, dphi)
  if (ctx.isothermal) {
    a1 = 1 + (ctx.gv ? dphi[4] : 0)
    a2 = 1 + (ctx.gv ? dphi[5] : 0)
  } else {
    const d1 = T + ctx.vp1.c
    const d2 = T + ctx.vp2.c
    a1 = (ctx.gv ? dphi[0] : 0) - g[2] - ctx.vp1.b / (d1 * d1)
    a2 = (ctx.gv ? dphi[1] : 0) - g[3] - ctx.vp2.b / (d2 * d2)
  }
  if (ctx.gv) {
    b1 = dphi[2]
    b2 = dphi[3]
  }
  const m11 = y1 * a1
  const m12 = 1 + y1 * b1
  const m21 = y2 * a2
  const m22 = -1 + y2 * b2
  const det = m11 * m22 - m12 * m21
  const scale = ctx.isothermal ? P : 1
  const mp = pm.steps.length
  if (dlng.length < 2 * mp) dlng = new Float64Array(2 * mp)
  lnGammaSensitivities(pm, x1, T, base1, base2, dlng)
  for (let j = 0; j < mp; j++) {
    const r1 = y1 * dlng[2 * j]
    const r2 = y2 * dlng[2 * j + 1]
    dCalc[j] = (scale * (r1 * m22 - m12 * r2)) / det
    dy[j] = (m11 * r2 - m21 * r1) / det
  }
}
