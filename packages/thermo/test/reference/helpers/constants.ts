/**
 * Published constants used by the reference tests. Every entry names its source; the tags follow
 * /work/shared/reference-values.md: S read in print, M from memory, C recomputed.
 */
import type { VaporPressureModel } from '../../../src/types.js'

type Antoine = Extract<VaporPressureModel, { kind: 'antoine' }>

/** ln(P/kPa) = A − B/(t/°C + C), range in °C. */
function svna(A: number, B: number, C: number, range: [number, number]): Antoine {
  return { kind: 'antoine', A, B, C, log: 'ln', pressureUnit: 'kPa', temperatureUnit: 'C', range }
}

/**
 * Smith, Van Ness & Abbott, Introduction to Chemical Engineering Thermodynamics, Appendix B, Table B.2,
 * with the table's normal boiling points tn (°C). Tags as in reference-values.md §1.
 */
export const TABLE_B2: { name: string; model: Antoine; tn: number; tag: string }[] = [
  { name: 'acetone', model: svna(14.3145, 2756.22, 228.06, [-26, 77]), tn: 56.2, tag: 'S' },
  { name: 'acetonitrile', model: svna(14.895, 3413.1, 250.523, [-27, 81]), tn: 81.6, tag: 'S' },
  { name: 'benzene', model: svna(13.7819, 2726.81, 217.572, [6, 104]), tn: 80.0, tag: 'S' },
  { name: 'chloroform', model: svna(13.7324, 2548.74, 218.552, [-23, 84]), tn: 61.1, tag: 'S' },
  { name: 'cyclohexane', model: svna(13.6568, 2723.44, 220.618, [9, 105]), tn: 80.7, tag: 'S' },
  { name: 'ethanol', model: svna(16.8958, 3795.17, 230.918, [3, 96]), tn: 78.2, tag: 'S' },
  { name: 'n-heptane', model: svna(13.8622, 2910.26, 216.432, [4, 123]), tn: 98.4, tag: 'A,B S; C, range, tn M' },
  { name: 'n-hexane', model: svna(13.8193, 2696.04, 224.317, [-19, 92]), tn: 68.7, tag: 'A,B S; C, range, tn M' },
  { name: 'methanol', model: svna(16.5785, 3638.27, 239.5, [-11, 83]), tn: 64.7, tag: 'A,B S; C, range, tn M' },
  { name: 'nitromethane', model: svna(14.7513, 3331.7, 227.6, [56, 146]), tn: 101.2, tag: 'A,B S; C, range, tn M' },
  { name: '2-propanol', model: svna(16.6796, 3640.2, 219.61, [8, 100]), tn: 82.2, tag: 'A,B S; C, range, tn M' },
  { name: '1-propanol', model: svna(16.1154, 3483.67, 205.807, [20, 116]), tn: 97.2, tag: 'S' },
  { name: 'toluene', model: svna(13.932, 3056.96, 217.625, [13, 136]), tn: 110.6, tag: 'M' },
  { name: 'water', model: svna(16.3872, 3885.7, 230.17, [0, 200]), tn: 100.0, tag: 'S' },
  { name: 'methyl acetate', model: svna(14.2456, 2662.78, 219.69, [-23, 78]), tn: 56.9, tag: 'A,B S; C M' },
]

/** Look up a Table B.2 model by compound name. */
export function b2(name: string): Antoine {
  const row = TABLE_B2.find((r) => r.name === name)
  if (!row) throw new Error(`no Table B.2 row for ${name}`)
  return row.model
}

/** SVNA 7th ed. (2005), Example 10.1, constants stated in the example (S). */
export const EX_10_1 = {
  acetonitrile: svna(14.2724, 2945.47, 224.0, [-50, 200]),
  nitromethane: svna(14.2043, 2972.64, 209.0, [-50, 200]),
}

/** cal → J (thermochemical calorie, exact). */
export const CAL = 4.184

/**
 * SVNA 7th ed., Table 12.5 (DECHEMA-recommended values): a, b in cal/mol, V in cm³/mol.
 * 1-propanol/water NRTL is S; the Wilson row and the other systems are M.
 */
export const TABLE_12_5 = {
  propanolWater: { V1: 75.14, V2: 18.07, a12: 775.48, a21: 1351.9, b12: 500.4, b21: 1636.57, alpha: 0.5081 },
  methanolWater: { V1: 40.73, V2: 18.07, a12: 107.38, a21: 469.55, b12: -253.88, b21: 845.21, alpha: 0.2994 },
  acetoneWater: { V1: 74.05, V2: 18.07, a12: 291.27, a21: 1448.01, b12: 631.05, b21: 1197.41, alpha: 0.5343 },
  acetoneMethanol: { V1: 74.05, V2: 40.73, a12: -161.88, a21: 583.11, b12: 184.7, b21: 222.64, alpha: 0.3084 },
}
