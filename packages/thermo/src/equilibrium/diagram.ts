import { checkMoleFraction, checkPressure, checkTemperature, ThermoError } from '../errors.js'
import type { BinarySystem, PhaseDiagram, RelativeVolatilityResult } from '../types.js'
import { bubbleTemperatureCompiled } from './bubble-dew.js'
import { res, solveBubbleP, solveBubbleT, startTemperature } from './kernel.js'
import { solveBubblePGammaPhi, solveBubbleTGammaPhi } from '../virial/kernel.js'
import { associationWarnings } from '../virial/model.js'
import { gapContaining } from './lle.js'
import { checkDomain, compileSystem, noConvergence, systemWarnings, type CompiledSystem } from './system.js'
import { bubbleTemperature } from './vle.js'

const phiBuf = new Float64Array(5)
import { binodalBelow, threePhaseIsobaric, threePhaseIsothermal, type ThreePhasePoint } from './three-phase.js'

/** Fixed pressure (Pa) for a T–x–y curve, or fixed temperature (K) for a P–x–y curve. */
export type DiagramCondition = { P: number; T?: undefined } | { T: number; P?: undefined }

export function checkCondition(condition: DiagramCondition): void {
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
  if (c.gv) {
    // γ–φ: α = (y1/x1)/(y2/x2) = γ1·P1sat·Φ2/(γ2·P2sat·Φ1), defined at the ends too.
    const b = bubbleTemperature(system, at)
    const T = b.T
    if (!solveBubbleTGammaPhi(c, c.gv, Math.log(at.P), at.x1, phiBuf))
      throw noConvergence('bubble-temperature', `x1 = ${at.x1} and ${at.P} Pa`)
    const lnAlpha =
      Math.log(b.gamma![0] / b.gamma![1]) +
      (c.vp1.a - c.vp1.b / (T + c.vp1.c)) -
      (c.vp2.a - c.vp2.b / (T + c.vp2.c)) -
      Math.log(phiBuf[2] / phiBuf[3])
    return { alpha: Math.exp(lnAlpha), T, y1: b.y1, warnings: b.warnings }
  }
  const b = bubbleTemperatureCompiled(c, at.P, at.x1)
  const T = b.T
  // Two liquid layers: α of the overall liquid against the three-phase vapour.
  if (!b.gamma) return { alpha: (b.y1 * (1 - at.x1)) / (at.x1 * (1 - b.y1)), T, y1: b.y1, warnings: b.warnings }
  const lnAlpha =
    Math.log(b.gamma[0] / b.gamma[1]) + (c.vp1.a - c.vp1.b / (T + c.vp1.c)) - (c.vp2.a - c.vp2.b / (T + c.vp2.c))
  return { alpha: Math.exp(lnAlpha), T, y1: b.y1, warnings: b.warnings }
}

/** Options of {@link phaseDiagram}. */
export interface PhaseDiagramOptions {
  /** Number of liquid compositions, default 101 (3–10001). */
  points?: number
  /** Also return the liquid–liquid envelope (`lle`) below the three-phase line. */
  lle?: boolean
  /** Isobaric: lowest temperature of the envelope, K (default 50 K below the three-phase temperature). */
  lleFromT?: number
  /** Isothermal: highest pressure of the envelope, Pa (default twice the three-phase pressure). */
  lleToP?: number
}

/**
 * The T–x–y curve at fixed P (Pa) or the P–x–y curve at fixed T (K), from x1 = 0 to 1 inclusive,
 * on a cosine-spaced grid (denser near the pure ends, where the curves bend most).
 * Only stable single-liquid bubble points are returned: compositions on the three-phase tie line (the liquid
 * boils as two layers) are replaced by the line itself (`threePhase`) and its two ends; `{ lle: true }` adds the
 * liquid–liquid envelope. A composition whose liquid splits but whose three-phase point cannot be resolved is
 * left out with a warning.
 * @throws ThermoError 'out-of-domain' (isothermal) when a vapour-pressure equation has no value at T.
 */
