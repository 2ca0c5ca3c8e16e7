/**
 * Allocation-free γ–φ bubble-temperature kernel for the hot paths (fitting, diagrams, benchmarks). Same equations
 * as gamma-phi.ts; the virial constants are reduced once per vapour model by {@link compileVirial}.
 */
import { lnGammaT } from '../activity/kernel.js'
import { res, solveBubbleT, startTemperature } from '../equilibrium/kernel.js'
import type { CompiledSystem } from '../equilibrium/system.js'
import { R } from '../types.js'
import { chemicalConstants, lnPhiChemical, lnPhiSatChemical } from './chemical-theory.js'
import { HOC_STRIDE, hocB, hocBinaryConstants } from './hayden-oconnell.js'
import { checkVaporModel, usesChemicalTheory } from './model.js'
import { crossCriticalConstants } from './tsonopoulos.js'
import type { VaporModel } from './virial-types.js'

/**
 * A virial vapour reduced to numbers. Tsonopoulos: per pair (1, 2, cross) Tc, R·Tc/Pc in m³/mol, ω, a, b in `k`.
 * Hayden–O'Connell: `hoc` holds the pairs' constants ({@link hocConstants}) and `k` is unused; `chem` is true when
 * some η or η12 ≥ 4.5 (a carboxylic acid), and then φ comes from the chemical theory (chemical-theory.ts).
 */
export interface CompiledVirial {
  k: Float64Array // [Tc, RTc/Pc, ω, a, b] × (1, 2, 12)
  /** Hayden–O'Connell constants (3 × HOC_STRIDE), or null under Tsonopoulos. */
  hoc: Float64Array | null
  /** The chemical theory of dimerisation (HOC with η or η12 ≥ 4.5) instead of the truncated virial φ. */
  chem: boolean
  VL1: number // m³/mol, 0 without Poynting
  VL2: number
}

/** Reduce a virial vapour model once (call {@link checkVaporModel} first). */
export function compileVirial(v: Extract<VaporModel, { kind: 'virial' }>): CompiledVirial {
  const [c1, c2] = v.components
  const VL1 = v.poynting ? 1e-6 * (c1.liquidMolarVolume ?? 0) : 0
  const VL2 = v.poynting ? 1e-6 * (c2.liquidMolarVolume ?? 0) : 0
  const k = new Float64Array(15)
  if (v.correlation === 'hayden-oconnell')
    return { k, hoc: hocBinaryConstants(c1, c2, v.eta12 ?? 0), chem: usesChemicalTheory(v), VL1, VL2 }
  const x = crossCriticalConstants(c1, c2, v.k12 ?? 0)
  const put = (i: number, Tc: number, Pc: number, w: number, a: number, b: number) => {
    k[5 * i] = Tc
    k[5 * i + 1] = (R * Tc) / Pc
    k[5 * i + 2] = w
    k[5 * i + 3] = a
    k[5 * i + 4] = b
  }
  put(0, c1.Tc, c1.Pc, c1.omega, c1.tsonopoulos?.a ?? 0, c1.tsonopoulos?.b ?? 0)
  put(1, c2.Tc, c2.Pc, c2.omega, c2.tsonopoulos?.a ?? 0, c2.tsonopoulos?.b ?? 0)
  put(2, x.Tc, x.Pc, x.omega, v.cross?.a12 ?? 0, v.cross?.b12 ?? 0)
  return { k, hoc: null, chem: false, VL1, VL2 }
}

const compiledCache = new WeakMap<object, CompiledVirial>()

/**
 * The checked, compiled form of a virial vapour model, kept while the model object lives (models are treated as
 * immutable). @throws ThermoError 'invalid-model' naming the missing or bad field.
 */
export function compiledVirial(v: Extract<VaporModel, { kind: 'virial' }>): CompiledVirial {
  let cv = compiledCache.get(v)
  if (!cv) {
    checkVaporModel(v)
    cv = compileVirial(v)
    compiledCache.set(v, cv)
  }
  return cv
}

