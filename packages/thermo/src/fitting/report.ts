import { res, solveBubbleT } from '../equilibrium/kernel.js'
import type { BinarySystem } from '../types.js'
import { DEFAULT_SIGMA_T, DEFAULT_SIGMA_Y, type BinaryPoint } from './fit-input.js'
import type { PointResidual } from './fit-binary.js'
import { bubbleSensitivities, perturbedModels, type FitData } from './objectives.js'
import type { ParameterLayout } from './parameters.js'
import type { FitStatistics } from './statistics.js'

const FLAG_LIMIT = 3

/**
 * Residuals of every point, measured − calculated (dT = T_meas − T_calc, dy = y_meas − y_calc), so a
 * point measured too hot has a positive dT (fitted, excluded and pure) under the fitted model. Fitted points get the
 * externally studentized residual of the fit; excluded mixture points get a prediction residual
 * r/(s·√(1 + h)), so an excluded point can still be seen to be an outlier.
 */
export function pointResiduals(
  points: BinaryPoint[],
  system: BinarySystem,
  data: FitData,
  index: number[],
  stats: FitStatistics,
  r: Float64Array,
  bubbleObjective: boolean,
  layout: ParameterLayout,
  p: Float64Array,
): PointResidual[] {
  const m = p.length
  const row = new Map(index.map((pointIndex, k) => [pointIndex, k]))
  const act = system.activity
  const pm = perturbedModels(layout, p)
  const dlng = new Float64Array(2 * m)
  const sT = new Float64Array(m)
  const sY = new Float64Array(m)
  return points.map((pt, i) => {
    const k = row.get(i)
    // Fitted points of the bubble-point objective already have their deviations in r (weighted), as
    // calculated − measured; reported residuals are measured − calculated, hence the minus signs.
    const known = bubbleObjective && k !== undefined
    const ok = known || solveBubbleT(act, data.vp1, data.vp2, Math.log(pt.P), pt.x1, pt.T)
    const dT = known ? -r[2 * k] / data.wT[k] : ok ? pt.T - res[0] : NaN
    const dy = known ? -r[2 * k + 1] / data.wY[k] : ok ? pt.y1 - res[1] : NaN
    const out: PointResidual = {
      dT,
      dy,
      studentized: NaN,
      leverage: NaN,
      flagged: false,
      excluded: pt.excluded === true,
    }
    if (k !== undefined) {
      // stats follow the objective's rows (calculated − measured): flip to measured − calculated.
      const a = -stats.studentized[2 * k]
      const b = -stats.studentized[2 * k + 1]
      out.studentized = Math.abs(a) >= Math.abs(b) ? a : b
      out.leverage = stats.leverage[2 * k] + stats.leverage[2 * k + 1]
    } else if (ok && bubbleObjective && pt.x1 > 0 && pt.x1 < 1 && stats.inverse) {
      bubbleSensitivities(act, data, pt.x1, pm, dlng, sT, sY)
      const wT = 1 / (pt.sigmaT ?? DEFAULT_SIGMA_T)
      const wY = 1 / (pt.sigmaY ?? DEFAULT_SIGMA_Y)
      const hT = quad(stats.inverse, sT, m) * wT * wT
      const hY = quad(stats.inverse, sY, m) * wY * wY
      const s = Math.sqrt(stats.s2)
      const a = (dT * wT) / (s * Math.sqrt(1 + hT))
      const b = (dy * wY) / (s * Math.sqrt(1 + hY))
      out.studentized = Math.abs(a) >= Math.abs(b) ? a : b
      out.leverage = hT + hY
    } else if (pt.x1 === 0 || pt.x1 === 1) {
      out.leverage = 0
    }
    out.flagged = Math.abs(out.studentized) > FLAG_LIMIT
    return out
  })
}

function quad(M: Float64Array, v: Float64Array, m: number): number {
  let s = 0
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) s += v[i] * M[i * m + j] * v[j]
  return s
}

/** RMS, mean absolute and largest absolute deviations of T (K) and y1 over the fitted points. */
export function summarise(residuals: PointResidual[], index: number[]) {
  const dT = index.map((i) => residuals[i].dT)
  const dy = index.map((i) => residuals[i].dy)
  const rms = (v: number[]) => Math.sqrt(v.reduce((s, x) => s + x * x, 0) / v.length)
  const aad = (v: number[]) => v.reduce((s, x) => s + Math.abs(x), 0) / v.length
  const max = (v: number[]) => v.reduce((s, x) => Math.max(s, Math.abs(x)), 0)
  return { rmsT: rms(dT), rmsY: rms(dy), aadT: aad(dT), aadY: aad(dy), maxAbsT: max(dT), maxAbsY: max(dy) }
}