export function phaseDiagram(
  system: BinarySystem,
  condition: DiagramCondition,
  options: PhaseDiagramOptions = {},
): PhaseDiagram {
  const c = compileSystem(system)
  checkCondition(condition)
  if (condition.T !== undefined) checkDomain(c, condition.T)
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
    if (c.gv) {
      const ok =
        condition.P !== undefined
          ? solveBubbleTGammaPhi(c, c.gv, lnP, x1, phiBuf)
          : solveBubblePGammaPhi(c, c.gv, condition.T, x1, phiBuf)
      if (!ok) {
        throw new ThermoError(
          'no-convergence',
          `The γ–φ diagram could not be computed at x1 = ${x1.toFixed(4)}; check the model parameters.`,
        )
      }
    } else if (condition.P !== undefined) {
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
  return finishDiagram(c, condition, options, xs, ys, vs, [...warnings])
}

/** The three-phase point of the diagram's condition, using an unstable diagram point as a start when needed. */
function diagramThreePhase(
  c: CompiledSystem,
  condition: DiagramCondition,
  xs: number[],
  vs: number[],
): ThreePhasePoint | null {
  if (condition.T !== undefined) return threePhaseIsothermal(c, condition.T)
  const found = threePhaseIsobaric(c, condition.P)
  if (found) return found
  for (let i = 0; i < xs.length; i++) {
    if (xs[i] <= 0 || xs[i] >= 1 || !c.stab.maySplit(vs[i])) continue
    const gap = gapContaining(c.stab.gaps(vs[i]), xs[i])
    if (gap) return threePhaseIsobaric(c, condition.P, { T: vs[i], gap })
  }
  return null
}

function finishDiagram(
  c: CompiledSystem,
  condition: DiagramCondition,
  options: PhaseDiagramOptions,
  xs: number[],
  ys: number[],
  vs: number[],
  warnings: string[],
): PhaseDiagram {
  // The three-phase line is computed for an ideal vapour only; under a virial vapour split liquids are left out.
  const tp = c.stab.canSplit && !c.gv ? diagramThreePhase(c, condition, xs, vs) : null
  const rows: [number, number, number][] = []
  const dropped: number[] = []
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i]
    if (tp && x > tp.xI && x < tp.xII) continue
    const Ti = condition.T ?? vs[i]
    if (x > 0 && x < 1 && c.stab.maySplit(Ti) && gapContaining(c.stab.gaps(Ti), x)) {
      dropped.push(x)
      continue
    }
    rows.push([x, ys[i], vs[i]])
  }
  if (tp) {
    const v = condition.P !== undefined ? tp.T : tp.P
    rows.push([tp.xI, tp.y1, v], [tp.xII, tp.y1, v])
    rows.sort((a, b) => a[0] - b[0])
  }
  if (dropped.length > 0 && c.gv) {
    warnings.push(
      `The activity model predicts two liquid phases near x1 = ${dropped[0].toFixed(3)} to ${dropped[dropped.length - 1].toFixed(3)}; three-phase points are not computed with a virial vapour, so those compositions are left out.`,
    )
  } else if (dropped.length > 0) {
    warnings.push(
      `The activity model predicts two liquid phases near x1 = ${dropped[0].toFixed(3)} to ${dropped[dropped.length - 1].toFixed(3)} but their three-phase point could not be resolved; those compositions are left out.`,
    )
  }
  // a dimerising (carboxylic-acid) vapour: say that the chemical theory gave φ, as every γ–φ result does
  if (c.gv?.chem && c.source.vapor) warnings.push(...associationWarnings(c.source.vapor))
  const col = (k: number) => rows.map((r) => r[k])
  if (condition.P !== undefined) {
    const threePhase = tp ? { T: tp.T, x1I: tp.xI, x1II: tp.xII, y1: tp.y1 } : null
    const lle = options.lle && tp ? binodalBelow(c, tp, options.lleFromT ?? tp.T - 50) : options.lle ? null : undefined
    return {
      kind: 'isobaric',
      P: condition.P,
      x1: col(0),
      y1: col(1),
      T: col(2),
      warnings,
      threePhase,
      ...(lle !== undefined ? { lle } : {}),
    }
  }
  const threePhase = tp ? { P: tp.P, x1I: tp.xI, x1II: tp.xII, y1: tp.y1 } : null
  const top = options.lleToP ?? (tp ? 2 * tp.P : 0)
  const lle = options.lle ? (tp ? { P: [tp.P, top], x1I: [tp.xI, tp.xI], x1II: [tp.xII, tp.xII] } : null) : undefined
  return {
    kind: 'isothermal',
    T: condition.T,
    x1: col(0),
    y1: col(1),
    P: col(2),
    warnings,
    threePhase,
    ...(lle !== undefined ? { lle } : {}),
  }
}
