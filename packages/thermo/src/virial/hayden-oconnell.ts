/**
 * Second virial coefficients by the correlation of J. G. Hayden and J. P. O'Connell, Ind. Eng. Chem. Process Des.
 * Dev. 14 (1975) 209 ("HOC"): B = B_free (non-polar + polar) + B_metastable+bound + B_chemical, each a multiple of
 * b0 = (2/3)·π·N_A·σ³ = 1.26184·σ³ cm³/mol (σ in Å). The equations are written here from memory of the paper's
 * appendix as it is reproduced in J. M. Prausnitz et al., Computer Calculations for Multicomponent Vapor–Liquid and
 * Liquid–Liquid Equilibria (Prentice-Hall, 1980); no stored copy of either was at hand. The tests check the result
 * against measured second virial coefficients (argon, methane, benzene, water) and against the dimerisation
 * constant of acetic-acid vapour, which is what the correlation was built to reproduce.
 *
 * Inputs per component: Tc (K), Pc (Pa), the mean radius of gyration RD (Å; it replaces the acentric factor through
 * the "non-polar acentric factor" ω' = 0.006026·RD + 0.02087·RD² − 0.001366·RD³), the dipole moment μ (debye) and
 * the association parameter η (0 for non-associating molecules, about 4.5 for carboxylic acids); per pair, the
 * solvation parameter η12.
 */
import type { VirialComponent } from './virial-types.js'

/** The HOC potential parameters of one pure component or of one unlike pair. */
export interface HocPair {
  /** ε/k, K */
  eps: number
  /** σ, Å */
  sigma: number
  /** the non-polar acentric factor ω' (pair: the mean of the two) */
  omega: number
  /** reduced dipole moment μ* = 7243.8·μi·μj/(ε/k·σ³) */
  muStar: number
  /** association (pure) or solvation (pair) parameter η */
  eta: number
}

/** The non-polar acentric factor ω' of HOC from the mean radius of gyration RD (Å). */
export function hocOmega(RD: number): number {
  return RD * (0.006026 + RD * (0.02087 - 0.001366 * RD))
}

/**
 * ε/k and σ of a pure component (HOC): ε'/k = Tc·(0.748 + 0.91ω' − 0.4η/(2 + 20ω')), σ' = (2.44 − ω')·(Tc/Pc[atm])^⅓,
 * then for μ ≥ 1.45 D the polar corrections ε = ε'·[1 − ξc1(1 − ξ(1 + c1/2))], σ = σ'·(1 + ξc2)^⅓ with
 * ξ = 1.7941e7·μ⁴/[(2.882 − 1.882ω'/(0.03 + ω'))·Tc·σ'⁶·ε'/k], c1 = (16 + 400ω')/(10 + 400ω'), c2 = 3/(10 + 400ω').
 */
export function hocPure(c: Pick<VirialComponent, 'Tc' | 'Pc' | 'RD' | 'dipole' | 'eta'>): HocPair {
  const w = hocOmega(c.RD ?? 0)
  const eta = c.eta ?? 0
  const mu = c.dipole ?? 0
  const epsP = c.Tc * (0.748 + 0.91 * w - (0.4 * eta) / (2 + 20 * w))
  const sigP = (2.44 - w) * Math.cbrt((c.Tc * 101325) / c.Pc)
  let eps = epsP
  let sigma = sigP
  if (mu >= 1.45) {
    const s3 = sigP * sigP * sigP
    const xi = (1.7941e7 * mu ** 4) / ((2.882 - (1.882 * w) / (0.03 + w)) * c.Tc * s3 * s3 * epsP)
    const c1 = (16 + 400 * w) / (10 + 400 * w)
    const c2 = 3 / (10 + 400 * w)
    eps = epsP * (1 - xi * c1 * (1 - xi * (1 + c1 / 2)))
    sigma = sigP * Math.cbrt(1 + xi * c2)
  }
  return { eps, sigma, omega: w, muStar: (7243.8 * mu * mu) / (eps * sigma * sigma * sigma), eta }
}

/**
 * The unlike pair (HOC): ω'12 = (ω'1 + ω'2)/2, ε'12 = 0.7·√(ε1ε2) + 0.6/(1/ε1 + 1/ε2), σ'12 = √(σ1σ2); when one
 * molecule is polar (μ ≥ 2 D) and the other has no dipole, the induction corrections ε12 = ε'12·(1 + ξc1),
 * σ12 = σ'12·(1 − ξc2)^⅓ with ξ = μp²·(εn)^⅔·σn⁴/(ε'12·σ'12⁶); μ*12 = 7243.8·μ1μ2/(ε12σ12³).
 */
export function hocCross(p1: HocPair, p2: HocPair, mu1: number, mu2: number, eta12: number): HocPair {
  const w = 0.5 * (p1.omega + p2.omega)
  const epsP = 0.7 * Math.sqrt(p1.eps * p2.eps) + 0.6 / (1 / p1.eps + 1 / p2.eps)
  const sigP = Math.sqrt(p1.sigma * p2.sigma)
  let xi = 0
  const s6 = sigP ** 6
  if (mu1 >= 2 && mu2 === 0) xi = (mu1 * mu1 * Math.cbrt(p2.eps * p2.eps) * p2.sigma ** 4) / (epsP * s6)
  else if (mu2 >= 2 && mu1 === 0) xi = (mu2 * mu2 * Math.cbrt(p1.eps * p1.eps) * p1.sigma ** 4) / (epsP * s6)
  const c1 = (16 + 400 * w) / (10 + 400 * w)
  const c2 = 3 / (10 + 400 * w)
  const eps = epsP * (1 + xi * c1)
  const sigma = sigP * Math.cbrt(1 - xi * c2)
  return { eps, sigma, omega: w, muStar: (7243.8 * mu1 * mu2) / (eps * sigma * sigma * sigma), eta: eta12 }
}

