/**
 * The Rayleigh balance shared by both stills: d(L·x)/dL = xD(x), written with τ = ln(L0/L) as
 * dx/dτ = −(xD(x) − x), which moves the pot composition monotonically towards a fixed point and never overshoots.
 */
import { ThermoError } from '../errors.js'
import type { EquilibriumCurve } from '../columns/equilibrium-curve.js'
import type { BatchCharge, BatchEndState, BatchFrame, BatchIntegration, BatchUntil } from './batch-types.js'
import { ABS_TOL, integrate, REL_TOL, valueAt, type AcceptedStep, type OdeStats } from './ode.js'

/** Largest τ = ln(L0/L) the still runs to: 1e-12 of the charge left. */
const TAU_MAX = Math.log(1e12)

function describe(v: unknown): string {
  return typeof v === 'number' ? String(v) : (JSON.stringify(v) ?? String(v))
}

/** Check the charge: positive moles, x1 strictly inside (0, 1). */
export function checkCharge(charge: BatchCharge): void {
  if (!charge || typeof charge.moles !== 'number' || !Number.isFinite(charge.moles) || charge.moles <= 0) {
    throw new ThermoError(
      'invalid-input',
      `charge.moles must be a positive number of moles; got ${describe(charge?.moles)}.`,
    )
  }
  if (typeof charge.x1 !== 'number' || !Number.isFinite(charge.x1) || charge.x1 <= 0 || charge.x1 >= 1) {
    throw new ThermoError(
      'invalid-input',
      `charge.x1 must be a mole fraction strictly between 0 and 1; got ${describe(charge.x1)}.`,
    )
  }
}

/** Check the frame count: a whole number from 2 to 5000. */
export function checkFrames(frames: number): void {
  if (!Number.isInteger(frames) || frames < 2 || frames > 5000)
    throw new ThermoError('invalid-input', `frames must be a whole number from 2 to 5000; got ${describe(frames)}.`)
}

/** Where the pot composition heads: the nearest fixed point of xD(x) = x in the direction it moves. */
function potLimit(curve: EquilibriumCurve, x0: number, falling: boolean): { x: number; what: string } {
  if (falling) {
    const az = curve.azeotropes.filter((a) => a < x0).at(-1)
    return az === undefined
      ? { x: 0, what: 'pure component 2 (x1 = 0)' }
      : { x: az, what: `the azeotrope at x1 = ${az.toFixed(4)}` }
  }
  const az = curve.azeotropes.find((a) => a > x0)
  return az === undefined
    ? { x: 1, what: 'pure component 1 (x1 = 1)' }
    : { x: az, what: `the azeotrope at x1 = ${az.toFixed(4)}` }
}

/** Translate `until` into a fixed τ or a stopping test. */
function stopRule(
  until: BatchUntil,
  charge: BatchCharge,
  curve: EquilibriumCurve,
  falling: boolean,
): { tau?: number; stop?: (tau: number, x: number) => boolean } {
  const keys = until && typeof until === 'object' ? Object.keys(until) : []
  if (keys.length !== 1)
    throw new ThermoError(
      'invalid-input',
      'Give exactly one stopping condition in until: potMoles, potX1, distillateMoles or recovery1.',
    )
  const u = until as Record<string, number>
  const v = u[keys[0]]
  const inside = (lo: number, hi: number) => typeof v === 'number' && Number.isFinite(v) && v > lo && v < hi
  switch (keys[0]) {
    case 'potMoles':
    case 'distillateMoles':
      if (!inside(0, charge.moles))
        throw new ThermoError(
          'invalid-input',
          `until.${keys[0]} must lie strictly between 0 and the charge (${charge.moles} mol); got ${describe(v)}.`,
        )
      return { tau: Math.log(charge.moles / (keys[0] === 'potMoles' ? v : charge.moles - v)) }
    case 'recovery1':
      if (!inside(0, 1))
        throw new ThermoError('invalid-input', `until.recovery1 must lie strictly between 0 and 1; got ${describe(v)}.`)
      return { stop: (tau, x) => 1 - (Math.exp(-tau) * x) / charge.x1 >= v }
    case 'potX1': {
      const limit = potLimit(curve, charge.x1, falling)
      const between = falling ? v < charge.x1 && v > limit.x : v > charge.x1 && v < limit.x
      if (typeof v !== 'number' || !between) {
        throw new ThermoError(
          'unreachable-pot-composition',
          `The pot cannot reach x1 = ${describe(v)}: starting from ${charge.x1} it moves towards ${limit.what}.`,
          { limit: limit.x },
        )
      }
      return { stop: falling ? (_t, x) => x <= v : (_t, x) => x >= v }
    }
    default:
      throw new ThermoError(
        'invalid-input',
        `Unknown stopping condition '${keys[0]}'; use potMoles, potX1, distillateMoles or recovery1.`,
      )
  }
}

/** Everything a still run returns besides its assumptions. */
export interface RayleighRun {
  frames: (BatchFrame & { tau: number })[]
  end: BatchEndState
  integration: BatchIntegration
}

/**
 * Integrate the pot from the charge to the stopping condition, then again to emit `frameCount` frames evenly
 * spaced in distilled fraction. `distillate(x)` is the instantaneous distillate composition for pot liquid x.
 */
export function runRayleigh(
  curve: EquilibriumCurve,
  distillate: (x: number) => number,
  charge: BatchCharge,
  until: BatchUntil,
  frameCount: number,
): RayleighRun {
  const y0 = distillate(charge.x1)
  const falling = y0 > charge.x1
  const rule = stopRule(until, charge, curve, falling)
  const f = (x: number) => -(distillate(x) - x)
  const stats: OdeStats = { steps: 0, rejected: 0 }
  const trace: AcceptedStep[] = []
  const finish = integrate(f, charge.x1, rule.tau ?? TAU_MAX, stats, trace, rule.stop)
  const endTau = finish.tau
  const endFraction = 1 - Math.exp(-endTau)
  const taus = Array.from({ length: frameCount }, (_, k) =>
    k === frameCount - 1 ? endTau : -Math.log(1 - (endFraction * k) / (frameCount - 1)),
  )
  const frames = taus.map((tau, k) => {
    const x = k === 0 ? charge.x1 : k === frameCount - 1 ? finish.x : valueAt(trace, tau)
    const L = charge.moles * Math.exp(-tau)
    const D = charge.moles - L
    const yNow = distillate(x)
    return {
      tau,
      distilledFraction: D / charge.moles,
      potMoles: L,
      potX1: x,
      potT: curve.T(x),
      instantaneousDistillateY1: yNow,
      cumulativeDistillateX1: D > 0 ? (charge.moles * charge.x1 - L * x) / D : yNow,
    }
  })
  const last = frames[frames.length - 1]
  const distillateMoles = charge.moles - last.potMoles
  return {
    frames,
    end: {
      potMoles: last.potMoles,
      potX1: last.potX1,
      potT: last.potT,
      distillateMoles,
      distillateX1: last.cumulativeDistillateX1,
      recovery1: (distillateMoles * last.cumulativeDistillateX1) / (charge.moles * charge.x1),
      distilledFraction: last.distilledFraction,
    },
    integration: {
      method: 'Dormand–Prince 5(4), adaptive',
      absoluteTolerance: ABS_TOL,
      relativeTolerance: REL_TOL,
      steps: stats.steps,
      rejectedSteps: stats.rejected,
    },
  }
}
