/**
 * Points where the analyst saw two liquid layers (`heterogeneous: true`, x1 the overall composition): the
 * model's counterpart is its three-phase point at the point's pressure — temperature T3 and vapour y3 —
 * whatever the overall composition on the tie line. T3 is re-solved warm from the last solution of the same
 * row; its parameter sensitivities are forward differences over the perturbed models (a few extra three-phase
 * solves per heterogeneous row, none for the others).
 */
import { res } from '../equilibrium/kernel.js'
import { solveGap } from '../equilibrium/lle.js'
import { stabilityOf } from '../equilibrium/stability.js'
import type { CompiledSystem } from '../equilibrium/system.js'
import { solveThreePhaseT, threePhaseIsobaric, type ThreePhasePoint } from '../equilibrium/three-phase.js'
import type { ActivityModel } from '../types.js'
import type { FitData } from './objectives.js'

/** Last three-phase solution of a row: T in K and the two liquids. */
export interface ThreePhaseMemo {
  T: number
  xI: number
  xII: number
}

const logit = (x: number) => Math.log(x / (1 - x))

function threePhaseOf(
  model: ActivityModel,
  d: FitData,
  i: number,
  memo: ThreePhaseMemo | null,
): ThreePhasePoint | null {
  const c = { act: model, vp1: d.vp1, vp2: d.vp2, stab: stabilityOf(model) } as CompiledSystem
  const P = Math.exp(d.lnP[i])
  if (memo) {
    const gap = solveGap(model, memo.T, logit(memo.xI), logit(memo.xII))
    const tp = gap ? solveThreePhaseT(c, P, memo.T, gap) : null
    if (tp) return tp
  }
  return threePhaseIsobaric(c, P)
}

/**
 * Three-phase T3 and y3 of `model` at row i's pressure into res[0], res[1] (memo updated).
 * @returns false when the model predicts no three-phase point at that pressure.
 */
export function threePhaseRow(model: ActivityModel, d: FitData, i: number, memo: (ThreePhaseMemo | null)[]): boolean {
  const tp = threePhaseOf(model, d, i, memo[i])
  if (!tp) return false
  memo[i] = { T: tp.T, xI: tp.xI, xII: tp.xII }
  res[0] = tp.T
  res[1] = tp.y1
  return true
}

/**
 * dT3/dθj and dy3/dθj by forward differences over the perturbed models; T3, y3 = base values.
 * @returns false when a perturbed model loses the three-phase point.
 */
export function threePhaseSensitivities(
  pm: { models: ActivityModel[]; steps: number[] },
  d: FitData,
  i: number,
  memo: ThreePhaseMemo | null,
  T3: number,
  y3: number,
  dT: Float64Array,
  dy: Float64Array,
): boolean {
  for (let j = 0; j < pm.steps.length; j++) {
    const tp = threePhaseOf(pm.models[j], d, i, memo)
    if (!tp) return false
    dT[j] = (tp.T - T3) / pm.steps[j]
    dy[j] = (tp.y1 - y3) / pm.steps[j]
  }
  return true
}
