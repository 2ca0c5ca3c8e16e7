import { checkPressure, ThermoError } from '../errors.js'
import type { FitBinaryResult } from './fit-binary.js'
import { invertSymmetric } from './linear-algebra.js'
import { checkCount, sensitivities, variance } from './prediction.js'

/** A suggested next measurement: liquid x1, its bubble T (K) and predicted y1, and σy before measuring there. */
export interface SuggestedComposition {
  x1: number
  T: number
  y1: number
  sigmaY: number
}

/** How {@link suggestNextCompositions} ranks a candidate composition. */
export type SuggestionCriterion = 'sigma-y' | 'd-optimal'

/** What to plan for: the pressure, how many picks, how to rank them, where to look and what to keep away from. */
export interface NextMeasurementOptions {
  /** pressure of the planned measurements, Pa */
  P: number
  /** how many compositions to suggest, 1–20 */
  count: number
  /** ranking, default 'sigma-y' */
  criterion?: SuggestionCriterion
  /** the liquid compositions x1 to search, [from, to] with 0 ≤ from < to ≤ 1, at least 0.01 wide; default [0, 1] */
  range?: [number, number]
  /** x1 of the points already measured: no pick lies closer to any of them than `exclusion` */
  measured?: number[]
  /** least distance in x1 of a pick from a measured point and from another pick, 0–0.5; default 0.02 */
  exclusion?: number
}

/** The suggestions with what bounded them, and plain notes where they fall short of what was asked. */
export interface NextMeasurementPlan {
  items: SuggestedComposition[]
  range: [number, number]
  exclusion: number
  /** candidates searched: the grid inside the range, minus those too close to a measured point */
  candidates: number
  notes: string[]
}

/** x1 below this or above 1 − this counts as a dilute end in the notes (common practice, no source). */
export const DILUTE_END = 0.15

/** det(I₂ + UᵀCU)/… for the two rows u1 = gT/σT, u2 = gY/σY of one hypothetical point, scaled by 1/s². */
function determinantGain(
  cov: number[][],
  gT: Float64Array,
  gY: Float64Array,
  wT: number,
  wY: number,
  s2: number,
): number {
  const m = gT.length
  let tt = 0
  let ty = 0
  let yy = 0
  for (let i = 0; i < m; i++)
    for (let j = 0; j < m; j++) {
      tt += gT[i] * cov[i][j] * gT[j]
      ty += gT[i] * cov[i][j] * gY[j]
      yy += gY[i] * cov[i][j] * gY[j]
    }
  const a = 1 + (tt * wT * wT) / s2
  const d = 1 + (yy * wY * wY) / s2
  const b = (ty * wT * wY) / s2
  return a * d - b * b
}

function checkOptions(o: NextMeasurementOptions): { range: [number, number]; exclusion: number } {
  checkPressure(o.P)
  checkCount('suggestions', o.count, 1, 20)
  const criterion = o.criterion ?? 'sigma-y'
  if (criterion !== 'sigma-y' && criterion !== 'd-optimal') {
    throw new ThermoError(
      'invalid-input',
      `The suggestion criterion must be 'sigma-y' or 'd-optimal'; got ${String(criterion)}.`,
    )
  }
  const [from, to] = o.range ?? [0, 1]
  if (!(from >= 0 && to <= 1 && to - from >= 0.01 - 1e-12)) {
    throw new ThermoError(
      'invalid-input',
      `The composition range must lie within 0–1 and be at least 0.01 wide; got ${String(from)}–${String(to)}.`,
    )
  }
  const exclusion = o.exclusion ?? 0.02
  if (!(exclusion >= 0 && exclusion <= 0.5)) {
    throw new ThermoError(
      'invalid-input',
      `The least distance from measured points must be from 0 to 0.5 in x1; got ${String(exclusion)}.`,
    )
  }
  if ((o.measured ?? []).some((x) => !(x >= 0 && x <= 1))) {
    throw new ThermoError('invalid-input', 'Every measured x1 must be a number from 0 to 1.')
  }
  return { range: [from, to], exclusion }
}

/**
 * Candidate compositions: every 0.005 in x1 inside the range (every 0.001 in a range under 0.1 wide), plus the
 * range's own ends, kept within 0.001–0.999 (a pure component carries no information about the mixture).
 * Rounded to 1e-4 so the list reads as typed.
 */
function candidateGrid([from, to]: [number, number]): number[] {
  const lo = Math.max(from, 0.001)
  const hi = Math.min(to, 0.999)
  const step = to - from >= 0.1 ? 0.005 : 0.001
  const xs = new Set<number>()
  for (let k = Math.ceil(lo / step - 1e-9); k * step <= hi + 1e-9; k++) xs.add(Math.round(k * step * 1e4) / 1e4)
  xs.add(Math.round(lo * 1e4) / 1e4)
  xs.add(Math.round(hi * 1e4) / 1e4)
  return [...xs].filter((x) => x >= lo - 1e-12 && x <= hi + 1e-12).sort((a, b) => a - b)
}

