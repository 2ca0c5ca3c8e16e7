/**
 * Test data shared by the virial tests (not exported from the package): acetic acid and water for Hayden–O'Connell
 * and the chemical theory, and an acid + water liquid.
 */
import type { BinarySystem } from '../types.js'
import type { VaporModel, VirialComponent } from './virial-types.js'

/**
 * Acetic acid: Tc, Pc, ω, Vc (from memory); HOC RD 2.595 Å, dipole 1.74 D, η 4.5 (HOC tables as reproduced in
 * Prausnitz et al., 1980; from memory).
 */
export const aceticAcid: VirialComponent = {
  Tc: 591.95,
  Pc: 5.786e6,
  omega: 0.467,
  Vc: 177.6,
  RD: 2.595,
  dipole: 1.74,
  eta: 4.5,
}

/** Water: Tc, Pc, ω, Vc as the `chemicals` 1.5.2 library gives them; RD 0.615 Å, 1.83 D, η 1.7 (HOC; from memory). */
export const water: VirialComponent = {
  Tc: 647.096,
  Pc: 22064000,
  omega: 0.3443,
  Vc: 55.948,
  RD: 0.615,
  dipole: 1.83,
  eta: 1.7,
}

/** Acid + water under HOC; η12 = 2.5 is an illustrative solvation value invented for the tests (below the acid branch). */
export const acidWaterVapour: VaporModel = {
  kind: 'virial',
  correlation: 'hayden-oconnell',
  components: [aceticAcid, water],
  eta12: 2.5,
}

/**
 * Antoine of acetic acid: log10(P/mmHg) = 7.38782 − 1533.313/(t/°C + 222.309) (Lange's Handbook of Chemistry, Antoine
 * table; from memory); water: Smith, Van Ness & Abbott, 7th ed., Table B.2. NRTL b12 = 2000, b21 = 1000 J/mol,
 * α = 0.3: invented for the tests (their checks are self-consistency and qualitative, not a published system).
 */
export const acidWaterLiquid: BinarySystem = {
  vaporPressure: [
    { kind: 'antoine', A: 7.38782, B: 1533.313, C: 222.309, log: 'log10', pressureUnit: 'mmHg', temperatureUnit: 'C' },
    { kind: 'antoine', A: 16.3872, B: 3885.7, C: 230.17, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C' },
  ],
  activity: { kind: 'nrtl', b12: 2000, b21: 1000, alpha: 0.3 },
}
