/**
 * One data-quality figure per data set and per point, combining four published tests in the way of
 * J. W. Kang et al., J. Chem. Eng. Data 55 (2010) 3631 (from memory: four tests that each contribute up to 0.25,
 * so a data set that passes all four scores 1). Each test's own limit is named beside it with its source; where a
 * published limit is not at hand the limit is Ebullio's own and says so. Scores decay as limit/value above the
 * limit (Ebullio's choice, so that a near miss still counts for something).
 */
import { activityCoefficients } from '../activity/activity.js'
import { ThermoError } from '../errors.js'
import type { BinaryPoint } from '../fitting/fit-input.js'
import { compileVaporPressure } from '../vapor-pressure/compiled.js'
import { compiledVapor } from '../fitting/fit-input.js'
import { lnPhiFactors } from '../virial/kernel.js'
import { requireVapourCompositions } from './area-integrand.js'
import type { ActivityModel } from '../types.js'
import { heringtonAreaTest } from './herington.js'
import { pointTest, type PointTestOptions } from './point-test.js'
import { pureComponentCheck, PURE_COMPONENT_TOLERANCE } from './pure-component.js'
import { redlichKisterAreaTest } from './redlich-kister.js'

/** One test's part of the quality figure. */
export interface QualityTestScore {
  test: 'area' | 'point' | 'infinite-dilution' | 'end-point'
  /** False when the data cannot be judged by this test (then it does not count in the figure). */
  applicable: boolean
  /** What was compared, in words, and the value found. */
  value: number
  limit: number
  passed: boolean
  /** 0 … 0.25. */
  score: number
  source: string
  detail: string
}

/** Result of {@link dataQualityScore}. */
export interface DataQualityScore {
  /** The combined figure, 0 … 1: the sum of the applicable tests' scores over 0.25 × their number. */
  quality: number
  tests: QualityTestScore[]
  /**
   * One figure per tested point, worst first: 1 when its point-test |Δy| is within 0.01, else 0.01/|Δy|
   * (dy = y measured − y calculated from the T–x fit), and how much the data set's figure would rise without it
   * (leave-one-out; 0 when the set already scores 1).
   */
  points: { index: number; dy: number; quality: number; gainIfExcluded: number }[]
  warnings: string[]
}

const SHARE = 0.25

function part(value: number, limit: number): number {
  if (!Number.isFinite(value)) return 0
  return value <= limit ? SHARE : SHARE * (limit / value)
}

/** Limiting ln γ∞ of the data at one end: gE/(x1·x2·RT) from the three most dilute points, extrapolated linearly. */
function dataLimit(
  points: BinaryPoint[],
  psat: (i: 0 | 1, T: number) => number,
  lnPhi: (p: { T: number; P: number; y1: number }) => [number, number],
  end: 0 | 1,
): { value: number; T: number } | null {
  const mix = points
    .filter(
      (p): p is BinaryPoint & { y1: number } =>
        !p.excluded && p.x1 > 0 && p.x1 < 1 && p.y1 !== null && p.y1 > 0 && p.y1 < 1,
    )
    .sort((a, b) => (end === 0 ? a.x1 - b.x1 : b.x1 - a.x1))
    .slice(0, 3)
  if (mix.length < 2) return null
  const xs: number[] = []
  const gs: number[] = []
  for (const p of mix) {
    const x2 = 1 - p.x1
    const [f1, f2] = lnPhi(p)
    const l1 = Math.log((p.y1 * p.P) / (p.x1 * psat(0, p.T))) + f1
    const l2 = Math.log(((1 - p.y1) * p.P) / (x2 * psat(1, p.T))) + f2
    xs.push(p.x1)
    gs.push((p.x1 * l1 + x2 * l2) / (p.x1 * x2))
  }
  const n = xs.length
  const mx = xs.reduce((s, v) => s + v, 0) / n
  const my = gs.reduce((s, v) => s + v, 0) / n
  const sxx = xs.reduce((s, v) => s + (v - mx) ** 2, 0)
  const slope = sxx > 0 ? xs.reduce((s, v, i) => s + (v - mx) * (gs[i] - my), 0) / sxx : 0
  return { value: my + slope * (end - mx), T: mix[0].T }
}

function combined(tests: QualityTestScore[]): number {
  const ran = tests.filter((t) => t.applicable)
  return ran.length ? ran.reduce((s, t) => s + t.score, 0) / (SHARE * ran.length) : 0
}

/** Options: the vapour-pressure models and the model the point test fits (as for {@link pointTest}). */
export type DataQualityOptions = PointTestOptions & {
  /** Isothermal data use the Redlich–Kister area test; default: decided from the spread of T and P. */
  isothermal?: boolean
}

