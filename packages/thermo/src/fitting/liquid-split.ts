/**
 * The check every fit gets: do the fitted parameters predict two liquid layers anywhere in the data's
 * temperature range although no measurement shows them? Fits of NRTL (small α) or large Margules/Van Laar
 * constants to miscible data are known to do this (common practice, no source); such parameters give wrong
 * numbers wherever a design or a diagram enters the false two-liquid region.
 */
import { liquidGaps, type LiquidGap } from '../equilibrium/lle.js'
import { coarseMinimumThermodynamicFactor, polishedMinimumThermodynamicFactor } from '../equilibrium/stability.js'
import type { ActivityModel } from '../types.js'

/** A warning with a name a program can act on; `message` is for the chemist. */
export interface NamedFitWarning {
  code: 'spurious-liquid-split' | 'heterogeneous-points-not-split'
  message: string
  /** Where: the predicted liquids x1I < x1II (mole fractions of component 1) at T (K). */
  x1I?: number
  x1II?: number
  T?: number
}

/** Temperatures checked: 9 evenly spaced over [Tmin, Tmax] (K), ends included. */
function temperatures(Tmin: number, Tmax: number): number[] {
  if (!(Tmax > Tmin)) return [Tmin]
  return Array.from({ length: 9 }, (_, i) => Tmin + ((Tmax - Tmin) * i) / 8)
}

/**
 * Named warnings about liquid splitting for a fitted model over the data's temperatures [Tmin, Tmax] (K).
 * @param heterogeneousPoints how many fitted points are marked as two-layer; when there are none, a predicted
 *   split is spurious; when there are some but the model never splits, those points were fitted as one liquid.
 */
export function liquidSplitWarnings(
  activity: ActivityModel,
  Tmin: number,
  Tmax: number,
  heterogeneousPoints: number,
): NamedFitWarning[] {
  let widest: { gap: LiquidGap; T: number } | null = null
  for (const T of temperatures(Tmin, Tmax)) {
    // Cheap screens first: far from a spinodal (Γ well above 0 everywhere) there is no gap to look for; nearer, the
    // polished minimum of Γ decides (a split needs Γ < 0 somewhere; 0.01 is a margin for the grid, our choice).
    if (activity.kind === 'ideal' || activity.kind === 'wilson' || coarseMinimumThermodynamicFactor(activity, T) > 0.05)
      continue
    if (polishedMinimumThermodynamicFactor(activity, T) > 0.01) continue
    for (const gap of liquidGaps(activity, T)) {
      if (!widest || gap.xII - gap.xI > widest.gap.xII - widest.gap.xI) widest = { gap, T }
    }
  }
  if (widest && heterogeneousPoints === 0) {
    const { gap, T } = widest
    return [
      {
        code: 'spurious-liquid-split',
        message: `The fitted parameters predict two liquid layers between x1 = ${gap.xI.toFixed(3)} and ${gap.xII.toFixed(3)} at ${T.toFixed(1)} K (${(T - 273.15).toFixed(1)} °C), which the measurements do not show: do not use these parameters there (diagrams and designs would show a false two-liquid region); refit with another α or model.`,
        x1I: gap.xI,
        x1II: gap.xII,
        T,
      },
    ]
  }
  if (!widest && heterogeneousPoints > 0) {
    return [
      {
        code: 'heterogeneous-points-not-split',
        message: `${heterogeneousPoints} point${heterogeneousPoints > 1 ? 's are' : ' is'} marked as two liquid layers, but the fitted parameters predict one liquid throughout; ${heterogeneousPoints > 1 ? 'they were' : 'it was'} compared with single-liquid bubble points.`,
      },
    ]
  }
  return []
}
