import type { ComponentProperties } from '@ebullio/schemas'

const minus = (s: string) => s.replace(/^-/, '−')
const sig = (v: number, digits: number) => minus(Number(v.toPrecision(digits)).toString())

/** One line of a component's critical constants, in the units the dialog uses (Pc in MPa); missing ones left out. */
export function criticalSummary(p: ComponentProperties): string {
  const parts: string[] = []
  if (p.Tc != null) parts.push(`Tc ${sig(p.Tc, 5)} K`)
  if (p.Pc != null) parts.push(`Pc ${sig(p.Pc / 1e6, 4)} MPa`)
  if (p.omega != null) parts.push(`ω ${sig(p.omega, 3)}`)
  if (p.Vc != null) parts.push(`Vc ${sig(p.Vc, 4)} cm³/mol`)
  if (p.dipole != null) parts.push(`μ ${sig(p.dipole, 3)} D`)
  if (p.tsonopoulosA != null || p.tsonopoulosB != null)
    parts.push(`Tsonopoulos a ${sig(p.tsonopoulosA ?? 0, 3)}, b ${sig(p.tsonopoulosB ?? 0, 3)}`)
  if (p.radiusOfGyration != null) parts.push(`RD ${sig(p.radiusOfGyration, 4)} Å`)
  if (p.associationEta != null) parts.push(`η ${sig(p.associationEta, 3)}`)
  if (p.uniquacR != null || p.uniquacQ != null)
    parts.push(
      `UNIQUAC r ${p.uniquacR == null ? '—' : sig(p.uniquacR, 4)}, q ${p.uniquacQ == null ? '—' : sig(p.uniquacQ, 4)}`,
    )
  return parts.join(' · ') || 'no values'
}
