/**
 * The equilibrium curve of a partially miscible system at P: liquids on the three-phase tie line
 * (x1I < x1 < x1II) boil as two layers with the three-phase vapour y3, so the x–y curve is flat there. The
 * curve is built as three pieces — a monotone cubic on each single-liquid branch (tabulated nodes plus the
 * tie-line end, which has the vapour y3 exactly) and the flat segment — so no interpolation smooths the
 * corners. The inverse x(y) is exact on each branch; for y = y3 exactly it returns x1I.
 */
import { ThermoError } from '../errors.js'
import { bubbleTemperature } from '../equilibrium/index.js'
import { spanWarnings } from '../vapor-pressure/compiled.js'
import type { BinarySystem } from '../types.js'
import type { EquilibriumCurve } from './equilibrium-curve.js'
import { findAzeotropes } from './equilibrium-curve.js'
import { monotoneSpline } from './monotone-spline.js'

function branch(xs: number[], ys: number[], Ts: number[]) {
  const bad = ys.findIndex((y, i) => i > 0 && !(y > ys[i - 1]))
  if (bad > 0) {
    throw new ThermoError(
      'non-monotone-equilibrium',
      `The model's vapour composition does not rise with x1 near x1 = ${xs[bad].toFixed(3)}; stage calculations need y1 increasing with x1.`,
    )
  }
  return { y: monotoneSpline(xs, ys), T: monotoneSpline(xs, Ts) }
}

/** Build the three-piece curve from the tabulated bubble points (nodes inside the tie line are dropped). */
export function twoLiquidCurve(
  system: BinarySystem,
  P: number,
  xs: number[],
  ys: number[],
  Ts: number[],
  tie: [number, number],
  pointwise: string[],
): EquilibriumCurve {
  const [xI, xII] = tie
  const at = bubbleTemperature(system, { P, x1: 0.5 * (xI + xII) })
  const y3 = at.y1
  const T3 = at.T
  // The branches bend most where they meet the tie line: add nodes clustered towards both tie ends.
  xs = [...xs]
  ys = [...ys]
  Ts = [...Ts]
  for (let k = 1; k <= 12; k++) {
    const f = (k / 12) ** 2
    for (const x of [xI - 0.08 * xI * f, xII + 0.3 * (1 - xII) * f]) {
      const b = bubbleTemperature(system, { P, x1: x })
      xs.push(x)
      ys.push(b.y1)
      Ts.push(b.T)
    }
  }
  const order = xs.map((_, i) => i).sort((a, b) => xs[a] - xs[b])
  ;[xs, ys, Ts] = [order.map((i) => xs[i]), order.map((i) => ys[i]), order.map((i) => Ts[i])]
  const pick = (keep: (x: number) => boolean) =>
    xs.flatMap((x, i) => (keep(x) && (i === 0 || x > xs[i - 1]) ? [i] : []))
  const li = pick((x) => x < xI)
  const ri = pick((x) => x > xII)
  const left = branch([...li.map((i) => xs[i]), xI], [...li.map((i) => ys[i]), y3], [...li.map((i) => Ts[i]), T3])
  const right = branch([xII, ...ri.map((i) => xs[i])], [y3, ...ri.map((i) => ys[i])], [T3, ...ri.map((i) => Ts[i])])
  const y = (x: number) => Math.min(1, Math.max(0, x <= xI ? left.y.at(x) : x >= xII ? right.y.at(x) : y3))
  const dense = Array.from({ length: 801 }, (_, i) => i / 800)
  const grid = [...new Set([...xs, ...dense])].sort((a, b) => a - b)
  const homogeneous = [
    ...findAzeotropes(
      y,
      grid.filter((x) => x < xI),
    ),
    ...findAzeotropes(
      y,
      grid.filter((x) => x > xII),
    ),
  ]
  const heterogeneousAzeotrope = y3 > xI && y3 < xII
  const azeotropes = [...homogeneous, ...(heterogeneousAzeotrope ? [y3] : [])].sort((a, b) => a - b)
  const names = system.names ? `${system.names[0]}–${system.names[1]}, ` : ''
  const curve: EquilibriumCurve = {
    kind: 'system',
    y,
    x: (v: number) => (v <= y3 ? left.y.inverse(v) : right.y.inverse(v)),
    T: (x: number) => (x <= xI ? left.T.at(x) : x >= xII ? right.T.at(x) : T3),
    alpha: (x: number) => {
      const v = y(x)
      return (v * (1 - x)) / (x * (1 - v))
    },
    azeotropes,
    description: `${names}${system.activity.kind} activity model at ${(P / 1000).toFixed(3)} kPa, ideal vapour, two liquid layers for ${xI.toFixed(4)} < x1 < ${xII.toFixed(4)}`,
    warnings: [],
    twoLiquid: { x1I: xI, x1II: xII, y1: y3, T: T3, heterogeneousAzeotrope },
  }
  curve.warnings.push(
    `Liquids with ${xI.toFixed(4)} < x1 < ${xII.toFixed(4)} separate into two layers at their boiling point (${(T3 - 273.15).toFixed(2)} °C); their vapour is the three-phase vapour y1 = ${y3.toFixed(4)}, the flat part of the x–y curve. Stages there hold two liquid layers, whose tray efficiencies are lower and less predictable.`,
    ...pointwise.filter((w) => !w.includes('outside the range of its vapour-pressure correlation')),
    ...spanWarnings(system.vaporPressure, Math.min(...Ts), Math.max(...Ts), system.names),
  )
  return curve
}
