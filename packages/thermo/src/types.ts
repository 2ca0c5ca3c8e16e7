/** Shared shapes of the engine. SI inside: T in K, P in Pa, energies in J/mol. */
import type { VaporModel } from './virial/virial-types.js'

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
  /**
   * UNIQUAC (z = 10; r, q dimensionless); a12T, a21T (J/(mol·K)) make the energies temperature-dependent:
   * a(T) = a + aT·(T − 298.15 K), τij = exp(−aij(T)/RT).
   */
  | {
      kind: 'uniquac'
      a12: number
      a21: number
      r1: number
      r2: number
      q1: number
      q2: number
      a12T?: number
      a21T?: number
    }

/**
 * A binary mixture: γ from the activity model; the vapour ideal (modified Raoult's law) unless `vapor` is a virial
 * vapour, when every solver uses γ–φ (yi·Φi·P = xi·γi·Pi_sat) and its results carry `phi`.
 */
export interface BinarySystem {
  vaporPressure: [VaporPressureModel, VaporPressureModel]
  activity: ActivityModel
  /** The vapour model; absent or `{ kind: 'ideal' }` is an ideal gas. */
  vapor?: VaporModel
  /** Optional names for messages, e.g. ['ethanol', 'water']. */
  names?: [string, string]
}

/** Optional display names used in warnings and error messages ("component 1" otherwise). */
export type ComponentNames = [string, string]

/**
 * What a three-phase (vapour + two liquids) result adds: the two liquids' x1 (x1I < x1II) and [γ1, γ2] in
 * each of them. A result with `liquidPhases` has no single `gamma`: its liquid is not one phase.
 */
export interface ThreePhaseFields {
  /** [x1I, x1II]: compositions of the two liquid layers (mole fractions of component 1). */
  liquidPhases?: [number, number]
  /** [[γ1, γ2] in liquid I, [γ1, γ2] in liquid II]; present exactly when liquidPhases is. */
  gammaPhases?: [[number, number], [number, number]]
}

/**
 * Result of a bubble-temperature solve: T in K, y1 vapour mole fraction, γ = [γ1, γ2] of the one liquid.
 * When the liquid splits into two layers at its boiling point the result is the heterogeneous (three-phase)
 * bubble point: `liquidPhases` and `gammaPhases` are set and `gamma` is absent.
 */
export interface BubbleTemperatureResult extends ThreePhaseFields {
  converged: true
  T: number
  y1: number
  gamma?: [number, number]
  iterations: number
  warnings: string[]
  /** Vapour fugacity coefficients [φ̂1, φ̂2]; present exactly when the system's vapour is virial. */
  phi?: [number, number]
}

/** Result of a bubble-pressure calculation: P in Pa; three-phase as in {@link BubbleTemperatureResult}. */
export interface BubblePressureResult extends ThreePhaseFields {
  P: number
  y1: number
  gamma?: [number, number]
  warnings: string[]
  /** Vapour fugacity coefficients [φ̂1, φ̂2]; present exactly when the system's vapour is virial. */
  phi?: [number, number]
}

/**
 * Result of a dew-temperature solve: T in K, x1 the (stable) liquid that appears first. A vapour at exactly
 * the three-phase composition gives the three-phase point: `liquidPhases` set, x1 = x1I, no `gamma`.
 */
export interface DewTemperatureResult extends ThreePhaseFields {
  converged: true
  T: number
  x1: number
  gamma?: [number, number]
  iterations: number
  warnings: string[]
  /** Vapour fugacity coefficients [φ̂1, φ̂2]; present exactly when the system's vapour is virial. */
  phi?: [number, number]
}

/** Result of a dew-pressure solve: P in Pa, x1 liquid mole fraction; three-phase as in {@link DewTemperatureResult}. */
export interface DewPressureResult extends ThreePhaseFields {
  converged: true
  P: number
  x1: number
  gamma?: [number, number]
  iterations: number
  warnings: string[]
  /** Vapour fugacity coefficients [φ̂1, φ̂2]; present exactly when the system's vapour is virial. */
  phi?: [number, number]
}

/** Relative volatility α12 = (y1/x1)/(y2/x2) = γ1·P1sat/(γ2·P2sat) at the bubble point; defined at the ends too. */
export interface RelativeVolatilityResult {
  alpha: number
  T: number
  y1: number
  warnings: string[]
}

/**
 * An azeotrope, T in K, P in Pa. Homogeneous ('minimum-boiling', 'maximum-boiling'): x1 = y1 of one liquid.
 * 'heterogeneous': x1 is the three-phase vapour composition (lying between the two liquids) and
 * `liquidPhases` gives the two liquid layers [x1I, x1II].
 */
export interface Azeotrope {
  x1: number
  T: number
  P: number
  kind: 'minimum-boiling' | 'maximum-boiling' | 'heterogeneous'
  /** [x1I, x1II] of the two liquid layers; heterogeneous azeotropes only. */
  liquidPhases?: [number, number]
  /** Range warnings of the vapour-pressure models at the azeotrope (always set by findAzeotrope). */
  warnings?: string[]
}

/** The isobaric three-phase line: T in K, the two liquids x1I < x1II and the vapour y1. */
export interface ThreePhaseLineIsobaric {
  T: number
  x1I: number
  x1II: number
  y1: number
}

/** The isothermal three-phase line: P in Pa, the two liquids x1I < x1II and the vapour y1. */
export interface ThreePhaseLineIsothermal {
  P: number
  x1I: number
  x1II: number
  y1: number
}

/**
 * A T–x–y curve at fixed P (Pa), or a P–x–y curve at fixed T (K); arrays run from x1 = 0 to x1 = 1 and hold
 * only stable single-liquid bubble points (plus both ends of the three-phase line, where the curve meets it).
 * `threePhase` is the vapour–liquid–liquid line (null when there is none). `lle` (only when asked with
 * `{ lle: true }`): isobaric, the binodal x1I(T), x1II(T) from the chosen lower temperature up to the
 * three-phase temperature (T ascending); isothermal, the two liquids' x1 at pressures from the three-phase
 * pressure up (liquids taken as incompressible, so the lines are vertical). Null when there is no gap.
 */
export type PhaseDiagram =
  | {
      kind: 'isobaric'
      P: number
      x1: number[]
      y1: number[]
      T: number[]
      warnings: string[]
      threePhase?: ThreePhaseLineIsobaric | null
      lle?: { T: number[]; x1I: number[]; x1II: number[] } | null
    }
  | {
      kind: 'isothermal'
      T: number
      x1: number[]
      y1: number[]
      P: number[]
      warnings: string[]
      threePhase?: ThreePhaseLineIsothermal | null
      lle?: { P: number[]; x1I: number[]; x1II: number[] } | null
    }
