import { checkPressure, checkTemperature, ThermoError } from '../errors.js'
import { res, solveBubbleT, startTemperature } from '../equilibrium/kernel.js'
import { compileSystem } from '../equilibrium/system.js'
import type { FitBinaryResult } from './fit-binary.js'
import { bubbleSensitivities, perturbedModels } from './objectives.js'
import { parameterLayout } from './parameters.js'
import { point, pointSensitivities, solvePoint } from './model-point.js'

/** The fitted model compiled for sensitivities: the system, the free parameters and the models at θ + h·e_j. */
function fittedModel(fit: FitBinaryResult) {
  const s = fit.settings
  const layout = parameterLayout(s.model, {
    V1: s.V1,
    V2: s.V2,
    uniquac: s.uniquac,
    temperatureDependent: s.temperatureDependent,
    alpha: s.alpha,
    fitAlpha: s.fitAlpha,
  })
  // A parameter held at its bound (NRTL α) is part of the layout's fixed settings, not of p.
  const p = Float64Array.from(
    fit.parameters.filter((q) => !q.atBound),
    (q) => q.value,
  )
  return { c: compileSystem(fit.system), pm: perturbedModels(layout, p), m: p.length }
}

/** n liquid compositions on a cosine grid from 0 to 1 (denser at the ends), for a band. */
function bandGrid(n: number): number[] {
  checkCount('band points', n, 3, 1001)
  return Array.from({ length: n }, (_, i) => (i === n - 1 ? 1 : 0.5 * (1 - Math.cos((Math.PI * i) / (n - 1)))))
}

/** The band's warning when the covariance cannot be used. */
function covarianceWarnings(fit: FitBinaryResult): string[] {
  return fit.covariance.flat().every(Number.isFinite)
    ? []
    : ['The fit has no usable covariance, so the band cannot be drawn.']
}

/** Bubble points and their parameter sensitivities along a list of liquid compositions at P (Pa). */
export function sensitivities(fit: FitBinaryResult, P: number, xs: number[]) {
  const { c, pm, m } = fittedModel(fit)
  const dlng = new Float64Array(2 * m)
  const lnP = Math.log(P)
  let T = NaN
  const ctx = { vp1: c.vp1, vp2: c.vp2, gv: c.gv, isothermal: false }
  return xs.map((x1) => {
    if (c.gv) {
      // Virial vapour: γ–φ bubble points and their implicit sensitivities (model-point.ts).
      if (!solvePoint(c.act, ctx, x1, NaN, lnP, Number.isFinite(T) ? T : startTemperature(c.vp1, c.vp2, lnP, x1))) {
        throw new ThermoError(
          'no-convergence',
          `No bubble point at x1 = ${x1.toFixed(4)} and ${P} Pa with the fitted parameters.`,
        )
      }
      T = point[0]
      const gT = new Float64Array(m)
      const gY = new Float64Array(m)
      pointSensitivities(c.act, ctx, x1, pm, gT, gY)
      return { x1, T, y1: point[1], gT, gY }
    }
    if (!solveBubbleT(c.act, c.vp1, c.vp2, lnP, x1, Number.isFinite(T) ? T : startTemperature(c.vp1, c.vp2, lnP, x1))) {
      throw new ThermoError(
        'no-convergence',
        `No bubble point at x1 = ${x1.toFixed(4)} and ${P} Pa with the fitted parameters.`,
      )
    }
    T = res[0]
    const y1 = res[1]
    const gT = new Float64Array(m)
    const gY = new Float64Array(m)
    bubbleSensitivities(c.act, c, x1, pm, dlng, gT, gY)
    return { x1, T, y1, gT, gY }
  })
}

export function variance(cov: number[][], g: Float64Array): number {
  let v = 0
  for (let i = 0; i < g.length; i++) for (let j = 0; j < g.length; j++) v += g[i] * cov[i][j] * g[j]
  return Math.max(v, 0)
}

export function checkCount(name: string, n: number, lo: number, hi: number): void {
  if (!Number.isInteger(n) || n < lo || n > hi) {
    throw new ThermoError(
      'invalid-input',
      `The number of ${name} must be a whole number from ${lo} to ${hi}; got ${n}.`,
    )
  }
}

/** A fitted T–x–y curve with its ±2σ confidence band. */
export interface PredictionBand {
  P: number
  x1: number[]
  T: number[]
  y1: number[]
  sigmaT: number[]
  sigmaY: number[]
  Tlow: number[]
  Thigh: number[]
  ylow: number[]
  yhigh: number[]
  warnings: string[]
}