/** B of entry i (0: B11, 1: B22, 2: B12) at T, m³/mol (Tsonopoulos). */
function B(k: Float64Array, i: number, T: number): number {
  const o = 5 * i
  const i1 = k[o] / T
  const i2 = i1 * i1
  const i3 = i2 * i1
  const i6 = i3 * i3
  const i8 = i6 * i2
  const f0 = 0.1445 - 0.33 * i1 - 0.1385 * i2 - 0.0121 * i3 - 0.000607 * i8
  const f1 = 0.0637 + 0.331 * i2 - 0.423 * i3 - 0.008 * i8
  return (f0 + k[o + 2] * f1 + k[o + 3] * i6 - k[o + 4] * i8) * k[o + 1]
}

/** B of entry i (0: B11, 1: B22, 2: B12) at T, m³/mol, by the compiled vapour's correlation. */
function Bv(v: CompiledVirial, i: number, T: number): number {
  return v.hoc === null ? B(v.k, i, T) : hocB(v.hoc, i * HOC_STRIDE, T)
}

const g = new Float64Array(4)
const lp = new Float64Array(4)
const lq = new Float64Array(4)
/** The chemical theory's B^F (m³/mol) and K (1/Pa) at the current T ({@link chemicalConstants}). */
const cs = new Float64Array(6)

/** The liquid and vapour-pressure part of a system the kernels need (a CompiledSystem fits). */
export type KernelSystem = Pick<CompiledSystem, 'act' | 'vp1' | 'vp2'>

/**
 * ln Φ1, ln Φ2 into out[0], out[1] and ln φ̂1, ln φ̂2 into out[2], out[3] at T (K), P (Pa), vapour y1, with the
 * vapour pressures ps1, ps2 (Pa): ln φ̂i = P(Bii + yj²δ12)/RT, ln Φi = ln φ̂i − [Bii·Pi_sat + V_L,i(P − Pi_sat)]/RT;
 * under the chemical theory (`v.chem`) φ̂i and φi_sat from chemical-theory.ts, the Poynting term the same.
 * @returns the vapour's molar volume (per apparent mole), m³/mol.
 */
export function lnPhiFactors(
  v: CompiledVirial,
  T: number,
  P: number,
  y1: number,
  ps1: number,
  ps2: number,
  out: Float64Array,
): number {
  const rt = R * T
  if (v.chem) {
    chemicalConstants(v.hoc!, T, cs)
    const V = lnPhiChemical(cs, T, P, y1, out, 2)
    out[0] = out[2] - lnPhiSatChemical(cs, T, 0, ps1) - (v.VL1 * (P - ps1)) / rt
    out[1] = out[3] - lnPhiSatChemical(cs, T, 1, ps2) - (v.VL2 * (P - ps2)) / rt
    return V
  }
  const b11 = Bv(v, 0, T)
  const b22 = Bv(v, 1, T)
  const b12 = Bv(v, 2, T)
  const d12 = 2 * b12 - b11 - b22
  const y2 = 1 - y1
  out[2] = (P * (b11 + y2 * y2 * d12)) / rt
  out[3] = (P * (b22 + y1 * y1 * d12)) / rt
  out[0] = out[2] - (b11 * ps1 + v.VL1 * (P - ps1)) / rt
  out[1] = out[3] - (b22 * ps2 + v.VL2 * (P - ps2)) / rt
  return rt / P + y1 * y1 * b11 + 2 * y1 * y2 * b12 + y2 * y2 * b22
}

/**
 * Partial derivatives of ln Φ1, ln Φ2 at a γ–φ state, for implicit derivatives in fitting:
 * out[0], out[1] ∂/∂T (1/K, vapour pressures following T, numerically), out[2], out[3] ∂/∂y1, out[4], out[5] ∂/∂ln P.
 */
