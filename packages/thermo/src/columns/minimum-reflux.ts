/** Minimum reflux ratio from the feed pinch or, for non-ideal curves, a tangent pinch above the feed. */
import { ThermoError } from '../errors.js'
import { checkNoAzeotropeBetween, checkOpenFraction, DESIGN_CAUTION, designAssumptions } from './design-notes.js'
import { equilibriumCurve, type EquilibriumCurve, type EquilibriumSource } from './equilibrium-curve.js'

/** Result of `minimumReflux`. */
export interface MinimumRefluxResult {
  /** Minimum reflux ratio L/D. */
  Rmin: number
  /**
   * 'pinch': the operating lines meet on the equilibrium curve at the q-line; 'tangent-pinch': the rectifying line
   * touches the curve above the feed; 'stripping-tangent-pinch': (only when xB is given) the stripping line touches it below the feed.
   */
  governs: 'pinch' | 'tangent-pinch' | 'stripping-tangent-pinch'
  /** Where the q-line cuts the equilibrium curve (x1, y1). */
  feedPinch: { x: number; y: number }
  /** The governing touching point (equals feedPinch when the pinch governs). */
  touch: { x: number; y: number }
  warnings: string[]
  assumptions: string[]
  caution: string
}

/** Check and read q: liquid fraction of the feed (1 saturated liquid, 0 saturated vapour, > 1 subcooled, < 0 superheated). */
export function checkQ(q: unknown): asserts q is number {
  if (typeof q !== 'number' || !Number.isFinite(q))
    throw new ThermoError(
      'invalid-input',
      `q must be a finite number (1 for a saturated-liquid feed); got ${String(q)}.`,
    )
}

/** The point where the q-line y = q/(q−1)·x − xF/(q−1) through (xF, xF) cuts the equilibrium curve. */
export function qLinePinch(curve: EquilibriumCurve, xF: number, q: number): { x: number; y: number } {
  if (Math.abs(q - 1) < 1e-12) return { x: xF, y: curve.y(xF) }
  // g > 0 at xF (the curve lies above the diagonal there); the root lies towards 1 for q > 1, towards 0 otherwise
  const g = (x: number) => curve.y(x) - (q * x - xF) / (q - 1)
  let a = xF
  let b = q > 1 ? 1 : 0
  for (let k = 0; k < 100 && Math.abs(b - a) > 1e-14; k++) {
    const m = 0.5 * (a + b)
    if (g(m) > 0) a = m
    else b = m
  }
  const x = 0.5 * (a + b)
  return { x, y: curve.y(x) }
}

/** Slope the rectifying line from (xD, xD) needs to pass through (x, y(x)). */
function slopeThrough(curve: EquilibriumCurve, xD: number, x: number): number {
  return (xD - curve.y(x)) / (xD - x)
}

/** Largest required slope over [x0, xD): a grid scan refined by golden-section search. */
function steepestRequirement(curve: EquilibriumCurve, xD: number, x0: number): { x: number; slope: number } {
  const n = 400
  const h = (xD - x0) / n
  let best = 0
  let bestSlope = slopeThrough(curve, xD, x0)
  for (let i = 1; i < n; i++) {
    const s = slopeThrough(curve, xD, x0 + i * h)
    if (s > bestSlope) [best, bestSlope] = [i, s]
  }
  if (best === 0) return { x: x0, slope: bestSlope }
  let a = x0 + (best - 1) * h
  let b = x0 + (best + 1) * h
  const r = (Math.sqrt(5) - 1) / 2
  for (let k = 0; k < 60 && b - a > 1e-13; k++) {
    const c = b - r * (b - a)
    const d = a + r * (b - a)
    if (slopeThrough(curve, xD, c) > slopeThrough(curve, xD, d)) b = d
    else a = c
  }
  const x = 0.5 * (a + b)
  const slope = slopeThrough(curve, xD, x)
  return slope > bestSlope ? { x, slope } : { x: x0 + best * h, slope: bestSlope }
}

/** Largest excess of the stripping line over the equilibrium curve between xB and the operating-line intersection, and where. */
function strippingExcess(
  curve: EquilibriumCurve,
  xF: number,
  q: number,
  xD: number,
  xB: number,
  R: number,
): { excess: number; x: number } {
  const xi = ((q - 1) * xD + (R + 1) * xF) / (R + q)
  const yi = (R / (R + 1)) * xi + xD / (R + 1)
  const slope = (yi - xB) / (xi - xB)
  let best = { excess: -Infinity, x: xB }
  for (let i = 1; i < 200; i++) {
    const x = xB + ((xi - xB) * i) / 200
    const excess = xB + slope * (x - xB) - curve.y(x)
    if (excess > best.excess) best = { excess, x }
  }
  return best
}

/**
 * The smallest R at which the stripping line clears the equilibrium curve, when the rectifying Rmin is not enough
 * (curves that hug the diagonal at the bottom). Bisection on R: the stripping line falls towards the diagonal as R rises.
 */
