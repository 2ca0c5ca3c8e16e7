import type { Azeotrope, BinarySystem } from '../types.js'
import { checkCondition, type DiagramCondition } from './diagram.js'
import { res, solveBubbleP, solveBubbleT, startTemperature } from './kernel.js'
import { solveBubblePGammaPhi, solveBubbleTGammaPhi } from '../virial/kernel.js'
import { associationWarnings } from '../virial/model.js'

const phiBuf = new Float64Array(5)
import { gapContaining } from './lle.js'
import { brent } from './roots.js'
import { checkDomain, compileSystem, systemWarnings, type CompiledSystem } from './system.js'
import { threePhaseIsobaric, threePhaseIsothermal } from './three-phase.js'

/** ln α12 at the bubble point of x1 (fixed P or T), without stability checks; NaN when no bubble point. */
function lnAlphaAt(c: CompiledSystem, condition: DiagramCondition, x1: number): number {
  if (c.gv) {
    // γ–φ: ln α = ln(γ1·P1sat/Φ1) − ln(γ2·P2sat/Φ2), defined at the ends too.
    const ok =
      condition.P !== undefined
        ? solveBubbleTGammaPhi(c, c.gv, Math.log(condition.P), x1, phiBuf)
        : solveBubblePGammaPhi(c, c.gv, condition.T, x1, phiBuf)
    if (!ok) return NaN
    const Tv = res[0]
    return (
      Math.log(res[2] / res[3]) +
      (c.vp1.a - c.vp1.b / (Tv + c.vp1.c)) -
      (c.vp2.a - c.vp2.b / (Tv + c.vp2.c)) -
      Math.log(phiBuf[2] / phiBuf[3])
    )
  }
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
 * Every azeotrope at fixed P (Pa) or fixed T (K), ascending in x1.
 * Homogeneous: where α12 = 1 strictly inside 0 < x1 < 1 for a stable single liquid (α = 1 at a pure end, the
 * x–y curve touching the diagonal, is not reported); kind 'minimum-boiling' when α falls through 1,
 * 'maximum-boiling' when it rises. Heterogeneous: the three-phase vapour lies between the two liquids; its x1
 * is that vapour composition, with `liquidPhases` [x1I, x1II]. A single-liquid α = 1 inside the two-liquid
 * region is not physical and is not reported.
 * @throws ThermoError 'out-of-domain' (fixed T) when a vapour-pressure equation has no value at T.
 */
export function findAzeotropes(system: BinarySystem, condition: DiagramCondition): Azeotrope[] {
  const c = compileSystem(system)
  checkCondition(condition)
  if (condition.T !== undefined) checkDomain(c, condition.T)
  // Three-phase points are computed for an ideal vapour only.
  const tp =
    !c.stab.canSplit || c.gv
      ? null
      : condition.P !== undefined
        ? threePhaseIsobaric(c, condition.P)
        : threePhaseIsothermal(c, condition.T)
  const found: Azeotrope[] = []
  let prevX = NaN
  let prevH = NaN
  for (const x of SCAN) {
    const h = lnAlphaAt(c, condition, x)
    const atEnd = x === 0 || x === 1
    if (!Number.isFinite(h) || (atEnd && Math.abs(h) < 1e-9)) continue
    if (Number.isFinite(prevH) && prevH * h < 0) {
      const az = azeotropeBetween(c, condition, prevX, x, prevH > 0)
      const onTie = tp !== null && az.x1 > tp.xI && az.x1 < tp.xII
      const splits = c.stab.maySplit(az.T) && gapContaining(c.stab.gaps(az.T), az.x1) !== null
      if (!onTie && !splits) found.push(az)
    }
    prevX = x
    prevH = h
  }
  if (tp && tp.y1 > tp.xI && tp.y1 < tp.xII) {
    found.push({
      x1: tp.y1,
      T: tp.T,
      P: tp.P,
      kind: 'heterogeneous',
      liquidPhases: [tp.xI, tp.xII],
      warnings: systemWarnings(c, tp.T, 0.5),
    })
  }
  return found.sort((a, b) => a.x1 - b.x1)
}

/**
 * The first azeotrope (smallest x1) of {@link findAzeotropes} at fixed P (Pa) or fixed T (K), or null.
 * @returns x1, T (K), P (Pa), the kind and, for a heterogeneous azeotrope, the two liquids.
 */
export function findAzeotrope(system: BinarySystem, condition: DiagramCondition): Azeotrope | null {
  return findAzeotropes(system, condition)[0] ?? null
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
  // α > 1 below the azeotrope and < 1 above: the vapour is richer in 1 on the left, so the boiling point has a minimum.
  const warnings = systemWarnings(c, T, x1)
  if (c.gv?.chem && c.source.vapor) warnings.push(...associationWarnings(c.source.vapor))
  return { x1, T, P, kind: fallsThrough ? 'minimum-boiling' : 'maximum-boiling', warnings }
}
