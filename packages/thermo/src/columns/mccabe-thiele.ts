/** Theoretical stages of a binary column by stepping off McCabe–Thiele stages from the top. */
import { ThermoError } from '../errors.js'
import { checkNoAzeotropeBetween, checkOpenFraction, DESIGN_CAUTION, designAssumptions } from './design-notes.js'
import { equilibriumCurve, type EquilibriumCurve, type EquilibriumSource } from './equilibrium-curve.js'
import { checkQ, minimumRefluxOnCurve } from './minimum-reflux.js'

/** A step never needs more stages than this; beyond it the design is pinched (R too close to Rmin). */
export const MAX_STAGES = 1000

/** Reflux as a number (L/D; Infinity = total reflux) or as a multiple of the minimum. */
export type RefluxSpec = number | { timesMinimum: number }

/** Options of `mccabeThiele`: mole fractions of component 1, q the feed liquid fraction (1 = saturated liquid). */
export interface McCabeThieleSpec {
  xF: number
  q: number
  xD: number
  xB: number
  R: RefluxSpec
}

/** A straight operating line y = slope·x + intercept. */
export interface OperatingLine {
  slope: number
  intercept: number
}

/** One theoretical stage from the top: liquid x1 leaving it, vapour y1 leaving it, its temperature (K) when known. */
export interface StagePoint {
  stage: number
  x: number
  y: number
  T: number | null
}

/** Result of `mccabeThiele`. */
export interface McCabeThieleResult {
  /** Whole theoretical stages including the reboiler (the last step). */
  stages: number
  /** Stages with the last one fractional: (n − 1) + (x_{n−1} − xB)/(x_{n−1} − x_n). */
  fractionalStages: number
  /** Optimal feed stage counted from the top (the step that crosses the operating-line intersection); null at total reflux. */
  feedStage: number | null
  steps: StagePoint[]
  /** Polyline of the staircase for an x–y chart, from (xD, xD). */
  staircase: { x: number; y: number }[]
  R: number
  Rmin: number
  governs: 'pinch' | 'tangent-pinch' | 'stripping-tangent-pinch'
  operatingLines: { rectifying: OperatingLine; stripping: OperatingLine; intersection: { x: number; y: number } | null }
  includesReboiler: true
  warnings: string[]
  assumptions: string[]
  caution: string
}

function checkSpec(spec: McCabeThieleSpec): void {
  const { xF, q, xD, xB } = spec ?? ({} as McCabeThieleSpec)
  checkOpenFraction(xF, 'xF')
  checkOpenFraction(xD, 'xD')
  checkOpenFraction(xB, 'xB')
  checkQ(q)
  if (!(xB < xF && xF < xD))
    throw new ThermoError(
      'invalid-input',
      `The compositions must satisfy xB < xF < xD; got xB = ${xB}, xF = ${xF}, xD = ${xD}.`,
    )
}

function resolveReflux(R: RefluxSpec, Rmin: number): number {
  if (typeof R === 'object' && R !== null) {
    const f = R.timesMinimum
    if (typeof f !== 'number' || !Number.isFinite(f) || f <= 1) {
      throw new ThermoError('invalid-input', `R.timesMinimum must be a number greater than 1; got ${String(f)}.`)
    }
    if (Rmin === 0)
      throw new ThermoError(
        'invalid-input',
        'Rmin is 0 for this feed and distillate, so R cannot be a multiple of it; give R as a number.',
      )
    return f * Rmin
  }
  if (typeof R !== 'number' || Number.isNaN(R) || R <= 0) {
    throw new ThermoError(
      'invalid-input',
      `R must be a positive reflux ratio L/D, Infinity for total reflux, or { timesMinimum }; got ${String(R)}.`,
    )
  }
  return R
}

function lines(spec: McCabeThieleSpec, R: number) {
  const { xF, q, xD, xB } = spec
  if (!Number.isFinite(R)) {
    const diagonal = { slope: 1, intercept: 0 }
    return { rectifying: diagonal, stripping: diagonal, intersection: null }
  }
  const rectifying = { slope: R / (R + 1), intercept: xD / (R + 1) }
  // intersection of the rectifying line and the q-line, written without the 1/(q − 1) singularity
  const x = ((q - 1) * xD + (R + 1) * xF) / (R + q)
  const y = rectifying.slope * x + rectifying.intercept
  const slope = (y - xB) / (x - xB)
  return { rectifying, stripping: { slope, intercept: xB * (1 - slope) }, intersection: { x, y } }
}