/**
 * The temperature-independent constants of one HOC pair, as the kernel uses them (7 numbers):
 * [b0 (m³/mol), ε/k (K), 1.6·ω', μ*' (the free-polar dipole), A, ΔH, E] and the chemical constant 1500·η (K) at
 * index 7. μ*' = μ* below 0.04, 0 from 0.04 to 0.25, μ* − 0.25 above; A = −0.3 − 0.05μ*; ΔH = 1.99 + 0.2μ*²;
 * E = exp[η·(650/(ε/k + 300) − 4.27)] for η < 4.5 and exp[η·(42800/(ε/k + 22400) − 4.27)] for η ≥ 4.5 (the
 * carboxylic-acid branch).
 */
export const HOC_STRIDE = 8

export function hocConstants(p: HocPair, out: Float64Array, at: number): void {
  const ms = p.muStar
  const mup = ms < 0.04 ? ms : ms < 0.25 ? 0 : ms - 0.25
  const s3 = p.sigma * p.sigma * p.sigma
  out[at] = 1.26184e-6 * s3
  out[at + 1] = p.eps
  out[at + 2] = 1.6 * p.omega
  out[at + 3] = mup
  out[at + 4] = -0.3 - 0.05 * ms
  out[at + 5] = 1.99 + 0.2 * ms * ms
  out[at + 6] = Math.exp(p.eta * ((p.eta < 4.5 ? 650 / (p.eps + 300) : 42800 / (p.eps + 22400)) - 4.27))
  out[at + 7] = 1500 * p.eta
}

/** The four HOC contributions at T (K), cm³/mol, from constants written by {@link hocConstants}. */
export function hocParts(
  k: Float64Array,
  at: number,
  T: number,
): { free: number; metastableBound: number; chemical: number; total: number } {
  const b0 = 1e6 * k[at]
  const inv = k[at + 1] / T // 1/T*
  const s = inv - k[at + 2] // 1/T*'
  const s2 = s * s
  const s3 = s2 * s
  const free = b0 * (0.94 - 1.47 * s - 0.85 * s2 + 1.015 * s3 - k[at + 3] * (0.74 - 3 * s + 2.1 * s2 + 2.1 * s3))
  const metastableBound = b0 * k[at + 4] * Math.exp(k[at + 5] * inv)
  const chemical = k[at + 7] > 0 ? b0 * k[at + 6] * (1 - Math.exp(k[at + 7] / T)) : 0
  return { free, metastableBound, chemical, total: free + metastableBound + chemical }
}

/** HOC B of pair `at` at T, m³/mol (the kernels' hot path; same sum as {@link hocParts}). */
export function hocB(k: Float64Array, at: number, T: number): number {
  const inv = k[at + 1] / T
  const s = inv - k[at + 2]
  const s2 = s * s
  const s3 = s2 * s
  let r = 0.94 - 1.47 * s - 0.85 * s2 + 1.015 * s3 - k[at + 3] * (0.74 - 3 * s + 2.1 * s2 + 2.1 * s3)
  r += k[at + 4] * Math.exp(k[at + 5] * inv)
  if (k[at + 7] > 0) r += k[at + 6] * (1 - Math.exp(k[at + 7] / T))
  return k[at] * r
}

/**
 * The free (physical: non-polar + polar) and dimerising (metastable + bound + chemical) parts of B of pair `at` at
 * T, m³/mol, into out[j] and out[j + 1] (same sums as {@link hocParts}; the chemical theory's split).
 */
export function hocFreeDimer(k: Float64Array, at: number, T: number, out: Float64Array, j: number): void {
  const inv = k[at + 1] / T
  const s = inv - k[at + 2]
  const s2 = s * s
  const s3 = s2 * s
  const free = 0.94 - 1.47 * s - 0.85 * s2 + 1.015 * s3 - k[at + 3] * (0.74 - 3 * s + 2.1 * s2 + 2.1 * s3)
  let dimer = k[at + 4] * Math.exp(k[at + 5] * inv)
  if (k[at + 7] > 0) dimer += k[at + 6] * (1 - Math.exp(k[at + 7] / T))
  out[j] = k[at] * free
  out[j + 1] = k[at] * dimer
}

/** The constants of the pairs 11, 22 and 12 of a binary (3 × {@link HOC_STRIDE} numbers). */
export function hocBinaryConstants(c1: VirialComponent, c2: VirialComponent, eta12: number): Float64Array {
  const p1 = hocPure(c1)
  const p2 = hocPure(c2)
  const k = new Float64Array(3 * HOC_STRIDE)
  hocConstants(p1, k, 0)
  hocConstants(p2, k, HOC_STRIDE)
  hocConstants(hocCross(p1, p2, c1.dipole ?? 0, c2.dipole ?? 0, eta12), k, 2 * HOC_STRIDE)
  return k
}

/**
 * Second virial coefficient of one pure component by Hayden–O'Connell at T (K), cm³/mol, split into its
 * contributions (free, metastable + bound, chemical) and their total.
 */
export function secondVirialHaydenOConnell(
  T: number,
  c: Pick<VirialComponent, 'Tc' | 'Pc' | 'RD' | 'dipole' | 'eta'>,
): { free: number; metastableBound: number; chemical: number; total: number } {
  const k = new Float64Array(HOC_STRIDE)
  hocConstants(hocPure(c), k, 0)
  return hocParts(k, 0, T)
}