/**
 * Where to measure next, with the limits the lab sets: a composition range to search and a least distance
 * from the points already measured. Candidates (every 0.005 in x1 inside the range, 0.001 in a narrow one) are chosen greedily
 * (sequential design): rank every candidate, pick the best, add a hypothetical measurement there (σT, σy as in
 * the fit) to the parameter information, and repeat. Picks keep the exclusion distance from the measured x1 and
 * max(exclusion, min(0.05, 0.5/count)) from each other. Best first.
 * Criteria: 'sigma-y' (default) picks the largest predicted σy of the curve; 'd-optimal' picks the
 * largest reduction of det(covariance), i.e. the largest det(I + UᵀCU) for the point's T and y rows U
 * (A. C. Atkinson, A. N. Donev, Optimum Experimental Designs, 1992, ch. 11; from memory). D-optimal picks
 * usually lie toward the dilute ends, where the activity coefficients are largest, but not at the very ends:
 * there T and y hardly depend on the parameters (their sensitivities vanish with the dilute component's
 * fraction). When no pick lands in a dilute end, a note says so; a range there asks for it anyway.
 * Pure: the same fit and options always give the same plan.
 */
export function planNextMeasurements(fit: FitBinaryResult, options: NextMeasurementOptions): NextMeasurementPlan {
  const { range, exclusion } = checkOptions(options)
  const criterion = options.criterion ?? 'sigma-y'
  const measured = options.measured ?? []
  const m = fit.covariance.length
  const info = new Float64Array(m * m)
  fit.covariance.forEach((row, i) => row.forEach((v, j) => (info[i * m + j] = v)))
  const inv = invertSymmetric(info, m)
  if (!inv)
    throw new ThermoError('no-covariance', 'The fit has no usable covariance, so no next measurement can be suggested.')
  const tooClose = (x: number, others: number[], d: number) => others.some((o) => Math.abs(o - x) < d - 1e-9)
  const grid = candidateGrid(range).filter((x) => !tooClose(x, measured, exclusion))
  const rows = grid.length ? sensitivities(fit, options.P, grid) : []
  const { sigmaT, sigmaY, residualVariance } = fit.settings
  const s2 = Number.isFinite(residualVariance) && residualVariance > 0 ? residualVariance : 1
  const spacing = Math.max(exclusion, Math.min(0.05, 0.5 / options.count))
  const items: SuggestedComposition[] = []
  let cov = fit.covariance
  for (let k = 0; k < options.count; k++) {
    let best = -1
    let bestScore = -Infinity
    const taken = items.map((p) => p.x1)
    rows.forEach((r, i) => {
      if (tooClose(r.x1, taken, spacing)) return
      const score =
        criterion === 'sigma-y' ? variance(cov, r.gY) : determinantGain(cov, r.gT, r.gY, 1 / sigmaT, 1 / sigmaY, s2)
      // Strictly greater: ties go to the lower x1, so the list is reproducible.
      if (score > bestScore) {
        bestScore = score
        best = i
      }
    })
    if (best < 0) break
    const r = rows[best]
    items.push({ x1: r.x1, T: r.T, y1: r.y1, sigmaY: Math.sqrt(variance(cov, r.gY)) })
    // Information of the hypothetical point: its T and y rows, weighted as the fit weighted its data.
    for (let i = 0; i < m; i++)
      for (let j = 0; j < m; j++) {
        inv[i * m + j] += ((r.gT[i] * r.gT[j]) / (sigmaT * sigmaT) + (r.gY[i] * r.gY[j]) / (sigmaY * sigmaY)) / s2
      }
    const next = invertSymmetric(inv, m)
    if (!next) break
    cov = Array.from({ length: m }, (_, i) => Array.from({ length: m }, (_, j) => next[i * m + j]))
  }
  const notes = planNotes(items, grid, options, range, exclusion, spacing)
  return { items, range, exclusion, candidates: grid.length, notes }
}

const x = (v: number) => v.toFixed(2)

/** Plain sentences where the plan falls short of what was asked, so the screen never claims more than it did. */
function planNotes(
  items: SuggestedComposition[],
  grid: number[],
  o: NextMeasurementOptions,
  range: [number, number],
  exclusion: number,
  spacing: number,
): string[] {
  const notes: string[] = []
  const where = `x1 = ${x(range[0])}–${x(range[1])}`
  if (items.length === 0) {
    notes.push(
      `No composition in ${where} is at least ${x(exclusion)} from every measured point; widen the range or shorten the distance.`,
    )
  } else if (items.length < o.count) {
    notes.push(
      `Only ${items.length} of the ${o.count} compositions asked for fit in ${where} at least ${x(exclusion)} from the measured points and ${x(spacing)} from each other.`,
    )
  }
  const isDilute = (v: number) => v < DILUTE_END || v > 1 - DILUTE_END
  const reachesDilute = range[0] < DILUTE_END || range[1] > 1 - DILUTE_END
  if (
    (o.criterion ?? 'sigma-y') !== 'd-optimal' ||
    items.length === 0 ||
    !reachesDilute ||
    items.some((p) => isDilute(p.x1))
  )
    return notes
  if (!grid.some(isDilute)) {
    notes.push(
      `Every composition at a dilute end (x1 below ${x(DILUTE_END)} or above ${x(1 - DILUTE_END)}) in the range is within ${x(exclusion)} of a measured point, so none is suggested there.`,
    )
  } else {
    notes.push(
      `None of these lies at a dilute end (x1 below ${x(DILUTE_END)} or above ${x(1 - DILUTE_END)}): for this fit, points there would pin the parameters less than the ones listed. Choose a range there to plan them anyway.`,
    )
  }
  return notes
}

/** {@link planNextMeasurements}, the suggestions only. */
export function suggestNextCompositions(fit: FitBinaryResult, options: NextMeasurementOptions): SuggestedComposition[] {
  return planNextMeasurements(fit, options).items
}
