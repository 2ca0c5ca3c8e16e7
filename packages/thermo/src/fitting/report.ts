import type { BinarySystem } from '../types.js'
import { DEFAULT_SIGMA_P, DEFAULT_SIGMA_T, DEFAULT_SIGMA_Y, type BinaryPoint } from './fit-input.js'
import type { PointResidual } from './fit-binary.js'
import { isIsothermal, perturbedModels, type FitData } from './objectives.js'
import { point, pointSensitivities, solvePoint } from './model-point.js'
import type { ParameterLayout } from './parameters.js'
import type { FitStatistics } from './statistics.js'

const FLAG_LIMIT = 3

/**
 * Residuals of every point, measured − calculated (dT = T_meas − T_calc, or in an isothermal fit dP = P_meas − P_calc
 * in Pa; dy = y_meas − y_calc, null when the point has no y), so a point measured too hot (or at too high a pressure)
 * has a positive residual (fitted, excluded and pure) under the fitted model. Fitted points get the externally
 * studentized residual of the fit; excluded mixture points get a prediction residual r/(s·√(1 + h)), so an excluded
 * point can still be seen to be an outlier.
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
  const sC = new Float64Array(m)
  const sY = new Float64Array(m)
  const ctxP = { vp1: data.vp1, vp2: data.vp2, gv: data.gv, isothermal: true }
  const ctxT = { vp1: data.vp1, vp2: data.vp2, gv: data.gv, isothermal: false }
  return points.map((pt, i) => {
    const k = row.get(i)
    // Each point's kind: its own flag (a joint fit over isobaric and isothermal data sets), else the fit's.
    const iso = k !== undefined ? isIsothermal(data, k) : (pt.isothermal ?? data.isothermal)
    const ctx = iso ? ctxP : ctxT
    const hasY = pt.y1 !== null
    // Fitted points of the bubble objectives already have their deviations in r (weighted), as
    // calculated − measured; reported residuals are measured − calculated, hence the minus signs.
    const known = bubbleObjective && k !== undefined
    const ok = known || solvePoint(act, ctx, pt.x1, pt.T, Math.log(pt.P), pt.T)
    const measured = iso ? pt.P : pt.T
    const dCalc = known ? -r[data.rowOf[k]] / (iso ? data.wP[k] : data.wT[k]) : ok ? measured - point[0] : NaN
    const dy = !hasY ? null : known ? -r[data.rowOf[k] + 1] / data.wY[k] : ok ? pt.y1! - point[1] : NaN
    const out: PointResidual = {
      dT: iso ? null : dCalc,
      ...(iso ? { dP: dCalc } : {}),
      dy,
      studentized: NaN,
      leverage: NaN,
      flagged: false,
      excluded: pt.excluded === true,
    }
    if (k !== undefined && bubbleObjective) {
      // stats follow the objective's rows (calculated − measured): flip to measured − calculated.
      const first = data.rowOf[k]
      const a = -stats.studentized[first]
      const b = hasY ? -stats.studentized[first + 1] : 0
      out.studentized = Math.abs(a) >= Math.abs(b) ? a : b
      out.leverage = stats.leverage[first] + (hasY ? stats.leverage[first + 1] : 0)
    } else if (k !== undefined) {
      // activity objective: two ln γ rows per point
      const a = -stats.studentized[2 * k]
      const b = -stats.studentized[2 * k + 1]
      out.studentized = Math.abs(a) >= Math.abs(b) ? a : b
      out.leverage = stats.leverage[2 * k] + stats.leverage[2 * k + 1]
    } else if (ok && bubbleObjective && pt.x1 > 0 && pt.x1 < 1 && stats.inverse) {
      pointSensitivities(act, ctx, pt.x1, pm, sC, sY)
      const wC = 1 / (iso ? (pt.sigmaP ?? DEFAULT_SIGMA_P) : (pt.sigmaT ?? DEFAULT_SIGMA_T))
      const wY = 1 / (pt.sigmaY ?? DEFAULT_SIGMA_Y)
      const hC = quad(stats.inverse, sC, m) * wC * wC
      const hY = hasY ? quad(stats.inverse, sY, m) * wY * wY : 0
      const s = Math.sqrt(stats.s2)
      const a = (dCalc * wC) / (s * Math.sqrt(1 + hC))
      const b = dy === null ? 0 : (dy * wY) / (s * Math.sqrt(1 + hY))
      out.studentized = Math.abs(a) >= Math.abs(b) ? a : b
      out.leverage = hC + hY
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

/**
 * RMS, mean absolute and largest absolute deviations over the fitted points: T (K) and y1, and for an isothermal
 * fit (or one with isothermal points) P (Pa). A statistic with no values (dT of an isothermal fit, dy without y) is NaN.
 */
export function summarise(residuals: PointResidual[], index: number[], isothermal = false) {
  const values = (f: (r: PointResidual) => number | null | undefined) =>
    index.map((i) => f(residuals[i])).filter((v): v is number => typeof v === 'number')
  const dT = values((r) => r.dT)
  const dy = values((r) => r.dy)
  const rms = (v: number[]) => (v.length ? Math.sqrt(v.reduce((s, x) => s + x * x, 0) / v.length) : NaN)
  const aad = (v: number[]) => (v.length ? v.reduce((s, x) => s + Math.abs(x), 0) / v.length : NaN)
  const max = (v: number[]) => (v.length ? v.reduce((s, x) => Math.max(s, Math.abs(x)), 0) : NaN)
  const out = { rmsT: rms(dT), rmsY: rms(dy), aadT: aad(dT), aadY: aad(dy), maxAbsT: max(dT), maxAbsY: max(dy) }
  const dP = values((r) => r.dP)
  if (!isothermal && dP.length === 0) return out
  return { ...out, rmsP: rms(dP), aadP: aad(dP), maxAbsP: max(dP) }
}
