import { ThermoError } from '../errors.js'
import type { BinaryPoint } from '../fitting/fit-input.js'
import type { VaporPressureModel } from '../types.js'
import type { VaporModel } from '../virial/virial-types.js'
import { heringtonAreaTest, type HeringtonResult } from './herington.js'
import { redlichKisterAreaTest, type RedlichKisterResult } from './redlich-kister.js'

/** Options of {@link areaTest}. */
export interface AreaTestOptions {
  /** Isobaric data: Herington's test (with its temperature term J); isothermal data: the Redlich–Kister test. */
  kind: 'isobaric' | 'isothermal'
  vaporPressure: [VaporPressureModel, VaporPressureModel]
  /** The vapour model (absent: ideal); a virial vapour puts Φ into each point's γ. */
  vapor?: VaporModel
}

/**
 * The area test that fits the data: Herington's for isobaric data, Redlich–Kister's (no temperature term) for
 * isothermal data. The result's `test` says which ran ('herington' or 'redlich-kister').
 * @throws ThermoError 'needs-vapour-composition' when a mixture point has no y; 'invalid-input' for an unknown kind.
 */
export function areaTest(points: BinaryPoint[], options: AreaTestOptions): HeringtonResult | RedlichKisterResult {
  if (options?.kind === 'isobaric') return heringtonAreaTest(points, options)
  if (options?.kind === 'isothermal') return redlichKisterAreaTest(points, options)
  throw new ThermoError(
    'invalid-input',
    `The area test needs kind 'isobaric' or 'isothermal'; got ${String(options?.kind)}.`,
  )
}
