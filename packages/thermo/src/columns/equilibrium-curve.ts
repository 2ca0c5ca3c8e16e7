/**
 * The one adapter between the design functions and the equilibrium model: given a constant relative
 * volatility, a BinarySystem at a pressure, or a published x–y table, return y(x), x(y), T(x) and the
 * azeotropes. Systems and tables are tabulated once and interpolated with a monotone cubic, so a design
 * run costs one table of bubble points however many stages it steps.
 */
import { spanWarnings } from '../vapor-pressure/compiled.js'
import { ThermoError } from '../errors.js'
import { bubbleTemperature } from '../equilibrium/index.js'
import type { BinarySystem } from '../types.js'
import { monotoneSpline, type MonotoneSpline } from './monotone-spline.js'
import { twoLiquidCurve } from './two-liquid-curve.js'

/** A row of a published equilibrium table: liquid x1, vapour y1, optionally T in K. */
export interface EquilibriumTableRow {
  x: number
  y: number
  T?: number
}

/** Where equilibrium comes from: constant α (> 1), a BinarySystem at P (Pa), or an x–y table. */
export type EquilibriumSource =
  { alpha: number } | { system: BinarySystem; P: number } | { table: EquilibriumTableRow[] }

/** The equilibrium curve the design functions step on. Component 1 is the more volatile one at its dilute end. */
export interface EquilibriumCurve {
  kind: 'constant-alpha' | 'system' | 'table'
  /** Vapour y1 in equilibrium with liquid x1. */
  y(x: number): number
  /** Liquid x1 in equilibrium with vapour y1 (inverse of y). */
  x(y: number): number
  /** Bubble temperature in K at liquid x1, or null when the source has no temperatures (constant α, bare tables). */
  T(x: number): number | null
  /** Local relative volatility α = y(1 − x)/(x(1 − y)), for 0 < x < 1. */
  alpha(x: number): number
  /** Liquid compositions 0 < x1 < 1 where y = x, ascending. */
  azeotropes: number[]
  /** Short description for assumptions lists, e.g. 'constant relative volatility α = 2.5'. */
  description: string
  /** Warnings from the equilibrium model (e.g. vapour-pressure ranges exceeded), passed on to design results. */
  warnings: string[]
  /**
   * The three-phase segment of a partially miscible system: liquids with x1I < x1 < x1II boil as two layers and
   * are in equilibrium with the three-phase vapour y1 (flat on the x–y curve), at temperature T (K); null otherwise.
   * `heterogeneousAzeotrope` is true when y1 lies between the two liquids (then x1 = y1 is in `azeotropes`).
   */
  twoLiquid?: { x1I: number; x1II: number; y1: number; T: number; heterogeneousAzeotrope: boolean } | null
}

function positive(v: unknown): v is number {
  return typeof v === 'number' && Number.isFinite(v) && v > 0
}

function constantAlphaCurve(alpha: number): EquilibriumCurve {
  if (!(typeof alpha === 'number' && Number.isFinite(alpha) && alpha > 1)) {
    throw new ThermoError(
      'invalid-alpha',
      `The relative volatility alpha must be a number greater than 1 (component 1 the more volatile); got ${String(alpha)}.`,
    )
  }
  return {
    kind: 'constant-alpha',
    y: (x) => (alpha * x) / (1 + (alpha - 1) * x),
    x: (y) => y / (alpha - (alpha - 1) * y),
    T: () => null,
    alpha: () => alpha,
    azeotropes: [],
    description: `constant relative volatility α = ${alpha}`,
    warnings: [],
  }
}

/** Roots of y(x) − x strictly inside (0, 1), found from sign changes on a fine grid and refined by bisection. */
export function findAzeotropes(y: (x: number) => number, grid: number[]): number[] {
  const g = (x: number) => y(x) - x
  const roots: number[] = []
  const inner = grid.filter((x) => x > 1e-6 && x < 1 - 1e-6)
  for (let i = 0; i + 1 < inner.length; i++) {
    let a = inner[i]
    let b = inner[i + 1]
    const ga = g(a)
    if (ga === 0) roots.push(a)
    if (ga * g(b) >= 0) continue
    for (let k = 0; k < 80 && b - a > 1e-13; k++) {
      const m = 0.5 * (a + b)
      if (g(m) * ga > 0) a = m
      else b = m
    }
    roots.push(0.5 * (a + b))
  }
  return roots
}

/** Build a curve from tabulated nodes (x from 0 to 1 included, y increasing). */
function tabulatedCurve(
  kind: 'system' | 'table',
  xs: number[],
  ys: number[],
  Ts: number[] | null,
  description: string,
): EquilibriumCurve {
  const yOfX: MonotoneSpline = monotoneSpline(xs, ys)
  const tOfX = Ts ? monotoneSpline(xs, Ts) : null
  const y = (x: number) => Math.min(1, Math.max(0, yOfX.at(x)))
  const dense = Array.from({ length: 801 }, (_, i) => i / 800)
  return {
    kind,
    y,
    x: (v: number) => yOfX.inverse(v),
    T: (x: number) => (tOfX ? tOfX.at(x) : null),
    alpha: (x: number) => {
      const v = y(x)
      return (v * (1 - x)) / (x * (1 - v))
    },
    azeotropes: findAzeotropes(
      y,
      [...new Set([...xs, ...dense])].sort((a, b) => a - b),
    ),
    description,
    warnings: [],
  }
}