function strippingMinimum(
  curve: EquilibriumCurve,
  xF: number,
  q: number,
  xD: number,
  xB: number,
  rectifyingRmin: number,
): { R: number; x: number } | null {
  const tolerance = 1e-9
  if (strippingExcess(curve, xF, q, xD, xB, Math.max(rectifyingRmin, 1e-12)).excess <= tolerance) return null
  let lo = Math.max(rectifyingRmin, 1e-12)
  let hi = Math.max(2 * lo, 1)
  while (strippingExcess(curve, xF, q, xD, xB, hi).excess > tolerance && hi < 1e9) hi *= 2
  for (let i = 0; i < 80 && hi - lo > 1e-10 * hi; i++) {
    const mid = 0.5 * (lo + hi)
    if (strippingExcess(curve, xF, q, xD, xB, mid).excess > tolerance) lo = mid
    else hi = mid
  }
  return { R: hi, x: strippingExcess(curve, xF, q, xD, xB, hi).x }
}

/** Rmin on an already built curve; shared with mccabeThiele. Inputs already checked; xB (optional) adds the stripping check. */
export function minimumRefluxOnCurve(
  curve: EquilibriumCurve,
  xF: number,
  q: number,
  xD: number,
  xB?: number,
): Omit<MinimumRefluxResult, 'assumptions' | 'caution'> {
  checkNoAzeotropeBetween(curve, xF, xD, 'xF', 'xD')
  const feedPinch = qLinePinch(curve, xF, q)
  const warnings: string[] = [...curve.warnings]
  if (feedPinch.y >= xD) {
    warnings.push('xD is at or below the vapour in equilibrium with the feed: any reflux ratio reaches it (Rmin = 0).')
    return { Rmin: 0, governs: 'pinch', feedPinch, touch: feedPinch, warnings }
  }
  const need = steepestRequirement(curve, xD, feedPinch.x)
  // a tangent pinch must beat the feed pinch by more than rounding to count as governing
  const tangent = need.slope > slopeThrough(curve, xD, feedPinch.x) + 1e-9
  if (need.slope >= 1) {
    throw new ThermoError(
      'unreachable-distillate',
      `The equilibrium curve meets the diagonal near x1 = ${need.x.toFixed(4)}, below xD = ${xD}: no reflux ratio reaches xD.`,
    )
  }
  const Rmin = Math.max(0, need.slope / (1 - need.slope))
  const touch = tangent ? { x: need.x, y: curve.y(need.x) } : feedPinch
  const stripping = xB === undefined ? null : strippingMinimum(curve, xF, q, xD, xB, Rmin)
  if (stripping)
    return {
      Rmin: stripping.R,
      governs: 'stripping-tangent-pinch',
      feedPinch,
      touch: { x: stripping.x, y: curve.y(stripping.x) },
      warnings,
    }
  return { Rmin, governs: tangent ? 'tangent-pinch' : 'pinch', feedPinch, touch, warnings }
}

/**
 * Minimum reflux ratio Rmin = L/D of a binary column with a total condenser, constant molar overflow.
 * The rectifying operating line from (xD, xD) must stay below the equilibrium curve between the q-line pinch
 * and xD; Rmin is set by the steepest such line: either through the q-line pinch ('pinch') or touching the curve
 * above the feed ('tangent-pinch', typical of strongly non-ideal systems such as ethanol–water). Given xB, the
 * stripping line from (xB, xB) is checked too and may raise Rmin ('stripping-tangent-pinch').
 * @param source `{ system, P }` (P in Pa), `{ alpha }` or `{ table }`
 * @param spec.xF feed mole fraction; spec.q feed liquid fraction (1 saturated liquid); spec.xD distillate (> xF); spec.xB optional bottoms (< xF)
 * @throws ThermoError for compositions outside (0, 1), xD ≤ xF, or an azeotrope between xF and xD
 */
export function minimumReflux(
  source: EquilibriumSource,
  spec: { xF: number; q: number; xD: number; xB?: number },
): MinimumRefluxResult {
  const curve = equilibriumCurve(source)
  const { xF, q, xD, xB } = spec ?? ({} as { xF: number; q: number; xD: number })
  checkOpenFraction(xF, 'xF')
  checkOpenFraction(xD, 'xD')
  checkQ(q)
  if (xD <= xF) throw new ThermoError('invalid-input', `xD must be greater than xF; got xD = ${xD}, xF = ${xF}.`)
  if (xB !== undefined) {
    checkOpenFraction(xB, 'xB')
    if (xB >= xF) throw new ThermoError('invalid-input', `xB must be less than xF; got xB = ${xB}, xF = ${xF}.`)
    checkNoAzeotropeBetween(curve, xB, xF, 'xB', 'xF')
  }
  const r = minimumRefluxOnCurve(curve, xF, q, xD, xB)
  return {
    ...r,
    assumptions: designAssumptions(curve, ['total condenser', 'minimum reflux means infinitely many stages']),
    caution: DESIGN_CAUTION,
  }
}
