/**
 * Control limits and run rules of an individuals chart (one result per check, plotted in time order).
 * Centre line and σ come from the first `baselineCount` results (the lab's reference period); later results
 * are judged against them. The run rules are the four Western Electric zone rules
 * (Western Electric Co., Statistical Quality Control Handbook, 1956, section 1-B), named in plain words.
 */
import { ThermoError } from '../errors.js'

/** One run rule a result broke. */
export type ControlRule = 'beyond-3-sigma' | '2-of-3-beyond-2-sigma' | '4-of-5-beyond-1-sigma' | '8-on-one-side'

/** What each rule means, in the words shown to a chemist. */
export const CONTROL_RULE_TEXT: Record<ControlRule, string> = {
  'beyond-3-sigma': 'one result beyond the 3σ limit',
  '2-of-3-beyond-2-sigma': '2 of 3 results in a row beyond 2σ on the same side',
  '4-of-5-beyond-1-sigma': '4 of 5 results in a row beyond 1σ on the same side',
  '8-on-one-side': '8 results in a row on the same side of the centre line',
}

export interface ControlChartOptions {
  /** results in time order (any unit; the limits come out in the same unit) */
  values: readonly number[]
  /** how many of the first results set the centre line and σ; default min(20, all), at least 2 */
  baselineCount?: number
  /** a known centre (e.g. the reference value) instead of the baseline mean */
  centre?: number
  /** a known σ instead of the baseline's sample standard deviation */
  sigma?: number
}

export interface ControlChartResult {
  centre: number
  sigma: number
  /** number of results the centre and σ were taken from (0 when both were given) */
  baselineCount: number
  limits: { lower3: number; lower2: number; upper2: number; upper3: number }
  /** per result (same order as `values`): the rules it broke (empty when in control) */
  flags: ControlRule[][]
  /** indices of results that broke at least one rule */
  outOfControl: number[]
}

/** Centre line, ±2σ/±3σ limits and the Western Electric rule flags of an individuals chart. */
export function controlChart(o: ControlChartOptions): ControlChartResult {
  const v = o.values
  if (v.some((x) => !Number.isFinite(x)))
    throw new ThermoError('invalid-input', 'Every control-chart result must be a finite number.')
  const needBaseline = o.centre === undefined || o.sigma === undefined
  const n = needBaseline ? Math.min(o.baselineCount ?? 20, v.length) : 0
  if (needBaseline && n < 2)
    throw new ThermoError(
      'invalid-input',
      'A control chart needs at least 2 results to set its centre line and limits.',
    )
  const base = v.slice(0, n)
  const mean = base.reduce((s, x) => s + x, 0) / Math.max(n, 1)
  const centre = o.centre ?? mean
  // sample standard deviation about the baseline mean (n − 1): common practice, no source
  const sd = n >= 2 ? Math.sqrt(base.reduce((s, x) => s + (x - mean) ** 2, 0) / (n - 1)) : 0
  const sigma = o.sigma ?? sd
  const z = v.map((x) => (sigma > 0 ? (x - centre) / sigma : x === centre ? 0 : Math.sign(x - centre) * Infinity))
  const flags: ControlRule[][] = v.map(() => [])
  const side = (i: number) => Math.sign(z[i])
  for (let i = 0; i < v.length; i++) {
    if (Math.abs(z[i]) > 3) flags[i].push('beyond-3-sigma')
    if (countBeyond(z, i, 3, 2) >= 2 && Math.abs(z[i]) > 2) flags[i].push('2-of-3-beyond-2-sigma')
    if (countBeyond(z, i, 5, 1) >= 4 && Math.abs(z[i]) > 1) flags[i].push('4-of-5-beyond-1-sigma')
    if (i >= 7 && side(i) !== 0 && [...Array(8).keys()].every((k) => side(i - k) === side(i)))
      flags[i].push('8-on-one-side')
  }
  return {
    centre,
    sigma,
    baselineCount: n,
    limits: {
      lower3: centre - 3 * sigma,
      lower2: centre - 2 * sigma,
      upper2: centre + 2 * sigma,
      upper3: centre + 3 * sigma,
    },
    flags,
    outOfControl: flags.flatMap((f, i) => (f.length ? [i] : [])),
  }
}

/** How many of the `window` results ending at i lie beyond `k`σ on the same side as result i. */
function countBeyond(z: readonly number[], i: number, window: number, k: number): number {
  if (i < window - 1) return 0
  const s = Math.sign(z[i])
  let c = 0
  for (let j = i - window + 1; j <= i; j++) if (Math.sign(z[j]) === s && Math.abs(z[j]) > k) c++
  return c
}
