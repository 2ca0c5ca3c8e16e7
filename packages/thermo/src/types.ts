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
  /** Wilson; a12T, a21T (J/(mol·K)) make the energies temperature-dependent: a(T) = a + aT·(T − 298.15 K). */
  | { kind: 'wilson'; a12: number; a21: number; V1: number; V2: number; a12T?: number; a21T?: number }
  /** NRTL; b12T, b21T (J/(mol·K)) make the energies temperature-dependent: b(T) = b + bT·(T − 298.15 K). */
  | { kind: 'nrtl'; b12: number; b21: number; alpha: number; b12T?: number; b21T?: number }
  | { kind: 'uniquac'; a12: number; a21: number; r1: number; r2: number; q1: number; q2: number }

/** A binary mixture under modified Raoult's law (ideal vapour, γ from the activity model). */
export interface BinarySystem {
  vaporPressure: [VaporPressureModel, VaporPressureModel]
  activity: ActivityModel
  /** Optional names for messages, e.g. ['ethanol', 'water']. */
  names?: [string, string]
}

/** Optional display names used in warnings and error messages ("component 1" otherwise). */
export type ComponentNames = [string, string]

/** Result of a bubble-temperature solve: T in K, y1 vapour mole fraction, γ = [γ1, γ2]. */
export interface BubbleTemperatureResult {
  converged: true
  T: number
  y1: number
  gamma: [number, number]
  iterations: number
  warnings: string[]
}

/** Result of a bubble-pressure calculation: P in Pa (direct, no iteration). */
export interface BubblePressureResult {
  P: number
  y1: number
  gamma: [number, number]
  warnings: string[]
}

/** Result of a dew-temperature solve: T in K, x1 liquid mole fraction. */
export interface DewTemperatureResult {
  converged: true
  T: number
  x1: number
  gamma: [number, number]
  iterations: number
  warnings: string[]
}

/** Result of a dew-pressure solve: P in Pa, x1 liquid mole fraction. */
export interface DewPressureResult {
  converged: true
  P: number
  x1: number
  gamma: [number, number]
  iterations: number
  warnings: string[]
}

/** Relative volatility α12 = (y1/x1)/(y2/x2) = γ1·P1sat/(γ2·P2sat) at the bubble point; defined at the ends too. */
export interface RelativeVolatilityResult {
  alpha: number
  T: number
  y1: number
  warnings: string[]
}

/** An azeotrope: x1 = y1, T in K, P in Pa. */
export interface Azeotrope {
  x1: number
  T: number
  P: number
  kind: 'minimum-boiling' | 'maximum-boiling'
  /** Range warnings of the vapour-pressure models at the azeotrope (always set by findAzeotrope). */
  warnings?: string[]
}

/** A T–x–y curve at fixed P (Pa), or a P–x–y curve at fixed T (K); arrays run from x1 = 0 to x1 = 1. */
export type PhaseDiagram =
  | { kind: 'isobaric'; P: number; x1: number[]; y1: number[]; T: number[]; warnings: string[] }
  | { kind: 'isothermal'; T: number; x1: number[]; y1: number[]; P: number[]; warnings: string[] }
