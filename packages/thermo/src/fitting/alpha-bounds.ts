/**
 * Bounds on a fitted NRTL α. Renon and Prausnitz recommended α of about 0.2 to 0.47 (from memory);
 * fits here keep a fitted α within 0.1 to 0.7 (common practice, no source). The search runs on an
 * unbounded u with α = lo + (hi − lo)/(1 + e^(−u)), so Levenberg–Marquardt never steps outside; the
 * statistics are then taken in α itself, or α is held at its bound when the optimum lies there.
 */
import type { ParameterLayout } from './parameters.js'

/** Lowest and highest NRTL α a fit may reach (dimensionless). */
export const NRTL_ALPHA_BOUNDS: readonly [number, number] = [0.1, 0.7]

/** α counts as "at its bound" within this distance of it (dimensionless; 1 % of the bounded range). */
export const ALPHA_BOUND_TOLERANCE = 0.006

const [LO, HI] = NRTL_ALPHA_BOUNDS

/** α from the search variable u. */
export function alphaOf(u: number): number {
  return LO + (HI - LO) / (1 + Math.exp(-u))
}

/** The search variable u for α, α clamped 0.01 inside the bounds so u stays finite. */
export function uOf(alpha: number): number {
  const a = Math.min(HI - 0.01, Math.max(LO + 0.01, alpha))
  return Math.log((a - LO) / (HI - a))
}

/** The NRTL (b12, b21, α) layout searched in (b12, b21, u). */
export function boundedAlphaLayout(direct: ParameterLayout): ParameterLayout {
  const toDirect = (p: ArrayLike<number>) => [p[0], p[1], alphaOf(p[2])]
  return {
    names: direct.names,
    scales: [direct.scales[0], direct.scales[1], 1],
    build: (p) => direct.build(toDirect(p)),
    valid: (p) => Math.abs(p[2]) < 40 && direct.valid(toDirect(p)),
    starts: direct.starts.map((s) => [s[0], s[1], uOf(s[2])]),
  }
}

/** The bound α sits at, or null when it is inside by more than {@link ALPHA_BOUND_TOLERANCE}. */
export function boundReached(alpha: number): number | null {
  if (alpha - LO < ALPHA_BOUND_TOLERANCE) return LO
  if (HI - alpha < ALPHA_BOUND_TOLERANCE) return HI
  return null
}
