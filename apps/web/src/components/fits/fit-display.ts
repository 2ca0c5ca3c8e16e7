/**
 * How a fit's parameters and its standing among the other fits are shown: symbols (α, never "alpha"),
 * a parameter sitting on its bound (no ±), and which fits may take part in the AIC comparison and be recommended.
 */
import { engineVaporDimerises, virialCorrelationLabel } from '@ebullio/schemas'
import type { Fit } from '../../api/datasets'

/**
 * Practical range of NRTL's α when it is fitted, as documented in packages/thermo (0.1 to 0.7). Used only when
 * the fit itself does not say whether a parameter reached its bound.
 */
export const NRTL_ALPHA_BOUNDS: readonly [number, number] = [0.1, 0.7]

/** Display symbol of a parameter: "α" for alpha, the name otherwise. */
export const paramSymbol = (name: string): string => (name === 'alpha' ? 'α' : name)

type Param = Fit['parameters'][number] & { atBound?: unknown; bound?: unknown; atLimit?: unknown }

/**
 * True when the parameter sits on (or past) a bound of its search range: the fit's own mark when it carries one
 * (thermo's `atBound` on the parameter, also `bound` or `atLimit`, or a parameter name listed in `statistics.atBound`),
 * else α outside NRTL_ALPHA_BOUNDS (within 1e-6; earlier fits ran α up to 1).
 */
export function atBound(f: Fit, p: Fit['parameters'][number]): boolean {
  const q = p as Param
  for (const k of ['atBound', 'atLimit'] as const) if (typeof q[k] === 'boolean') return q[k] as boolean
  if (typeof q.bound === 'string' || typeof q.bound === 'number') return true
  const listed = (f.statistics as Record<string, unknown>)?.atBound
  if (Array.isArray(listed)) return listed.includes(p.name)
  if (p.name !== 'alpha') return false
  const [lo, hi] = NRTL_ALPHA_BOUNDS
  return p.value <= lo + 1e-6 || p.value >= hi - 1e-6
}

/** "b12 = 949.3 ± 71.5" or "α = 0.7000 (at bound)": a ± on a parameter held by its bound means nothing. */
export function paramValueText(f: Fit, p: Fit['parameters'][number]): string {
  const digits = Math.abs(p.value) >= 100 ? 1 : 4
  if (atBound(f, p)) return `${p.value.toFixed(digits)} (at bound)`
  const se = p.standardError as number | null | undefined
  return typeof se === 'number' && Number.isFinite(se)
    ? `${p.value.toFixed(digits)} ± ${se.toFixed(digits)}`
    : p.value.toFixed(digits)
}

/** The solver's verdict: true, false, or null when the fit does not say. */
export function convergedOf(f: Fit): boolean | null {
  const v = (f.statistics as Record<string, unknown>)?.converged ?? (f.options as Record<string, unknown>)?.converged
  return v === undefined ? null : v === true
}

/**
 * Why this fit cannot be recommended nor compared on AIC, or null when it can: a fit the solver did not
 * converge has parameters that are not a minimum, so its AIC says nothing about the model.
 */
export function notComparableReason(f: Fit): string | null {
  // AIC compares fits on the same points only: a fit computed on other points is not compared.
  if (f.stale)
    return 'Computed on other points than the data set has now: run it again to compare it on AIC or recommend it.'
  return convergedOf(f) === false
    ? 'The solver did not converge: these parameters are not a best fit, so it is not compared on AIC and cannot be recommended.'
    : null
}

/** "α reached its bound (0.7): not determinable from these data", or null when no parameter sits on a bound. */
export function boundNote(f: Fit): string | null {
  const held = f.parameters.filter((p) => atBound(f, p))
  if (!held.length) return null
  return `${held.map((p) => `${paramSymbol(p.name)} reached its bound (${p.value})`).join(', ')}: not determinable from these data.`
}

/** Lowest AIC among the fits that may be compared (Infinity when none); the "★ lowest" mark goes to this value. */
export function bestComparableAic(rows: { f: Fit; aic: number | null }[]): number {
  return Math.min(
    ...rows.filter((r) => r.aic !== null && notComparableReason(r.f) === null).map((r) => r.aic as number),
  )
}

/** Objective and vapour model of a fit, in words ("ΔP, Δy · virial vapour"; Barker's method without y). */
export function fitMethodText(f: Pick<Fit, 'options' | 'statistics'>): string {
  const o = f.options as {
    objective?: string
    vapor?: { kind: string; correlation?: string; poynting?: boolean; eta12?: number }
  }
  const stats = f.statistics as { method?: string }
  const objective =
    stats.method === 'barker'
      ? `Barker's method (${o.objective === 'bubble-pressure' ? 'ΔP' : 'ΔT'} only)`
      : { 'bubble-pressure': 'on ΔP and Δy₁', activity: 'on ln γ', 'bubble-point': 'on ΔT and Δy₁' }[
          o.objective ?? 'bubble-point'
        ]
  const vapour =
    o.vapor?.kind === 'virial'
      ? `virial vapour (${virialCorrelationLabel(o.vapor.correlation)}${o.vapor.correlation === 'hayden-oconnell' && o.vapor.eta12 ? `, η12 ${o.vapor.eta12}` : ''}${o.vapor.poynting ? ', Poynting' : ''})`
      : 'ideal vapour'
  // a dimerising (carboxylic-acid) vapour: φ came from the chemical theory, not the truncated virial equation
  const dimer = engineVaporDimerises(o.vapor) ? ', chemical theory of dimerisation' : ''
  return `${objective} · ${vapour}${dimer}`
}
