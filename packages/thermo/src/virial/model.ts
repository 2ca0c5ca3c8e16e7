/** Checking a virial vapour model, and its second virial coefficients under either correlation. */
import { ThermoError } from '../errors.js'
import { R } from '../types.js'
import { HOC_STRIDE, hocBinaryConstants, hocCross, hocParts, hocPure } from './hayden-oconnell.js'
import { crossCriticalConstants, secondVirialTsonopoulos, tsonopoulosReduced } from './tsonopoulos.js'
import type { SecondVirialCoefficients, VaporModel } from './virial-types.js'

/** The largest η (association or solvation) the checks accept; published values stay well below. */
export const MAX_HOC_ETA = 10

/** η at or above which Hayden–O'Connell takes its carboxylic-acid branch (the vapour dimerises strongly). */
export const HOC_ACID_ETA = 4.5

const finite = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x)

/** Check a virial vapour model once; throws ThermoError 'invalid-model' naming the missing or bad field. */
export function checkVaporModel(v: VaporModel): void {
  if (v?.kind === 'ideal') return
  if (v?.kind !== 'virial' || (v.correlation !== 'tsonopoulos' && v.correlation !== 'hayden-oconnell')) {
    throw new ThermoError(
      'invalid-model',
      "The vapour model must be ideal or a virial vapour by Tsonopoulos or Hayden–O'Connell.",
    )
  }
  if (
    !Array.isArray(v.components) ||
    v.components.length !== 2 ||
    !v.components.every((c) => c && typeof c === 'object')
  )
    throw new ThermoError('invalid-model', 'A virial vapour needs the critical data of both components.')
  if (v.k12 !== undefined && !(Number.isFinite(v.k12) && Math.abs(v.k12) < 1))
    throw new ThermoError('invalid-model', `The cross parameter k12 must be a number between −1 and 1; got ${v.k12}.`)
  const hoc = v.correlation === 'hayden-oconnell'
  if (hoc && v.eta12 !== undefined && !(finite(v.eta12) && v.eta12 >= 0 && v.eta12 <= MAX_HOC_ETA))
    throw new ThermoError(
      'invalid-model',
      `The solvation parameter η12 must be a number from 0 to ${MAX_HOC_ETA}; got ${v.eta12}.`,
    )
  v.components.forEach((c, i) => {
    // Hayden–O'Connell does not use ω (its non-polar acentric factor comes from RD)
    for (const key of hoc ? (['Tc', 'Pc', 'Vc'] as const) : (['Tc', 'Pc', 'omega', 'Vc'] as const)) {
      const value = c[key]
      if (!Number.isFinite(value) || (key !== 'omega' && value <= 0)) {
        throw new ThermoError(
          'invalid-model',
          `A virial vapour needs ${key} of component ${i + 1} (finite${key === 'omega' ? '' : ', positive'}); got ${value}.`,
        )
      }
    }
    if (hoc) {
      if (!(finite(c.RD) && c.RD >= 0 && c.RD <= 20))
        throw new ThermoError(
          'invalid-model',
          `Hayden–O'Connell needs the mean radius of gyration RD of component ${i + 1} (Å, from 0 to 20); got ${c.RD}.`,
        )
      if (c.dipole !== undefined && !(finite(c.dipole) && c.dipole >= 0 && c.dipole <= 20))
        throw new ThermoError(
          'invalid-model',
          `The dipole moment of component ${i + 1} must be a number from 0 to 20 debye; got ${c.dipole}.`,
        )
      if (c.eta !== undefined && !(finite(c.eta) && c.eta >= 0 && c.eta <= MAX_HOC_ETA))
        throw new ThermoError(
          'invalid-model',
          `The association parameter η of component ${i + 1} must be a number from 0 to ${MAX_HOC_ETA}; got ${c.eta}.`,
        )
    }
    if (v.poynting && !(c.liquidMolarVolume! > 0)) {
      throw new ThermoError(
        'invalid-model',
        `The Poynting factor needs the liquid molar volume of component ${i + 1} (cm³/mol).`,
      )
    }
  })
  if (hoc) {
    const [c1, c2] = v.components
    const p = [hocPure(c1), hocPure(c2)]
    p.forEach((q, i) => {
      if (!(q.eps > 0 && q.sigma > 0 && Number.isFinite(q.eps) && Number.isFinite(q.sigma)))
        throw new ThermoError(
          'invalid-model',
          `Hayden–O'Connell gives component ${i + 1} no positive energy parameter ε/k from RD ${v.components[i].RD} Å and η ${v.components[i].eta ?? 0}: an association parameter this large needs a larger molecule; check RD and η.`,
        )
    })
    const x = hocCross(p[0], p[1], c1.dipole ?? 0, c2.dipole ?? 0, v.eta12 ?? 0)
    if (!(x.eps > 0 && x.sigma > 0 && Number.isFinite(x.eps) && Number.isFinite(x.sigma)))
      throw new ThermoError(
        'invalid-model',
        "Hayden–O'Connell gives the unlike pair no positive energy and size parameters; check the dipole moments and radii of gyration.",
      )
  }
}

