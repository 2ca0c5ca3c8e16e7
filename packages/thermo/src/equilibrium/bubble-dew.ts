/**
 * The ideal-vapour (modified Raoult's law) bubble and dew solvers on a compiled system, with the two-liquid
 * handling. The public entry points, which also dispatch to γ–φ for a virial vapour, are in vle.ts.
 */
import type {
  BubblePressureResult,
  BubbleTemperatureResult,
  DewPressureResult,
  DewTemperatureResult,
} from '../types.js'
import { res, solveBubbleP, solveBubbleT, solveDewP, solveDewT, startTemperature } from './kernel.js'
import { gapContaining } from './lle.js'
import { brent } from './roots.js'
import { checkDomain, liquidSplitError, noConvergence, systemWarnings, type CompiledSystem } from './system.js'
import { threePhaseIsobaric, threePhaseIsothermal, type ThreePhasePoint } from './three-phase.js'

/** The fields a three-phase result carries. */
function threePhaseFields(tp: ThreePhasePoint) {
  return {
    liquidPhases: [tp.xI, tp.xII] as [number, number],
    gammaPhases: [tp.gammaI, tp.gammaII] as [[number, number], [number, number]],
  }
}

/** True when x1 lies on the three-phase tie line (inclusive within 1e-12). */
function onTieLine(tp: ThreePhasePoint | null, x1: number): tp is ThreePhasePoint {
  return tp !== null && x1 >= tp.xI - 1e-12 && x1 <= tp.xII + 1e-12
}

/** The ideal-vapour bubble temperature on an already checked system (used by `bubbleTemperature`, the diagram and fitting code). */
export function bubbleTemperatureCompiled(c: CompiledSystem, P: number, x1: number): BubbleTemperatureResult {
  const lnP = Math.log(P)
  if (!solveBubbleT(c.act, c.vp1, c.vp2, lnP, x1, startTemperature(c.vp1, c.vp2, lnP, x1))) {
    throw noConvergence('bubble-temperature', `x1 = ${x1} and ${P} Pa`)
  }
  const T = res[0]
  const y1 = res[1]
  const g1 = res[2]
  const g2 = res[3]
  const iterations = res[4]
  if (x1 > 0 && x1 < 1 && c.stab.canSplit) {
    // The tie line at P (remembered per pressure) catches liquids that boil as two layers even when the
    // single liquid would look stable at its own (wrong) bubble temperature.
    let tp = threePhaseIsobaric(c, P)
    if (!onTieLine(tp, x1) && c.stab.maySplit(T)) {
      const gap = gapContaining(c.stab.gaps(T), x1)
      if (gap) {
        tp = threePhaseIsobaric(c, P, { T, gap })
        if (!onTieLine(tp, x1)) throw liquidSplitError(c, x1, T)
      }
    }
    if (onTieLine(tp, x1)) {
      return {
        converged: true,
        T: tp.T,
        y1: tp.y1,
        ...threePhaseFields(tp),
        iterations,
        warnings: systemWarnings(c, tp.T, 0.5),
      }
    }
  }
  return { converged: true, T, y1, gamma: [g1, g2], iterations, warnings: systemWarnings(c, T, x1) }
}

/** The ideal-vapour bubble pressure (modified Raoult's law, P = Σ xi·γi·Pi_sat) on an already checked system. */
export function bubblePressureCompiled(c: CompiledSystem, T: number, x1: number): BubblePressureResult {
  checkDomain(c, T)
  if (x1 > 0 && x1 < 1 && c.stab.maySplit(T) && gapContaining(c.stab.gaps(T), x1)) {
    const tp = threePhaseIsothermal(c, T) as ThreePhasePoint
    return { P: tp.P, y1: tp.y1, ...threePhaseFields(tp), warnings: systemWarnings(c, T, 0.5) }
  }
  solveBubbleP(c.act, c.vp1, c.vp2, T, x1)
  return { P: res[5], y1: res[1], gamma: [res[2], res[3]], warnings: systemWarnings(c, T, x1) }
}

/** True when a single liquid x1 is stable at T (K): not strictly inside a two-liquid gap. */
function stableLiquid(c: CompiledSystem, x1: number, T: number): boolean {
  return !(x1 > 0 && x1 < 1 && c.stab.maySplit(T) && gapContaining(c.stab.gaps(T), x1) !== null)
}

