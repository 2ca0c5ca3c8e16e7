/**
 * The chemical theory of vapour-phase dimerisation with Hayden–O'Connell constants (J. G. Hayden, J. P. O'Connell,
 * Ind. Eng. Chem. Process Des. Dev. 14 (1975) 209; the treatment as in J. M. Prausnitz et al., Computer Calculations
 * for Multicomponent Vapor–Liquid and Liquid–Liquid Equilibria, Prentice-Hall, 1980; both from memory).
 *
 * The vapour holds five true species: monomers 1 and 2, dimers 11, 12 and 22, in chemical equilibrium at T and P.
 * Each Bij splits into a free (physical) part B^F_ij and a dimerising part B^D_ij (metastable + bound + chemical);
 * the dimerisation constants are Kij = zij/(zi·zj·P) = −B^D_ij·(2 − δij)/(RT), 1/Pa. The factor 2 of the unlike
 * pair makes the low-pressure limit exact: there Z = 1 − P·(K11y1² + K12y1y2 + K22y2²) must equal 1 + B^D·P/RT with
 * B^D = y1²B^D_11 + 2y1y2B^D_12 + y2²B^D_22.
 *
 * Physical part: a dimer's physical interactions are taken as those of its two monomers (φij = φi·φj), so the
 * equilibrium needs no fugacity coefficients and the monomers' φi,M is the truncated virial equation with the free B
 * at the apparent composition: ln φi,M = (P/RT)(B^F_ii + yj²δ^F_12). The apparent fugacity coefficient is
 * φ̂i = zi,M·φi,M/yi. This is thermodynamically consistent (the apparent φ̂ obey Gibbs–Duhem at fixed T and P, since
 * an ideal-gas reacting mixture does and the physical part is a Gibbs-energy derivative), tends to the truncated
 * virial equation with B = B^F + B^D at low pressure, and to the truncated virial equation with B^F when every K → 0.
 * A pure component at saturation: φi_sat = zM(Kii·Pi_sat)·exp(B^F_ii·Pi_sat/RT), so a pure acid boils exactly at its
 * vapour pressure.
 *
 * zi,M/yi is written (1 + zD)/(1 + 2kii·zi + kij·zj), zD = z11 + z12 + z22, kij = Kij·P, which needs no division by
 * yi and is exact at infinite dilution.
 */
import { R } from '../types.js'
import { HOC_STRIDE, hocFreeDimer } from './hayden-oconnell.js'

/** True-species mole fractions of the last {@link solveSpecies}: z1, z2 (monomers), z11, z12, z22 (dimers). */
export const species = new Float64Array(5)

/**
 * The monomer fraction of a pure dimerising vapour at kP = K·P (dimensionless): zM + kP·zM² = 1, so
 * zM = (−1 + √(1 + 4kP))/(2kP), written 2/(1 + √(1 + 4kP)) (no cancellation as kP → 0, where zM → 1).
 */
export function pureMonomerFraction(kP: number): number {
  return 2 / (1 + Math.sqrt(1 + 4 * kP))
}

/** Monomer 2 from Σz = 1 at monomer 1: k22·z2² + (1 + k12·z1)·z2 − (1 − z1 − k11·z1²) = 0, the positive root. */
function monomer2(k11: number, k22: number, k12: number, z1: number): number {
  const c = 1 - z1 - k11 * z1 * z1
  if (c <= 0) return 0
  const b = 1 + k12 * z1
  return (2 * c) / (b + Math.sqrt(b * b + 4 * k22 * c))
}

/**
 * The true composition of a dimerising binary vapour with apparent y1 and kij = Kij·P ≥ 0, into out (z1, z2, z11,
 * z12, z22). Closed form for a pure component; otherwise Newton on z1 with z2(z1) from Σz = 1, kept inside a
 * bracket [lo, hi] on which the apparent-balance residual F = y2·A1 − y1·A2 (Ai: moles of i per mole of true
 * species) changes sign (F(0) ≤ 0 ≤ F(z1 of pure 1)); a step leaving the bracket is replaced by bisection. The
 * Newton variable is the minority component's monomer (the other from Σz = 1 in closed form, without cancellation),
 * stopped at a relative step of 4e-16. The equilibrium of an ideal-gas reacting mixture is unique, so the root is.
 * @returns the iterations (0: closed form).
 */
export function solveSpecies(k11: number, k22: number, k12: number, y1: number, out: Float64Array): number {
  if (y1 <= 0.5) return solveMinority(k11, k22, k12, y1, out)
  // iterate on the minority's monomer: the majority's from Σz = 1 would cancel when it is nearly all the vapour
  const it = solveMinority(k22, k11, k12, 1 - y1, out)
  const z2 = out[0]
  const z22 = out[2]
  out[0] = out[1]
  out[1] = z2
  out[2] = out[4]
  out[4] = z22
  return it
}