export function lnPhiDerivatives(
  c: Pick<KernelSystem, 'vp1' | 'vp2'>,
  v: CompiledVirial,
  T: number,
  P: number,
  y1: number,
  out: Float64Array,
): void {
  const h = 1e-4 * T
  const at = (t: number) => {
    lnPhiFactors(v, t, P, y1, psat(c.vp1, t), psat(c.vp2, t), lp)
  }
  at(T + h)
  const up1 = lp[0]
  const up2 = lp[1]
  at(T - h)
  out[0] = (up1 - lp[0]) / (2 * h)
  out[1] = (up2 - lp[1]) / (2 * h)
  if (v.chem) {
    chemicalDerivatives(c, v, T, P, y1, out)
    return
  }
  const b11 = Bv(v, 0, T)
  const b22 = Bv(v, 1, T)
  const d12 = 2 * Bv(v, 2, T) - b11 - b22
  const rt = R * T
  const y2 = 1 - y1
  out[2] = (-2 * P * y2 * d12) / rt
  out[3] = (2 * P * y1 * d12) / rt
  out[4] = (P * (b11 + y2 * y2 * d12 - v.VL1)) / rt
  out[5] = (P * (b22 + y1 * y1 * d12 - v.VL2)) / rt
}

/**
 * ∂ln Φi/∂y1 and ∂ln Φi/∂ln P under the chemical theory, into out[2..5], by central differences (h = 1e-6; one-sided
 * at y1 = 0 or 1): the true composition has no closed form to differentiate.
 */
function chemicalDerivatives(
  c: Pick<KernelSystem, 'vp1' | 'vp2'>,
  v: CompiledVirial,
  T: number,
  P: number,
  y1: number,
  out: Float64Array,
): void {
  const ps1 = psat(c.vp1, T)
  const ps2 = psat(c.vp2, T)
  const ya = y1 > 1e-6 ? y1 - 1e-6 : 0
  const yb = y1 < 1 - 1e-6 ? y1 + 1e-6 : 1
  lnPhiFactors(v, T, P, yb, ps1, ps2, lq)
  lnPhiFactors(v, T, P, ya, ps1, ps2, lp)
  out[2] = (lq[0] - lp[0]) / (yb - ya)
  out[3] = (lq[1] - lp[1]) / (yb - ya)
  lnPhiFactors(v, T, P * Math.exp(1e-6), y1, ps1, ps2, lq)
  lnPhiFactors(v, T, P * Math.exp(-1e-6), y1, ps1, ps2, lp)
  out[4] = (lq[0] - lp[0]) / 2e-6
  out[5] = (lq[1] - lp[1]) / 2e-6
}

function psat(vp: { a: number; b: number; c: number }, T: number): number {
  return Math.exp(vp.a - vp.b / (T + vp.c))
}

/**
 * γ–φ bubble temperature at ln(P/Pa) = lnP and x1, from T0 (default: the ideal-vapour bubble point). Writes res[0]
 * T, res[1] y1, res[2] γ1, res[3] γ2, res[4] iterations (ideal start + γ–φ), res[5] P; into phiOut: φ̂1, φ̂2, Φ1, Φ2
 * (of the last iterate) and the vapour's molar volume RT/P + B_mix (m³/mol). @returns false when it does not converge.
 */