/** The x1 interval of stable liquids whose vapour can be y1: the branch of the bubble curve on y1's side of the tie line. */
function dewBranch(tp: ThreePhasePoint | null, y1: number): [number, number] {
  if (!tp) return [0, 1]
  return y1 < tp.y1 ? [0, tp.xI] : [tp.xII, 1]
}

/** The ideal-vapour dew temperature on an already checked system. */
export function dewTemperatureCompiled(c: CompiledSystem, P: number, y1: number): DewTemperatureResult {
  const lnP = Math.log(P)
  const tp = y1 > 0 && y1 < 1 ? threePhaseIsobaric(c, P) : null
  if (tp && Math.abs(y1 - tp.y1) <= 1e-9) {
    return {
      converged: true,
      T: tp.T,
      x1: tp.xI,
      ...threePhaseFields(tp),
      iterations: 0,
      warnings: systemWarnings(c, tp.T, 0.5),
    }
  }
  const [lo, hi] = dewBranch(tp, y1)
  let ok = solveDewT(c.act, c.vp1, c.vp2, lnP, y1, startTemperature(c.vp1, c.vp2, lnP, y1))
  let iterations = res[4]
  if (!ok || res[1] < lo || res[1] > hi || !stableLiquid(c, res[1], res[0])) {
    // Substitution can stall near an azeotrope or land on a liquid that is not stable; y1(x1) rises
    // monotonically along the stable branch, so bracket x1 on that branch instead.
    let count = 0
    const x1 = brent(
      (x) => {
        count++
        return bubbleY(c, lnP, x) - y1
      },
      lo,
      hi,
      1e-13,
    )
    ok = Number.isFinite(x1) && solveBubbleT(c.act, c.vp1, c.vp2, lnP, x1, startTemperature(c.vp1, c.vp2, lnP, x1))
    res[1] = x1
    iterations = count
  }
  if (!ok) throw noConvergence('dew-temperature', `y1 = ${y1} and ${P} Pa`)
  const out: DewTemperatureResult = {
    converged: true,
    T: res[0],
    x1: res[1],
    gamma: [res[2], res[3]],
    iterations,
    warnings: systemWarnings(c, res[0], y1),
  }
  if (!stableLiquid(c, out.x1, out.T)) throw liquidSplitError(c, out.x1, out.T)
  return out
}

function bubbleY(c: CompiledSystem, lnP: number, x1: number): number {
  if (!solveBubbleT(c.act, c.vp1, c.vp2, lnP, x1, startTemperature(c.vp1, c.vp2, lnP, x1))) return NaN
  return res[1]
}

/** The ideal-vapour dew pressure on an already checked system: the lowest pressure at which a stable liquid appears. */
export function dewPressureCompiled(c: CompiledSystem, T: number, y1: number): DewPressureResult {
  checkDomain(c, T)
  const tp = y1 > 0 && y1 < 1 ? threePhaseIsothermal(c, T) : null
  if (tp && Math.abs(y1 - tp.y1) <= 1e-9) {
    return {
      converged: true,
      P: tp.P,
      x1: tp.xI,
      ...threePhaseFields(tp),
      iterations: 0,
      warnings: systemWarnings(c, T, 0.5),
    }
  }
  const [lo, hi] = dewBranch(tp, y1)
  let ok = solveDewP(c.act, c.vp1, c.vp2, T, y1)
  let iterations = res[4]
  if (!ok || res[1] < lo || res[1] > hi || !stableLiquid(c, res[1], T)) {
    let count = 0
    const x1 = brent(
      (x) => {
        count++
        solveBubbleP(c.act, c.vp1, c.vp2, T, x)
        return res[1] - y1
      },
      lo,
      hi,
      1e-13,
    )
    ok = Number.isFinite(x1)
    if (ok) solveBubbleP(c.act, c.vp1, c.vp2, T, x1)
    res[1] = x1
    iterations = count
  }
  if (!ok) throw noConvergence('dew-pressure', `y1 = ${y1} and ${T} K`)
  const out: DewPressureResult = {
    converged: true,
    P: res[5],
    x1: res[1],
    gamma: [res[2], res[3]],
    iterations,
    warnings: systemWarnings(c, T, y1),
  }
  if (!stableLiquid(c, out.x1, T)) throw liquidSplitError(c, out.x1, T)
  return out
}