/** {@link solveSpecies} for y1 ≤ 0.5 (component 1 the minority), Newton on z1 with a relative stop. */
function solveMinority(k11: number, k22: number, k12: number, y1: number, out: Float64Array): number {
  const y2 = 1 - y1
  let z1: number
  let z2: number
  let it = 0
  if (y2 <= 0) {
    z1 = pureMonomerFraction(k11)
    z2 = 0
  } else if (y1 <= 0) {
    z1 = 0
    z2 = pureMonomerFraction(k22)
  } else {
    let lo = 0
    let hi = pureMonomerFraction(k11)
    // start: component 1's share of the monomers of a vapour dimerising with the mean constant
    z1 = y1 * pureMonomerFraction(y1 * y1 * k11 + y1 * y2 * k12 + y2 * y2 * k22)
    if (!(z1 > lo && z1 < hi)) z1 = 0.5 * hi
    for (it = 1; it <= 200; it++) {
      z2 = monomer2(k11, k22, k12, z1)
      const u1 = 1 + 2 * k11 * z1 + k12 * z2
      const u2 = 1 + 2 * k22 * z2 + k12 * z1
      const F = y2 * z1 * u1 - y1 * z2 * u2
      if (F === 0) break
      if (F < 0) lo = z1
      else hi = z1
      const dz2 = -u1 / (1 + k12 * z1 + 2 * k22 * z2)
      const dA1 = u1 + 2 * k11 * z1 + k12 * z1 * dz2
      const dA2 = dz2 * (u2 + 2 * k22 * z2) + k12 * z2
      const dF = y2 * dA1 - y1 * dA2
      let zn = z1 - F / dF
      if (!(zn > lo && zn < hi)) zn = 0.5 * (lo + hi)
      const step = zn - z1
      z1 = zn
      if (Math.abs(step) <= 4e-16 * z1 || hi - lo <= 4e-16 * hi) break
    }
    z2 = monomer2(k11, k22, k12, z1)
  }
  out[0] = z1
  out[1] = z2
  out[2] = k11 * z1 * z1
  out[3] = k12 * z1 * z2
  out[4] = k22 * z2 * z2
  return it
}

/**
 * The chemical theory's numbers at T (K) from the compiled HOC constants (3 × HOC_STRIDE): B^F_11, B^F_22, B^F_12
 * (m³/mol) into s[0..2] and K11, K22, K12 (1/Pa) into s[3..5].
 */
export function chemicalConstants(hoc: Float64Array, T: number, s: Float64Array): void {
  hocFreeDimer(hoc, 0, T, s, 0) // s[0] = B^F_11, s[1] = B^D_11
  const d11 = s[1]
  hocFreeDimer(hoc, HOC_STRIDE, T, s, 1) // s[1] = B^F_22, s[2] = B^D_22
  const d22 = s[2]
  hocFreeDimer(hoc, 2 * HOC_STRIDE, T, s, 2) // s[2] = B^F_12, s[3] = B^D_12
  const rt = R * T
  s[5] = (-2 * s[3]) / rt
  s[3] = -d11 / rt
  s[4] = -d22 / rt
}

/**
 * Apparent ln φ̂1, ln φ̂2 at T (K), P (Pa), apparent y1, from {@link chemicalConstants} s, into out[at], out[at + 1];
 * leaves the true composition in {@link species}. @returns the apparent molar volume RT/(P(1 + zD)) + B^F_mix, m³/mol.
 */
export function lnPhiChemical(
  s: Float64Array,
  T: number,
  P: number,
  y1: number,
  out: Float64Array,
  at: number,
): number {
  const k11 = s[3] * P
  const k22 = s[4] * P
  const k12 = s[5] * P
  solveSpecies(k11, k22, k12, y1, species)
  const z1 = species[0]
  const z2 = species[1]
  const n = 1 + species[2] + species[3] + species[4] // true moles → apparent moles
  const rt = R * T
  const y2 = 1 - y1
  const d12 = 2 * s[2] - s[0] - s[1]
  out[at] = Math.log(n / (1 + 2 * k11 * z1 + k12 * z2)) + (P * (s[0] + y2 * y2 * d12)) / rt
  out[at + 1] = Math.log(n / (1 + 2 * k22 * z2 + k12 * z1)) + (P * (s[1] + y1 * y1 * d12)) / rt
  return rt / (P * n) + y1 * y1 * s[0] + 2 * y1 * y2 * s[2] + y2 * y2 * s[1]
}

/** ln φ_sat of pure component i (0 or 1) at its vapour pressure ps (Pa): ln zM(Kii·ps) + B^F_ii·ps/RT. */
export function lnPhiSatChemical(s: Float64Array, T: number, i: number, ps: number): number {
  return Math.log(pureMonomerFraction(s[3 + i] * ps)) + (s[i] * ps) / (R * T)
}
