import { R } from '../types.js'
import type { VirialComponent } from './virial-types.js'

/**
 * Reduced second virial coefficient of the Tsonopoulos correlation, B·Pc/(R·Tc) = f0 + ω·f1 + a·f2a + b·f2b,
 * C. Tsonopoulos, AIChE J. 20 (1974) 263 (forms as in Poling, Prausnitz & O'Connell, The Properties of Gases and
 * Liquids, 5th ed., §4-5; from memory, checked against the Python library `chemicals` 1.5.2 in the tests).
 */
export function tsonopoulosReduced(Tr: number, omega: number, a = 0, b = 0): number {
  const i1 = 1 / Tr
  const i2 = i1 * i1
  const i3 = i2 * i1
  const i6 = i3 * i3
  const i8 = i6 * i2
  const f0 = 0.1445 - 0.33 * i1 - 0.1385 * i2 - 0.0121 * i3 - 0.000607 * i8
  const f1 = 0.0637 + 0.331 * i2 - 0.423 * i3 - 0.008 * i8
  return f0 + omega * f1 + a * i6 - b * i8
}

/** Second virial coefficient of one pure component by Tsonopoulos, cm³/mol (T in K). */
export function secondVirialTsonopoulos(T: number, c: VirialComponent): number {
  const a = c.tsonopoulos?.a ?? 0
  const b = c.tsonopoulos?.b ?? 0
  return ((tsonopoulosReduced(T / c.Tc, c.omega, a, b) * R * c.Tc) / c.Pc) * 1e6
}

/**
 * The published polar parameters a and b of Tsonopoulos for a component class, from the reduced dipole moment
 * μr = 1e5·μ²·(Pc/atm)/Tc² (μ in debye). Classes and constants: Tsonopoulos, AIChE J. 20 (1974) 263 and
 * AIChE J. 21 (1975) 827; Tsonopoulos & Heidman, Fluid Phase Equilib. 57 (1990) 261 (water). Constants as
 * implemented in `chemicals` 1.5.2 (`BVirial_Tsonopoulos_extended`), which quotes the same papers, except the
 * haloalkane exponent (see below).
 */
export function tsonopoulosPolarParameters(o: {
  kind:
    | 'non-polar'
    | 'ketone-ether-ester-aldehyde-nitrile'
    | 'haloalkane-mercaptan-sulfide'
    | 'alcohol'
    | 'methanol'
    | 'water'
  dipole?: number
  Tc: number
  Pc: number
}): { a: number; b: number } {
  const mur = (1e5 * (o.dipole ?? 0) ** 2 * (o.Pc / 101325)) / (o.Tc * o.Tc)
  switch (o.kind) {
    case 'non-polar':
      return { a: 0, b: 0 }
    case 'water':
      return { a: -0.0109, b: 0 }
    case 'methanol':
      return { a: 0.0878, b: 0.0525 }
    case 'alcohol':
      return { a: 0.0878, b: 0.00908 + 0.0006957 * mur }
    case 'ketone-ether-ester-aldehyde-nitrile':
      return { a: -2.14e-4 * mur - 4.308e-21 * mur ** 8, b: 0 }
    case 'haloalkane-mercaptan-sulfide':
      // Poling, Prausnitz & O'Connell, 5th ed., §4-5 (from memory): −2.188e-11·μr⁴. `chemicals` 1.5.2 writes
      // −2.188e-4, which gives a ≈ −26 for chloroform (physically absurd); we keep the published exponent.
      return { a: -2.188e-11 * mur ** 4 - 7.831e-21 * mur ** 8, b: 0 }
  }
}

/**
 * Cross critical constants of Tsonopoulos (AIChE J. 20 (1974) 263; from memory): Tc12 = √(Tc1·Tc2)·(1 − k12),
 * Pc12 = 4·Tc12·(Pc1·Vc1/Tc1 + Pc2·Vc2/Tc2)/(Vc1^⅓ + Vc2^⅓)³, ω12 = (ω1 + ω2)/2.
 */
export function crossCriticalConstants(
  c1: VirialComponent,
  c2: VirialComponent,
  k12 = 0,
): { Tc: number; Pc: number; omega: number } {
  const Tc = Math.sqrt(c1.Tc * c2.Tc) * (1 - k12)
  const s = Math.cbrt(c1.Vc) + Math.cbrt(c2.Vc)
  const Pc = (4 * Tc * ((c1.Pc * c1.Vc) / c1.Tc + (c2.Pc * c2.Vc) / c2.Tc)) / (s * s * s)
  return { Tc, Pc, omega: 0.5 * (c1.omega + c2.omega) }
}