function scoreOnce(
  points: BinaryPoint[],
  o: DataQualityOptions,
): { tests: QualityTestScore[]; warnings: string[]; dy: number[] } {
  const warnings: string[] = []
  const kept = points.filter((p) => !p.excluded)
  const Ts = kept.map((p) => p.T)
  const isothermal = o.isothermal ?? Math.max(...Ts) - Math.min(...Ts) < 0.5
  const tests: QualityTestScore[] = []

  // 1. Area test. Herington (isobaric): D − J < 10; Redlich–Kister (isothermal): D < 10.
  if (isothermal) {
    const a = redlichKisterAreaTest(points, o)
    tests.push({
      test: 'area',
      applicable: true,
      value: a.D,
      limit: 10,
      passed: a.passed,
      score: part(a.D, 10),
      source: 'Redlich & Kister, Ind. Eng. Chem. 40 (1948) 345; limit D < 10 after Herington (1951), from memory',
      detail: `Redlich–Kister area test: D = ${a.D.toFixed(1)} %`,
    })
  } else {
    const a = heringtonAreaTest(points, o)
    const v = Math.max(0, a.D - a.J)
    tests.push({
      test: 'area',
      applicable: true,
      value: a.D - a.J,
      limit: 10,
      passed: a.passed,
      score: part(v, 10),
      source: 'Herington, J. Inst. Petrol. 37 (1951) 457: D − J < 10 (from memory)',
      detail: `Herington area test: D − J = ${(a.D - a.J).toFixed(1)}`,
    })
  }

  // 2. Point test: mean |Δy| < 0.01.
  const pt = pointTest(points, { ...o, isothermal })
  tests.push({
    test: 'point',
    applicable: true,
    value: pt.meanAbsDeltaY,
    limit: 0.01,
    passed: pt.passed,
    score: part(pt.meanAbsDeltaY, 0.01),
    source: 'Van Ness, Byer & Gibbs, AIChE J. 19 (1973) 238: mean |Δy| < 0.01 (limit from memory)',
    detail: `point test: mean |Δy| = ${pt.meanAbsDeltaY.toFixed(4)}`,
  })

  // 3. Infinite dilution: the data's limiting gE/(x1x2RT) at each end against the T–x model's ln γ∞.
  const vps = o.vaporPressure.map(compileVaporPressure)
  const psat = (i: 0 | 1, T: number) => Math.exp(vps[i].a - vps[i].b / (T + vps[i].c))
  const gv = compiledVapor(o.vapor)
  const phiOut = new Float64Array(4)
  const lnPhi = (p: { T: number; P: number; y1: number }): [number, number] => {
    if (!gv) return [0, 0]
    lnPhiFactors(gv, p.T, p.P, p.y1, psat(0, p.T), psat(1, p.T), phiOut)
    return [phiOut[0], phiOut[1]]
  }
  const devs: number[] = []
  for (const end of [0, 1] as const) {
    const d = dataLimit(points, psat, lnPhi, end)
    if (!d) continue
    const g = activityCoefficients(pt.activity as ActivityModel, { x1: end, T: d.T })
    const model = Math.log(end === 0 ? g[0] : g[1])
    if (Math.abs(model) < 0.05) continue // nearly ideal at this end: a relative deviation means nothing
    devs.push(Math.abs((d.value - model) / model))
  }
  const worst = devs.length ? Math.max(...devs) : NaN
  if (!devs.length)
    warnings.push('The infinite-dilution test needs two mixture points near an end of a non-ideal system.')
  tests.push({
    test: 'infinite-dilution',
    applicable: devs.length > 0,
    value: worst,
    limit: 0.3,
    passed: worst <= 0.3,
    score: part(worst, 0.3),
    source:
      'Kang et al., J. Chem. Eng. Data 55 (2010) 3631: limiting behaviour of the data against the model (30 % limit from memory)',
    detail: devs.length
      ? `infinite dilution: largest relative deviation ${(100 * worst).toFixed(0)} %`
      : 'infinite dilution: not enough dilute points',
  })

  // 4. End points: measured pure boiling points against the vapour-pressure correlations (0.3 K). Without measured
  // pure points the test does not apply (extrapolating T–x to an end is too crude near a steep end).
  const pure = pureComponentCheck(points, o)
  const endDev = pure.checks.length ? Math.max(...pure.checks.map((c) => Math.abs(c.dT))) : NaN
  tests.push({
    test: 'end-point',
    applicable: pure.checks.length > 0,
    value: endDev,
    limit: PURE_COMPONENT_TOLERANCE,
    passed: endDev <= PURE_COMPONENT_TOLERANCE,
    score: part(endDev, PURE_COMPONENT_TOLERANCE),
    source: 'Ebullio: measured pure boiling points within 0.3 K of the correlations (common practice, no source)',
    detail: pure.checks.length
      ? `end points: measured pure boiling points within ${endDev.toFixed(2)} K of the vapour-pressure correlations`
      : 'end points: no measured pure-component points, the test does not apply',
  })
  const dy = pt.residuals.map((r) => r.y1 - r.yCalculated) // measured − calculated
  return { tests, dy, warnings: [...warnings, ...pure.warnings.filter((w) => !w.startsWith('No pure'))] }
}

/**
 * The data-quality figure of a data set (0 … 1) and its four parts, and for each included point how much the figure
 * would rise without it (leave-one-out), so a reviewer sees which points hurt the score most.
 * Under a virial vapour (`vapor` in the options) every test uses it.
 * @param points T in K, P in Pa, mole fractions; at least 3 mixture points with measured y.
 * @throws ThermoError 'needs-vapour-composition' when a mixture point has no y.
 */
export function dataQualityScore(points: BinaryPoint[], options: DataQualityOptions): DataQualityScore {
  if (!Array.isArray(points)) throw new ThermoError('invalid-input', 'Points must be an array.')
  requireVapourCompositions(points, 'data-quality score')
  const { tests, warnings, dy } = scoreOnce(points, options)
  const quality = combined(tests)
  const out: DataQualityScore['points'] = []
  points.forEach((p, index) => {
    if (p.excluded || !Number.isFinite(dy[index])) return
    let gainIfExcluded = 0
    try {
      const without = scoreOnce(
        points.map((q, i) => (i === index ? { ...q, excluded: true } : q)),
        options,
      )
      gainIfExcluded = combined(without.tests) - quality
    } catch {
      // too few points left for a test: this point cannot be judged by leaving it out
    }
    out.push({ index, dy: dy[index], quality: part(Math.abs(dy[index]), 0.01) / SHARE, gainIfExcluded })
  })
  out.sort((a, b) => a.quality - b.quality || b.gainIfExcluded - a.gainIfExcluded)
  return { quality, tests, points: out, warnings }
}
