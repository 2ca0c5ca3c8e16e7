import { thermodynamicFactor } from '../activity/activity.js'
import { checkMoleFraction, checkPressure, checkTemperature, ThermoError } from '../errors.js'
import type { Azeotrope, BinarySystem, PhaseDiagram, RelativeVolatilityResult } from '../types.js'
import { bubbleTemperatureCompiled } from './bubble-dew.js'
import { res, solveBubbleP, solveBubbleT, startTemperature } from './kernel.js'
import { brent } from './roots.js'
import { assertOneLiquid, compileSystem, systemWarnings, type CompiledSystem } from './system.js'

/** Fixed pressure (Pa) for a T–x–y curve, or fixed temperature (K) for a P–x–y curve. */
export type DiagramCondition = { P: number; T?: undefined } | { T: number; P?: undefined }

function checkCondition(condition: DiagramCondition): void {
  if (condition?.P !== undefined) checkPressure(condition.P)
  else if (condition?.T !== undefined) checkTemperature(condition.T)
  else
    throw new ThermoError(
      'invalid-input',
      'Give either a pressure P (Pa) for a T–x–y diagram or a temperature T (K) for a P–x–y diagram.',
    )
}

/**
 * Relative volatility α12 = (y1/x1)/(y2/x2) = γ1·P1sat/(γ2·P2sat) at the bubble point.
 * @param at P in Pa, x1 liquid mole fraction (0–1; at the ends α is the infinite-dilution limit).
 * @returns α (dimensionless), bubble T in K, vapour y1, range warnings.
 */
export function relativeVolatility(system: BinarySystem, at: { P: number; x1: number }): RelativeVolatilityResult {
  const c = compileSystem(system)
  checkPressure(at.P)
  checkMoleFraction(at.x1, 'x1')
  const b = bubbleTemperatureCompiled(c, at.P, at.x1)
  const T = b.T
  const lnAlpha =
    Math.log(b.gamma[0] / b.gamma[1]) + (c.vp1.a - c.vp1.b / (T + c.vp1.c)) - (c.vp2.a - c.vp2.b / (T + c.vp2.c))
  return { alpha: Math.exp(lnAlpha), T, y1: b.y1, warnings: b.warnings }
}

/** ln α12 at the bubble point of x1 (fixed P or T), without stability checks; NaN when no bubble point. */
function lnAlphaAt(c: CompiledSystem, condition: DiagramCondition, x1: number): number {
  let T: number
  if (condition.P !== undefined) {
    const lnP = Math.log(condition.P)
    if (!solveBubbleT(c.act, c.vp1, c.vp2, lnP, x1, startTemperature(c.vp1, c.vp2, lnP, x1))) return NaN
    T = res[0]
  } else {
    T = condition.T
    solveBubbleP(c.act, c.vp1, c.vp2, T, x1)
  }
  return Math.log(res[2] / res[3]) + (c.vp1.a - c.vp1.b / (T + c.vp1.c)) - (c.vp2.a - c.vp2.b / (T + c.vp2.c))
}

/** Scan grid: dense near both ends so an azeotrope at x1 = 1e-5 is still bracketed. */
const SCAN: number[] = (() => {
  const ends = [0, 1e-6, 1e-5, 1e-4, 1e-3, 0.003, 0.006]
  const mid = Array.from({ length: 99 }, (_, i) => (i + 1) / 100)
  return [...ends, ...mid, ...ends.map((x) => 1 - x).reverse()].filter((x, i, a) => i === 0 || x > a[i - 1])
})()

/**
 * Find an azeotrope (x1 = y1 strictly inside 0 < x1 < 1) at fixed P (Pa) or fixed T (K).
 * It is where α12 = 1; α at a pure end equal to 1 (x–y curve touching the diagonal) is not reported.
 * @returns null, or x1, T (K), P (Pa) and the kind; when there are two, the one with the smaller x1.
 * @throws ThermoError 'liquid-split' when the composition found lies where the model predicts two liquids.
 */
export function findAzeotrope(system: BinarySystem, condition: DiagramCondition): Azeotrope | null {
  const c = compileSystem(system)
  checkCondition(condition)
  let prevX = NaN
  let prevH = NaN
  for (const x of SCAN) {
    const h = lnAlphaAt(c, condition, x)
    const atEnd = x === 0 || x === 1
    if (!Number.isFinite(h) || (atEnd && Math.abs(h) < 1e-9)) continue
    if (Number.isFinite(prevH) && prevH * h < 0) return azeotropeBetween(c, condition, prevX, x, prevH > 0)
    prevX = x
    prevH = h
  }
  return null
}