export function solveBubbleTGammaPhi(
  c: KernelSystem,
  v: CompiledVirial,
  lnP: number,
  x1: number,
  phiOut: Float64Array,
  T0?: number,
): boolean {
  let T: number
  let y1: number
  let start = 0
  if (T0 === undefined) {
    if (!solveBubbleT(c.act, c.vp1, c.vp2, lnP, x1, startTemperature(c.vp1, c.vp2, lnP, x1))) return false
    T = res[0]
    y1 = res[1]
    start = res[4]
  } else {
    T = T0
    y1 = x1
  }
  const P = Math.exp(lnP)
  if (v.chem) return solveBubbleTChemical(c, v, P, x1, T, y1, start, phiOut)
  const x2 = 1 - x1
  const { vp1, vp2 } = c
  const k = v.k
  const hoc = v.hoc
  for (let it = 1; it <= 100; it++) {
    lnGammaT(c.act, x1, T, g)
    const d1 = T + vp1.c
    const d2 = T + vp2.c
    const ps1 = Math.exp(vp1.a - vp1.b / d1)
    const ps2 = Math.exp(vp2.a - vp2.b / d2)
    // ln Φi as in lnPhiFactors, inlined: this loop is the γ–φ hot path.
    const b11 = hoc === null ? B(k, 0, T) : hocB(hoc, 0, T)
    const b22 = hoc === null ? B(k, 1, T) : hocB(hoc, HOC_STRIDE, T)
    const b12 = hoc === null ? B(k, 2, T) : hocB(hoc, 2 * HOC_STRIDE, T)
    const d12 = 2 * b12 - b11 - b22
    const rt = R * T
    const y2 = 1 - y1
    const lnPhiHat1 = (P * (b11 + y2 * y2 * d12)) / rt
    const lnPhiHat2 = (P * (b22 + y1 * y1 * d12)) / rt
    const lnPhi1 = lnPhiHat1 - (b11 * ps1 + v.VL1 * (P - ps1)) / rt
    const lnPhi2 = lnPhiHat2 - (b22 * ps2 + v.VL2 * (P - ps2)) / rt
    const k1 = x1 > 0 ? x1 * Math.exp(g[0] - lnPhi1) * ps1 : 0
    const k2 = x2 > 0 ? x2 * Math.exp(g[1] - lnPhi2) * ps2 : 0
    const S = k1 + k2
    const fp = (k1 * (g[2] + vp1.b / (d1 * d1)) + k2 * (g[3] + vp2.b / (d2 * d2))) / S
    const dT = -Math.log(S / P) / fp
    const yn = k1 / S
    const dy = yn - y1
    if (!Number.isFinite(dT)) return false
    if (dT < 1e-9 && dT > -1e-9 && dy < 1e-12 && dy > -1e-12) {
      res[0] = T + dT
      res[1] = yn
      res[2] = Math.exp(g[0])
      res[3] = Math.exp(g[1])
      res[4] = start + it
      res[5] = P
      phiOut[0] = Math.exp(lnPhiHat1)
      phiOut[1] = Math.exp(lnPhiHat2)
      phiOut[2] = Math.exp(lnPhi1)
      phiOut[3] = Math.exp(lnPhi2)
      // molar volume of the vapour, m³/mol, for the validity check: RT/P + B_mix
      phiOut[4] = rt / P + y1 * y1 * b11 + 2 * y1 * y2 * b12 + y2 * y2 * b22
      return true
    }
    y1 = yn
    T += dT > 20 ? 20 : dT < -20 ? -20 : dT
  }
  return false
}

/**
 * {@link solveBubbleTGammaPhi} under the chemical theory, from T and y1. Φ moves with T much more than under the
 * truncated virial (K falls by about a factor of 2 per 10 K), so the Newton slope takes ∂ln Φi/∂T (forward difference,
 * 1e-3 K) instead of carrying Φ from the last iterate, and y1 takes a Newton step on y1 = k1/S (∂ln Φ/∂y1 by a
 * difference of 1e-7) instead of substitution: both would converge only linearly (20 iterations against 9).
 */