/**
 * One predicted quantity along the grid with σ = √(gᵀ·C·g) from its sensitivities g and the fit's covariance C, and
 * its ±2σ limits, clipped to [lo, hi] (0–1 for a mole fraction).
 */
function twoSigma(fit: FitBinaryResult, value: number[], g: Float64Array[], lo = -Infinity, hi = Infinity) {
  const sigma = g.map((gi) => Math.sqrt(variance(fit.covariance, gi)))
  return {
    value,
    sigma,
    low: value.map((v, i) => Math.max(lo, v - 2 * sigma[i])),
    high: value.map((v, i) => Math.min(hi, v + 2 * sigma[i])),
  }
}

/**
 * The fitted T–x–y curve at P (Pa) with a ±2σ band from the parameter covariance, by linear
 * propagation σ² = gᵀ·C·g with g = ∂(T or y1)/∂θ. It shows how sure the fit is of the curve
 * (a confidence band of the model), not the scatter of a single new measurement.
 * @param options points: compositions on a cosine grid from 0 to 1, default 51 (3–1001).
 */
export function predictionBand(fit: FitBinaryResult, options: { P: number; points?: number }): PredictionBand {
  checkPressure(options.P)
  const xs = bandGrid(options.points ?? 51)
  const rows = sensitivities(fit, options.P, xs)
  const t = twoSigma(
    fit,
    rows.map((r) => r.T),
    rows.map((r) => r.gT),
  )
  const y = twoSigma(
    fit,
    rows.map((r) => r.y1),
    rows.map((r) => r.gY),
    0,
    1,
  )
  return {
    P: options.P,
    x1: xs,
    T: t.value,
    y1: y.value,
    sigmaT: t.sigma,
    sigmaY: y.sigma,
    Tlow: t.low,
    Thigh: t.high,
    ylow: y.low,
    yhigh: y.high,
    warnings: covarianceWarnings(fit),
  }
}

/** A fitted P–x–y curve at one temperature with its ±2σ confidence band (pressures in Pa). */
export interface PredictionBandIsothermal {
  T: number
  x1: number[]
  P: number[]
  y1: number[]
  sigmaP: number[]
  sigmaY: number[]
  Plow: number[]
  Phigh: number[]
  ylow: number[]
  yhigh: number[]
  warnings: string[]
}

/**
 * The fitted P–x–y curve at T (K) with a ±2σ band from the parameter covariance, by the same linear propagation as
 * {@link predictionBand} with g = ∂(P or y1)/∂θ at each bubble pressure (the implicit sensitivities the isothermal
 * fits use, under the fit's own vapour). For isothermal data, where the fit was made on pressures.
 * @param options points: compositions on a cosine grid from 0 to 1, default 51 (3–1001).
 */
export function predictionBandIsothermal(
  fit: FitBinaryResult,
  options: { T: number; points?: number },
): PredictionBandIsothermal {
  const T = options.T
  checkTemperature(T)
  const xs = bandGrid(options.points ?? 51)
  const { c, pm, m } = fittedModel(fit)
  const ctx = { vp1: c.vp1, vp2: c.vp2, gv: c.gv, isothermal: true }
  const rows = xs.map((x1) => {
    if (!solvePoint(c.act, ctx, x1, T, NaN, T)) {
      throw new ThermoError(
        'no-convergence',
        `No bubble pressure at x1 = ${x1.toFixed(4)} and ${T} K with the fitted parameters.`,
      )
    }
    const P = point[0]
    const y1 = point[1]
    const gP = new Float64Array(m)
    const gY = new Float64Array(m)
    pointSensitivities(c.act, ctx, x1, pm, gP, gY)
    return { P, y1, gP, gY }
  })
  const p = twoSigma(
    fit,
    rows.map((r) => r.P),
    rows.map((r) => r.gP),
  )
  const y = twoSigma(
    fit,
    rows.map((r) => r.y1),
    rows.map((r) => r.gY),
    0,
    1,
  )
  return {
    T,
    x1: xs,
    P: p.value,
    y1: y.value,
    sigmaP: p.sigma,
    sigmaY: y.sigma,
    Plow: p.low,
    Phigh: p.high,
    ylow: y.low,
    yhigh: y.high,
    warnings: covarianceWarnings(fit),
  }
}