function azeotropeBetween(
  c: CompiledSystem,
  condition: DiagramCondition,
  a: number,
  b: number,
  fallsThrough: boolean,
): Azeotrope {
  const x1 = brent((x) => lnAlphaAt(c, condition, x), a, b, 1e-14)
  lnAlphaAt(c, condition, x1)
  const T = res[0]
  const P = condition.P ?? res[5]
  assertOneLiquid(c, x1, T)
  // α > 1 below the azeotrope and < 1 above: the vapour is richer in 1 on the left, so the boiling point has a minimum.
  return { x1, T, P, kind: fallsThrough ? 'minimum-boiling' : 'maximum-boiling', warnings: systemWarnings(c, T, x1) }
}

/**
 * The T–x–y curve at fixed P (Pa) or the P–x–y curve at fixed T (K), from x1 = 0 to 1 inclusive,
 * on a cosine-spaced grid (denser near the pure ends, where the curves bend most).
 * @param options points: number of liquid compositions, default 101 (3–10001).
 * Compositions where the model predicts two liquids are left out, with a warning.
 */
export function phaseDiagram(
  system: BinarySystem,
  condition: DiagramCondition,
  options: { points?: number } = {},
): PhaseDiagram {
  const c = compileSystem(system)
  checkCondition(condition)
  const n = options.points ?? 101
  if (!Number.isInteger(n) || n < 3 || n > 10001) {
    throw new ThermoError(
      'invalid-input',
      `The number of diagram points must be a whole number from 3 to 10001; got ${n}.`,
    )
  }
  const xs: number[] = []
  const ys: number[] = []
  const vs: number[] = []
  const warnings = new Set<string>()
  const lnP = condition.P !== undefined ? Math.log(condition.P) : 0
  let T = NaN
  for (let i = 0; i < n; i++) {
    const x1 = i === n - 1 ? 1 : 0.5 * (1 - Math.cos((Math.PI * i) / (n - 1)))
    if (condition.P !== undefined) {
      const start = Number.isFinite(T) ? T : startTemperature(c.vp1, c.vp2, lnP, x1)
      if (!solveBubbleT(c.act, c.vp1, c.vp2, lnP, x1, start)) {
        throw new ThermoError(
          'no-convergence',
          `The T–x–y diagram could not be computed at x1 = ${x1.toFixed(4)}; check the model parameters.`,
        )
      }
      T = res[0]
    } else {
      solveBubbleP(c.act, c.vp1, c.vp2, condition.T, x1)
    }
    xs.push(x1)
    ys.push(res[1])
    vs.push(condition.P !== undefined ? res[0] : res[5])
    for (const w of systemWarnings(c, res[0], x1))
      warnings.add(w.replace(/: [\d.]+ K \([-\d.]+ °C\) is/, ': part of this diagram is'))
  }
  return finishDiagram(c, condition, xs, ys, vs, [...warnings])
}

function finishDiagram(
  c: CompiledSystem,
  condition: DiagramCondition,
  xs: number[],
  ys: number[],
  vs: number[],
  warnings: string[],
): PhaseDiagram {
  // Each point is checked at its own temperature: inside the spinodal the one-liquid curve is not physical.
  const keep = xs.map((x, i) => thermodynamicFactor(c.act, x, condition.T ?? vs[i]) > 0)
  const dropped = xs.filter((_, i) => !keep[i])
  if (dropped.length > 0) {
    warnings.push(
      `The activity model predicts two liquid phases near x1 = ${dropped[0].toFixed(3)} to ${dropped[dropped.length - 1].toFixed(3)}; the single-liquid curve there is not physical and is left out.`,
    )
  }
  const pick = (a: number[]) => (dropped.length > 0 ? a.filter((_, i) => keep[i]) : a)
  return condition.P !== undefined
    ? { kind: 'isobaric', P: condition.P, x1: pick(xs), y1: pick(ys), T: pick(vs), warnings }
    : { kind: 'isothermal', T: condition.T, x1: pick(xs), y1: pick(ys), P: pick(vs), warnings }
}
