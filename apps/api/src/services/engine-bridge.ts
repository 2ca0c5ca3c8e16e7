/**
 * The fitting and consistency functions of @ebullio/thermo (part 1), typed here by the names and shapes
 * agreed for the engine. They are looked up at call time, so the API works (and says so clearly) while
 * the engine's fitting module is still being written. No mathematics here: only the call.
 */
import * as engine from '@ebullio/thermo'
import type { ActivityModel, VaporPressureModel } from '@ebullio/thermo'
import { AppError } from '../errors/index.js'

export type FitModelName = 'margules' | 'van-laar' | 'wilson' | 'nrtl'

export interface FitPointInput {
  T: number
  P: number
  x1: number
  y1: number
  sigmaT?: number
  sigmaY?: number
  excluded?: boolean
}

export interface FitBinaryOptions {
  points: FitPointInput[]
  vaporPressure: [VaporPressureModel, VaporPressureModel]
  model: FitModelName
  V1?: number
  V2?: number
  alpha?: number
  fitAlpha?: boolean
  objective?: 'bubble-point' | 'activity'
}

export interface FitBinaryResult {
  activity: ActivityModel
  parameters: { name: string; value: number; standardError: number }[]
  covariance: number[][]
  correlation: number[][]
  converged: boolean
  iterations: number
  objective: number
  rmsT: number
  rmsY: number
  aadT: number
  aadY: number
  maxAbsT: number
  maxAbsY: number
  aic: number
  residuals: { dT: number; dy: number; studentized: number; leverage: number; flagged: boolean }[]
  warnings: string[]
}

export interface ConsistencyPoint {
  T: number
  P: number
  x1: number
  y1: number
}

type Fn<A extends unknown[], R> = (...args: A) => R

function lookup<A extends unknown[], R>(name: string): Fn<A, R> {
  const fn = (engine as Record<string, unknown>)[name]
  if (typeof fn !== 'function') {
    throw new AppError(503, 'engine_unavailable', `The computation "${name}" is not available in this build of the engine yet.`)
  }
  return fn as Fn<A, R>
}

/** thermo's fitBinary: bubble-point (default) or activity objective, multi-start Levenberg–Marquardt. */
export const fitBinary = (o: FitBinaryOptions): FitBinaryResult => lookup<[FitBinaryOptions], FitBinaryResult>('fitBinary')(o)

/** thermo's Herington area test (D − J < 10 passes). */
export const heringtonAreaTest = (points: ConsistencyPoint[], o: { vaporPressure: [VaporPressureModel, VaporPressureModel] }) =>
  lookup<[ConsistencyPoint[], typeof o], { D: number; J: number; passed: boolean } & Record<string, unknown>>('heringtonAreaTest')(points, o)

/** thermo's Van Ness–Byer–Gibbs point test (mean |Δy| < 0.01 passes). */
export const pointTest = (points: ConsistencyPoint[], o: { vaporPressure: [VaporPressureModel, VaporPressureModel]; model: FitModelName | ActivityModel; V1?: number; V2?: number }) =>
  lookup<[ConsistencyPoint[], typeof o], { meanAbsDeltaY: number; passed: boolean } & Record<string, unknown>>('pointTest')(points, o)
