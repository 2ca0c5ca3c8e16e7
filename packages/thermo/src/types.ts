/** Shared shapes of the engine. SI inside: T in K, P in Pa, energies in J/mol. */

/** Molar gas constant, J/(mol·K) (CODATA 2018 exact value). */
export const R = 8.314462618

export type PressureUnit = 'Pa' | 'kPa' | 'bar' | 'mmHg' | 'atm'

/**
 * A pure-component vapour-pressure correlation, stored exactly as published.
 * Antoine: log(P / pressureUnit) = A − B / (T / temperatureUnit + C); `range` is in the model's own temperature unit.
 * Clausius–Clapeyron: integrated form with constant ΔHvap; Tref in K, Pref in Pa, dHvap in J/mol.
 */
export type VaporPressureModel =
  | {
      kind: 'antoine'
      A: number
      B: number
      C: number
      log: 'log10' | 'ln'
      pressureUnit: PressureUnit
      temperatureUnit: 'C' | 'K'
      range?: [number, number]
    }
  | { kind: 'clausius-clapeyron'; Tref: number; Pref: number; dHvap: number; range?: [number, number] }

/** Binary liquid-phase activity-coefficient models (component 1 is the lighter one by convention). */
export type ActivityModel =
  | { kind: 'ideal' }
  | { kind: 'margules'; A12: number; A21: number }
  | { kind: 'van-laar'; A12: number; A21: number }
  | { kind: 'wilson'; a12: number; a21: number; V1: number; V2: number }
  | { kind: 'nrtl'; b12: number; b21: number; alpha: number }
  | { kind: 'uniquac'; a12: number; a21: number; r1: number; r2: number; q1: number; q2: number }

/** A binary mixture under modified Raoult's law (ideal vapour, γ from the activity model). */
export interface BinarySystem {
  vaporPressure: [VaporPressureModel, VaporPressureModel]
  activity: ActivityModel
}
