/**
 * A first guess of the FID relative response factor from effective carbon numbers (ECN),
 * J. T. Scanlon, D. E. Willis, J. Chromatogr. Sci. 23 (1985) 333. Only a starting value shown beside
 * the measured calibration; never a substitute for standards.
 */
import { ThermoError } from '../errors.js'

/** Detectors the workbench knows about. */
export type GcDetector = 'FID' | 'TCD'

/**
 * ECN contribution of each structural group (from memory of Scanlon & Willis, Table I; treat as 2 figures).
 * An FID responds to carbon burnt to CH radicals; oxygen bonded to carbon takes part of the response away.
 */
export const ECN_CONTRIBUTIONS = {
  aliphaticC: 1.0,
  aromaticC: 1.0,
  olefinicC: 0.95,
  acetylenicC: 1.3,
  carbonylC: 0.0,
  carboxylC: 0.0,
  nitrileC: 0.3,
  etherO: -1.0,
  primaryAlcoholO: -0.5,
  secondaryAlcoholO: -0.75,
  tertiaryAlcoholO: -0.25,
  esterO: -0.25,
} as const

/** A structural group named in `ECN_CONTRIBUTIONS`. */
export type EcnGroup = keyof typeof ECN_CONTRIBUTIONS

/** A component for the ECN estimate: either its ECN directly or its group counts. */
export interface EcnComponent {
  name: string
  ecn?: number
  groups?: Partial<Record<EcnGroup, number>>
}

/** An FID sees essentially nothing below about half a carbon (common practice, no source). */
const FID_VISIBLE_ECN = 0.5

function isWater(name: string): boolean {
  return /^(water|h2o)$/i.test(name.trim())
}

/** Effective carbon number of a component from its ECN or its groups; water is 0. */
export function effectiveCarbonNumber(c: EcnComponent): number {
  if (typeof c.ecn === 'number') return c.ecn
  if (isWater(c.name)) return 0
  if (!c.groups)
    throw new ThermoError('invalid-ecn-component', `${c.name}: give its effective carbon number (ecn) or its groups.`)
  let sum = 0
  for (const [group, count] of Object.entries(c.groups)) {
    if (!(group in ECN_CONTRIBUTIONS))
      throw new ThermoError('invalid-ecn-component', `${c.name}: unknown group '${group}'.`)
    sum += ECN_CONTRIBUTIONS[group as EcnGroup] * (count ?? 0)
  }
  return sum
}

/**
 * Warnings for components a detector cannot see. An FID barely responds to water (and to anything with
 * almost no C–H): aqueous binaries need a TCD, or water determined by difference (common practice).
 */
export function detectorWarnings(detector: GcDetector, components: EcnComponent[]): string[] {
  if (detector !== 'FID') return []
  return components.flatMap((c) => {
    if (isWater(c.name)) {
      return [
        `An FID barely responds to water: measure ${c.name} with a TCD, or take it by difference from the other component.`,
      ]
    }
    const ecn = effectiveCarbonNumber(c)
    return ecn < FID_VISIBLE_ECN
      ? [
          `An FID barely responds to ${c.name} (effective carbon number ${ecn.toFixed(2)}): use a TCD or another detector for it.`,
        ]
      : []
  })
}

/** Result of `ecnResponseFactor`. */
export interface EcnEstimate {
  /** Estimated k in A1/A2 = k·n1/n2 (ECN1/ECN2), or null when a component is invisible to the FID. */
  k: number | null
  ecn: [number, number]
  warnings: string[]
  note: string
}

/**
 * Starting estimate of the relative molar response factor k (A1/A2 = k·n1/n2) of an FID from effective
 * carbon numbers: k ≈ ECN1/ECN2. Shown as a starting guess beside the measured calibration only.
 * @param options.detector 'FID' (the only detector the ECN concept applies to) or 'TCD'
 * @param options.components [component 1, component 2], each with `ecn` or `groups`; water is recognised by name
 * @throws ThermoError when the detector is not an FID
 */
export function ecnResponseFactor(options: {
  detector: GcDetector
  components: [EcnComponent, EcnComponent]
}): EcnEstimate {
  const { detector, components } = options
  if (detector !== 'FID') {
    throw new ThermoError(
      'ecn-needs-fid',
      `Effective carbon numbers estimate FID responses only; a ${detector} needs response factors measured on standards.`,
    )
  }
  if (!Array.isArray(components) || components.length !== 2) {
    throw new ThermoError('invalid-ecn-component', 'Give exactly two components.')
  }
  const ecn: [number, number] = [effectiveCarbonNumber(components[0]), effectiveCarbonNumber(components[1])]
  const warnings = detectorWarnings(detector, components)
  const visible = ecn.every((e) => e >= FID_VISIBLE_ECN)
  return {
    k: visible ? ecn[0] / ecn[1] : null,
    ecn,
    warnings,
    note: 'A starting guess from effective carbon numbers; the measured calibration on gravimetric standards governs.',
  }
}