function solveBubbleTChemical(
  c: KernelSystem,
  v: CompiledVirial,
  P: number,
  x1: number,
  T: number,
  y1: number,
  start: number,
  phiOut: Float64Array,
): boolean {
  const x2 = 1 - x1
  const { vp1, vp2 } = c
  for (let it = 1; it <= 100; it++) {
    lnGammaT(c.act, x1, T, g)
    const d1 = T + vp1.c
    const d2 = T + vp2.c
    const ps1 = Math.exp(vp1.a - vp1.b / d1)
    const ps2 = Math.exp(vp2.a - vp2.b / d2)
    lnPhiFactors(v, T + 1e-3, P, y1, psat(vp1, T + 1e-3), psat(vp2, T + 1e-3), lq)
    const V = lnPhiFactors(v, T, P, y1, ps1, ps2, lp)
    const e1 = (lq[0] - lp[0]) / 1e-3
    const e2 = (lq[1] - lp[1]) / 1e-3
    const k1 = x1 > 0 ? x1 * Math.exp(g[0] - lp[0]) * ps1 : 0
    const k2 = x2 > 0 ? x2 * Math.exp(g[1] - lp[1]) * ps2 : 0
    const S = k1 + k2
    const fp = (k1 * (g[2] + vp1.b / (d1 * d1) - e1) + k2 * (g[3] + vp2.b / (d2 * d2) - e2)) / S
    const dT = -Math.log(S / P) / fp
    const yn = k1 / S
    const dy = yn - y1
    if (!Number.isFinite(dT)) return false
    if (dT < 1e-9 && dT > -1e-9 && dy < 1e-12 && dy > -1e-12) {
      res[0] = T + dT
      res[1] = yn
      res[2] = Math.exp(g[0])
      res[3] = Math.exp(g[1])
      res[4] = start + it
      res[5] = P
      phiOut[0] = Math.exp(lp[2])
      phiOut[1] = Math.exp(lp[3])
      phiOut[2] = Math.exp(lp[0])
      phiOut[3] = Math.exp(lp[1])
      phiOut[4] = V
      return true
    }
    // Newton on y1 = G(y1) = k1/S instead of substitution (which converges only linearly here, Φ depending on y
    // through the speciation): G' = y1n·y2n·(∂ln Φ2/∂y1 − ∂ln Φ1/∂y1), the slopes by a one-sided difference
    const hy = y1 < 0.5 ? 1e-7 : -1e-7
    const lnPhi1 = lp[0]
    const lnPhi2 = lp[1]
    lnPhiFactors(v, T, P, y1 + hy, ps1, ps2, lq)
    const slope = 1 - yn * (1 - yn) * ((lq[1] - lnPhi2 - (lq[0] - lnPhi1)) / hy)
    const yNewton = slope > 0.2 && slope < 5 ? y1 + dy / slope : yn
    y1 = yNewton > 0 && yNewton < 1 ? yNewton : yn
    T += dT > 20 ? 20 : dT < -20 ? -20 : dT
  }
  return false
}

/**
 * γ–φ bubble pressure at T (K) and x1 by substitution on P and y1 (a few steps below ~1 MPa). Writes res[] as
 * {@link solveBubbleTGammaPhi} (res[0] = T, res[5] = P) and phiOut[0..3] = φ̂1, φ̂2, Φ1, Φ2. @returns false when it does
 * not settle.
 */
export function solveBubblePGammaPhi(
  c: KernelSystem,
  v: CompiledVirial,
  T: number,
  x1: number,
  phiOut: Float64Array,
): boolean {
  lnGammaT(c.act, x1, T, g)
  const ps1 = psat(c.vp1, T)
  const ps2 = psat(c.vp2, T)
  const a1 = x1 > 0 ? x1 * Math.exp(g[0]) * ps1 : 0
  const a2 = x1 < 1 ? (1 - x1) * Math.exp(g[1]) * ps2 : 0
  let P = a1 + a2
  let y1 = a1 / P
  for (let it = 1; it <= 200; it++) {
    lnPhiFactors(v, T, P, y1, ps1, ps2, lp)
    const q1 = a1 * Math.exp(-lp[0])
    const Pn = q1 + a2 * Math.exp(-lp[1])
    const yn = q1 / Pn
    const done = Math.abs(Pn - P) < 1e-11 * Pn && Math.abs(yn - y1) < 1e-13
    P = Pn
    y1 = yn
    if (done) {
      res[0] = T
      res[1] = y1
      res[2] = Math.exp(g[0])
      res[3] = Math.exp(g[1])
      res[4] = it
      res[5] = P
      phiOut[0] = Math.exp(lp[2])
      phiOut[1] = Math.exp(lp[3])
      phiOut[2] = Math.exp(lp[0])
      phiOut[3] = Math.exp(lp[1])
      return true
    }
    if (!Number.isFinite(P)) return false
  }
  return false
}
