/** Pressures in running text: the display unit's decimals, with trailing zeros dropped ("40 bar", "1.0133 bar"). */
import { roundShown } from '../../stores/preferences'

/** The parts of the preferences store a pressure in prose needs. */
export interface PressureDisplay {
  pFromPa: (P: number) => number
  pDecimals: () => number
  pLabel: () => string
}

/**
 * A pressure (Pa) for a sentence or a caption: rounded as in the field (the unit's decimals), then trailing zeros
 * dropped, so 40 bar reads "40 bar" and not "40.0000 bar", while 1 atm in bar stays "1.0133 bar". "—" when not finite.
 */
export function proseP(u: PressureDisplay, P: number | null | undefined): string {
  if (P === null || P === undefined || !Number.isFinite(P)) return '—'
  const s = roundShown(u.pFromPa(P), u.pDecimals())
  const trimmed = s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s
  return `${trimmed.replace(/^-/, '−')} ${u.pLabel()}`
}