/** B11, B22 and B12 (cm³/mol) of a virial vapour at T (K), by the vapour's correlation; zeros for an ideal gas. */
export function secondVirialCoefficients(vapor: VaporModel, T: number): SecondVirialCoefficients {
  if (vapor.kind !== 'virial') return { B11: 0, B22: 0, B12: 0 }
  const [c1, c2] = vapor.components
  if (vapor.correlation === 'hayden-oconnell') {
    const k = hocBinaryConstants(c1, c2, vapor.eta12 ?? 0)
    return {
      B11: hocParts(k, 0, T).total,
      B22: hocParts(k, HOC_STRIDE, T).total,
      B12: hocParts(k, 2 * HOC_STRIDE, T).total,
    }
  }
  const x = crossCriticalConstants(c1, c2, vapor.k12 ?? 0)
  const B12 =
    ((tsonopoulosReduced(T / x.Tc, x.omega, vapor.cross?.a12 ?? 0, vapor.cross?.b12 ?? 0) * R * x.Tc) / x.Pc) * 1e6
  return { B11: secondVirialTsonopoulos(T, c1), B22: secondVirialTsonopoulos(T, c2), B12 }
}

/** Which members of a Hayden–O'Connell vapour take the carboxylic-acid branch (η or η12 ≥ 4.5), in words. */
function acidMembers(vapor: VaporModel): string[] {
  if (vapor.kind !== 'virial' || vapor.correlation !== 'hayden-oconnell') return []
  const [c1, c2] = vapor.components
  const which: string[] = []
  if ((c1.eta ?? 0) >= HOC_ACID_ETA) which.push('component 1')
  if ((c2.eta ?? 0) >= HOC_ACID_ETA) which.push('component 2')
  if ((vapor.eta12 ?? 0) >= HOC_ACID_ETA) which.push('the unlike pair')
  return which
}

/**
 * Whether the vapour's φ come from the chemical theory of dimerisation (chemical-theory.ts): a Hayden–O'Connell
 * vapour with η or η12 at or above {@link HOC_ACID_ETA} (carboxylic acids), chosen automatically.
 */
export function usesChemicalTheory(vapor: VaporModel): boolean {
  return acidMembers(vapor).length > 0
}

/**
 * The statement every γ–φ result and fit of a Hayden–O'Connell vapour with a carboxylic acid (η or η12 at or above
 * 4.5) carries: which treatment of the vapour ran (the chemical theory of dimerisation). Empty for other vapours,
 * whose φ come from the truncated virial equation as the vapour model says.
 */
export function associationWarnings(vapor: VaporModel): string[] {
  const which = acidMembers(vapor)
  if (which.length === 0) return []
  return [
    `The vapour dimerises (η ≥ ${HOC_ACID_ETA} for ${which.join(' and ')}: carboxylic acid). Its fugacity coefficients come from the chemical theory of dimerisation: monomers and dimers in chemical equilibrium, with dimerisation constants from the metastable, bound and chemical parts of the Hayden–O'Connell B and the free part for the physical non-ideality (not from the truncated virial equation with the total B).`,
  ]
}
