/** Batch rectification at constant reflux: a column of theoretical stages on top of the pot, quasi-steady. */
import { ThermoError } from '../errors.js'
import { DESIGN_CAUTION, designAssumptions } from '../columns/design-notes.js'
import { equilibriumCurve, type EquilibriumCurve, type EquilibriumSource } from '../columns/equilibrium-curve.js'
import type { BatchCharge, BatchEndState, BatchFrame, BatchIntegration, BatchUntil } from './batch-types.js'
import { checkCharge, checkFrames, runRayleigh } from './rayleigh.js'

/** Options of `batchRectification`. */
export interface BatchRectificationOptions {
  charge: BatchCharge
  /** Theoretical stages INCLUDING the still pot (1 = simple distillation). */
  stages: number
  /** Constant reflux ratio L/D (> 0, finite). */
  R: number
  until: BatchUntil
  /** Number of frames, evenly spaced in distilled fraction (default 101, 2–5000). */
  frames?: number
}

/** A frame of the rectification movie: the still frame plus the still-head temperature. */
export interface BatchRectificationFrame extends BatchFrame {
  /** Temperature at the top of the column (top stage), K; null for constant α. */
  stillHeadT: number | null
}

/** Result of `batchRectification`. */
export interface BatchRectificationResult {
  frames: BatchRectificationFrame[]
  end: BatchEndState & { stillHeadT: number | null }
  integration: BatchIntegration
  warnings: string[]
  assumptions: string[]
  caution: string
}

/** x at the bottom (the pot) after stepping `stages` stages down from a distillate xD at reflux slope s. */
function potFromDistillate(curve: EquilibriumCurve, xD: number, stages: number, s: number): number {
  let x = curve.x(xD)
  for (let n = 2; n <= stages; n++) x = curve.x(s * x + (1 - s) * xD)
  return x
}

/**
 * The distillate composition that N stages at reflux R deliver from pot liquid xW: the root in (xW, 1) of
 * potFromDistillate(xD) = xW, by the Illinois variant of regula falsi (bracketed, superlinear).
 */
export function distillateForPot(
  curve: EquilibriumCurve,
  xW: number,
  stages: number,
  R: number,
  hint?: number,
): number {
  const s = R / (R + 1)
  let a = xW
  let b = 1
  let fa = potFromDistillate(curve, a, stages, s) - xW
  let fb = 1 - xW
  if (fa >= 0) return a
  if (hint !== undefined && hint > xW && hint < 1) {
    // the pot changes little between calls: try a narrow bracket around the last answer first
    const lo = Math.max(xW, hint - 1e-3)
    const hi = Math.min(1, hint + 1e-3)
    const flo = potFromDistillate(curve, lo, stages, s) - xW
    const fhi = potFromDistillate(curve, hi, stages, s) - xW
    if (flo < 0 && fhi > 0) [a, fa, b, fb] = [lo, flo, hi, fhi]
  }
  let side = 0
  for (let i = 0; i < 200; i++) {
    const c = (a * fb - b * fa) / (fb - fa)
    const fc = potFromDistillate(curve, c, stages, s) - xW
    if (Math.abs(fc) < 1e-14 || b - a < 1e-14) return c
    if (fc * fb > 0) {
      b = c
      fb = fc
      if (side === -1) fa /= 2
      side = -1
    } else {
      a = c
      fa = fc
      if (side === 1) fb /= 2
      side = 1
    }
  }
  return 0.5 * (a + b)
}

function checkColumn(stages: number, R: number): void {
  if (!Number.isInteger(stages) || stages < 1 || stages > 200) {
    throw new ThermoError(
      'invalid-input',
      `stages must be a whole number of theoretical stages from 1 to 200 (the pot counts as one); got ${String(stages)}.`,
    )
  }
  if (typeof R !== 'number' || !Number.isFinite(R) || R <= 0) {
    throw new ThermoError(
      'invalid-input',
      `R must be a positive, finite reflux ratio L/D (at total reflux nothing is collected); got ${String(R)}.`,
    )
  }
}

/**
 * Batch rectification with N theoretical stages (pot included) at constant reflux ratio R, quasi-steady:
 * at each pot composition the column is at steady state, so the distillate xD is the one N stages deliver at R
 * (McCabe–Thiele stepping on the rectifying line), and the pot follows d(L·xW)/dL = xD, integrated like the
 * Rayleigh equation (adaptive Dormand–Prince 5(4), same tolerance). Column holdup is neglected.
 * @param source `{ system, P }` (P in Pa), `{ alpha }` or `{ table }`
 * @param options charge, stages (including the pot), R (L/D), until (as simpleBatchDistillation), frames
 * @returns frames with the still-head temperature (top-stage bubble point, K), the end state, integration statistics
 * @throws ThermoError for a bad charge, stage count, reflux ratio or stopping condition, or an unreachable pot composition
 */
export function batchRectification(
  source: EquilibriumSource,
  options: BatchRectificationOptions,
): BatchRectificationResult {
  const curve = equilibriumCurve(source)
  checkCharge(options?.charge)
  checkColumn(options.stages, options.R)
  const frameCount = options.frames ?? 101
  checkFrames(frameCount)
  let last: number | undefined
  const distillate = (x: number) => (last = distillateForPot(curve, x, options.stages, options.R, last))
  const run = runRayleigh(curve, distillate, options.charge, options.until, frameCount)
  const head = (xD: number) => curve.T(curve.x(xD))
  const frames = run.frames.map(({ tau: _tau, ...f }) => ({ ...f, stillHeadT: head(f.instantaneousDistillateY1) }))
  return {
    frames,
    end: { ...run.end, stillHeadT: frames[frames.length - 1].stillHeadT },
    integration: run.integration,
    warnings: [...curve.warnings],
    assumptions: designAssumptions(curve, [
      `${options.stages} theoretical stages including the still pot, total condenser`,
      `constant reflux ratio R = ${options.R}`,
      'quasi-steady column, holdup on the stages neglected',
    ]),
    caution: DESIGN_CAUTION,
  }
}
