/**
 * The demo scenario's chemistry. THE MEASUREMENTS OF THE DEMO ARE INVENTED: the "lab" below does not
 * exist, and its points are generated from published model parameters plus simulated GC noise.
 * The constants themselves are published values, cited beside each one.
 *
 * Invented lab: Halvorsen Fine Chemicals, Solvent Recovery Laboratory (fictional), recovering
 * process solvents for its plant. Projects (fictional): "SR-24 mother-liquor recovery" and
 * "Kestrel acetone recycle".
 */
import type { ActivityModel, VaporPressureModel } from '@ebullio/thermo'

const CAL = 4.184 // J per thermochemical calorie

/** SVNA = Smith, Van Ness & Abbott, Introduction to Chemical Engineering Thermodynamics, 7th ed. (2005). */
const SVNA_B2 = 'Smith, Van Ness & Abbott, Introduction to Chemical Engineering Thermodynamics, 7th ed., Table B.2'
const SVNA_12_5 = 'Smith, Van Ness & Abbott, Introduction to Chemical Engineering Thermodynamics, 7th ed., Table 12.5'

/** A component with its published Antoine set: ln(P/kPa) = A − B/(t/°C + C). */
export interface DemoComponent {
  name: string
  cas: string
  formula: string
  /** g/mol */
  molarMass: number
  /** cm³/mol (SVNA Table 12.5 where given; otherwise common handbook value, from memory) */
  molarVolume: number
  antoine: { A: number; B: number; C: number; range: [number, number] }
  source: string
}

const antoine = (c: DemoComponent): VaporPressureModel => ({
  kind: 'antoine',
  A: c.antoine.A,
  B: c.antoine.B,
  C: c.antoine.C,
  log: 'ln',
  pressureUnit: 'kPa',
  temperatureUnit: 'C',
  range: c.antoine.range,
})

// Molar masses: IUPAC atomic weights (common practice, no source). CAS numbers: check digits verified by the database.
export const DEMO_COMPONENTS: Record<string, DemoComponent> = {
  acetone: {
    name: 'acetone',
    cas: '67-64-1',
    formula: 'C3H6O',
    molarMass: 58.08,
    molarVolume: 74.05,
    antoine: { A: 14.3145, B: 2756.22, C: 228.06, range: [-26, 77] },
    source: SVNA_B2,
  },
  methanol: {
    name: 'methanol',
    cas: '67-56-1',
    formula: 'CH4O',
    molarMass: 32.042,
    molarVolume: 40.73,
    antoine: { A: 16.5785, B: 3638.27, C: 239.5, range: [-11, 83] },
    source: SVNA_B2,
  },
  // No demo system: ethanol is there so a new ethanol/water series can be started on screen (issue 11's journey).
  ethanol: {
    name: 'ethanol',
    cas: '64-17-5',
    formula: 'C2H6O',
    molarMass: 46.069,
    molarVolume: 58.68,
    antoine: { A: 16.8958, B: 3795.17, C: 230.918, range: [3, 96] },
    source: SVNA_B2,
  },
  water: {
    name: 'water',
    cas: '7732-18-5',
    formula: 'H2O',
    molarMass: 18.015,
    molarVolume: 18.07,
    antoine: { A: 16.3872, B: 3885.7, C: 230.17, range: [0, 200] },
    source: SVNA_B2,
  },
  '1-propanol': {
    name: '1-propanol',
    cas: '71-23-8',
    formula: 'C3H8O',
    molarMass: 60.096,
    molarVolume: 75.14,
    antoine: { A: 16.1154, B: 3483.67, C: 205.807, range: [20, 116] },
    source: SVNA_B2,
  },
  chloroform: {
    name: 'chloroform',
    cas: '67-66-3',
    formula: 'CHCl3',
    molarMass: 119.38,
    molarVolume: 80.7,
    antoine: { A: 13.7324, B: 2548.74, C: 218.552, range: [-23, 84] },
    source: SVNA_B2,
  },
  'n-hexane': {
    name: 'n-hexane',
    cas: '110-54-3',
    formula: 'C6H14',
    molarMass: 86.175,
    molarVolume: 131.6,
    antoine: { A: 13.8193, B: 2696.04, C: 224.317, range: [-19, 92] },
    source: SVNA_B2,
  },
  // Published as log10(P/bar) = 4.6493 − 1395.14/(t/°C + 182.739), 37–138 °C (Poling, Prausnitz & O'Connell, 5th ed.,
  // Appendix A; read from the Python `chemicals` 1.5.2 table Psat_data_AntoinePoling, which stores it as
  // log10(P/Pa) = 9.6493 − 1395.14/(T/K − 90.411), 310.18–411.26 K). Converted exactly to this file's form:
  // A = (4.6493 + 2)·ln 10, B = 1395.14·ln 10, C unchanged. It gives 117.7 °C at 101.325 kPa.
  '1-butanol': {
    name: '1-butanol',
    cas: '71-36-3',
    formula: 'C4H10O',
    molarMass: 74.123,
    molarVolume: 91.97,
    antoine: { A: 6.6493 * Math.LN10, B: 1395.14 * Math.LN10, C: 182.739, range: [37.03, 138.11] },
    source:
      "Poling, Prausnitz & O'Connell, The Properties of Gases and Liquids, 5th ed. (2001), Appendix A (log10 bar form converted to ln kPa)",
  },
  'n-heptane': {
    name: 'n-heptane',
    cas: '142-82-5',
    formula: 'C7H16',
    molarMass: 100.202,
    molarVolume: 147.5,
    antoine: { A: 13.8622, B: 2910.26, C: 216.432, range: [4, 123] },
    source: SVNA_B2,
  },
}

