/** Vapour-phase models for γ–φ equilibrium. SI inside except where a field says otherwise. */

/** Parameters of one component for a virial vapour. */
export interface VirialComponent {
  /** Critical temperature, K. */
  Tc: number
  /** Critical pressure, Pa. */
  Pc: number
  /** Acentric factor, dimensionless. */
  omega: number
  /**
   * Critical volume, cm³/mol: required (Tsonopoulos builds the cross critical pressure from it; both correlations
   * use it to warn when the vapour is too dense for the truncated virial equation).
   */
  Vc: number
  /** Tsonopoulos polar parameters a and b (0 and 0 for non-polar molecules); see {@link tsonopoulosPolarParameters}. */
  tsonopoulos?: { a: number; b: number }
  /** Hayden–O'Connell: mean radius of gyration, Å (required by that correlation; 0 for a monatomic gas). */
  RD?: number
  /** Hayden–O'Connell: dipole moment, debye (default 0). */
  dipole?: number
  /**
   * Hayden–O'Connell: association parameter η of the pure component (default 0: no association; about 1–2 for
   * alcohols and water, 4.5 and above for carboxylic acids, whose vapour dimerises).
   */
  eta?: number
  /** Saturated-liquid molar volume, cm³/mol: needed only when the Poynting factor is switched on. */
  liquidMolarVolume?: number
}

/** The correlations of the second virial coefficients. */
export type VirialCorrelation = 'tsonopoulos' | 'hayden-oconnell'

/**
 * The vapour model of a binary system. `ideal` is modified Raoult's law; `virial` is the pressure-explicit
 * virial equation truncated after B, Z = 1 + B·P/(R·T), with the second virial coefficients from a correlation
 * (Tsonopoulos, or Hayden–O'Connell for polar and associating vapours).
 * Under `virial` the fugacity coefficient at saturation is always applied (a pure component boils exactly at its
 * vapour pressure); `poynting` switches only the Poynting factor of the liquid.
 */
export type VaporModel =
  | { kind: 'ideal' }
  | {
      kind: 'virial'
      correlation: VirialCorrelation
      components: [VirialComponent, VirialComponent]
      /** Tsonopoulos: interaction parameter of the cross critical temperature, Tc12 = √(Tc1·Tc2)·(1 − k12); default 0. */
      k12?: number
      /** Cross polar parameters of Tsonopoulos; default a12 = b12 = 0. */
      cross?: { a12?: number; b12?: number }
      /**
       * Hayden–O'Connell: solvation parameter η12 of the unlike pair (default 0). Published values are per pair; two
       * carboxylic acids take the acid branch (η12 ≥ 4.5).
       */
      eta12?: number
      /** Apply the Poynting factor exp(V_L·(P − P_sat)/(R·T)); default false. */
      poynting?: boolean
    }

/** Second virial coefficients at one temperature, cm³/mol. */
export interface SecondVirialCoefficients {
  B11: number
  B22: number
  B12: number
}

/** The vapour-phase corrections at one state (T, P, y). */
export interface VaporCorrection {
  /** Fugacity coefficients of the components in the vapour mixture. */
  phi: [number, number]
  /** Fugacity coefficients of the pure saturated vapours at their own vapour pressures. */
  phiSat: [number, number]
  /** Poynting factors (1 when switched off). */
  poynting: [number, number]
  /** Φi = φ̂i / (φi_sat · PFi), so that yi·Φi·P = xi·γi·Pi_sat. */
  Phi: [number, number]
}