/** Step from (xD, xD) down to xB; throws when a step stops making progress. */
function stepOff(
  curve: EquilibriumCurve,
  spec: McCabeThieleSpec,
  ops: ReturnType<typeof lines>,
  R: number,
  Rmin: number,
) {
  const steps: StagePoint[] = []
  const staircase = [{ x: spec.xD, y: spec.xD }]
  let y = spec.xD
  let xPrev = spec.xD
  let stripping = false
  let feedStage: number | null = null
  for (let n = 1; n <= MAX_STAGES; n++) {
    const x = curve.x(y)
    if (!(x < xPrev - 1e-12)) {
      const where = stripping ? 'below the feed; raise R' : 'above the feed; raise R'
      throw new ThermoError(
        'pinched-column',
        `The operating line meets the equilibrium curve near x1 = ${x.toFixed(4)} ${where}: no more separation per stage.`,
        { x },
      )
    }
    steps.push({ stage: n, x, y, T: curve.T(x) })
    staircase.push({ x, y })
    if (x <= spec.xB) return { steps, staircase, feedStage, fractional: n - 1 + (xPrev - spec.xB) / (xPrev - x) }
    if (!stripping && ops.intersection && x <= ops.intersection.x) [stripping, feedStage] = [true, n]
    const line = stripping ? ops.stripping : ops.rectifying
    y = line.slope * x + line.intercept
    staircase.push({ x, y })
    xPrev = x
  }
  const why = Number.isFinite(R)
    ? `R = ${R.toFixed(4)} is too close to Rmin = ${Rmin.toFixed(4)}`
    : 'even at total reflux the relative volatility is too close to 1 for this separation'
  throw new ThermoError('too-many-stages', `More than ${MAX_STAGES} theoretical stages are needed: ${why}.`)
}

/**
 * McCabe–Thiele stage count for a binary column with a total condenser and a partial reboiler (counted as the
 * last stage), constant molar overflow, optimal feed location. Stages are stepped from the top on the model's
 * equilibrium curve: x_n = x_eq(y_n), y_{n+1} on the rectifying line until x_n passes the operating-line
 * intersection, then on the stripping line, until x_n ≤ xB.
 * @param source `{ system, P }` (P in Pa), `{ alpha }` or `{ table }`
 * @param spec xF, q (1 saturated liquid, 0 saturated vapour), xD, xB (mole fractions, xB < xF < xD) and R:
 *   L/D, Infinity for total reflux, or `{ timesMinimum: 1.3 }`
 * @throws ThermoError naming the reason when the target is unreachable: an azeotrope between xB and xD,
 *   R at or below Rmin, a pinch, or more than MAX_STAGES stages
 */
export function mccabeThiele(source: EquilibriumSource, spec: McCabeThieleSpec): McCabeThieleResult {
  const curve = equilibriumCurve(source)
  checkSpec(spec)
  checkNoAzeotropeBetween(curve, spec.xB, spec.xD, 'xB', 'xD')
  const pinch = minimumRefluxOnCurve(curve, spec.xF, spec.q, spec.xD, spec.xB)
  const R = resolveReflux(spec.R, pinch.Rmin)
  if (R <= pinch.Rmin * (1 + 1e-9)) {
    throw new ThermoError(
      'reflux-below-minimum',
      `R = ${R.toFixed(4)} is not above the minimum reflux Rmin = ${pinch.Rmin.toFixed(4)} (${pinch.governs} at x1 = ${pinch.touch.x.toFixed(4)}): the column cannot reach xD.`,
      { Rmin: pinch.Rmin },
    )
  }
  if (Number.isFinite(R) && Math.abs(R + spec.q) < 1e-12) {
    throw new ThermoError(
      'invalid-input',
      'The q-line is parallel to the rectifying line (q = −R): the feed condition and R are inconsistent.',
    )
  }
  const ops = lines(spec, R)
  const run = stepOff(curve, spec, ops, R, pinch.Rmin)
  return {
    stages: run.steps.length,
    fractionalStages: run.fractional,
    feedStage: Number.isFinite(R) ? (run.feedStage ?? run.steps.length) : null,
    steps: run.steps,
    staircase: run.staircase,
    R,
    Rmin: pinch.Rmin,
    governs: pinch.governs,
    operatingLines: ops,
    includesReboiler: true,
    warnings: pinch.warnings,
    assumptions: designAssumptions(curve, [
      'total condenser',
      'partial reboiler counted as the last stage',
      'optimal feed location',
    ]),
    caution: DESIGN_CAUTION,
  }
}