const R = 8.314462618 // J/(mol·K), CODATA 2018 (exact since the 2019 SI)

/** A binary system of the demo and the model its invented points are generated from. */
export interface DemoSystem {
  key: string
  light: string
  heavy: string
  activity: ActivityModel
  modelSource: string
  detector: 'FID' | 'TCD'
  /** relative response factor k in A1/A2 = k·n1/n2 used to simulate the GC (invented) */
  responseFactor: number
  note: string
}

/**
 * The partially miscible pair of the demo: water (1) / 1-butanol (2). NRTL from the interaction-parameter table
 * "ChemSep NRTL" as distributed with the Python `thermo` 0.6.1 library (IPDB): τij = bij/T with b12 = 1325.3268 K,
 * b21 = 253.6418 K, α = 0.4447; here b in J/mol = b[K]·R. With the Antoine sets above it predicts the
 * heterogeneous azeotrope at 92.97 °C and 101.325 kPa, vapour y_water = 0.764, liquid layers x_water = 0.588 and
 * 0.982 (computed here, tag C; handbook: about 92.7 °C and 57.5 wt % 1-butanol, i.e. y_water ≈ 0.75, CRC Handbook
 * azeotrope table, from memory).
 */
export const WATER_BUTANOL: DemoSystem = {
  key: 'water-1-butanol',
  light: 'water',
  heavy: '1-butanol',
  activity: { kind: 'nrtl', b12: 1325.3268196 * R, b21: 253.64181755 * R, alpha: 0.4447 },
  modelSource: 'NRTL, "ChemSep NRTL" table of the Python thermo 0.6.1 library (water/1-butanol)',
  detector: 'TCD',
  responseFactor: 0.62,
  note: 'Partially miscible: the liquid splits into two layers; heterogeneous azeotrope near 92.7 °C at 1 atm (CRC Handbook, from memory).',
}

export const DEMO_SYSTEMS: DemoSystem[] = [
  {
    key: 'acetone-methanol',
    light: 'acetone',
    heavy: 'methanol',
    // Wilson a12, a21 in cal/mol from SVNA Table 12.5 (reference-values: M), converted to J/mol.
    activity: { kind: 'wilson', a12: -161.88 * CAL, a21: 583.11 * CAL, V1: 74.05, V2: 40.73 },
    modelSource: `${SVNA_12_5} (Wilson, acetone/methanol)`,
    detector: 'FID',
    responseFactor: 1.32,
    note: 'Minimum-boiling azeotrope near 55 °C at 1 atm.',
  },
  {
    key: '1-propanol-water',
    light: '1-propanol',
    heavy: 'water',
    // NRTL b12, b21 in cal/mol and α from SVNA Table 12.5 (reference-values: S), converted to J/mol.
    activity: { kind: 'nrtl', b12: 500.4 * CAL, b21: 1636.57 * CAL, alpha: 0.5081 },
    modelSource: `${SVNA_12_5} (NRTL, 1-propanol/water)`,
    detector: 'TCD',
    responseFactor: 1.85,
    note: 'Minimum-boiling azeotrope near 87.7 °C at 1 atm (CRC Handbook); water needs a TCD.',
  },
  {
    key: 'acetone-chloroform',
    light: 'acetone',
    heavy: 'chloroform',
    // Two-parameter Margules chosen so that, with the Table B.2 Antoine constants, the model reproduces the
    // handbook maximum-boiling azeotrope (about 64.5 °C, about 20 wt % acetone, CRC Handbook; tag M).
    // Derived here (tag C): at x1 = 0.339, 64.5 °C, γi = 101.325 kPa / Pi_sat → A12 = −0.8485, A21 = −0.5291.
    activity: { kind: 'margules', A12: -0.8485, A21: -0.5291 },
    modelSource:
      'Margules fitted to the CRC Handbook azeotrope (about 64.5 °C, 20 wt % acetone) with SVNA Table B.2 Antoine constants',
    detector: 'TCD',
    responseFactor: 0.78,
    note: 'Maximum-boiling azeotrope near 64.5 °C at 1 atm.',
  },
  {
    key: 'hexane-heptane',
    light: 'n-hexane',
    heavy: 'n-heptane',
    // Neighbouring n-alkanes form nearly ideal solutions (common practice, no source): Raoult's law.
    activity: { kind: 'ideal' },
    modelSource: "Raoult's law (neighbouring n-alkanes are nearly ideal; common practice, no source)",
    detector: 'FID',
    responseFactor: 1.04,
    note: 'Nearly ideal pair, no azeotrope.',
  },
  {
    key: 'methanol-water',
    light: 'methanol',
    heavy: 'water',
    // NRTL b12, b21 in cal/mol and α from SVNA Table 12.5 (reference-values: M), converted to J/mol.
    activity: { kind: 'nrtl', b12: -253.88 * CAL, b21: 845.21 * CAL, alpha: 0.2994 },
    modelSource: `${SVNA_12_5} (NRTL, methanol/water)`,
    detector: 'TCD',
    responseFactor: 1.42,
    note: 'Non-ideal, no azeotrope at 1 atm (CRC Handbook).',
  },
  WATER_BUTANOL,
]

/** thermo's vapour-pressure model of a demo component. */
export function demoVaporPressure(name: string): VaporPressureModel {
  return antoine(DEMO_COMPONENTS[name])
}
