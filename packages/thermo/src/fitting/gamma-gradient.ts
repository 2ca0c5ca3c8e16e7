/**
 * Parameter derivatives of ln γ for the fits' Jacobians: the layout's analytic gradient where it has one (NRTL with α
 * held), else forward differences over models built at p + h·e_j, h = 1e-6·max(|pj|, scale j).
 */
import { lnGammaT } from '../activity/kernel.js'
import type { ActivityModel } from '../types.js'
import type { ParameterLayout } from './parameters.js'

const g = new Float64Array(4)

/** The parameter derivatives of ln γ at p: analytic where the layout has them, else models at p + h·e_j. */
export interface Perturbed {
  base: ActivityModel
  models: ActivityModel[]
  steps: number[]
  /** The layout's analytic gradient, when it has one (then models are built only for the three-phase rows). */
  gradient?: (model: ActivityModel, x1: number, T: number, out: Float64Array) => void
}

/**
 * Models at p + h·e_j for forward differences in the parameters, with their steps h (and the analytic gradient).
 * With `needModels` false and an analytic gradient, the perturbed models are not built (only three-phase rows,
 * which difference whole three-phase solves, need them).
 */
export function perturbedModels(layout: ParameterLayout, p: Float64Array, needModels = true): Perturbed {
  const models: ActivityModel[] = []
  const steps: number[] = []
  const build = needModels || !layout.gradient
  const q = Float64Array.from(p)
  for (let j = 0; j < p.length; j++) {
    const h = 1e-6 * Math.max(Math.abs(p[j]), layout.scales[j])
    if (build) {
      q[j] = p[j] + h
      models.push(layout.build(q))
      q[j] = p[j]
    }
    steps.push(h)
  }
  return { base: layout.build(p), models, steps, ...(layout.gradient ? { gradient: layout.gradient } : {}) }
}

/** ∂ln γ1/∂θj and ∂ln γ2/∂θj at (x1, T) into out[2j], out[2j+1]; base = ln γ1, ln γ2 of the unperturbed model. */
export function lnGammaSensitivities(
  pm: Perturbed,
  x1: number,
  T: number,
  base1: number,
  base2: number,
  out: Float64Array,
): void {
  if (pm.gradient) return pm.gradient(pm.base, x1, T, out)
  for (let j = 0; j < pm.steps.length; j++) {
    lnGammaT(pm.models[j], x1, T, g)
    out[2 * j] = (g[0] - base1) / pm.steps[j]
    out[2 * j + 1] = (g[1] - base2) / pm.steps[j]
  }
}