function tableCurve(rows: EquilibriumTableRow[]): EquilibriumCurve {
  if (!Array.isArray(rows) || rows.length < 2)
    throw new ThermoError('invalid-table', 'The equilibrium table needs at least 2 rows.')
  rows.forEach((r, i) => {
    const ok =
      r && [r.x, r.y].every((v) => typeof v === 'number' && v >= 0 && v <= 1) && (r.T === undefined || positive(r.T))
    if (!ok)
      throw new ThermoError(
        'invalid-table',
        `Equilibrium table row ${i + 1}: x and y must be mole fractions between 0 and 1 and T, if given, a positive number of kelvins.`,
      )
    if (i > 0 && !(r.x > rows[i - 1].x && r.y > rows[i - 1].y)) {
      throw new ThermoError(
        'invalid-table',
        `Equilibrium table row ${i + 1}: x and y must both increase from row to row.`,
      )
    }
  })
  const withT = rows.every((r) => r.T !== undefined) && rows[0].x === 0 && rows[rows.length - 1].x === 1
  const full = [
    ...(rows[0].x > 0 ? [{ x: 0, y: 0 }] : []),
    ...rows,
    ...(rows[rows.length - 1].x < 1 ? [{ x: 1, y: 1 }] : []),
  ]
  return tabulatedCurve(
    'table',
    full.map((r) => r.x),
    full.map((r) => r.y),
    withT ? full.map((r) => r.T as number) : null,
    `tabulated x–y equilibrium (${rows.length} rows, monotone cubic interpolation)`,
  )
}

/** Tabulation nodes clustered at both ends, where non-ideal curves bend most. */
export const SYSTEM_NODES = 161

/**
 * Tabulate bubble points of the system at P on nodes clustered at both ends (x = (1 − cos πi/N)/2), where
 * non-ideal curves bend most. Interpolation error is below 1e-5 in y for the systems in the tests.
 */
function systemCurve(system: BinarySystem, P: number): EquilibriumCurve {
  if (!positive(P))
    throw new ThermoError('invalid-input', `Pressure must be a positive number of pascals; got ${String(P)}.`)
  const xs = Array.from({ length: SYSTEM_NODES }, (_, i) =>
    i === 0 ? 0 : i === SYSTEM_NODES - 1 ? 1 : 0.5 * (1 - Math.cos((Math.PI * i) / (SYSTEM_NODES - 1))),
  )
  const ys: number[] = []
  const Ts: number[] = []
  const warnings = new Set<string>()
  let tie: [number, number] | null = null
  for (const x of xs) {
    const b = bubbleTemperature(system, { P, x1: x })
    ys.push(b.y1)
    Ts.push(b.T)
    if (b.liquidPhases) tie = b.liquidPhases
    b.warnings.forEach((w) => warnings.add(w))
  }
  if (tie) return twoLiquidCurve(system, P, xs, ys, Ts, tie, [...warnings])
  const bad = ys.findIndex((y, i) => i > 0 && !(y > ys[i - 1]))
  if (bad > 0) {
    throw new ThermoError(
      'non-monotone-equilibrium',
      `The model's vapour composition does not rise with x1 near x1 = ${xs[bad].toFixed(3)}; stage calculations need y1 increasing with x1.`,
    )
  }
  const names = system.names ? `${system.names[0]}–${system.names[1]}, ` : ''
  const curve = tabulatedCurve(
    'system',
    xs,
    ys,
    Ts,
    `${names}${system.activity.kind} activity model at ${(P / 1000).toFixed(3)} kPa, ${system.vapor?.kind === 'virial' ? `virial vapour (${system.vapor.correlation === 'hayden-oconnell' ? "Hayden–O'Connell" : 'Tsonopoulos'})` : 'ideal vapour'}`,
  )
  // One line per component for the whole temperature span, not one per tabulated node.
  const pointwise = [...warnings].filter((w) => !w.includes('outside the range of its vapour-pressure correlation'))
  curve.warnings.push(
    ...pointwise,
    ...spanWarnings(system.vaporPressure, Math.min(...Ts), Math.max(...Ts), system.names),
  )
  return curve
}

/**
 * Equilibrium curve for the design functions.
 * @param source `{ alpha }` (constant relative volatility > 1), `{ system, P }` (P in Pa) or `{ table }` (x, y rows, ends added)
 * @throws ThermoError for α ≤ 1, a bad pressure or a table that is not increasing
 */
export function equilibriumCurve(source: EquilibriumSource): EquilibriumCurve {
  if (source && 'alpha' in source) return constantAlphaCurve(source.alpha)
  if (source && 'system' in source) return systemCurve(source.system, source.P)
  if (source && 'table' in source) return tableCurve(source.table)
  throw new ThermoError('invalid-equilibrium', 'Give the equilibrium as { alpha }, { system, P } or { table }.')
}
